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
    isDefault: Boolean(r.is_default),
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
    is_default: s.isDefault,
  };
}

export async function list(db: Knex, includeArchived = false): Promise<SavedSpec[]> {
  const q = db('model_specs').orderBy([{ column: 'is_default', order: 'desc' }, { column: 'name' }]);
  if (!includeArchived) q.where({ archived: false });
  return (await q.select('*')).map(toSpec);
}

export async function find(db: Knex, id: number): Promise<SavedSpec | null> {
  const r = await db('model_specs').where({ id }).first();
  return r ? toSpec(r) : null;
}

export async function findDefault(db: Knex): Promise<SavedSpec | null> {
  const r = await db('model_specs').where({ is_default: true, archived: false }).first();
  return r ? toSpec(r) : null;
}

export async function clearDefault(db: Knex): Promise<void> {
  await db('model_specs').where({ is_default: true }).update({ is_default: false });
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
  return toSpec(r);
}

export async function archive(db: Knex, id: number): Promise<void> {
  await db('model_specs').where({ id }).update({ archived: true, is_default: false, updated_at: db.fn.now() });
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
