import type { Knex } from 'knex';

export async function readAll(db: Knex): Promise<Record<string, unknown>> {
  const rows: { key: string; value: unknown }[] = await db('settings').select('key', 'value');
  return Object.fromEntries(rows.map((r) => [r.key, r.value]));
}

export async function write(db: Knex, values: Record<string, unknown>, userId: number | null): Promise<void> {
  for (const [key, value] of Object.entries(values)) {
    await db('settings')
      .insert({ key, value: JSON.stringify(value), updated_by: userId, updated_at: db.fn.now() })
      .onConflict('key')
      .merge();
  }
}
