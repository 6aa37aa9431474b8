/**
 * Readers under heavy load: ten people each post a maximal estimate at once; once the
 * server has taken all ten in (`ready`), a district card and the health check are asked
 * for, then asked again in a loop until the last heavy one answers. Times are ms from
 * the start. Shared by tests/security/compute-starvation.test.ts and bench/starvation.ts.
 */
import type TestAgent from 'supertest/lib/agent';
import { maximalEstimateBody } from './maximal-estimate';

export interface LoadTimings {
  /** When each heavy answer arrived, and its status. */
  heavy: { doneAt: number; status: number }[];
  /** When the readers were first sent (all heavy ones taken in). */
  readersFrom: number;
  /** Every reader request: which, when sent, how long it took, its status. */
  readers: { what: 'card' | 'health'; sentAt: number; ms: number; status: number }[];
}

export async function readersUnderLoad(
  heavyAgents: TestAgent[],
  reader: TestAgent,
  ready: () => boolean,
  card = '/api/districts/D01',
): Promise<LoadTimings> {
  const body = maximalEstimateBody();
  const t0 = performance.now();
  const now = () => performance.now() - t0;
  const heavy: LoadTimings['heavy'] = [];
  let pending = heavyAgents.length;
  const heavyDone = Promise.all(
    heavyAgents.map(async (a) => {
      const res = await a.post('/api/estimate').send(body);
      heavy.push({ doneAt: now(), status: res.status });
      pending--;
    }),
  );
  while (!ready() && pending > 0) await new Promise((r) => setTimeout(r, 2));
  const readersFrom = now();
  const readers: LoadTimings['readers'] = [];
  const ask = async (what: 'card' | 'health') => {
    const sentAt = now();
    const res = await reader.get(what === 'card' ? card : '/api/health');
    readers.push({ what, sentAt, ms: now() - sentAt, status: res.status });
  };
  do {
    await Promise.all([ask('card'), ask('health')]);
  } while (pending > 0);
  await heavyDone;
  return { heavy, readersFrom, readers };
}

const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))] : NaN;
};

/** One line of figures: reader latencies (median, 95th, max) and when the heavy ones ended. */
export function describeTimings(t: LoadTimings): string {
  const line = (what: 'card' | 'health') => {
    const ms = t.readers.filter((r) => r.what === what).map((r) => r.ms);
    return `${what} median ${quantile(ms, 0.5).toFixed(0)} ms, p95 ${quantile(ms, 0.95).toFixed(0)} ms, max ${Math.max(...ms).toFixed(0)} ms (${ms.length} requests)`;
  };
  const done = t.heavy.map((h) => h.doneAt);
  return `${line('card')}; ${line('health')}; heavy estimates answered from ${Math.min(...done).toFixed(0)} to ${Math.max(...done).toFixed(0)} ms`;
}
