/**
 * Signs a test agent in through the real flow: our /api/auth/google redirects to the
 * OAuth stand-in, whose /authorize redirects back with a code; the callback exchanges it,
 * checks the state and starts a session. The agent then carries the CSRF header.
 */
import type { Server } from 'node:http';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import type { CrestwatchApp } from '../../api/app';
import { CSRF_HEADER } from '../../api/http/routes';
import { listenOn } from '../../api/http/listen';

export interface SignedIn {
  agent: TestAgent;
  csrfToken: string | null;
  /** Where the callback sent the browser (`/` on success, `/no-access?...` when refused). */
  landedOn: string;
  /** The callback URL the stand-in redirected to (for replay tests). */
  callbackPath: string;
}

export function listen(app: CrestwatchApp): Promise<Server> {
  return listenOn(app, 0);
}

export async function closeServer(server: Server, app: CrestwatchApp): Promise<void> {
  await new Promise<void>((resolve) => server.close(() => resolve()));
  server.closeAllConnections();
  await app.locals.close();
}

/** The stand-in's redirect back to our callback, for a fresh sign-in start. */
export async function startSignIn(agent: TestAgent, email: string): Promise<string> {
  const start = await agent.get(`/api/auth/google?login_hint=${encodeURIComponent(email)}`);
  if (start.status !== 302) throw new Error(`sign-in start answered ${start.status}`);
  const authorize = await fetch(start.headers.location, { redirect: 'manual' });
  const back = new URL(authorize.headers.get('location')!);
  return back.pathname + back.search;
}

export async function signInAs(server: Server, email: string): Promise<SignedIn> {
  const agent = request.agent(server);
  const callbackPath = await startSignIn(agent, email);
  const cb = await agent.get(callbackPath);
  const landedOn = String(cb.headers.location ?? '');
  let csrfToken: string | null = null;
  const me = await agent.get('/api/me');
  if (me.status === 200) {
    csrfToken = me.body.csrfToken;
    agent.set(CSRF_HEADER, csrfToken!);
  }
  return { agent, csrfToken, landedOn, callbackPath };
}

export const DEMO = {
  admin: 'admin@crestwatch.example',
  analyst: 'analyst@crestwatch.example',
  official: 'official@crestwatch.example',
  former: 'former@crestwatch.example',
} as const;
