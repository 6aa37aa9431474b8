/**
 * Item 9 of the hardening issue: the request log and the error log write the path but
 * never the values of `token`, `code` or `state` in the query.
 */
import type { Server } from 'node:http';
import type { Request, Response } from 'express';
import request from 'supertest';
import { createApp, type CrestwatchApp } from '../../api/app';
import { loadConfig } from '../../api/config';
import { errorMiddleware } from '../../api/http/error-middleware';
import { redactUrl } from '../../api/http/redact-url';
import { ensureDemoAccounts } from '../../api/people/service';
import { closeServer, DEMO, listen, startSignIn } from '../support/auth';
import { memoryMailer } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

jest.setTimeout(60_000);

let t: TestDatabase;
let app: CrestwatchApp;
let server: Server;
const lines: string[] = [];

beforeAll(async () => {
  t = await freshDatabase();
  await ensureDemoAccounts(t.db);
  const c = (t.db.client as { connectionSettings: { user: string; host: string; port: string; database: string } })
    .connectionSettings;
  const config = {
    ...loadConfig({ CRESTWATCH_MODE: 'test' }),
    databaseUrl: `postgres://${c.user}@${c.host}:${c.port}/${c.database}`,
    logRequests: true,
  };
  app = createApp({ db: t.db, config, log: (l) => lines.push(l), mailer: memoryMailer() });
  server = await listen(app);
});
afterAll(async () => {
  await closeServer(server, app);
  await t.drop();
});

/** Waits for the request log line of a path (morgan writes when the response ends). */
async function logLineFor(path: string): Promise<string> {
  for (let i = 0; i < 50; i++) {
    const line = lines.find((l) => l.includes(path));
    if (line) return line;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error(`no log line for ${path}: ${lines.join('\n')}`);
}

describe('the request log', () => {
  it('redacts the unsubscribe token and keeps the path and other parameters', async () => {
    const token = 'eyJzdWIiOjQyfQ.c2VjcmV0LXNpZ25hdHVyZQ';
    await request(server).get(`/api/subscriptions/unsubscribe?token=${token}&lang=en`);
    const line = await logLineFor('/api/subscriptions/unsubscribe');
    expect(line).toContain('GET /api/subscriptions/unsubscribe?token=[redacted]&lang=en');
    expect(line).not.toContain(token);
  });

  it('redacts the OAuth code and state of a real callback', async () => {
    const agent = request.agent(server);
    const callback = await startSignIn(agent, DEMO.analyst);
    const url = new URL(callback, 'http://x');
    const code = url.searchParams.get('code')!;
    const state = url.searchParams.get('state')!;
    expect(code.length).toBeGreaterThan(8);
    await agent.get(callback);
    const line = await logLineFor('/api/auth/google/callback');
    expect(line).toMatch(/^GET \/api\/auth\/google\/callback\?/);
    expect(line).toContain('code=[redacted]');
    expect(line).toContain('state=[redacted]');
    expect(line).not.toContain(code);
    expect(line).not.toContain(encodeURIComponent(state));
    expect(line).not.toContain(state);
  });
});

describe('the error log', () => {
  it('writes the failing request’s path with the secrets redacted', () => {
    const logged: string[] = [];
    const res = { headersSent: false, status: () => res, json: () => res } as unknown as Response;
    const req = { method: 'GET', originalUrl: '/api/subscriptions/unsubscribe?token=abc.def&x=1' } as Request;
    errorMiddleware((m) => logged.push(m))(new Error('boom'), req, res, () => {});
    expect(logged).toHaveLength(1);
    expect(logged[0]).toMatch(/^error on GET \/api\/subscriptions\/unsubscribe\?token=\[redacted\]&x=1: Error: boom/);
    expect(logged[0]).not.toContain('abc.def');
  });
});

describe('redactUrl', () => {
  it.each([
    ['/a?token=s3cret', '/a?token=[redacted]'],
    ['/a?Token=s3cret&CODE=x&State=y', '/a?Token=[redacted]&CODE=[redacted]&State=[redacted]'],
    ['/a?%74oken=s3cret', '/a?%74oken=[redacted]'],
    ['/a?code', '/a?code=[redacted]'],
    ['/a?tokens=kept&encode=kept', '/a?tokens=kept&encode=kept'],
    ['/a?token=1&token=2', '/a?token=[redacted]&token=[redacted]'],
    ['/plain/path', '/plain/path'],
    ['/a?%zz=1&code=2', '/a?%zz=1&code=[redacted]'],
  ])('%s → %s', (input, output) => {
    expect(redactUrl(input)).toBe(output);
  });
});
