/**
 * Reads at agency scale: published answers carry an ETag of their version and answer 304
 * to a device that holds it; a publish, a note edit or a data change gives a new version;
 * answers above 1 KB are compressed; the signed-in person is cached for at most 5 s, and a
 * change made through the people service reaches the guard at once.
 */
import type { Server } from 'node:http';
import type { CrestwatchApp } from '../../api/app';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import type { Jobs } from '../../api/jobs/boss';
import { ensureDemoAccounts } from '../../api/people/service';
import { PERSON_CACHE_MS } from '../../api/people/session-person';
import { closeServer, DEMO, listen, signInAs } from '../support/auth';
import { startRunAndWait, testJobs, workIn } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(180_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;

beforeAll(async () => {
  t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  jobs = await testJobs(t.url);
  app = testApp(t.db);
  app.locals.ctx.jobs = jobs;
  await workIn(app.locals.ctx, jobs);
  server = await listen(app);
});
afterAll(async () => {
  await jobs?.stop();
  await closeServer(server, app);
  await t.drop();
});

const PUBLISHED_PATHS = ['/api/region', '/api/districts', '/api/districts/D13/estimate', '/api/districts/D13/history'];

describe('published answers', () => {
  it('carry their version as an ETag, answer 304 to a device that holds it, and change with a publish and a note', async () => {
    const official = (await signInAs(server, DEMO.official)).agent;
    const analyst = (await signInAs(server, DEMO.analyst)).agent;
    const tags = async () =>
      Object.fromEntries(
        await Promise.all(PUBLISHED_PATHS.map(async (p) => [p, (await official.get(p)).headers.etag as string])),
      );

    const before = await tags();
    for (const p of PUBLISHED_PATHS) {
      expect(before[p]).toMatch(/^"p-/);
      const again = await official.get(p).set('If-None-Match', before[p]);
      expect(again.status).toBe(304);
      expect(again.text).toBe('');
    }
    const first = await official.get('/api/region');
    expect(first.headers['cache-control']).toBe('private, no-cache');

    const { run } = await startRunAndWait(analyst);
    // A run in review changes nothing officials see: the same versions.
    expect(await tags()).toEqual(before);
    expect((await analyst.post(`/api/runs/${run.id}/publish`).send({})).status).toBe(200);
    const published = await tags();
    for (const p of PUBLISHED_PATHS) expect(published[p]).not.toBe(before[p]);
    const card = await official
      .get('/api/districts/D13/estimate')
      .set('If-None-Match', before['/api/districts/D13/estimate']);
    expect(card.status).toBe(200);
    expect(card.body.run.id).toBe(run.id);

    const note = await analyst.put(`/api/runs/${run.id}/districts/D13/note`).send({ note: 'Income revised for 2024.' });
    expect(note.status).toBeLessThan(300);
    const noted = await official.get('/api/districts/D13/estimate');
    expect(noted.headers.etag).not.toBe(published['/api/districts/D13/estimate']);
    expect(JSON.stringify(noted.body.note)).toContain('Income revised for 2024.');
  });

  it('are compressed above 1 KB: brotli when accepted, else gzip', async () => {
    const official = (await signInAs(server, DEMO.official)).agent;
    const br = await official.get('/api/region').set('Accept-Encoding', 'br, gzip');
    expect(br.headers['content-encoding']).toBe('br');
    const gz = await official.get('/api/region').set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.body.districts).toHaveLength(24);
    const small = await official.get('/api/published').set('Accept-Encoding', 'gzip');
    expect(small.headers['content-encoding']).toBeUndefined();
  });
});

describe('the signed-in person', () => {
  it('a role change through the people screen reaches the guard at once', async () => {
    const admin = (await signInAs(server, DEMO.admin)).agent;
    const [person] = await t
      .db('users')
      .insert({ email: 'mover@crestwatch.example', name: 'Mover', role: 'analyst', active: true })
      .returning('id');
    const mover = (await signInAs(server, 'mover@crestwatch.example')).agent;
    expect((await mover.get('/api/runs')).status).toBe(200);
    expect((await admin.patch(`/api/people/${person.id}`).send({ role: 'official' })).status).toBe(200);
    expect((await mover.get('/api/runs')).status).toBe(403);
  });

  it('a change made outside this process takes effect within 5 s', async () => {
    const [person] = await t
      .db('users')
      .insert({ email: 'far@crestwatch.example', name: 'Far', role: 'analyst', active: true })
      .returning('id');
    const far = (await signInAs(server, 'far@crestwatch.example')).agent;
    expect((await far.get('/api/runs')).status).toBe(200);
    await t.db('users').where({ id: person.id }).update({ active: false });
    const changedAt = Date.now();
    let status = 200;
    while (status === 200 && Date.now() - changedAt < PERSON_CACHE_MS + 2_000) {
      status = (await far.get('/api/runs')).status;
      if (status === 200) await new Promise((r) => setTimeout(r, 250));
    }
    expect(status).toBe(403);
    expect(Date.now() - changedAt).toBeLessThan(PERSON_CACHE_MS + 1_000);
  });
});
