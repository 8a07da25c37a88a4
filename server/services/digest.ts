import { canSeeCase } from '../../shared/auth/case-policy';
import { findUserById } from '../db/repositories/users';
import { prefsOf } from '../db/repositories/notification-prefs';
import type { AppDeps } from '../deps';
import { compose } from '../mail/templates';

/**
 * Sends each active user one mail with their waiting digest items and the lessons verified
 * since they last got them. What goes into a mail is claimed (marked) in the same transaction that
 * queues the mail, so a second run, even at the same time on another instance, sends nothing
 * twice, and a crash loses nothing.
 */
export async function sendDigests(deps: AppDeps, now = new Date()): Promise<{ mails: number; lessons: number }> {
  const users = await deps.db.selectFrom('users').select('id').where('active', '=', 1).orderBy('id').execute();
  let mails = 0;
  let lessonCount = 0;
  for (const { id } of users) {
    const user = (await findUserById(deps.db, id))!;
    const wantsLessons = ((await prefsOf(deps.db, id)).lessons ?? 'digest') !== 'off';
    const queued = await deps.db.transaction().execute(async (trx) => {
      const stamp = now.toISOString();
      // Claimed, not just read: marking the waiting lines sent is one statement, so of two runs at
      // once (two instances) each line goes to one; on PostgreSQL the second waits for the first's
      // row locks, then finds the lines sent.
      const claimed = (await trx.updateTable('digest_items').set({ sent_at: stamp }).where('user_id', '=', id).where('sent_at', 'is', null).returning('id').execute()).map((r) => r.id);
      const waiting = claimed.length
        ? await trx
            .selectFrom('digest_items')
            .leftJoin('cases', 'cases.id', 'digest_items.case_id')
            .selectAll('digest_items')
            .select(['cases.author_id', 'cases.status'])
            .where('digest_items.id', 'in', claimed)
            .orderBy('digest_items.id')
            .execute()
        : [];
      // the case may have been retired or sent back since the line was queued: ask the policy now
      // (a line the reader may no longer see stays marked sent, and is dropped)
      const readable = (i: (typeof waiting)[number]) => i.case_id === null || (i.status !== null && i.author_id !== null && canSeeCase(user, { authorId: i.author_id, status: i.status }));
      const items = waiting.filter(readable);
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
      const visible = lessonRows.filter((l) => canSeeCase(user, { authorId: l.author_id, status: l.status }));
      // the delivery row is the lesson's claim: one a concurrent run recorded first conflicts and is left out
      const delivered = visible.length
        ? new Set(
            (
              await trx
                .insertInto('lesson_deliveries')
                .values(visible.map((l) => ({ user_id: id, case_id: l.id, sent_at: stamp })))
                .onConflict((oc) => oc.columns(['user_id', 'case_id']).doNothing())
                .returning('case_id')
                .execute()
            ).map((r) => r.case_id),
          )
        : new Set<number>();
      const lessons = visible.filter((l) => delivered.has(l.id));
      if (!items.length && !lessons.length) return false;
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
  // one statement claims today's run: of several instances checking at once, one gets the row written
  const claimed = await deps.db
    .insertInto('app_state')
    .values({ key: LAST_RUN_KEY, value: today })
    .onConflict((oc) => oc.column('key').doUpdateSet({ value: today }).where('app_state.value', '!=', today))
    .executeTakeFirst();
  if (Number(claimed.numInsertedOrUpdatedRows ?? 0) !== 1) return false;
  await sendDigests(deps, now);
  return true;
}
