import { canSeeCase } from '../../shared/auth/case-policy';
import type { Actor } from '../../shared/auth/roles';
import { MAX_SAVED_SEARCHES, type SavedSearch, type SavedSearchInput } from '../../shared/schemas/saved-searches';
import { queueDigestItem } from '../db/repositories/notification-prefs';
import { countSavedSearches, deleteSavedSearch, insertSavedSearch, listSavedSearches, savedSearchesOfActiveUsers, type SavedSearchRow } from '../db/repositories/saved-searches';
import { searchSourceRows, searchTags, synonymsByTag } from '../db/repositories/search-source';
import { findUserById } from '../db/repositories/users';
import type { AppDeps } from '../deps';
import { invalid, notFound } from '../errors';
import { compose } from '../mail/templates';
import { caseDocument } from '../search/case-document';
import { caseMatchesSearch } from '../search/match-case';
import { synonymMap } from './tags';

interface StoredQuery {
  q: string;
  cause?: string;
  tag?: string;
}

const queryOf = (row: SavedSearchRow): StoredQuery => {
  try {
    return JSON.parse(row.query) as StoredQuery;
  } catch {
    return { q: '' };
  }
};

function toSavedSearch(row: SavedSearchRow): SavedSearch {
  const q = queryOf(row);
  return { id: row.id, name: row.name, q: q.q, cause: q.cause ?? null, tag: q.tag ?? null, delivery: row.delivery, createdAt: row.created_at };
}

export const savedSearchesOf = async ({ db }: AppDeps, actor: Actor) => (await listSavedSearches(db, actor.id)).map(toSavedSearch);

export async function saveSearch({ db }: AppDeps, actor: Actor, input: SavedSearchInput): Promise<SavedSearch> {
  if ((await countSavedSearches(db, actor.id)) >= MAX_SAVED_SEARCHES) {
    throw invalid(`You already keep ${MAX_SAVED_SEARCHES} saved searches; remove one on your profile first`);
  }
  const query: StoredQuery = { q: input.q, ...(input.cause && { cause: input.cause }), ...(input.tag && { tag: input.tag }) };
  const id = await insertSavedSearch(db, { user_id: actor.id, name: input.name, query: JSON.stringify(query), delivery: input.delivery, created_at: new Date().toISOString() });
  return toSavedSearch((await listSavedSearches(db, actor.id)).find((s) => s.id === id)!);
}

export async function removeSavedSearch({ db }: AppDeps, actor: Actor, id: number) {
  // someone else's search answers like one that does not exist
  if (!(await deleteSavedSearch(db, actor.id, id))) throw notFound('No such saved search');
}

/**
 * Tells the owners of the saved searches a newly verified case answers: by mail (queued, sent
 * by the background sender) or as a line of their next digest. Each owner is told once per case
 * however many of their searches match, and only if the visibility policy lets them open the
 * case; the digest asks the policy again when it goes out. The case's author is not told of it.
 */
export async function tellSavedSearches(deps: AppDeps, caseId: number): Promise<number> {
  const [row] = await searchSourceRows(deps.db, [caseId]);
  if (!row) return 0;
  const searches = await savedSearchesOfActiveUsers(deps.db);
  if (searches.length === 0) return 0;
  const entry = caseDocument(row, (await searchTags(deps.db, [caseId])).get(caseId) ?? [], await synonymsByTag(deps.db));
  const synonyms = await synonymMap(deps.db);
  const facts = { authorId: row.author_id, status: row.status };

  const matched = new Map<number, SavedSearchRow[]>();
  for (const s of searches) {
    if (s.user_id === row.author_id) continue;
    if (caseMatchesSearch(entry, queryOf(s), synonyms)) matched.set(s.user_id, [...(matched.get(s.user_id) ?? []), s]);
  }
  const url = `${deps.config.publicUrl}/cases/${caseId}`;
  let told = 0;
  for (const [userId, hits] of matched) {
    const user = await findUserById(deps.db, userId);
    if (!user || user.active !== 1 || !canSeeCase(user, facts)) continue;
    const names = hits.map((h) => `“${h.name}”`).join(', ');
    const line = `Newly verified, matching your saved search ${names}: #${caseId} ${row.title}`;
    // mail wins when any of the matching searches asked for it
    if (hits.some((h) => h.delivery === 'mail')) {
      await deps.mail.send(compose(user.email, `[Falsetrace] Saved search ${names}: ${row.title}`, [line, row.summary], { label: 'Open the case', url }));
    } else {
      await queueDigestItem(deps.db, userId, 'saved_search', caseId, `${line} — ${url}`);
    }
    told++;
  }
  return told;
}
