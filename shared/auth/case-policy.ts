import type { CaseStatus } from '../schemas/case';
import { canModerate, type Actor } from './roles';

export interface CaseAccessFacts {
  authorId: number;
  status: CaseStatus;
}

const isAuthor = (actor: Actor, c: CaseAccessFacts) => actor.id === c.authorId;

/** Engineers see verified cases and their own; moderators and admins see everything. */
export const canSeeCase = (actor: Actor, c: CaseAccessFacts) => canModerate(actor) || isAuthor(actor, c) || c.status === 'verified';

/** Authors edit their own drafts and sent-back cases; moderators edit any case. */
export const canEditCase = (actor: Actor, c: CaseAccessFacts) =>
  canModerate(actor) || (isAuthor(actor, c) && (c.status === 'draft' || c.status === 'needs_changes'));

export const canSubmitCase = (actor: Actor, c: CaseAccessFacts) =>
  isAuthor(actor, c) && (c.status === 'draft' || c.status === 'needs_changes');

/** Only an unsubmitted draft can be thrown away, and only by its author. */
export const canDeleteCase = (actor: Actor, c: CaseAccessFacts) => isAuthor(actor, c) && c.status === 'draft';

export const canCommentOnCase = canSeeCase;

/** Moderators review, but never their own case. */
export const canReviewCase = (actor: Actor, c: CaseAccessFacts) => canModerate(actor) && !isAuthor(actor, c);
