/**
 * Alerts on publish: each district of the new run is compared with the previous published
 * run of the same track (never another track's); one alert per district, kind and run (a unique key), and one queued e-mail per
 * (alert, instant subscriber) or per (run, digest subscriber). The feed shows a person the
 * alerts their subscriptions cover, newest first, unread marked.
 */
import type { Knex } from 'knex';
import type { Config } from '../config';
import { comparableEstimates } from '../estimates/service';
import { NotFoundError } from '../http/errors';
import type { Caller } from '../http/routes';
import { enqueue, type QueuedMail } from '../outbox/service';
import { activeSubscribers, coversTrack, unsubscribeUrl } from '../subscriptions/service';
import { trackById } from '../tracks/service';
import { alertsFor } from './compare';
import { digestMail, instantMail, type AlertForMail } from './messages';
import * as store from './store';

export type { FeedRow as FeedItem } from './store';

/**
 * Raises the alerts of a publish inside its transaction: `run` against `previous` (the
 * published run of the same track it replaces; none, no alerts: a track's first publish
 * raises none), and queues the e-mails they call for, to subscribers of that track.
 */
export async function createAlertsForPublish(
  trx: Knex.Transaction,
  run: { id: number; trackId: number },
  previous: { id: number; trackId: number } | null,
  shiftPercent: number,
  config: Pick<Config, 'publicUrl' | 'sessionSecret'>,
): Promise<{ alerts: number; mails: number }> {
  if (!previous) return { alerts: 0, mails: 0 };
  if (previous.trackId !== run.trackId)
    throw new Error(`Run #${run.id} and run #${previous.id} belong to different tracks: alerts never compare tracks.`);
  const track = await trackById(trx, run.trackId);
  const [next, prev] = await Promise.all([comparableEstimates(trx, run.id), comparableEstimates(trx, previous.id)]);
  const prevById = new Map(prev.map((p) => [p.districtId, p]));
  const drafts = next.flatMap((n) =>
    alertsFor(prevById.get(n.districtId) ?? null, n, shiftPercent).map((a) => ({
      runId: run.id,
      previousRunId: previous.id,
      districtId: n.districtId,
      kind: a.kind,
      details: { ...a.details, districtCode: n.code, districtName: n.name },
    })),
  );
  if (!drafts.length) return { alerts: 0, mails: 0 };
  const inserted = await store.insertAlerts(trx, drafts);
  // An archived track's subscriptions stop; otherwise those covering this track are asked.
  const subs = track.state === 'archived' ? [] : (await activeSubscribers(trx)).filter((s) => coversTrack(s, track.id));
  const mails: QueuedMail[] = [];
  const forMail = (a: store.InsertedAlert): AlertForMail => ({
    id: a.id,
    kind: a.kind,
    details: a.details,
    districtCode: String(a.details.districtCode),
    districtName: String(a.details.districtName),
    runId: run.id,
    track: { code: track.code, name: track.name },
  });
  for (const s of subs) {
    const matched = inserted.filter(
      (a) => s.kinds.includes(a.kind) && (s.scope === 'region' || s.districtIds.includes(a.districtId)),
    );
    if (!matched.length) continue;
    const unsubscribe = unsubscribeUrl(config, s.id);
    if (s.delivery === 'instant') {
      for (const a of matched) {
        mails.push({
          dedupeKey: `alert:${a.id}:user:${s.userId}`,
          userId: s.userId,
          runId: run.id,
          to: s.email,
          message: instantMail(forMail(a), config.publicUrl, unsubscribe),
        });
      }
    } else {
      mails.push({
        dedupeKey: `digest:${run.id}:user:${s.userId}`,
        userId: s.userId,
        runId: run.id,
        to: s.email,
        message: {
          ...digestMail(matched.map(forMail), run.id, config.publicUrl, unsubscribe, s.attachBrief),
          attachments: s.attachBrief ? [{ kind: 'region_brief', runId: run.id }] : [],
        },
      });
    }
  }
  // One person with two overlapping subscriptions still gets each alert once (the dedupe key).
  await enqueue(trx, mails);
  return { alerts: inserted.length, mails: mails.length };
}

/** The caller's feed: alerts their subscriptions cover (optionally one district's). */
export function feed(
  db: Knex,
  caller: Caller,
  opts: { districtCode?: string; track?: string; limit: number; unreadOnly?: boolean },
): Promise<store.FeedRow[]> {
  return store.feedFor(db, caller.id, opts);
}

/** Every alert of a district (any reader: it is what the published runs said), optionally one track's. */
export function districtAlerts(db: Knex, code: string, limit: number, track?: string) {
  return store.listForDistrict(db, code, limit, track);
}

export async function markRead(db: Knex, caller: Caller, alertId: number): Promise<void> {
  if (!(await store.alertExists(db, alertId))) throw new NotFoundError(`No alert ${alertId}`, { id: alertId });
  await store.markRead(db, alertId, caller.id);
}
