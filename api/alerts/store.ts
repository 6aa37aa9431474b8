/** Alerts and who read them: the only place their SQL lives; rows come back camelCased. */
import type { Knex } from 'knex';
import type { AlertKind } from '../common/alert-kinds';

export interface NewAlert {
  runId: number;
  previousRunId: number;
  districtId: number;
  kind: AlertKind;
  details: Record<string, unknown>;
}

export interface InsertedAlert {
  id: number;
  districtId: number;
  kind: AlertKind;
  details: Record<string, unknown>;
}

/** Inserts alerts; one per (run, district, kind), so a repeat is skipped. Returns the new ones. */
export async function insertAlerts(db: Knex, alerts: NewAlert[]): Promise<InsertedAlert[]> {
  if (!alerts.length) return [];
  const rows = await db('alerts')
    .insert(
      alerts.map((a) => ({
        run_id: a.runId,
        previous_run_id: a.previousRunId,
        district_id: a.districtId,
        kind: a.kind,
        details: JSON.stringify(a.details),
      })),
    )
    .onConflict(['run_id', 'district_id', 'kind'])
    .ignore()
    .returning(['id', 'district_id', 'kind', 'details']);
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    districtId: Number(r.district_id),
    kind: r.kind as AlertKind,
    details: r.details as Record<string, unknown>,
  }));
}

export interface FeedRow {
  id: number;
  runId: number;
  track: string;
  trackName: string;
  kind: AlertKind;
  districtCode: string;
  districtName: string;
  details: Record<string, unknown>;
  createdAt: string;
  read: boolean;
}

/**
 * The alerts a person's subscriptions cover (district, kind and track; optionally one
 * district's or one track's), newest first; alerts of archived tracks are left out.
 */
export async function feedFor(
  db: Knex,
  userId: number,
  opts: { districtCode?: string; track?: string; limit: number; unreadOnly?: boolean },
): Promise<FeedRow[]> {
  const rows = await db.raw(
    `SELECT a.id, a.run_id, a.kind, a.details, a.created_at, d.code, d.name, (r.alert_id IS NOT NULL) AS read,
            t.code AS track, t.name AS track_name
       FROM alerts a
       JOIN districts d ON d.id = a.district_id
       JOIN runs ru ON ru.id = a.run_id
       JOIN tracks t ON t.id = ru.track_id
       LEFT JOIN alert_reads r ON r.alert_id = a.id AND r.user_id = :user
      WHERE EXISTS (SELECT 1 FROM subscriptions s WHERE s.user_id = :user AND a.kind = ANY(s.kinds)
                      AND (s.scope = 'region' OR a.district_id = ANY(s.district_ids))
                      AND (s.all_tracks OR t.id = ANY(s.track_ids)))
        AND t.state <> 'archived'
        AND (:track::text IS NULL OR t.code = :track::text)
        AND (:code::text IS NULL OR d.code = :code::text)
        AND (NOT :unreadOnly OR r.alert_id IS NULL)
      ORDER BY a.created_at DESC, a.id DESC
      LIMIT :limit`,
    {
      user: userId,
      code: opts.districtCode ?? null,
      track: opts.track ?? null,
      limit: opts.limit,
      unreadOnly: Boolean(opts.unreadOnly),
    },
  );
  return rows.rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    runId: Number(r.run_id),
    track: String(r.track),
    trackName: String(r.track_name),
    kind: r.kind as AlertKind,
    districtCode: String(r.code),
    districtName: String(r.name),
    details: r.details as Record<string, unknown>,
    createdAt: new Date(r.created_at as string).toISOString(),
    read: Boolean(r.read),
  }));
}

/** Every alert of the district with this code (optionally one track's; archived tracks left out), newest first. */
export async function listForDistrict(db: Knex, code: string, limit: number, track?: string) {
  const q = db('alerts as a')
    .join('districts as d', 'd.id', 'a.district_id')
    .join('runs as ru', 'ru.id', 'a.run_id')
    .join('tracks as t', 't.id', 'ru.track_id')
    .where('d.code', code)
    .whereNot('t.state', 'archived');
  if (track) q.where('t.code', track);
  const rows = await q
    .orderBy([
      { column: 'a.created_at', order: 'desc' },
      { column: 'a.id', order: 'desc' },
    ])
    .limit(limit)
    .select('a.id', 'a.run_id', 'a.kind', 'a.details', 'a.created_at', 't.code as track', 't.name as track_name');
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    runId: Number(r.run_id),
    track: String(r.track),
    trackName: String(r.track_name),
    kind: r.kind as AlertKind,
    details: r.details,
    createdAt: new Date(r.created_at as string).toISOString(),
  }));
}

export async function alertExists(db: Knex, id: number): Promise<boolean> {
  return Boolean(await db('alerts').where({ id }).first('id'));
}

export async function markRead(db: Knex, alertId: number, userId: number): Promise<void> {
  await db('alert_reads').insert({ alert_id: alertId, user_id: userId }).onConflict(['alert_id', 'user_id']).ignore();
}
