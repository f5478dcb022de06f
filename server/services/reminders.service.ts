import { isoDate } from '../../shared/trade/time';
import type { AppContext } from '../context';
import { retryOnDeadlock } from '../lib/retry';
import { mailTemplates } from '../mail/templates';
import {
  claimReminders,
  queueDueReminders,
  releaseReminder,
} from '../repositories/cave.repository';

/**
 * One pass of the reminder job: queue the reminders that are due (idempotent), claim a batch
 * in a transaction, mail each once. A mail that fails goes back in the queue for the next
 * pass. Safe to run on several app servers at once and again after a restart.
 */
export async function runReminderPass(
  ctx: AppContext,
  now = new Date(),
): Promise<{ queued: number; sent: number; failed: number }> {
  const db = ctx.database.db;
  const today = isoDate({
    year: now.getUTCFullYear(),
    month: now.getUTCMonth() + 1,
    day: now.getUTCDate(),
  });
  // Two servers' passes can deadlock on the queue's index entries; InnoDB rolls the victim
  // back whole, so running it again is safe.
  const queued = await retryOnDeadlock(() => queueDueReminders(db, today));
  let sent = 0;
  let failed = 0;
  for (;;) {
    const batch = await retryOnDeadlock(() => claimReminders(db));
    if (!batch.length) break;
    for (const reminder of batch) {
      const url = `${ctx.config.publicUrl}/journals/${reminder.journalId}/taste`;
      const mail =
        reminder.kind === 'ready'
          ? mailTemplates.wheelReady(
              reminder.email,
              reminder.displayName,
              reminder.title,
              reminder.makeDate,
              reminder.agingTargetDays ?? 0,
              url,
              reminder.heatTreatment,
            )
          : mailTemplates.wheelCheck(
              reminder.email,
              reminder.displayName,
              reminder.title,
              `${ctx.config.publicUrl}/journals/${reminder.journalId}`,
            );
      try {
        await ctx.mailer.send(mail);
        sent += 1;
      } catch {
        await releaseReminder(db, reminder.id);
        failed += 1;
      }
    }
    if (failed) break; // try the rest on the next pass rather than spinning on a dead relay
  }
  if (queued || sent || failed) ctx.logger.info({ queued, sent, failed }, 'reminder pass');
  return { queued, sent, failed };
}
