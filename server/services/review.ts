import { canReviewCase } from '../../shared/auth/case-policy';
import { canModerate } from '../../shared/auth/roles';
import type { User } from '../../shared/schemas/auth';
import type { Case } from '../../shared/schemas/case';
import type { ReviewInput } from '../../shared/schemas/review';
import { recordAudit } from '../db/repositories/audit-log';
import { findCaseById, updateCaseRow } from '../db/repositories/cases';
import type { AppDeps } from '../deps';
import { AppError, forbidden, invalid, notFound } from '../errors';
import { loadCase, visibleCaseRow } from './cases';
import { audienceOf, notifyUsers } from './notifications';
import { tellSavedSearches } from './saved-searches';
import { caseChanged } from '../search/change-log';

const REVIEWABLE = { verify: ['in_review'], send_back: ['in_review'], retire: ['in_review', 'needs_changes', 'verified'], duplicate: ['in_review', 'needs_changes', 'verified'] } as const;

/** A moderator's decision on a case: the state change, its audit entry and the author's mail. */
export async function reviewCase(deps: AppDeps, actor: User, id: number, input: ReviewInput): Promise<Case> {
  if (!canModerate(actor)) throw forbidden('Only moderators review cases');
  const row = await visibleCaseRow(deps.db, actor, id);
  if (!canReviewCase(actor, { authorId: row.author_id, status: row.status })) throw forbidden('Authors may not review their own cases; ask another moderator');
  const allowed = REVIEWABLE[input.action] as readonly string[];
  if (!allowed.includes(row.status)) {
    throw new AppError('conflict', `A case that is ${row.status.replace('_', ' ')} cannot be ${input.action === 'send_back' ? 'sent back' : input.action === 'verify' ? 'verified' : 'retired'}`);
  }

  let duplicateOfTitle: string | undefined;
  if (input.action === 'duplicate') {
    if (input.duplicateOf === id) throw invalid('A case cannot duplicate itself', [{ path: 'duplicateOf', message: 'Pick another case' }]);
    const original = await findCaseById(deps.db, input.duplicateOf!);
    if (!original) throw notFound(`There is no case #${input.duplicateOf}`);
    if (original.status === 'retired') throw invalid(`Case #${original.id} is itself retired; point at the case that stays`, [{ path: 'duplicateOf', message: 'That case is retired' }]);
    duplicateOfTitle = original.title;
  }

  const now = new Date().toISOString();
  const next = input.action === 'verify' ? 'verified' : input.action === 'send_back' ? 'needs_changes' : 'retired';
  await deps.db.transaction().execute(async (trx) => {
    await updateCaseRow(trx, id, {
      status: next,
      updated_at: now,
      ...(input.action === 'verify' && { verified_at: now, review_note: null }),
      ...(input.action === 'send_back' && { review_note: input.note! }),
      ...(input.action === 'retire' && { retired_reason: input.note! }),
      ...(input.action === 'duplicate' && { duplicate_of: input.duplicateOf!, retired_reason: input.note || `Duplicate of case #${input.duplicateOf}` }),
    });
    await recordAudit(trx, {
      caseId: id,
      actorId: actor.id,
      action: input.action,
      before: { status: row.status },
      after: { status: next, ...(input.duplicateOf && { duplicateOf: input.duplicateOf }) },
      note: input.note ?? null,
    });
  });

  await caseChanged(deps, id);

  const line = {
    verify: `Verified by ${actor.name}`,
    send_back: `Sent back for changes by ${actor.name}`,
    retire: `Retired by ${actor.name}`,
    duplicate: `Marked as a duplicate of #${input.duplicateOf} “${duplicateOfTitle}” by ${actor.name}`,
  }[input.action];
  const kind = input.action === 'verify' ? 'verified' : input.action === 'send_back' ? 'sent_back' : 'retired';
  const audience = input.action === 'send_back' ? [row.author_id] : await audienceOf(deps, id, row.author_id);
  await notifyUsers(deps, audience, { kind, caseId: id, caseTitle: row.title, line, details: input.note ? [`Note: ${input.note}`] : [] }, actor.id);
  if (input.action === 'verify') {
    // the verification stands even if telling the saved searches fails
    await tellSavedSearches(deps, id).catch((err) => console.error('[falsetrace] saved-search notices failed:', err));
  }
  return loadCase(deps.db, actor, id);
}
