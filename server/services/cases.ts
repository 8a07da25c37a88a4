import { canDeleteCase, canEditCase, canSeeCase, canSubmitCase } from '../../shared/auth/case-policy';
import type { Actor } from '../../shared/auth/roles';
import type { Case, CaseCreateInput, CaseListQuery, CasePatchInput, CaseSetup, CaseSummary } from '../../shared/schemas/case';
import { listAttachments } from '../db/repositories/attachments';
import { replaceCaseTags, tagsOfCases } from '../db/repositories/case-tags';
import { deleteCaseRow, findCaseById, insertCase, listCaseAuthors, listCases, TEXT_CANDIDATE_LIMIT, updateCaseRow, type CaseRowWithAuthor } from '../db/repositories/cases';
import { insertRevision } from '../db/repositories/revisions';
import type { Db } from '../db/database';
import type { AppDeps } from '../deps';
import { AppError, forbidden, notFound } from '../errors';
import { recordAudit } from '../db/repositories/audit-log';
import { watchCase } from '../db/repositories/watches';
import { diagnosisColumns, recomputeDiagnosis } from './case-diagnosis';
import { moderatorIds, notifyUsers } from './notifications';
import { canonicalTags } from './tags';
import { toCase, toCaseSummary } from './case-mapper';
import { recordWriteUpReferences, visibleReferences, visibleReferrers } from './case-references';
import { caseChanged, caseRemoved } from '../search/change-log';

/** The case row if the actor may see it; a 404 otherwise, so existence does not leak. */
export async function visibleCaseRow(db: Db, actor: Actor, id: number): Promise<CaseRowWithAuthor> {
  const row = await findCaseById(db, id);
  if (!row || !canSeeCase(actor, { authorId: row.author_id, status: row.status })) throw notFound('No such case');
  return row;
}

export async function loadCase(db: Db, actor: Actor, id: number): Promise<Case> {
  const row = await visibleCaseRow(db, actor, id);
  const tags = (await tagsOfCases(db, [id])).get(id) ?? [];
  return {
    ...toCase(row, tags, await listAttachments(db, id), actor),
    references: await visibleReferences(db, actor, row.narrative, row.lesson_detail),
    referredBy: await visibleReferrers(db, actor, id),
  };
}

const authorTagsOf = async (db: Db, id: number) =>
  (await db.selectFrom('case_tags').select('tag').where('case_id', '=', id).where('source', '=', 'author').orderBy('tag').execute()).map((r) => r.tag);

/** The write-up as a revision stores it. */
async function snapshotOf(db: Db, id: number): Promise<string> {
  const row = (await findCaseById(db, id))!;
  const snapshot: CaseCreateInput = {
    title: row.title,
    summary: row.summary,
    narrative: row.narrative,
    setup: JSON.parse(row.setup) as CaseSetup,
    statedCause: row.stated_cause as CaseCreateInput['statedCause'],
    statedCauseOther: row.stated_cause_other,
    fix: row.fix,
    lessonSummary: row.lesson_summary,
    lessonDetail: row.lesson_detail,
    safetyNote: row.safety_note,
    tags: await authorTagsOf(db, id),
  };
  return JSON.stringify(snapshot);
}

export async function createCase({ db, search }: AppDeps, actor: Actor, input: CaseCreateInput): Promise<Case> {
  const now = new Date().toISOString();
  const setup = input.setup ?? {};
  const d = recomputeDiagnosis(setup, input.statedCause);
  const tags = await canonicalTags(db, input.tags ?? []);
  const id = await db.transaction().execute(async (trx) => {
    const { id } = await insertCase(trx, {
      author_id: actor.id,
      title: input.title,
      summary: input.summary,
      narrative: input.narrative ?? '',
      setup: JSON.stringify(setup),
      stated_cause: input.statedCause ?? null,
      stated_cause_other: input.statedCause === 'other' ? (input.statedCauseOther ?? null) : null,
      fix: input.fix ?? null,
      lesson_summary: input.lessonSummary ?? null,
      lesson_detail: input.lessonDetail ?? null,
      safety_note: input.safetyNote ?? null,
      ...diagnosisColumns(d),
      created_at: now,
      updated_at: now,
    });
    await replaceCaseTags(trx, id, 'author', tags);
    await replaceCaseTags(trx, id, 'engine', d.engineTags);
    await recordWriteUpReferences(trx, id, input.narrative ?? '', input.lessonDetail ?? null);
    // authors follow their own cases
    await watchCase(trx, actor.id, id);
    return id;
  });
  await caseChanged({ db, search }, id);
  return loadCase(db, actor, id);
}

export interface UpdateCaseOptions {
  /** Refuse a change that does not say which version it edits (HTTP callers); the seed edits its own fresh rows. */
  requireBase?: boolean;
}

