import { canModerate, type Actor } from '../../shared/auth/roles';
import { CASE_STATUSES } from '../../shared/schemas/case';
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
 * no case uses yet is listed. Counted per visibility branch of the case policy (`canSeeCase`:
 * moderators every case; others verified cases and their own): the counts of all and of verified
 * cases come from `tag_counts`, kept by triggers, and only an author's own unverified cases are
 * counted here, never every tag use of every case.
 */
export async function listTags({ db }: AppDeps, actor: Actor): Promise<TagInfo[]> {
  const visible = new Map<string, number>();
  const add = (rows: { tag: string; n: number | string | bigint }[]) => {
    for (const r of rows) visible.set(r.tag, (visible.get(r.tag) ?? 0) + Number(r.n));
  };
  if (canModerate(actor)) {
    add(await db.selectFrom('tag_counts').select(['tag', 'all_cases as n']).where('all_cases', '>', 0).execute());
  } else {
    add(await db.selectFrom('tag_counts').select(['tag', 'verified_cases as n']).where('verified_cases', '>', 0).execute());
    add(
      await db
        .selectFrom('cases')
        .innerJoin('case_tags', 'case_tags.case_id', 'cases.id')
        .select(['case_tags.tag', (eb) => eb.fn.countAll<number>().as('n')])
        .where('cases.author_id', '=', actor.id)
        .where('cases.status', 'in', CASE_STATUSES.filter((x) => x !== 'verified'))
        .groupBy('case_tags.tag')
        .execute(),
    );
  }
  const meta = await db.selectFrom('tags').selectAll().execute();
  const syn = await db.selectFrom('tag_synonyms').selectAll().execute();
  // curated tags no case uses (no counter, or a counter at zero)
  const unused = meta.length
    ? new Set(
        (
          await db
            .selectFrom('tags')
            .leftJoin('tag_counts', 'tag_counts.tag', 'tags.tag')
            .select('tags.tag')
            .where((eb) => eb.or([eb('tag_counts.all_cases', 'is', null), eb('tag_counts.all_cases', '=', 0)]))
            .execute()
        ).map((r) => r.tag),
      )
    : new Set<string>();
  const metaOf = new Map(meta.map((m) => [m.tag, m]));
  const synonymsOf = new Map<string, string[]>();
  for (const s of syn) synonymsOf.set(s.tag, [...(synonymsOf.get(s.tag) ?? []), s.synonym]);
  const names = new Set([...visible.keys(), ...unused]);
  return [...names].sort().map((tag) => {
    const m = metaOf.get(tag);
    return {
      tag,
      count: visible.get(tag) ?? 0,
      synonyms: (synonymsOf.get(tag) ?? []).sort(),
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
