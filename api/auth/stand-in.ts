/**
 * The local stand-in for Google's OAuth 2.0 endpoints (oauth2-mock-server) used in demo and
 * test mode. Its /authorize redirects back at once; the identity comes from `login_hint`.
 * Codes are single-use and tied to the e-mail chosen at /authorize; the userinfo answer
 * has Google's v3 shape (sub, email, email_verified, name).
 */
import { createHash } from 'node:crypto';
import { standInName } from './demo-accounts';

export interface StandIn {
  url: string;
  stop(): Promise<void>;
}

interface Req {
  query?: Record<string, unknown>;
  body?: Record<string, unknown>;
  url?: string;
  headers: Record<string, string | string[] | undefined>;
}

export async function startStandIn(port: number, host = '127.0.0.1'): Promise<StandIn> {
  const { OAuth2Server } = await import('oauth2-mock-server');
  const server = new OAuth2Server();
  await server.issuer.keys.generate('RS256');
  const emailByCode = new Map<string, string>();
  const usedCodes = new Set<string>();
  const emailByToken = new Map<string, string>();

  server.service.on('beforeAuthorizeRedirect', (redirect: { url: URL }, req: Req) => {
    const hint = new URL(req.url ?? '/', 'http://x').searchParams.get('login_hint') ?? '';
    const code = redirect.url.searchParams.get('code');
    if (!code) return;
    if (!/^[^@\s]+@[^@\s]+$/.test(hint)) {
      redirect.url.searchParams.delete('code');
      redirect.url.searchParams.set('error', 'access_denied');
      return;
    }
    emailByCode.set(code, hint.toLowerCase());
  });
  server.service.on('beforeResponse', (response: { body: Record<string, unknown>; statusCode: number }, req: Req) => {
    const code = String(req.body?.code ?? '');
    const email = emailByCode.get(code);
    if (!email || usedCodes.has(code)) {
      response.statusCode = 400;
      response.body = { error: 'invalid_grant', error_description: 'unknown or already used code' };
      return;
    }
    usedCodes.add(code);
    emailByCode.delete(code);
    emailByToken.set(String(response.body.access_token), email);
  });
  server.service.on('beforeUserinfo', (response: { body: Record<string, unknown>; statusCode: number }, req: Req) => {
    const fromQuery = new URL(req.url ?? '/', 'http://x').searchParams.get('access_token');
    const auth = String(req.headers.authorization ?? '');
    const token = fromQuery ?? (auth.startsWith('Bearer ') ? auth.slice(7) : '');
    const email = emailByToken.get(token);
    if (!email) {
      response.statusCode = 401;
      response.body = { error: 'invalid_token' };
      return;
    }
    response.body = {
      sub: `standin-${createHash('sha256').update(email).digest('hex').slice(0, 20)}`,
      email,
      email_verified: true,
      name: standInName(email),
    };
  });

  await server.start(port, host);
  server.issuer.url = `http://${host}:${port}`;
  return { url: server.issuer.url, stop: () => server.stop() };
}
