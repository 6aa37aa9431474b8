/**
 * Warms a worker process's fitting threads before it takes jobs. A fresh thread loads the
 * engine and then runs its first few hundred fits unoptimised (measured here: a cold
 * pool of two threads took 3.4 s for what it does in 1.5 s warm), so without this the
 * first run after a worker starts pays that once, in the middle of its chunks. Each
 * thread fits a small invented series (a smooth hump in income, no real data) with the
 * model's every variant, and the answers are thrown away.
 */
import { ModelSpec } from '../estimation/model-spec';
import type { ComputePool } from './pool';

const YEARS = 40;
const DISTRICTS_PER_TASK = 60;

function inventedDistrict(i: number) {
  const years = Array.from({ length: YEARS }, (_, k) => 1981 + k);
  const x = years.map((_, k) => 8_000 * Math.exp(0.03 * k + 0.002 * i));
  const y = x.map((v, k) => {
    const l = Math.log(v);
    return Math.exp(-40 + 8.6 * l - 0.45 * l * l + 0.02 * Math.sin(7 * i + 3 * k));
  });
  const density = years.map((_, k) => 120 + i + 0.8 * k);
  return { districtId: -1 - i, data: { years, x, y, controls: { density }, droppedYears: [] } };
}

/** Resolves once every thread of the pool has fitted its share (a no-op for an inline pool). */
export async function warmUp(pool: ComputePool): Promise<void> {
  if (pool.size === 0) return;
  const model = {
    spec: ModelSpec.parse({ form: 'quadratic', transform: 'log', covariance: 'newey_west' }),
    controls: ['density'],
  };
  await Promise.all(
    Array.from({ length: pool.size * 2 }, (_, t) =>
      pool.run({
        kind: 'district-fits-copy',
        runId: 0,
        model,
        districts: Array.from({ length: DISTRICTS_PER_TASK }, (_, i) => inventedDistrict(t * DISTRICTS_PER_TASK + i)),
        pooled: null,
      }),
    ),
  );
}
