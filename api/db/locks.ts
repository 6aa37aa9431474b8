/**
 * Named PostgreSQL advisory locks, one id each, so two unrelated jobs never wait on one
 * another by sharing a number. Take them with `pg_advisory_xact_lock` inside a transaction
 * (released at commit or rollback).
 */
import type { Knex } from 'knex';

export const LOCKS = {
  /** Loading the demo region (first start and reseed). */
  demoSeed: 20261201,
  /** Every change to the observations: uploads, reverts, recomputed derived series, the demo load. */
  observations: 20261202,
  /** Publishing a run, so "the previous published run" is well defined. */
  publish: 20261203,
  /** Creating the default model spec on first use. */
  starterSpec: 20261204,
  /** Creating the first track (the headline) on first use. */
  headlineTrack: 20261205,
} as const;

export type LockName = keyof typeof LOCKS;

/** Waits for the named lock inside `trx`; it is released when the transaction ends. */
export async function lockForTransaction(trx: Knex.Transaction, name: LockName): Promise<void> {
  await trx.raw('SELECT pg_advisory_xact_lock(?)', [LOCKS[name]]);
}
