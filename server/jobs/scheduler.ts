import { Cron } from 'croner';
import type { AppContext } from '../context';
import { runReminderPass } from '../services/reminders.service';

/**
 * Starts the background jobs of one app server: the reminder pass every 15 minutes and once
 * shortly after start. Each pass is idempotent and claims its rows in the database, so every
 * app server may run the scheduler.
 */
export function startJobs(ctx: AppContext): () => void {
  const run = async () => {
    try {
      await runReminderPass(ctx);
    } catch (error) {
      ctx.logger.warn({ err: error }, 'reminder pass failed; it runs again at the next tick');
    }
  };
  const job = new Cron('*/15 * * * *', { protect: true, name: 'reminders' }, run);
  const first = setTimeout(run, 10_000);
  first.unref();
  return () => {
    clearTimeout(first);
    job.stop();
  };
}