export async function updateCase({ db, search }: AppDeps, actor: Actor, id: number, input: CasePatchInput, options: UpdateCaseOptions = {}): Promise<Case> {
  const row = await visibleCaseRow(db, actor, id);
  if (!canEditCase(actor, { authorId: row.author_id, status: row.status })) {
    throw forbidden(row.author_id === actor.id ? `A case that is ${row.status.replace('_', ' ')} cannot be edited by its author` : 'Only the author or a moderator may edit this case');
  }
  // asked after the access checks, so the answer says nothing about a case the caller may not edit
  if (options.requireBase && !input.baseUpdatedAt) {
    throw new AppError(
      'conflict',
      'Say which version you edited: send baseUpdatedAt with the case\'s updatedAt as you loaded it (GET /api/cases/:id), so a save cannot silently overwrite a newer one.',
    );
  }
  if (input.baseUpdatedAt && input.baseUpdatedAt !== row.updated_at) {
    throw new AppError('conflict', 'This case was saved elsewhere since you opened it. Reload to see the newer version; your edits are kept in this browser.');
  }
  const setup = input.setup ?? (JSON.parse(row.setup) as CaseSetup);
  const statedCause = input.statedCause !== undefined ? input.statedCause : (row.stated_cause as CasePatchInput['statedCause']);
  const d = recomputeDiagnosis(setup, statedCause);
  const tags = input.tags ? await canonicalTags(db, input.tags) : undefined;
  const now = new Date().toISOString();
  await db.transaction().execute(async (trx) => {
    await updateCaseRow(trx, id, {
      ...(input.title !== undefined && { title: input.title }),
      ...(input.summary !== undefined && { summary: input.summary }),
      ...(input.narrative !== undefined && { narrative: input.narrative }),
      ...(input.fix !== undefined && { fix: input.fix }),
      ...(input.lessonSummary !== undefined && { lesson_summary: input.lessonSummary }),
      ...(input.lessonDetail !== undefined && { lesson_detail: input.lessonDetail }),
      ...(input.safetyNote !== undefined && { safety_note: input.safetyNote }),
      ...(input.statedCauseOther !== undefined && { stated_cause_other: input.statedCauseOther }),
      setup: JSON.stringify(setup),
      stated_cause: statedCause ?? null,
      ...diagnosisColumns(d),
      updated_at: now,
    });
    if (tags) await replaceCaseTags(trx, id, 'author', tags);
    await replaceCaseTags(trx, id, 'engine', d.engineTags);
    if (input.narrative !== undefined || input.lessonDetail !== undefined) {
      await recordWriteUpReferences(trx, id, input.narrative ?? row.narrative, input.lessonDetail !== undefined ? input.lessonDetail : row.lesson_detail);
    }
    // drafts change freely; once submitted, every save is kept for the history
    if (row.submitted_at) await insertRevision(trx, id, actor.id, await snapshotOf(trx, id), now);
    if (actor.id !== row.author_id) {
      const changed = Object.keys(input).filter((k) => k !== 'baseUpdatedAt');
      await recordAudit(trx, { caseId: id, actorId: actor.id, action: 'moderator_edit', before: pick(row, changed), after: input, note: `Edited ${changed.join(', ')}` });
    }
  });
  await caseChanged({ db, search }, id);
  return loadCase(db, actor, id);
}

/** The stored values of the fields a moderator changed, for the audit entry's "before". */
function pick(row: CaseRowWithAuthor, fields: string[]): Record<string, unknown> {
  const column: Record<string, keyof CaseRowWithAuthor> = {
    title: 'title', summary: 'summary', narrative: 'narrative', setup: 'setup', statedCause: 'stated_cause', statedCauseOther: 'stated_cause_other',
    fix: 'fix', lessonSummary: 'lesson_summary', lessonDetail: 'lesson_detail', safetyNote: 'safety_note',
  };
  return Object.fromEntries(fields.filter((f) => column[f]).map((f) => [f, f === 'setup' ? JSON.parse(row.setup) : row[column[f]]]));
}

export async function submitCase(deps: AppDeps, actor: Actor, id: number): Promise<Case> {
  const { db } = deps;
  const row = await visibleCaseRow(db, actor, id);
  if (!canSubmitCase(actor, { authorId: row.author_id, status: row.status })) {
    throw row.author_id === actor.id
      ? new AppError('conflict', `The case is ${row.status.replace('_', ' ')}; only drafts and sent-back cases can be submitted`)
      : forbidden('Only the author may submit a case for review');
  }
  const now = new Date().toISOString();
  await db.transaction().execute(async (trx) => {
    await updateCaseRow(trx, id, { status: 'in_review', submitted_at: now, updated_at: now });
    await insertRevision(trx, id, actor.id, await snapshotOf(trx, id), now);
    await recordAudit(trx, { caseId: id, actorId: actor.id, action: 'submit', before: { status: row.status }, after: { status: 'in_review' } });
  });
  await caseChanged(deps, id);
  const resubmitted = row.status === 'needs_changes';
  await notifyUsers(deps, await moderatorIds(deps), {
    kind: 'submitted',
    caseId: id,
    caseTitle: row.title,
    line: `${resubmitted ? 'Resubmitted' : 'Submitted'} for review by ${row.author_name}`,
    details: [row.summary],
  }, actor.id);
  return loadCase(db, actor, id);
}

export async function deleteCase({ db, search }: AppDeps, actor: Actor, id: number): Promise<string[]> {
  const row = await visibleCaseRow(db, actor, id);
  if (!canDeleteCase(actor, { authorId: row.author_id, status: row.status })) throw forbidden('Only the author may delete a draft that was never submitted');
  const files = await listAttachments(db, id);
  await deleteCaseRow(db, id);
  await caseRemoved({ db, search }, id);
  return files.flatMap((f) => [f.storage_name, ...(f.thumbnail_name ? [f.thumbnail_name] : [])]);
}

export async function listCasesFor({ db, search }: AppDeps, actor: Actor, query: CaseListQuery): Promise<{ cases: CaseSummary[]; total: number; totalCapped?: true }> {
  // the text filter reads only the cases the search index names; every case when the index is not ready or cannot say
  const candidates = query.q && search ? await search.listCandidates(query.q, TEXT_CANDIDATE_LIMIT).catch(() => undefined) : undefined;
  const { rows, total, totalCapped } = await listCases(db, actor, query, candidates);
  return { cases: rows.map((r) => toCaseSummary(r, r.tags)), total, ...(totalCapped && { totalCapped: true as const }) };
}

export const authorsFor = ({ db }: AppDeps, actor: Actor) => listCaseAuthors(db, actor);
