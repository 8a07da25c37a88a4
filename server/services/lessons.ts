import { sql, type SqlBool } from 'kysely';
import { canModerate, type Actor } from '../../shared/auth/roles';
import { CAUSE_LABELS, CAUSES } from '../../shared/schemas/diagnosis';
import type { Lesson, LessonBook } from '../../shared/schemas/lessons';
import type { AppDeps } from '../deps';
import { AppError, forbidden, invalid, notFound } from '../errors';
import { recordAudit } from '../db/repositories/audit-log';
import { appendPinnedLesson, lockWriters } from '../db/repositories/casebook';
import { TEXT_CANDIDATE_LIMIT } from '../db/repositories/cases';
import { containsText } from '../db/repositories/text-match';
import { visibleReferencesOfEach } from './case-references';

/** Each cause's group shows this many of its most recently verified lessons; `total` says how many it has. */
export const LESSONS_PER_GROUP = 50;
/**
 * A group's count stops here (`totalCapped`): past it the page says "1,000+", and a count never
 * walks more than this many index entries, however large the casebook.
 */
export const LESSON_COUNT_CAP = 1000;

/** Literals, not parameters, so SQLite can prove the partial index `cases_lessons` applies. */
const HAS_LESSON = sql<SqlBool>`${sql.ref('cases.status')} = 'verified' and ${sql.ref('cases.lesson_summary')} is not null and ${sql.ref('cases.lesson_summary')} <> ''`;

type LessonRow = { id: number; title: string; cause: string | null; lesson_summary: string | null; lesson_detail: string | null; verified_at: string | null; position: number | null };
const toLesson = (r: LessonRow): Lesson => ({
  caseId: r.id,
  title: r.title,
  cause: r.cause,
  lessonSummary: r.lesson_summary!,
  lessonDetail: r.lesson_detail,
  verifiedAt: r.verified_at,
  pinned: r.position !== null,
  pinPosition: r.position,
  references: [],
});

/**
 * Verified lessons grouped by cause (causes in the engine's order, then the rest), each group
 * its latest LESSONS_PER_GROUP with the group's total, plus the whole pinned checklist. The
 * conditions match the partial index of migration 0012 term for term, so SQLite uses it.
 */
export async function listLessons({ db, search }: AppDeps, q?: string, reader?: Actor): Promise<LessonBook> {
  // as the case list: the substring test reads only the cases the search index names, when it can name them
  const candidates = q && search ? await search.listCandidates(q, TEXT_CANDIDATE_LIMIT, 'lessons').catch(() => undefined) : undefined;
  const lessons = () => {
    let query = db.selectFrom('cases').leftJoin('pinned_lessons', 'pinned_lessons.case_id', 'cases.id').where(HAS_LESSON);
    if (q) {
      if (candidates) query = query.where('cases.id', 'in', candidates.length ? candidates : [-1]);
      query = query.where((eb) => eb.or([containsText('cases.lesson_summary', q), containsText('cases.lesson_detail', q), containsText('cases.title', q)]));
    }
    return query;
  };
  const columns = ['cases.id', 'cases.title', 'cases.cause', 'cases.lesson_summary', 'cases.lesson_detail', 'cases.verified_at', 'pinned_lessons.position'] as const;
  // the stored cause is a stated cause (an engine cause or "other") or the engine's, or none:
  // one count and one page per value, each a seek in the partial index
  const values: (string | null)[] = [...CAUSES, 'other', null];
  const ofCause = (value: string | null) => lessons().where('cases.cause', value === null ? 'is' : '=', value);
  const groups = [];
  for (const cause of [...CAUSES, 'other']) {
    const parts = cause === 'other' ? values.slice(-2) : [cause];
    let total = 0;
    let totalCapped = false;
    const rows: LessonRow[] = [];
    for (const value of parts) {
      const counted = ofCause(value).select(sql<number>`1`.as('one')).limit(LESSON_COUNT_CAP + 1).as('m');
      const n = Number((await db.selectFrom(counted).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);
      if (n > LESSON_COUNT_CAP) totalCapped = true;
      total += Math.min(n, LESSON_COUNT_CAP);
      rows.push(...(await ofCause(value).select(columns).orderBy('cases.verified_at', 'desc').orderBy('cases.id', 'desc').limit(LESSONS_PER_GROUP).execute()));
    }
    if (total === 0) continue;
    rows.sort((a, b) => (b.verified_at ?? '').localeCompare(a.verified_at ?? '') || b.id - a.id);
    groups.push({ cause, label: CAUSE_LABELS[cause as keyof typeof CAUSE_LABELS] ?? 'Other causes', lessons: rows.slice(0, LESSONS_PER_GROUP).map(toLesson), total, ...(totalCapped && { totalCapped: true as const }) });
  }
  const pinnedIds = (await db.selectFrom('pinned_lessons').select('case_id').execute()).map((p) => p.case_id);
  const pinned = pinnedIds.length ? await lessons().where('cases.id', 'in', pinnedIds).select(columns).orderBy('pinned_lessons.position').execute() : [];
  const checklist = pinned.map(toLesson);
  if (reader) {
    // the `#id`s in each shown lesson, only those the reader may open
    const shown = [...groups.flatMap((g) => g.lessons), ...checklist];
    const refs = await visibleReferencesOfEach(db, reader, shown.map((l) => [l.lessonDetail]));
    shown.forEach((l, i) => (l.references = refs[i] ?? []));
  }
  return { groups, checklist };
}

export async function pinLesson({ db }: AppDeps, actor: Actor, caseId: number, pinned: boolean) {
  if (!canModerate(actor)) throw forbidden('Only moderators curate the bench checklist');
  const row = await db.selectFrom('cases').select(['id', 'status', 'lesson_summary']).where('id', '=', caseId).executeTakeFirst();
  if (!row) throw notFound('No such case');
  if (pinned) {
    if (row.status !== 'verified' || !row.lesson_summary) throw invalid('Only the lesson of a verified case can be pinned');
    await appendPinnedLesson(db, caseId, actor.id, new Date().toISOString());
  } else {
    await db.deleteFrom('pinned_lessons').where('case_id', '=', caseId).execute();
  }
  await recordAudit(db, { caseId, actorId: actor.id, action: pinned ? 'pin_lesson' : 'unpin_lesson' });
}

/**
 * Puts the bench checklist in a moderator's order. The list must hold exactly the lessons pinned
 * now: an order made on a stale page (someone pinned or unpinned meanwhile) is refused, not guessed at.
 */
export async function reorderChecklist(deps: AppDeps, actor: Actor, caseIds: number[]) {
  if (!canModerate(actor)) throw forbidden('Only moderators curate the bench checklist');
  const current = (await listLessons(deps)).checklist.map((l) => l.caseId);
  const same = current.length === caseIds.length && current.every((id) => caseIds.includes(id));
  if (!same) throw new AppError('conflict', 'The checklist changed since you loaded it; reload the Lessons page and move the lesson again');
  await deps.db.transaction().execute(async (trx) => {
    await lockWriters(trx, 'checklist');
    for (const [i, caseId] of caseIds.entries()) await trx.updateTable('pinned_lessons').set({ position: i + 1 }).where('case_id', '=', caseId).execute();
  });
}
