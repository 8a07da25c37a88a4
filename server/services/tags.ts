import { canSeeCase } from '../../shared/auth/case-policy';
import { canModerate, type Actor } from '../../shared/auth/roles';
import type { TagInfo } from '../../shared/schemas/tags';
import { recordAudit } from '../db/repositories/audit-log';
import type { Db } from '../db/database';
import type { AppDeps } from '../deps';
import { forbidden, invalid } from '../errors';
import { allCasesChanged } from '../search/change-log';

async function ensureTagRow(db: Db, tag: string) {
  await db.insertInto('tags').values({ tag, created_at: new Date().toISOString() }).onConflict((oc) => oc.doNothing()).execute();
}

/**
 * Every tag the actor may know of, with how many cases they may open carry it. A tag that only
 * cases hidden from the actor use is left out (its name alone can tell of a draft); a curated tag
 * no case uses yet is listed.
 */
export async function listTags({ db }: AppDeps, actor: Actor): Promise<TagInfo[]> {
  const uses = await db
    .selectFrom('case_tags')
    .innerJoin('cases', 'cases.id', 'case_tags.case_id')
    .select(['case_tags.tag', 'case_tags.case_id', 'cases.author_id', 'cases.status'])
    .distinct()
    .execute();
  const visible = new Map<string, number>();
  const used = new Set<string>();
  for (const u of uses) {
    used.add(u.tag);
    if (canSeeCase(actor, { authorId: u.author_id, status: u.status })) visible.set(u.tag, (visible.get(u.tag) ?? 0) + 1);
  }
  const meta = await db.selectFrom('tags').selectAll().execute();
  const syn = await db.selectFrom('tag_synonyms').selectAll().execute();
  const names = new Set([...visible.keys(), ...meta.map((m) => m.tag).filter((t) => !used.has(t))]);
  return [...names].sort().map((tag) => {
    const m = meta.find((x) => x.tag === tag);
    return {
      tag,
      count: visible.get(tag) ?? 0,
      synonyms: syn.filter((s) => s.tag === tag).map((s) => s.synonym).sort(),
      retired: m?.retired === 1,
      description: m?.description ?? null,
    };
  });
}

/** All synonyms → their tag, for search and for saving cases. */
export async function synonymMap(db: Db): Promise<Map<string, string>> {
  return new Map((await db.selectFrom('tag_synonyms').selectAll().execute()).map((r) => [r.synonym, r.tag]));
}

/** An author's tags with synonyms replaced by their tag; a retired tag is refused. */
export async function canonicalTags(db: Db, tags: string[]): Promise<string[]> {
  const map = await synonymMap(db);
  const mapped = [...new Set(tags.map((t) => map.get(t) ?? t))];
  // no tags, no query (PostgreSQL refuses a NUL placeholder in text, and `in ()` is not SQL)
  const retired = mapped.length ? await db.selectFrom('tags').select('tag').where('retired', '=', 1).where('tag', 'in', mapped).execute() : [];
  if (retired.length) {
    throw invalid(`Moderators retired the tag${retired.length > 1 ? 's' : ''} ${retired.map((r) => r.tag).join(', ')}; pick another`, [{ path: 'tags', message: `Retired: ${retired.map((r) => r.tag).join(', ')}` }]);
  }
  return mapped;
}

function mustModerate(actor: Actor) {
  if (!canModerate(actor)) throw forbidden('Only moderators curate tags');
}

/** Moves every use of `from` to `to` (rename when `to` is new, merge when it exists); `from` becomes a synonym. */
async function moveTag(deps: AppDeps, actor: Actor, from: string, to: string, action: 'rename_tag' | 'merge_tag') {
  mustModerate(actor);
  if (from === to) throw invalid('The new name is the same as the old one');
  await deps.db.transaction().execute(async (trx) => {
    await ensureTagRow(trx, to);
    // cases that already carry `to` just lose `from`
    await trx.deleteFrom('case_tags').where('tag', '=', from).where('case_id', 'in', trx.selectFrom('case_tags').select('case_id').where('tag', '=', to)).execute();
    await trx.updateTable('case_tags').set({ tag: to }).where('tag', '=', from).execute();
    await trx.updateTable('tag_synonyms').set({ tag: to }).where('tag', '=', from).execute();
    await trx.deleteFrom('tags').where('tag', '=', from).execute();
    await trx.insertInto('tag_synonyms').values({ synonym: from, tag: to }).onConflict((oc) => oc.column('synonym').doUpdateSet({ tag: to })).execute();
    await trx.deleteFrom('watches').where('tag', '=', from).where('user_id', 'in', trx.selectFrom('watches').select('user_id').where('tag', '=', to)).execute();
    await trx.updateTable('watches').set({ tag: to }).where('tag', '=', from).execute();
    await recordAudit(trx, { caseId: null, actorId: actor.id, action, before: { tag: from }, after: { tag: to } });
  });
  // tags and synonyms are indexed words: many cases change at once
  await allCasesChanged(deps);
}

export const renameTag = (deps: AppDeps, actor: Actor, from: string, to: string) => moveTag(deps, actor, from, to, 'rename_tag');
export const mergeTag = (deps: AppDeps, actor: Actor, from: string, into: string) => moveTag(deps, actor, from, into, 'merge_tag');

export async function setTagSynonyms(deps: AppDeps, actor: Actor, tag: string, synonyms: string[]) {
  mustModerate(actor);
  const clash = synonyms.filter((s) => s === tag);
  if (clash.length) throw invalid('A tag cannot be its own synonym');
  await deps.db.transaction().execute(async (trx) => {
    await ensureTagRow(trx, tag);
    const before = (await trx.selectFrom('tag_synonyms').select('synonym').where('tag', '=', tag).execute()).map((r) => r.synonym);
    await trx.deleteFrom('tag_synonyms').where('tag', '=', tag).execute();
    for (const synonym of new Set(synonyms)) {
      await trx.insertInto('tag_synonyms').values({ synonym, tag }).onConflict((oc) => oc.column('synonym').doUpdateSet({ tag })).execute();
    }
    await recordAudit(trx, { caseId: null, actorId: actor.id, action: 'tag_synonyms', before: { tag, synonyms: before }, after: { tag, synonyms } });
  });
  await allCasesChanged(deps);
}

export async function setTagRetired(deps: AppDeps, actor: Actor, tag: string, retired: boolean) {
  mustModerate(actor);
  await ensureTagRow(deps.db, tag);
  await deps.db.updateTable('tags').set({ retired: retired ? 1 : 0 }).where('tag', '=', tag).execute();
  await recordAudit(deps.db, { caseId: null, actorId: actor.id, action: retired ? 'retire_tag' : 'restore_tag', after: { tag } });
}
