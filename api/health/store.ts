/** The health check's one query. */
import type { Knex } from 'knex';

/** True when the database answers a trivial query. */
export async function databaseAnswers(db: Knex): Promise<boolean> {
  try {
    await db.raw('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
