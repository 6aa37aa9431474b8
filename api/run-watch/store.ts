/** The scheduled-run watch's SQL: scheduled runs that need a person, missed starts, and staff to tell. */
import type { Knex } from 'knex';

export interface WatchedRunRow {
  id: number;
  state: 'failed' | 'queued' | 'in_review';
  createdAt: string;
  finishedAt: string | null;
  error: string | null;
  trackCode: string;
  trackName: string;
}

const iso = (v: unknown): string => new Date(v as string).toISOString();

/**
 * Scheduled runs of live tracks that need a person: failed with no later run of their track,
 * still queued an hour after they were created, or in review since before `reviewSince`.
 */
export async function watchedRuns(db: Knex, now: Date, reviewSince: Date): Promise<WatchedRunRow[]> {
  const { rows } = await db.raw(
    `SELECT r.id, r.state, r.created_at, r.finished_at, r.error, t.code AS track_code, t.name AS track_name
       FROM runs r JOIN tracks t ON t.id = r.track_id
      WHERE r.trigger = 'schedule' AND t.state <> 'archived'
        AND (
          (r.state = 'failed'
             AND NOT EXISTS (SELECT 1 FROM runs n WHERE n.track_id = r.track_id AND n.created_at > r.created_at))
          OR (r.state = 'queued' AND r.started_at IS NULL AND r.created_at < ?::timestamptz - interval '1 hour')
          OR (r.state = 'in_review' AND coalesce(r.finished_at, r.created_at) < ?::timestamptz)
        )
      ORDER BY r.created_at, r.id`,
    [now.toISOString(), reviewSince.toISOString()],
  );
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    state: r.state as WatchedRunRow['state'],
    createdAt: iso(r.created_at),
    finishedAt: r.finished_at ? iso(r.finished_at) : null,
    error: (r.error as string | null) ?? null,
    trackCode: String(r.track_code),
    trackName: String(r.track_name),
  }));
}

/**
 * Active tracks that existed at `scheduledAt` and have no run created since then (a minute
 * of slack for clocks): the scheduled start did not happen at all.
 */
export async function tracksWithoutRunSince(db: Knex, scheduledAt: Date): Promise<{ code: string; name: string }[]> {
  const { rows } = await db.raw(
    `SELECT t.code, t.name FROM tracks t
      WHERE t.state = 'active' AND t.created_at < ?::timestamptz
        AND NOT EXISTS (
          SELECT 1 FROM runs r WHERE r.track_id = t.id AND r.created_at >= ?::timestamptz - interval '1 minute')
      ORDER BY t.code`,
    [scheduledAt.toISOString(), scheduledAt.toISOString()],
  );
  return rows.map((r: { code: string; name: string }) => ({ code: r.code, name: r.name }));
}

/** Active admins and analysts: the people a run notice is for. */
export async function staffRecipients(db: Knex): Promise<{ id: number; email: string }[]> {
  return db('users').where({ active: true }).whereIn('role', ['admin', 'analyst']).orderBy('id').select('id', 'email');
}
