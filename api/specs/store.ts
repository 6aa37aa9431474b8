import type { Knex } from 'knex';
import type { SavedSpec, SavedSpecInput } from './schema';

function toSpec(r: Record<string, unknown>): SavedSpec {
  return {
    id: Number(r.id),
    name: String(r.name),
    description: String(r.description),
    emissionsIndicator: String(r.emissions_indicator),
    driverIndicator: String(r.driver_indicator),
    controls: r.controls as string[],
    levelControls: r.level_controls as string[],
    form: r.form as SavedSpec['form'],
    transform: r.transform as SavedSpec['transform'],
    covariance: r.covariance as SavedSpec['covariance'],
    lag: r.lag === null ? undefined : Number(r.lag),
    intervalMethod: r.interval_method as SavedSpec['intervalMethod'],
    firstYear: r.first_year === null ? null : Number(r.first_year),
    lastYear: r.last_year === null ? null : Number(r.last_year),
    minYears: r.min_years === null ? null : Number(r.min_years),
    tracks: [],
    archived: Boolean(r.archived),
    createdAt: new Date(r.created_at as string).toISOString(),
    updatedAt: new Date(r.updated_at as string).toISOString(),
  };
}

function toRow(s: SavedSpecInput) {
  return {
    name: s.name,
    description: s.description,
    emissions_indicator: s.emissionsIndicator,
    driver_indicator: s.driverIndicator,
    controls: s.controls,
    level_controls: s.levelControls,
    form: s.form,
    transform: s.transform,
    covariance: s.covariance,
    lag: s.lag ?? null,
    interval_method: s.intervalMethod,
    first_year: s.firstYear,
    last_year: s.lastYear,
    min_years: s.minYears,
  };
}

/** Fills each spec's `tracks`: the names of the tracks (not archived) whose runs use it. */
async function withTracks(db: Knex, specs: SavedSpec[]): Promise<SavedSpec[]> {
  if (!specs.length) return specs;
  const rows: { spec_id: number; name: string }[] = await db('tracks')
    .whereIn(
      'spec_id',
      specs.map((s) => s.id),
    )
    .whereNot('state', 'archived')
    .orderBy('name')
    .select('spec_id', 'name');
  for (const s of specs) s.tracks = rows.filter((r) => Number(r.spec_id) === s.id).map((r) => String(r.name));
  return specs;
}

/** Specs a track uses first, then by name. */
export async function list(db: Knex, includeArchived = false): Promise<SavedSpec[]> {
  const q = db('model_specs').orderBy('name');
  if (!includeArchived) q.where({ archived: false });
  const specs = await withTracks(db, (await q.select('*')).map(toSpec));
  return specs.sort((a, b) => Number(b.tracks.length > 0) - Number(a.tracks.length > 0));
}

export async function find(db: Knex, id: number): Promise<SavedSpec | null> {
  const r = await db('model_specs').where({ id }).first();
  return r ? (await withTracks(db, [toSpec(r)]))[0] : null;
}

/** The oldest spec still in the library, if any. */
export async function findOldest(db: Knex): Promise<SavedSpec | null> {
  const r = await db('model_specs').where({ archived: false }).orderBy('id').first();
  return r ? (await withTracks(db, [toSpec(r)]))[0] : null;
}

/** The spec of the headline track (the setting's track, else the first one not archived). */
export async function headlineSpecId(db: Knex): Promise<number | null> {
  const r = await db('tracks as t')
    .leftJoin('settings as s', function () {
      this.on('s.key', '=', db.raw('?', ['headline_track'])).andOn('s.value', '=', db.raw('to_jsonb(t.code)'));
    })
    .whereNot('t.state', 'archived')
    .orderByRaw('(s.key IS NOT NULL) DESC, t.id')
    .first('t.spec_id');
  return r ? Number(r.spec_id) : null;
}

export async function insert(db: Knex, s: SavedSpecInput, userId: number | null): Promise<SavedSpec> {
  const [r] = await db('model_specs')
    .insert({ ...toRow(s), created_by: userId })
    .returning('*');
  return toSpec(r);
}

export async function update(db: Knex, id: number, s: SavedSpecInput): Promise<SavedSpec> {
  const [r] = await db('model_specs')
    .where({ id })
    .update({ ...toRow(s), updated_at: db.fn.now() })
    .returning('*');
  return (await withTracks(db, [toSpec(r)]))[0];
}

export async function archive(db: Knex, id: number): Promise<void> {
  await db('model_specs').where({ id }).update({ archived: true, updated_at: db.fn.now() });
}

/** Codes of the tracks (not archived) whose next run uses this spec. */
export async function trackCodesUsing(db: Knex, specId: number): Promise<string[]> {
  const rows: { code: string }[] = await db('tracks')
    .where({ spec_id: specId })
    .whereNot('state', 'archived')
    .orderBy('code')
    .select('code');
  return rows.map((r) => String(r.code));
}
