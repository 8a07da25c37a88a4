import { canSeeCase } from '../../shared/auth/case-policy';
import type { NotificationKind } from '../../shared/schemas/review';
import { findCaseById } from '../db/repositories/cases';
import { prefsOf, queueDigestItem } from '../db/repositories/notification-prefs';
import { findUserById, listUsersWithRole } from '../db/repositories/users';
import { watchersOf } from '../db/repositories/watches';
import type { AppDeps } from '../deps';
import { compose } from '../mail/templates';

export interface CaseNotice {
  kind: NotificationKind;
  caseId: number;
  caseTitle: string;
  /** One line for the digest and the mail's first paragraph. */
  line: string;
  /** More paragraphs for the instant mail (a review note, the comment text). */
  details?: string[];
}

/**
 * Sends one notice to each recipient by their preference: at once, in the daily digest, or not
 * at all. Returns who was told (either way). Only people who may open the case as it is now are
 * told: the same policy as `GET /api/cases/:id`, asked at send time.
 */
export async function notifyUsers(deps: AppDeps, userIds: Iterable<number>, notice: CaseNotice, exceptUserId?: number): Promise<Set<number>> {
  const told = new Set<number>();
  const url = `${deps.config.publicUrl}/cases/${notice.caseId}`;
  const row = await findCaseById(deps.db, notice.caseId);
  if (!row) return told;
  const facts = { authorId: row.author_id, status: row.status };
  for (const id of new Set(userIds)) {
    if (id === exceptUserId) continue;
    const user = await findUserById(deps.db, id);
    if (!user || user.active !== 1) continue;
    if (!canSeeCase(user, facts)) continue;
    const mode = (await prefsOf(deps.db, id))[notice.kind] ?? 'instant';
    if (mode === 'off') continue;
    told.add(id);
    if (mode === 'digest') {
      await queueDigestItem(deps.db, id, notice.kind, notice.caseId, `${notice.line} — ${url}`);
      continue;
    }
    await deps.mail.send(
      compose(user.email, `[Falsetrace] ${notice.caseTitle}: ${notice.line}`, [notice.line, ...(notice.details ?? [])], { label: 'Open the case', url }),
    );
  }
  return told;
}

export const moderatorIds = async (deps: AppDeps) => (await listUsersWithRole(deps.db, ['moderator', 'admin'])).map((u) => u.id);

/** The case's author and everyone watching the case or one of its tags. */
export const audienceOf = async (deps: AppDeps, caseId: number, authorId: number) => [authorId, ...(await watchersOf(deps.db, caseId))];

/** Users named as @local-part of their e-mail (e.g. @ines.okafor) in a text. */
export async function mentionedUserIds(deps: AppDeps, text: string): Promise<number[]> {
  const handles = new Set([...text.matchAll(/(?:^|[\s(])@([a-z0-9._-]+[a-z0-9])/gi)].map((m) => m[1].toLowerCase()));
  if (handles.size === 0) return [];
  const users = await deps.db.selectFrom('users').select(['id', 'email']).where('active', '=', 1).execute();
  return users.filter((u) => handles.has(u.email.split('@')[0].toLowerCase())).map((u) => u.id);
}
