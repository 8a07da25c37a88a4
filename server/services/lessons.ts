import { canModerate, type Actor } from '../../shared/auth/roles';
import { CAUSE_LABELS, CAUSES } from '../../shared/schemas/diagnosis';
import type { Lesson, LessonBook } from '../../shared/schemas/lessons';
import type { AppDeps } from '../deps';
import { AppError, forbidden, invalid, notFound } from '../errors';
import { recordAudit } from '../db/repositories/audit-log';
import { containsText } from '../db/repositories/text-match';
import { visibleReferencesOfEach } from './case-references';

/** Verified lessons grouped by cause (causes in the engine's order, then the rest), plus the pinned checklist. */
export async function listLessons({ db }: AppDeps, q?: string, reader?: Actor): Promise<LessonBook> {
  let query = db
    .selectFrom('cases')
    .leftJoin('pinned_lessons', 'pinned_lessons.case_id', 'cases.id')
    .select(['cases.id', 'cases.title', 'cases.cause', 'cases.lesson_summary', 'cases.lesson_detail', 'cases.verified_at', 'pinned_lessons.position'])
    .where('cases.status', '=', 'verified')
    .where('cases.lesson_summary', 'is not', null)
    .where('cases.lesson_summary', '!=', '');
  if (q) {
    query = query.where((eb) => eb.or([containsText('cases.lesson_summary', q), containsText('cases.lesson_detail', q), containsText('cases.title', q)]));
  }
  const rows = await query.orderBy('cases.verified_at', 'desc').execute();
  const refs = reader ? await visibleReferencesOfEach(db, reader, rows.map((r) => [r.lesson_detail])) : [];
  const lessons: Lesson[] = rows.map((r, i) => ({
    caseId: r.id,
    title: r.title,
    cause: r.cause,
    lessonSummary: r.lesson_summary!,
    lessonDetail: r.lesson_detail,
    verifiedAt: r.verified_at,
    pinned: r.position !== null,
    pinPosition: r.position,
    references: refs[i] ?? [],
  }));
  const order = [...CAUSES, 'other'] as string[];
  const causes = [...new Set(lessons.map((l) => l.cause ?? 'other'))].sort((a, b) => (order.indexOf(a) + 1 || 99) - (order.indexOf(b) + 1 || 99));
  return {
    groups: causes.map((cause) => ({
      cause,
      label: CAUSE_LABELS[cause as keyof typeof CAUSE_LABELS] ?? 'Other causes',
      lessons: lessons.filter((l) => (l.cause ?? 'other') === cause),
    })),
    checklist: lessons.filter((l) => l.pinned).sort((a, b) => a.pinPosition! - b.pinPosition!),
  };
}

export async function pinLesson({ db }: AppDeps, actor: Actor, caseId: number, pinned: boolean) {
  if (!canModerate(actor)) throw forbidden('Only moderators curate the bench checklist');
  const row = await db.selectFrom('cases').select(['id', 'status', 'lesson_summary']).where('id', '=', caseId).executeTakeFirst();
  if (!row) throw notFound('No such case');
  if (pinned) {
    if (row.status !== 'verified' || !row.lesson_summary) throw invalid('Only the lesson of a verified case can be pinned');
    const { max } = await db.selectFrom('pinned_lessons').select((eb) => eb.fn.max('position').as('max')).executeTakeFirstOrThrow();
    await db
      .insertInto('pinned_lessons')
      .values({ case_id: caseId, position: Number(max ?? 0) + 1, pinned_by: actor.id, created_at: new Date().toISOString() })
      .onConflict((oc) => oc.doNothing())
      .execute();
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
    for (const [i, caseId] of caseIds.entries()) await trx.updateTable('pinned_lessons').set({ position: i + 1 }).where('case_id', '=', caseId).execute();
  });
}
