/**
 * The scheduled-run watch: what staff must be told about scheduled runs, in the app
 * (`runNotices`) and by e-mail (`mailRunNotices`, from the `run-watch` job every ten
 * minutes). Three problems, each a notice with a stable key:
 * - a scheduled run failed (until a later run of its track is created);
 * - a scheduled run did not start within an hour of its scheduled time: either it is still
 *   queued an hour after it was created, or the latest scheduled time passed more than an
 *   hour ago with no run of an active track at all (the schedule itself did not fire);
 * - a scheduled run has waited in review longer than the `reviewWaitDays` setting.
 * Each staff member (active admin or analyst) gets each notice once by e-mail: the outbox's
 * dedupe key is the notice's key and the person.
 */
import parser from 'cron-parser';
import type { Knex } from 'knex';
import type { RunNotice, RunNoticesResponse } from '../../contracts/run-watch';
import type { AppContext } from '../context';
import { enqueue, type QueuedMail } from '../outbox/service';
import { getSettings } from '../settings/service';
import * as store from './store';

/** How long a scheduled run may take to start before staff hear of it (issue 14: one hour). */
export const START_GRACE_MS = 60 * 60 * 1000;
const DAY_MS = 24 * 60 * 60 * 1000;

/** The latest time the cron fired at or before `now`, in the region's time zone (null: bad cron). */
export function lastScheduledTime(cron: string, timeZone: string, now: Date): Date | null {
  try {
    return parser.parseExpression(cron, { tz: timeZone, currentDate: now }).prev().toDate();
  } catch {
    return null;
  }
}

const whole = (ms: number, unit: number): number => Math.floor(ms / unit);

function runNotice(r: store.WatchedRunRow, now: Date, reviewWaitDays: number): RunNotice {
  const track = { code: r.trackCode, name: r.trackName };
  const href = `/runs/${r.id}`;
  if (r.state === 'failed') {
    return {
      key: `failed:run-${r.id}`,
      kind: 'failed',
      track,
      runId: r.id,
      since: r.finishedAt ?? r.createdAt,
      message: `The scheduled run #${r.id} of ${r.trackName} failed${r.error ? `: ${r.error}` : ''}. Officials still see the track's previous published run; start it again once the cause is fixed.`,
      href,
    };
  }
  if (r.state === 'queued') {
    const hours = whole(now.getTime() - Date.parse(r.createdAt), 60 * 60 * 1000);
    return {
      key: `not-started:run-${r.id}`,
      kind: 'not_started',
      track,
      runId: r.id,
      since: r.createdAt,
      message: `The scheduled run #${r.id} of ${r.trackName} has not started ${hours} hour${hours === 1 ? '' : 's'} after its scheduled time: check that a worker is running.`,
      href,
    };
  }
  const days = whole(now.getTime() - Date.parse(r.finishedAt ?? r.createdAt), DAY_MS);
  return {
    key: `review-overdue:run-${r.id}`,
    kind: 'review_overdue',
    track,
    runId: r.id,
    since: r.finishedAt ?? r.createdAt,
    message: `The scheduled run #${r.id} of ${r.trackName} has waited in review for ${days} days (more than ${reviewWaitDays}): publish or discard it, so officials do not read a stale ${r.trackName} track.`,
    href,
  };
}

/** Every notice at `now`, oldest first. */
export async function runNotices(db: Knex, now = new Date()): Promise<RunNoticesResponse> {
  const settings = await getSettings(db);
  const reviewSince = new Date(now.getTime() - settings.reviewWaitDays * DAY_MS);
  const notices = (await store.watchedRuns(db, now, reviewSince)).map((r) =>
    runNotice(r, now, settings.reviewWaitDays),
  );
  const scheduledAt = settings.scheduleEnabled
    ? lastScheduledTime(settings.scheduleCron, settings.regionTimeZone, now)
    : null;
  if (scheduledAt && now.getTime() - scheduledAt.getTime() > START_GRACE_MS) {
    for (const track of await store.tracksWithoutRunSince(db, scheduledAt)) {
      notices.push({
        key: `not-started:${track.code}:${scheduledAt.toISOString()}`,
        kind: 'not_started',
        track,
        runId: null,
        since: scheduledAt.toISOString(),
        message: `No run of ${track.name} started for the schedule of ${scheduledAt.toISOString().slice(0, 16).replace('T', ' ')} UTC: check the schedule and the workers, or start the run by hand.`,
        href: `/runs?track=${encodeURIComponent(track.code)}`,
      });
    }
  }
  notices.sort((a, b) => a.since.localeCompare(b.since) || a.key.localeCompare(b.key));
  return { notices, reviewWaitDays: settings.reviewWaitDays, checkedAt: now.toISOString() };
}

const SUBJECT: Record<RunNotice['kind'], string> = {
  failed: 'scheduled run failed',
  not_started: 'scheduled run did not start',
  review_overdue: 'run waiting in review',
};

/** The e-mail of one notice. */
export function noticeMail(n: RunNotice, publicUrl: string): { subject: string; text: string } {
  return {
    subject: `Crestwatch · ${n.track.name}: ${SUBJECT[n.kind]}${n.runId ? ` (#${n.runId})` : ''}`,
    text: [
      n.message,
      '',
      `Open: ${publicUrl}${n.href}`,
      '',
      'You receive this because you are an analyst or admin of Crestwatch; each problem is sent once.',
    ].join('\n'),
  };
}

/** Queues each notice once per staff member; returns how many notices there were and mails were new. */
export async function mailRunNotices(
  ctx: Pick<AppContext, 'db' | 'config'>,
  now = new Date(),
): Promise<{ notices: number; queued: number }> {
  const { notices } = await runNotices(ctx.db, now);
  if (!notices.length) return { notices: 0, queued: 0 };
  const staff = await store.staffRecipients(ctx.db);
  const mails: QueuedMail[] = notices.flatMap((n) =>
    staff.map((p) => ({
      dedupeKey: `run-watch:${n.key}:user-${p.id}`,
      userId: p.id,
      runId: n.runId,
      to: p.email,
      message: noticeMail(n, ctx.config.publicUrl),
    })),
  );
  const queued = await ctx.db.transaction((trx) => enqueue(trx, mails));
  return { notices: notices.length, queued };
}
