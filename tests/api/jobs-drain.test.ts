/**
 * The job queue's workers drain queued jobs back to back. pg-boss on its own waits out the
 * rest of its polling interval (0.5 s here) after a job that ended early, even with more
 * queued; a run's chunks lost about 0.2 s each that way. Behaviour, not a speed target: six
 * quick jobs take well under the 2.5 s those pauses alone would add (measured without the
 * wake-up: 2.5 s).
 */
import type { Jobs } from '../../api/jobs/boss';
import { testJobs } from '../support/jobs';
import { freshDatabase, type TestDatabase } from '../support/test-db';

let t: TestDatabase;
let jobs: Jobs;
beforeAll(async () => {
  t = await freshDatabase();
  jobs = await testJobs(t.url);
});
afterAll(async () => {
  await jobs.stop();
  await t.drop();
});

it('works queued jobs one after the other without a polling pause between them', async () => {
  const done: number[] = [];
  let all: () => void = () => {};
  const finished = new Promise<void>((resolve) => (all = resolve));
  await jobs.work({
    'outbox-send': async () => {
      await new Promise((r) => setTimeout(r, 10));
      done.push(Date.now());
      if (done.length === 6) all();
    },
  });
  // Let the first, empty poll pass so the worker is waiting out its interval.
  await new Promise((r) => setTimeout(r, 700));
  const t0 = Date.now();
  await jobs.insert(
    'outbox-send',
    Array.from({ length: 6 }, (_, i) => ({ i })),
  );
  jobs.notify('outbox-send');
  await finished;
  expect(Date.now() - t0).toBeLessThan(1_500);
});
