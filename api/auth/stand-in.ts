/**
 * The local stand-in for Google's OAuth 2.0 endpoints (oauth2-mock-server) used in demo and
 * test mode. Its /authorize redirects back at once; the identity comes from `login_hint`.
 * Codes are single-use and tied to the e-mail chosen at /authorize; the userinfo answer
 * has Google's v3 shape (sub, email, email_verified, name, and `hd`, the address's domain,
 * as for a Workspace account). Every token carries its own `jti`: without it two tokens
 * signed within the same second were identical, and the later sign-in's identity answered
 * for both.
 *
 * Test mode only (`testIdentities`): the hint may carry `#`-separated suffixes that change
 * the answer, so the server's refusals can be tried end to end — `#unverified`
 * (email_verified false), `#sub=<text>` (another Google subject for the same address),
 * `#hd=<domain>` (another Workspace domain; `#hd=` for none). Elsewhere a `#` in the hint
 * is refused like any malformed address.
 */
import { createHash, randomUUID } from 'node:crypto';
import { standInName } from '../common/demo-accounts';

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

/** Who the stand-in says signed in. */
interface Identity {
  email: string;
  verified: boolean;
  sub: string;
  hd: string | null;
}

const standInSub = (email: string) => `standin-${createHash('sha256').update(email).digest('hex').slice(0, 20)}`;

/** The identity a login hint asks for, or null when the hint is not acceptable. */
export function identityFromHint(hint: string, testIdentities: boolean): Identity | null {
  const [address, ...suffixes] = hint.split('#');
  if (!/^[^@\s#]+@[^@\s#]+$/.test(address)) return null;
  if (suffixes.length > 0 && !testIdentities) return null;
  const email = address.toLowerCase();
  const id: Identity = { email, verified: true, sub: standInSub(email), hd: email.split('@')[1] };
  for (const suffix of suffixes) {
    if (suffix === 'unverified') id.verified = false;
    else if (suffix.startsWith('sub=') && suffix.length > 4) id.sub = `standin-other-${suffix.slice(4)}`;
    else if (suffix.startsWith('hd=')) id.hd = suffix.slice(3) || null;
    else return null;
  }
  return id;
}

export async function startStandIn(
  port: number,
  host = '127.0.0.1',
  opts: { testIdentities?: boolean } = {},
): Promise<StandIn> {
  const { OAuth2Server } = await import('oauth2-mock-server');
  const server = new OAuth2Server();
  await server.issuer.keys.generate('RS256');
  const identityByCode = new Map<string, Identity>();
  const usedCodes = new Set<string>();
  const identityByToken = new Map<string, Identity>();

  server.service.on('beforeAuthorizeRedirect', (redirect: { url: URL }, req: Req) => {
    const hint = new URL(req.url ?? '/', 'http://x').searchParams.get('login_hint') ?? '';
    const code = redirect.url.searchParams.get('code');
    if (!code) return;
    const identity = identityFromHint(hint, opts.testIdentities ?? false);
    if (!identity) {
      redirect.url.searchParams.delete('code');
      redirect.url.searchParams.set('error', 'access_denied');
      return;
    }
    identityByCode.set(code, identity);
  });
  server.service.on('beforeTokenSigning', (token: { payload: Record<string, unknown> }) => {
    token.payload.jti = randomUUID();
  });
  server.service.on('beforeResponse', (response: { body: Record<string, unknown>; statusCode: number }, req: Req) => {
    const code = String(req.body?.code ?? '');
    const identity = identityByCode.get(code);
    if (!identity || usedCodes.has(code)) {
      response.statusCode = 400;
      response.body = { error: 'invalid_grant', error_description: 'unknown or already used code' };
      return;
    }
    usedCodes.add(code);
    identityByCode.delete(code);
    identityByToken.set(String(response.body.access_token), identity);
  });
  server.service.on('beforeUserinfo', (response: { body: Record<string, unknown>; statusCode: number }, req: Req) => {
    const fromQuery = new URL(req.url ?? '/', 'http://x').searchParams.get('access_token');
    const auth = String(req.headers.authorization ?? '');
    const token = fromQuery ?? (auth.startsWith('Bearer ') ? auth.slice(7) : '');
    const identity = identityByToken.get(token);
    if (!identity) {
      response.statusCode = 401;
      response.body = { error: 'invalid_token' };
      return;
    }
    response.body = {
      sub: identity.sub,
      email: identity.email,
      email_verified: identity.verified,
      name: standInName(identity.email),
      ...(identity.hd ? { hd: identity.hd } : {}),
    };
  });

  await server.start(port, host);
  server.issuer.url = `http://${host}:${port}`;
  return { url: server.issuer.url, stop: () => server.stop() };
}
