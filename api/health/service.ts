/**
 * Whether the database answers, as the health check reports it. A load balancer or monitor
 * may ask many times a second; the database is asked at most once per PROBE_MS per process,
 * and callers arriving while a probe is out share it (common practice for health checks:
 * the check must be cheap enough never to be the load). The answer is at most PROBE_MS old.
 */
import type { Knex } from 'knex';
import { databaseAnswers } from './store';

export const PROBE_MS = 1_000;

interface Probe {
  at: number;
  up: Promise<boolean>;
}
/** One probe per database (tests run several databases in one process). */
const probes = new WeakMap<Knex, Probe>();

export function databaseIsUp(db: Knex, now = Date.now()): Promise<boolean> {
  const last = probes.get(db);
  if (last && now - last.at < PROBE_MS) return last.up;
  const probe: Probe = { at: now, up: databaseAnswers(db) };
  probes.set(db, probe);
  return probe.up;
}
