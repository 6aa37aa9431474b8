/**
 * Signs in through the real flow with one of the stand-in's test-only identities: the
 * login hint our server sends to the stand-in gets a suffix (`#unverified`, `#sub=…`,
 * `#hd=…`) that the stand-in, started by jest's global setup in test mode, honours.
 */
import type { Server } from 'node:http';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { CSRF_HEADER } from '../../api/http/routes';

export async function signInWithIdentity(
  server: Server,
  email: string,
  suffix = '',
): Promise<{ agent: TestAgent; landedOn: string }> {
  const agent = request.agent(server);
  const start = await agent.get(`/api/auth/google?login_hint=${encodeURIComponent(email)}`);
  if (start.status !== 302) throw new Error(`sign-in start answered ${start.status}`);
  const authorize = new URL(start.headers.location);
  authorize.searchParams.set('login_hint', `${email}${suffix}`);
  const answer = await fetch(authorize, { redirect: 'manual' });
  const back = new URL(answer.headers.get('location')!);
  const cb = await agent.get(back.pathname + back.search);
  const me = await agent.get('/api/me');
  if (me.status === 200) agent.set(CSRF_HEADER, me.body.csrfToken);
  return { agent, landedOn: String(cb.headers.location ?? '') };
}
