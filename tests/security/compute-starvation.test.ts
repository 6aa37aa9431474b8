/**
 * Compute that cannot starve readers: while ten people each run a maximal estimate
 * (1,000 rows, 8 controls, Newey–West lag 999), a district card and the health check
 * answer before the heavy ones finish, because the fits run in the compute pool and not
 * on the event loop that serves every request.
 */
import type TestAgent from 'supertest/lib/agent';
import { signInAs } from '../support/auth';
import { signedInApp, type SignedInApp } from '../support/signed-in-app';
import { describeTimings, readersUnderLoad } from '../support/starvation';

jest.setTimeout(180_000);

let s: SignedInApp;
const people: TestAgent[] = [];
let submitted = 0;

beforeAll(async () => {
  // One pool thread: the smallest pool, where the heavy fits queue behind each other.
  s = await signedInApp({ as: 'official', config: { computePoolSize: 1 } });
  const emails = Array.from({ length: 10 }, (_, i) => `heavy${i + 1}@crestwatch.example`);
  await s.t.db('users').insert(emails.map((email, i) => ({ email, name: `Heavy user ${i + 1}`, role: 'analyst' })));
  for (const email of emails) people.push((await signInAs(s.server, email)).agent);
  // Count the tasks handed to the pool, to know when all ten are in.
  const pool = s.app.locals.ctx.compute;
  const run = pool.run.bind(pool);
  pool.run = ((task: Parameters<typeof pool.run>[0]) => {
    submitted++;
    return run(task);
  }) as typeof pool.run;
});
afterAll(async () => s?.close());

it('answers card and health requests before ten maximal estimates finish', async () => {
  const t = await readersUnderLoad(people, s.agent, () => submitted >= people.length);
  // Every heavy one was taken in and fitted (not refused by the per-person limits).
  expect(t.heavy.map((h) => h.status)).toEqual(Array(10).fill(200));
  expect(submitted).toBe(10);
  const lastHeavy = Math.max(...t.heavy.map((h) => h.doneAt));
  for (const what of ['card', 'health'] as const) {
    const first = t.readers.find((r) => r.what === what)!;
    expect(first.status).toBe(200);
    // Asked once all ten were in the pool, answered before the last of them.
    expect(first.sentAt).toBeGreaterThanOrEqual(t.readersFrom);
    expect(first.sentAt + first.ms).toBeLessThan(lastHeavy);
  }
  // The readers kept answering all along, not in one burst at the end.
  expect(t.readers.filter((r) => r.sentAt + r.ms < lastHeavy).length).toBeGreaterThanOrEqual(4);
  process.stdout.write(`${describeTimings(t)}\n`);
});
