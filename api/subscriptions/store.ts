import type { Knex } from 'knex';
import type { AlertKind } from '../common/alert-kinds';

export interface SubscriptionRow {
  id: number;
  userId: number;
  scope: 'district' | 'districts' | 'region';
  districtIds: number[];
  districtCodes: string[];
  kinds: AlertKind[];
  delivery: 'instant' | 'digest';
  attachBrief: boolean;
  /** every track (including tracks created later), or only those in trackIds */
  allTracks: boolean;
  trackIds: number[];
  trackCodes: string[];
  createdAt: string;
}

const select = `s.*, coalesce((SELECT array_agg(d.code ORDER BY d.code) FROM districts d WHERE d.id = ANY(s.district_ids)), '{}') AS district_codes,
  coalesce((SELECT array_agg(t.code ORDER BY t.id) FROM tracks t WHERE t.id = ANY(s.track_ids)), '{}') AS track_codes`;

function toRow(r: Record<string, unknown>): SubscriptionRow {
  return {
    id: Number(r.id),
    userId: Number(r.user_id),
    scope: r.scope as SubscriptionRow['scope'],
    districtIds: (r.district_ids as number[]).map(Number),
    districtCodes: r.district_codes as string[],
    kinds: r.kinds as AlertKind[],
    delivery: r.delivery as SubscriptionRow['delivery'],
    attachBrief: Boolean(r.attach_brief),
    allTracks: Boolean(r.all_tracks),
    trackIds: ((r.track_ids as number[] | null) ?? []).map(Number),
    trackCodes: (r.track_codes as string[] | null) ?? [],
    createdAt: new Date(r.created_at as string).toISOString(),
  };
}

export async function listForUser(db: Knex, userId: number): Promise<SubscriptionRow[]> {
  return (await db('subscriptions as s').where('s.user_id', userId).orderBy('s.id').select(db.raw(select))).map(toRow);
}

export async function find(db: Knex, id: number): Promise<SubscriptionRow | null> {
  const r = await db('subscriptions as s').where('s.id', id).first(db.raw(select));
  return r ? toRow(r) : null;
}

export async function insert(
  db: Knex,
  s: Omit<SubscriptionRow, 'id' | 'createdAt' | 'districtCodes' | 'trackCodes'>,
): Promise<number> {
  const [r] = await db('subscriptions')
    .insert({
      user_id: s.userId,
      scope: s.scope,
      district_ids: s.districtIds,
      kinds: s.kinds,
      delivery: s.delivery,
      attach_brief: s.attachBrief,
      all_tracks: s.allTracks,
      track_ids: s.trackIds,
    })
    .returning('id');
  return Number(r.id);
}

export async function remove(db: Knex, id: number): Promise<number> {
  return db('subscriptions').where({ id }).del();
}

/** Active people whose subscriptions cover a district, with the matching kinds and delivery. */
export async function subscribersFor(db: Knex): Promise<(SubscriptionRow & { email: string })[]> {
  const rows = await db('subscriptions as s')
    .join('users as u', 'u.id', 's.user_id')
    .where('u.active', true)
    .select(db.raw(select), 'u.email');
  return rows.map((r: Record<string, unknown>) => ({ ...toRow(r), email: String(r.email) }));
}
