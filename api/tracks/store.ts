/** Tracks, the headline-track setting and the indicator labels tracks show: the only place their SQL lives. */
import type { Knex } from 'knex';
import type { IndicatorLabel, TrackState } from '../../contracts/tracks';

export interface TrackRow {
  id: number;
  code: string;
  name: string;
  emissionsIndicator: string;
  specId: number;
  specName: string;
  state: TrackState;
  createdAt: string;
  updatedAt: string;
  /** the track's latest published run, if any */
  publishedRunId: number | null;
  publishedAt: string | null;
}

const iso = (v: unknown) => (v ? new Date(v as string).toISOString() : null);

const SELECT = `
  SELECT t.id, t.code, t.name, t.emissions_indicator, t.spec_id, s.name AS spec_name, t.state,
         t.created_at, t.updated_at, p.id AS published_run_id, p.published_at
    FROM tracks t
    JOIN model_specs s ON s.id = t.spec_id
    LEFT JOIN LATERAL (
      SELECT r.id, r.published_at FROM runs r
       WHERE r.track_id = t.id AND r.state = 'published'
       ORDER BY r.published_at DESC, r.id DESC LIMIT 1
    ) p ON true`;

function toTrack(r: Record<string, unknown>): TrackRow {
  return {
    id: Number(r.id),
    code: String(r.code),
    name: String(r.name),
    emissionsIndicator: String(r.emissions_indicator),
    specId: Number(r.spec_id),
    specName: String(r.spec_name),
    state: r.state as TrackState,
    createdAt: iso(r.created_at)!,
    updatedAt: iso(r.updated_at)!,
    publishedRunId: r.published_run_id === null || r.published_run_id === undefined ? null : Number(r.published_run_id),
    publishedAt: iso(r.published_at),
  };
}

/** Every track, in creation order. */
export async function list(db: Knex): Promise<TrackRow[]> {
  const { rows } = await db.raw(`${SELECT} ORDER BY t.id`);
  return rows.map(toTrack);
}

export async function findByCode(db: Knex, code: string): Promise<TrackRow | null> {
  const { rows } = await db.raw(`${SELECT} WHERE t.code = ?`, [code]);
  return rows[0] ? toTrack(rows[0]) : null;
}

export async function findById(db: Knex, id: number): Promise<TrackRow | null> {
  const { rows } = await db.raw(`${SELECT} WHERE t.id = ?`, [id]);
  return rows[0] ? toTrack(rows[0]) : null;
}

export async function findByIndicator(db: Knex, indicator: string): Promise<TrackRow | null> {
  const { rows } = await db.raw(`${SELECT} WHERE t.emissions_indicator = ? ORDER BY t.id LIMIT 1`, [indicator]);
  return rows[0] ? toTrack(rows[0]) : null;
}

/** Ids of the tracks with these codes (unknown codes are left out). */
export async function idsByCodes(db: Knex, codes: string[]): Promise<{ id: number; code: string }[]> {
  if (!codes.length) return [];
  const rows: { id: number; code: string }[] = await db('tracks').whereIn('code', codes).select('id', 'code');
  return rows.map((r) => ({ id: Number(r.id), code: String(r.code) }));
}

/** Codes of the tracks with these ids, in id order. */
export async function codesByIds(db: Knex, ids: number[]): Promise<string[]> {
  if (!ids.length) return [];
  const rows: { code: string }[] = await db('tracks').whereIn('id', ids).orderBy('id').select('code');
  return rows.map((r) => String(r.code));
}

export async function insert(
  db: Knex,
  t: { code: string; name: string; emissionsIndicator: string; specId: number; createdBy: number | null },
): Promise<number> {
  const [r] = await db('tracks')
    .insert({
      code: t.code,
      name: t.name,
      emissions_indicator: t.emissionsIndicator,
      spec_id: t.specId,
      created_by: t.createdBy,
    })
    .returning('id');
  return Number(r.id);
}

export async function update(
  db: Knex,
  id: number,
  patch: { name?: string; state?: TrackState; specId?: number },
): Promise<void> {
  const row: Record<string, unknown> = { updated_at: db.fn.now() };
  if (patch.name !== undefined) row.name = patch.name;
  if (patch.state !== undefined) row.state = patch.state;
  if (patch.specId !== undefined) row.spec_id = patch.specId;
  await db('tracks').where({ id }).update(row);
}

/** The headline track's code as the setting holds it (null when never set). */
export async function headlineCode(db: Knex): Promise<string | null> {
  const r = await db('settings').where({ key: 'headline_track' }).first('value');
  return typeof r?.value === 'string' ? r.value : null;
}

export async function setHeadlineCode(db: Knex, code: string, userId: number | null): Promise<void> {
  await db('settings')
    .insert({ key: 'headline_track', value: JSON.stringify(code), updated_by: userId, updated_at: db.fn.now() })
    .onConflict('key')
    .merge();
}

/** The catalogue's label (name, unit, source, licence) of each indicator code given. */
export async function indicatorLabels(db: Knex, codes: string[]): Promise<Map<string, IndicatorLabel>> {
  const wanted = [...new Set(codes)];
  if (!wanted.length) return new Map();
  const rows: Record<string, unknown>[] = await db('indicators')
    .whereIn('code', wanted)
    .select('code', 'name', 'unit', 'source', 'licence');
  return new Map(
    rows.map((r) => [
      String(r.code),
      {
        code: String(r.code),
        name: String(r.name),
        unit: String(r.unit),
        source: (r.source as string | null) ?? null,
        licence: (r.licence as string | null) ?? null,
      },
    ]),
  );
}
