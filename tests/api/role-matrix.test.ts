/**
 * The role matrix, generated from the route table: every API route × (anonymous,
 * official, analyst, admin, deactivated) → the guard's answer. A route mounted without a
 * table entry fails the first test.
 */
import type { Server } from 'node:http';
import request from 'supertest';
import type { CrestwatchApp } from '../../api/app';
import { ensureDemoAccounts } from '../../api/people/service';
import { PERSON_CACHE_MS } from '../../api/people/session-person';
import type { Role, RouteSpec } from '../../api/http/routes';
import type { Jobs } from '../../api/jobs/boss';
import { closeServer, DEMO, listen, signInAs, type SignedIn } from '../support/auth';
import { testJobs } from '../support/jobs';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(60_000);

type Persona = 'anonymous' | Role | 'deactivated';
const PERSONAS: Persona[] = ['anonymous', 'official', 'analyst', 'admin', 'deactivated'];

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
let jobs: Jobs;
const sessions = new Map<Persona, SignedIn>();

beforeAll(async () => {
  t = await freshDatabase();
  await ensureDemoAccounts(t.db);
  await t.db('users').insert({ email: 'leaver@crestwatch.example', name: 'Leaver', role: 'admin', active: true });
  app = testApp(t.db);
  // A queue that accepts jobs but has no worker: routes that start work answer as they
  // would in production (202, then 409 while queued) and nothing runs behind the matrix.
  jobs = await testJobs(t.url);
  app.locals.ctx.jobs = jobs;
  server = await listen(app);
  for (const role of ['official', 'analyst', 'admin'] as const) sessions.set(role, await signInAs(server, DEMO[role]));
  // Deactivated after signing in: the session remains, the guard must refuse it.
  sessions.set('deactivated', await signInAs(server, 'leaver@crestwatch.example'));
  await t.db('users').where({ email: 'leaver@crestwatch.example' }).update({ active: false });
  // A change made outside the people service (here: SQL by hand) reaches the guard once the
  // signed-in person's cache entry lapses (api/people/session-person.ts).
  await new Promise((r) => setTimeout(r, PERSON_CACHE_MS + 100));
});
afterAll(async () => {
  await jobs?.stop();
  await closeServer(server, app);
  await t.drop();
});

/** Paths of every route Express actually has, as "METHOD /path". */
function mountedRoutes(a: CrestwatchApp): string[] {
  const out: string[] = [];
  const walk = (
    stack: { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: unknown[] } }[],
  ) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const m of Object.keys(layer.route.methods)) out.push(`${m.toUpperCase()} ${layer.route.path}`);
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack as never);
      }
    }
  };
  walk((a as unknown as { router: { stack: never[] } }).router.stack);
  return out.filter((r) => r.split(' ')[1].startsWith('/api'));
}

const key = (r: RouteSpec) => `${r.method.toUpperCase()} ${r.path}`;

function expected(route: RouteSpec, who: Persona): 'allowed' | 401 | 403 {
  if (route.allow === 'public') return 'allowed';
  if (who === 'anonymous') return 401;
  if (who === 'deactivated') return 403;
  return route.allow.includes(who) ? 'allowed' : 403;
}

function samplePath(path: string): string {
  return path.replace(':code', 'D01').replace(/:[A-Za-z]+/g, '999999');
}

describe('route table', () => {
  it('covers every API route Express has mounted, and nothing else', () => {
    const table = app.locals.routes.map(key).sort();
    expect(mountedRoutes(app).sort()).toEqual(table);
    expect(new Set(table).size).toBe(table.length);
  });

  it('leaves no state-changing route open to anonymous callers without a stated reason', () => {
    const open = app.locals.routes.filter((r) => r.allow === 'public' && r.method !== 'get' && !r.anonymousWriteReason);
    expect(open.map(key)).toEqual([]);
  });

  it('documents every route in the OpenAPI file', async () => {
    const doc = (await request(server).get('/api/openapi.json')).body;
    for (const r of app.locals.routes) {
      expect(doc.paths[r.path.replace(/:([A-Za-z0-9_]+)/g, '{$1}')]?.[r.method]).toBeDefined();
    }
  });
});

describe('upload history and previews', () => {
  // Failed previews quote old and new values and the uploader's address: staff only.
  it.each(['/api/uploads', '/api/uploads/:id'])('%s is declared for admins and analysts only', (path) => {
    const r = app.locals.routes.find((x) => x.method === 'get' && x.path === path)!;
    expect(r.allow).toEqual(['admin', 'analyst']);
  });

  it('refuses an official with 403 and lets an analyst read', async () => {
    const official = await sessions.get('official')!.agent.get('/api/uploads');
    expect(official.status).toBe(403);
    expect(official.body.error.code).toBe('forbidden');
    expect((await sessions.get('official')!.agent.get('/api/uploads/1')).status).toBe(403);
    expect((await sessions.get('analyst')!.agent.get('/api/uploads')).status).toBe(200);
  });
});

describe('role matrix', () => {
  // Read from the live table inside the test, so a new route is always included.
  it('answers every route for every persona as the table says', async () => {
    let checked = 0;
    const failures: string[] = [];
    for (const route of app.locals.routes) {
      for (const who of PERSONAS) {
        // Signing out ends the session: use a throwaway one for that route.
        let agent = who === 'anonymous' ? request.agent(server) : sessions.get(who)!.agent;
        if (route.path === '/api/auth/sign-out' && (who === 'official' || who === 'analyst' || who === 'admin')) {
          agent = (await signInAs(server, DEMO[who])).agent;
        }
        const res = await agent[route.method](samplePath(route.path)).send(route.method === 'get' ? undefined : {});
        const want = expected(route, who);
        // 'allowed' means the guard let it through and the route answered without failing: a 500 is not allowed.
        const ok =
          want === 'allowed' ? res.status !== 401 && res.status !== 403 && res.status < 500 : res.status === want;
        checked++;
        if (!ok)
          failures.push(
            `${key(route)} as ${who}: expected ${want}, got ${res.status} ${JSON.stringify(res.body?.error ?? '')}`,
          );
      }
    }
    expect(failures).toEqual([]);
    expect(checked).toBe(app.locals.routes.length * PERSONAS.length);
  });
});
