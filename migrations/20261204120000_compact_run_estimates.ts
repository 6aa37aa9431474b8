import type { Knex } from 'knex';

/**
 * Compact run records (see api/runs/estimate-record.ts): records written before lose the
 * fields no screen, brief, export or alert reads — the terms' standard errors and
 * p-values and the residual standard error; sensitivity variants keep only what their
 * summaries show — so a reproduction of an older run compares like with like. The
 * records are compressed with lz4 where the server has it: far cheaper to write than
 * the default pglz at a similar size for these JSON documents.
 */
const VARIANT_BLANKS = {
  terms: [],
  coefficients: [],
  rSquared: null,
  turningPoints: [],
  uTest: null,
  wald: null,
  elasticity: null,
  trendPerYear: null,
};

export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    `UPDATE run_estimates
        SET result = (result - 'standardErrors' - 'pValues' - 'residualStandardError')
                     || CASE WHEN variant = 'main' THEN '{}'::jsonb ELSE ?::jsonb END
      WHERE jsonb_exists_any(result, array['standardErrors', 'pValues', 'residualStandardError'])`,
    [JSON.stringify(VARIANT_BLANKS)],
  );
  const { rows } = await knex.raw(
    `SELECT 'lz4' = ANY(enumvals) AS lz4 FROM pg_settings WHERE name = 'default_toast_compression'`,
  );
  if (rows[0]?.lz4) await knex.raw(`ALTER TABLE run_estimates ALTER COLUMN result SET COMPRESSION lz4`);
}

export async function down(knex: Knex): Promise<void> {
  // The dropped fields are recomputed by reproducing a run; only the compression goes back.
  await knex.raw(`ALTER TABLE run_estimates ALTER COLUMN result SET COMPRESSION default`);
}
