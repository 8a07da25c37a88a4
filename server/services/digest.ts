import { canSeeCase } from '../../shared/auth/case-policy';
import { findUserById } from '../db/repositories/users';
import { prefsOf } from '../db/repositories/notification-prefs';
import type { AppDeps } from '../deps';
import { compose } from '../mail/templates';

/**
 * Sends each active user one mail with their waiting digest items and the lessons verified
 * since they last got them. What goes into a mail is marked in the same transaction that queues
 * the mail, so a second run sends nothing twice and a crash loses nothing.
 */
export async function sendDigests(deps: AppDeps, now = new Date()): Promise<{ mails: number; lessons: number }> {
  const users = await deps.db.selectFrom('users').select('id').where('active', '=', 1).execute();
  let mails = 0;
  let lessonCount = 0;
  for (const { id } of users) {
    const user = (await findUserById(deps.db, id))!;
    const wantsLessons = ((await prefsOf(deps.db, id)).lessons ?? 'digest') !== 'off';
    const queued = await deps.db.transaction().execute(async (trx) => {
      const waiting = await trx
        .selectFrom('digest_items')
        .leftJoin('cases', 'cases.id', 'digest_items.case_id')
        .selectAll('digest_items')
        .select(['cases.author_id', 'cases.status'])
        .where('digest_items.user_id', '=', id)
        .where('digest_items.sent_at', 'is', null)
        .orderBy('digest_items.id')
        .execute();
      // the case may have been retired or sent back since the line was queued: ask the policy now
      const readable = (i: (typeof waiting)[number]) => i.case_id === null || (i.status !== null && i.author_id !== null && canSeeCase(user, { authorId: i.author_id, status: i.status }));
      const items = waiting.filter(readable);
      const dropped = waiting.filter((i) => !readable(i));
      if (dropped.length) await trx.updateTable('digest_items').set({ sent_at: now.toISOString() }).where('id', 'in', dropped.map((i) => i.id)).execute();
      const lessonRows = wantsLessons
        ? await trx
            .selectFrom('cases')
            .select(['id', 'title', 'lesson_summary', 'author_id', 'status'])
            .where('status', '=', 'verified')
            .where('lesson_summary', 'is not', null)
            .where('lesson_summary', '!=', '')
            .where('id', 'not in', trx.selectFrom('lesson_deliveries').select('case_id').where('user_id', '=', id))
            .orderBy('verified_at')
            .execute()
        : [];
      const lessons = lessonRows.filter((l) => canSeeCase(user, { authorId: l.author_id, status: l.status }));
      if (!items.length && !lessons.length) return false;
      const stamp = now.toISOString();
      if (items.length) await trx.updateTable('digest_items').set({ sent_at: stamp }).where('id', 'in', items.map((i) => i.id)).execute();
      if (lessons.length) await trx.insertInto('lesson_deliveries').values(lessons.map((l) => ({ user_id: id, case_id: l.id, sent_at: stamp }))).execute();
      const paragraphs = [
        ...(lessons.length ? ['Newly verified lessons:', ...lessons.map((l) => `• ${l.lesson_summary} — “${l.title}” ${deps.config.publicUrl}/cases/${l.id}`)] : []),
        ...(items.length ? ['Since your last digest:', ...items.map((i) => `• ${i.line}`)] : []),
      ];
      const message = compose(user.email, `[Falsetrace] Daily digest: ${lessons.length} new lesson${lessons.length === 1 ? '' : 's'}`, paragraphs, {
        label: 'Open the Lessons page',
        url: `${deps.config.publicUrl}/lessons`,
      });
      await deps.mail.enqueue(message, trx);
      lessonCount += lessons.length;
      return true;
    });
    if (queued) mails++;
  }
  await deps.mail.retryDue();
  return { mails, lessons: lessonCount };
}

const LAST_RUN_KEY = 'digest_last_run_date';

/** Runs the digest once a day, at or after `hourUtc`; checked hourly by the server. */
export async function runDailyDigestIfDue(deps: AppDeps, now = new Date(), hourUtc = 7) {
  if (now.getUTCHours() < hourUtc) return false;
  const today = now.toISOString().slice(0, 10);
  const last = await deps.db.selectFrom('app_state').select('value').where('key', '=', LAST_RUN_KEY).executeTakeFirst();
  if (last?.value === today) return false;
  await deps.db.insertInto('app_state').values({ key: LAST_RUN_KEY, value: today }).onConflict((oc) => oc.column('key').doUpdateSet({ value: today })).execute();
  await sendDigests(deps, now);
  return true;
}
