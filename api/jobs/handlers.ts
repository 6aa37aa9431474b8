/** Every job this server knows how to do, for the server's workers and `npm run worker`. */
import '../briefs/attachment';
import type { AppContext } from '../context';
import { deliverOutbox } from '../outbox/sender';
import { pruneExpired } from '../retention/service';
import { runHandlers } from '../runs/jobs';
import { startRuns } from '../runs/service';
import { getSettings } from '../settings/service';
import type { Handler, Jobs, QueueName } from './boss';
import { QUEUES } from './boss';

export function allHandlers(ctx: AppContext): Record<QueueName, Handler> {
  return {
    ...runHandlers(ctx),
    [QUEUES.outbox]: async () => {
      await deliverOutbox(ctx);
    },
    [QUEUES.retention]: async () => {
      await pruneExpired(ctx.db);
    },
    [QUEUES.scheduledRun]: async () => {
      try {
        // One run per active track; a paused or archived track gets none.
        await startRuns(ctx, null, { track: 'all', trigger: 'schedule' });
      } catch (err) {
        // Every active track's run still going is not a failure of the schedule.
        if ((err as { code?: string }).code !== 'run_in_progress') throw err;
      }
    },
  };
}

/** Nightly, at a quiet hour: sessions, finished mail and unread alerts past their retention. */
export const RETENTION_CRON = '17 3 * * *';

/** Registers the cron jobs: the quarterly run (from settings), the outbox sweep and retention. */
export async function registerSchedules(ctx: AppContext, jobs: Jobs): Promise<void> {
  const s = await getSettings(ctx.db);
  await jobs.schedule(s.scheduleCron, s.regionTimeZone, s.scheduleEnabled);
  await jobs.boss.schedule(QUEUES.outbox, '* * * * *', { reason: 'sweep' }, { tz: 'UTC' });
  await jobs.boss.schedule(QUEUES.retention, RETENTION_CRON, {}, { tz: 'UTC' });
}
