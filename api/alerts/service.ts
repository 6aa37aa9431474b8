/**
 * Alerts on publish: each district of the new run is compared with the previous published
 * run; one alert per district, kind and run (a unique key), and one outbox row per
 * (alert, instant subscriber) or per (run, digest subscriber). The feed shows a person the
 * alerts their subscriptions cover, newest first, unread marked.
 */
import type { Knex } from 'knex';
import type { Config } from '../config';
import type { Caller } from '../http/routes';
import { NotFoundError } from '../http/errors';
import { digestMail, instantMail, type AlertForMail } from '../outbox/messages';
import * as runStore from '../runs/store';
import * as subStore from '../subscriptions/store';
import { unsubscribeToken } from '../subscriptions/token';
import { alertsFor, type AlertKind } from './compare';

export async function createAlertsForPublish(
  trx: Knex.Transaction,
  run: runStore.RunRow,
  previous: runStore.RunRow | null,
  shiftPercent: number,
  config: Pick<Config, 'publicUrl' | 'sessionSecret'>,
): Promise<{ alerts: number; mails: number }> {
  if (!previous) return { alerts: 0, mails: 0 };
  const [next, prev] = await Promise.all([runStore.listEstimateRows(trx, run.id), runStore.listEstimateRows(trx, previous.id)]);
  const prevById = new Map(prev.map((p) => [p.districtId, p]));
  const drafts = next.flatMap((n) =>
    alertsFor(prevById.get(n.districtId) ?? null, n, shiftPercent).map((a) => ({
      run_id: run.id,
      previous_run_id: previous.id,
      district_id: n.districtId,
      kind: a.kind,
      details: JSON.stringify({ ...a.details, districtCode: n.code, districtName: n.name }),
    })),
  );
  if (!drafts.length) return { alerts: 0, mails: 0 };
  const inserted: { id: number; district_id: number; kind: AlertKind; details: Record<string, unknown> }[] = await trx('alerts')
    .insert(drafts)
    .onConflict(['run_id', 'district_id', 'kind'])
    .ignore()
    .returning(['id', 'district_id', 'kind', 'details']);
  const subs = await subStore.subscribersFor(trx);
  const outbox: Record<string, unknown>[] = [];
  const forMail = (a: (typeof inserted)[number]): AlertForMail => ({
    id: a.id,
    kind: a.kind,
    details: a.details,
    districtCode: String(a.details.districtCode),
    districtName: String(a.details.districtName),
    runId: run.id,
  });
  for (const s of subs) {
    const matched = inserted.filter((a) => s.kinds.includes(a.kind) && (s.scope === 'region' || s.districtIds.includes(a.district_id)));
    if (!matched.length) continue;
    const unsubscribeUrl = `${config.publicUrl}/api/subscriptions/unsubscribe?token=${unsubscribeToken(config.sessionSecret, s.id)}`;
    if (s.delivery === 'instant') {
      for (const a of matched) {
        outbox.push({
          dedupe_key: `alert:${a.id}:user:${s.userId}`,
          user_id: s.userId,
          run_id: run.id,
          to_address: s.email,
          message: JSON.stringify(instantMail(forMail(a), config.publicUrl, unsubscribeUrl)),
        });
      }
    } else {
      outbox.push({
        dedupe_key: `digest:${run.id}:user:${s.userId}`,
        user_id: s.userId,
        run_id: run.id,
        to_address: s.email,
        message: JSON.stringify({
          ...digestMail(matched.map(forMail), run.id, config.publicUrl, unsubscribeUrl, s.attachBrief),
          attachments: s.attachBrief ? [{ kind: 'region_brief', runId: run.id }] : [],
        }),
      });
    }
  }
  // One person with two overlapping subscriptions still gets each alert once.
  if (outbox.length) await trx('outbox').insert(outbox).onConflict('dedupe_key').ignore();
  return { alerts: inserted.length, mails: outbox.length };
}

export interface FeedItem {
  id: number;
  runId: number;
  kind: AlertKind;
  districtCode: string;
  districtName: string;
  details: Record<string, unknown>;
  createdAt: string;
  read: boolean;
}

/** The caller's feed: alerts their subscriptions cover (optionally one district's). */
export async function feed(db: Knex, caller: Caller, opts: { districtCode?: string; limit: number; unreadOnly?: boolean }): Promise<FeedItem[]> {
  const rows = await db.raw(
    `SELECT a.id, a.run_id, a.kind, a.details, a.created_at, d.code, d.name, (r.alert_id IS NOT NULL) AS read
       FROM alerts a
       JOIN districts d ON d.id = a.district_id
       LEFT JOIN alert_reads r ON r.alert_id = a.id AND r.user_id = :user
      WHERE EXISTS (SELECT 1 FROM subscriptions s WHERE s.user_id = :user AND a.kind = ANY(s.kinds)
                      AND (s.scope = 'region' OR a.district_id = ANY(s.district_ids)))
        AND (:code::text IS NULL OR d.code = :code::text)
        AND (NOT :unreadOnly OR r.alert_id IS NULL)
      ORDER BY a.created_at DESC, a.id DESC
      LIMIT :limit`,
    { user: caller.id, code: opts.districtCode ?? null, limit: opts.limit, unreadOnly: Boolean(opts.unreadOnly) },
  );
  return rows.rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    runId: Number(r.run_id),
    kind: r.kind as AlertKind,
    districtCode: String(r.code),
    districtName: String(r.name),
    details: r.details as Record<string, unknown>,
    createdAt: new Date(r.created_at as string).toISOString(),
    read: Boolean(r.read),
  }));
}

/** Every alert of a district (any reader: it is what the published runs said). */
export async function districtAlerts(db: Knex, code: string, limit: number) {
  const rows = await db('alerts as a')
    .join('districts as d', 'd.id', 'a.district_id')
    .where('d.code', code)
    .orderBy([{ column: 'a.created_at', order: 'desc' }, { column: 'a.id', order: 'desc' }])
    .limit(limit)
    .select('a.id', 'a.run_id', 'a.kind', 'a.details', 'a.created_at');
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    runId: Number(r.run_id),
    kind: r.kind as AlertKind,
    details: r.details,
    createdAt: new Date(r.created_at as string).toISOString(),
  }));
}

export async function markRead(db: Knex, caller: Caller, alertId: number): Promise<void> {
  const exists = await db('alerts').where({ id: alertId }).first('id');
  if (!exists) throw new NotFoundError(`No alert ${alertId}`, { id: alertId });
  await db('alert_reads').insert({ alert_id: alertId, user_id: caller.id }).onConflict(['alert_id', 'user_id']).ignore();
}
