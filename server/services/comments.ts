import { canSeeCase } from '../../shared/auth/case-policy';
import { canModerate, type Actor } from '../../shared/auth/roles';
import type { Comment } from '../../shared/schemas/case';
import { deleteComment, findComment, insertComment, listComments, updateComment, type CommentRow } from '../db/repositories/comments';
import type { Db } from '../db/database';
import type { AppDeps } from '../deps';
import { forbidden, invalid, notFound } from '../errors';
import { visibleCaseRow } from './cases';
import { recordCommentReferences, visibleReferencesOfEach } from './case-references';
import type { CaseReference } from '../../shared/cases/case-references';
import { audienceOf, mentionedUserIds, notifyUsers } from './notifications';

function toComment(row: CommentRow, actor: Actor, references: CaseReference[] = []): Comment {
  const own = row.author_id === actor.id;
  const hidden = row.hidden === 1;
  const mod = canModerate(actor);
  return {
    id: row.id,
    caseId: row.case_id,
    authorId: row.author_id,
    authorName: row.author_name,
    // moderators still read what they hid; others see only that it was hidden
    body: hidden && !mod && !own ? '' : row.body,
    hidden,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    permissions: { edit: own && !hidden, delete: own, hide: mod },
    references,
  };
}

/** Comments as the reader gets them, each with the `#123` links it may follow. */
async function toComments(db: Db, rows: CommentRow[], actor: Actor): Promise<Comment[]> {
  const comments = rows.map((r) => toComment(r, actor));
  const refs = await visibleReferencesOfEach(db, actor, comments.map((c) => [c.body]));
  return comments.map((c, i) => ({ ...c, references: refs[i] }));
}
const oneComment = async (deps: AppDeps, id: number, actor: Actor) => (await toComments(deps.db, [(await findComment(deps.db, id))!], actor))[0];

export async function commentsOf({ db }: AppDeps, actor: Actor, caseId: number): Promise<Comment[]> {
  await visibleCaseRow(db, actor, caseId);
  return toComments(db, await listComments(db, caseId), actor);
}

/** Each mention mails someone; a comment naming the whole team is a broadcast, not a comment. */
export const MAX_MENTIONS_PER_COMMENT = 10;

export async function addComment(deps: AppDeps, actor: Actor, caseId: number, body: string): Promise<Comment> {
  const row = await visibleCaseRow(deps.db, actor, caseId);
  const named = await mentionedUserIds(deps, body);
  if (named.length > MAX_MENTIONS_PER_COMMENT) {
    throw invalid(`A comment may @mention at most ${MAX_MENTIONS_PER_COMMENT} people; this one names ${named.length}`, [{ path: 'body', message: `At most ${MAX_MENTIONS_PER_COMMENT} @mentions` }]);
  }
  const id = await insertComment(deps.db, caseId, actor.id, body, new Date().toISOString());
  await recordCommentReferences(deps.db, caseId, id, body);
  const comment = await oneComment(deps, id, actor);
  const excerpt = body.length > 600 ? `${body.slice(0, 600)}…` : body;
  // a mention is only sent to people who may read the case
  const mentioned: number[] = [];
  for (const uid of named) {
    const u = await deps.db.selectFrom('users').select(['id', 'role']).where('id', '=', uid).executeTakeFirst();
    if (u && canSeeCase(u, { authorId: row.author_id, status: row.status })) mentioned.push(uid);
  }
  const toldOfMention = await notifyUsers(deps, mentioned, { kind: 'mention', caseId, caseTitle: row.title, line: `${comment.authorName} mentioned you`, details: [excerpt] }, actor.id);
  const watchers = (await audienceOf(deps, caseId, row.author_id)).filter((u) => !toldOfMention.has(u));
  await notifyUsers(deps, watchers, { kind: 'comment', caseId, caseTitle: row.title, line: `New comment by ${comment.authorName}`, details: [excerpt] }, actor.id);
  return comment;
}

/** A comment on a case the actor can see; others are 404 like their case. */
async function visibleComment(deps: AppDeps, actor: Actor, id: number) {
  const row = await findComment(deps.db, id);
  if (!row) throw notFound('No such comment');
  await visibleCaseRow(deps.db, actor, row.case_id);
  return row;
}

export async function editComment(deps: AppDeps, actor: Actor, id: number, body: string): Promise<Comment> {
  const row = await visibleComment(deps, actor, id);
  if (row.author_id !== actor.id) throw forbidden('You can edit only your own comments');
  if (row.hidden) throw forbidden('A hidden comment cannot be edited');
  await updateComment(deps.db, id, { body, updated_at: new Date().toISOString() });
  await recordCommentReferences(deps.db, row.case_id, id, body);
  return oneComment(deps, id, actor);
}

export async function removeComment(deps: AppDeps, actor: Actor, id: number): Promise<void> {
  const row = await visibleComment(deps, actor, id);
  if (row.author_id !== actor.id) throw forbidden('You can delete only your own comments; moderators hide others');
  await deleteComment(deps.db, id);
}

export async function setCommentHidden(deps: AppDeps, actor: Actor, id: number, hidden: boolean): Promise<Comment> {
  const row = await visibleComment(deps, actor, id);
  if (!canModerate(actor)) throw forbidden('Only moderators may hide comments');
  await updateComment(deps.db, id, { hidden: hidden ? 1 : 0, hidden_by: hidden ? actor.id : null });
  // a hidden comment's links no longer count as the case linking there
  await recordCommentReferences(deps.db, row.case_id, id, hidden ? null : row.body);
  return oneComment(deps, id, actor);
}
