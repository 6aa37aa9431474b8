/**
 * Sign-in with Google (or its local stand-in), sign-out and "who am I".
 */
import { randomBytes } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import { NotFoundError } from '../http/errors';
import { getSettings } from '../settings/service';
import { callerOf, route, SIGNED_IN, type Caller, type RouteSpec } from '../http/routes';
import type { createPassport, SignInRefusal } from './passport';
import { sessionCookieName, sessionCookieOptions, startSessionClock } from './session';
import { standInPage } from './stand-in-page';
import { NO_CONTENT, REDIRECT } from '../../contracts/common';
import { AuthOptionsResponseSchema, MeResponseSchema } from '../../contracts/districts';

/** Runs an Express middleware inside a handler; resolves when it calls next or answers. */
function run(mw: RequestHandler, req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    res.once('finish', () => resolve());
    mw(req, res, (err?: unknown) => (err ? reject(err) : resolve()));
  });
}

/** Refusals that land on the no-access page (the others go back to sign-in with an error). */
const NO_ACCESS: ReadonlySet<string> = new Set<SignInRefusal>([
  'not_invited',
  'deactivated',
  'email_unverified',
  'wrong_domain',
  'identity_mismatch',
  'invitation_expired',
]);

export function newCsrfToken(): string {
  return randomBytes(24).toString('base64url');
}

export function authRoutes(ctx: AppContext, passport: ReturnType<typeof createPassport>): RouteSpec[] {
  const { db, config } = ctx;
  const limiter = rateLimit({
    windowMs: 60_000,
    limit: config.authRateLimitPerMinute,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res
        .status(429)
        .json({ error: { code: 'rate_limited', message: 'Too many sign-in attempts; wait a minute and try again.' } });
    },
  });
  const standInAvailable = config.mode !== 'production';

  return [
    route({
      method: 'get',
      path: '/api/auth/options',
      answer: AuthOptionsResponseSchema,
      allow: 'public',
      tag: 'auth',
      summary: 'How this server signs people in (Google, or the local stand-in in demo mode)',
      handler: () => ({
        provider: standInAvailable ? 'stand-in' : 'google',
        signInUrl: standInAvailable ? '/api/auth/stand-in' : '/api/auth/google',
      }),
    }),
    route({
      method: 'get',
      path: '/api/auth/stand-in',
      allow: 'public',
      tag: 'auth',
      produces: 'text/html',
      summary: 'Demo and test mode only: choose a demo account to sign in as',
      handler: (_input, _req, res) => {
        if (!standInAvailable) throw new NotFoundError('There is no sign-in stand-in in production.');
        res.type('html').send(standInPage());
      },
    }),
    route({
      method: 'get',
      path: '/api/auth/google',
      answer: REDIRECT,
      allow: 'public',
      tag: 'auth',
      summary: 'Start Google sign-in (login_hint chooses the account at the stand-in)',
      before: [limiter],
      schemas: { query: z.object({ login_hint: z.string().email().max(254).optional() }) },
      handler: ({ query }, req, res) =>
        run(
          passport.authenticate('google', {
            loginHint: query.login_hint,
            prompt: 'select_account',
            // A hint to Google's account chooser only; the callback checks the `hd` claim itself.
            ...(config.googleHostedDomain ? { hostedDomain: config.googleHostedDomain } : {}),
          } as object),
          req,
          res,
        ),
    }),
    route({
      method: 'get',
      path: '/api/auth/google/callback',
      answer: REDIRECT,
      allow: 'public',
      tag: 'auth',
      summary: 'Google redirects here; checks state, signs an invited person in',
      before: [limiter],
      handler: (_input, req, res) =>
        new Promise<void>((resolve, reject) => {
          const done = (err: unknown, user: Caller | false, info?: { reason?: SignInRefusal; message?: string }) => {
            if (err) return reject(err);
            if (!user) {
              const reason = info?.reason ?? 'state';
              if (NO_ACCESS.has(reason)) {
                res.redirect(303, `/no-access?reason=${reason}`);
              } else {
                res.redirect(
                  303,
                  `/sign-in?error=${encodeURIComponent(reason === 'no_email' ? 'no_email' : 'failed')}`,
                );
              }
              return resolve();
            }
            req.logIn(user, (loginErr) => {
              if (loginErr) return reject(loginErr);
              req.session.csrfToken = newCsrfToken();
              startSessionClock(req.session);
              req.session.save((saveErr) => {
                if (saveErr) return reject(saveErr);
                res.redirect(303, '/');
                resolve();
              });
            });
          };
          passport.authenticate('google', done as never)(req, res, (err?: unknown) => (err ? reject(err) : resolve()));
        }),
    }),
    route({
      method: 'post',
      path: '/api/auth/sign-out',
      answer: NO_CONTENT,
      allow: SIGNED_IN,
      tag: 'auth',
      summary: 'Sign out: ends and deletes the session',
      handler: async (_input, req, res) => {
        const caller = callerOf(req)!;
        await audit.record(db, {
          actorId: caller.id,
          actorEmail: caller.email,
          action: 'sign_out',
          targetType: 'user',
          targetId: caller.id,
        });
        await new Promise<void>((resolve, reject) => req.logOut((err) => (err ? reject(err) : resolve())));
        await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
        res.clearCookie(sessionCookieName(config), sessionCookieOptions(config));
        res.status(204).end();
      },
    }),
    route({
      method: 'get',
      path: '/api/me',
      answer: MeResponseSchema,
      allow: SIGNED_IN,
      tag: 'auth',
      summary: 'The signed-in person, their role, the CSRF token for state-changing calls, and the region’s locale',
      handler: async (_input, req) => {
        const caller = callerOf(req)!;
        if (!req.session.csrfToken) req.session.csrfToken = newCsrfToken();
        const { regionLocale } = await getSettings(ctx.db);
        return {
          id: caller.id,
          email: caller.email,
          name: caller.name,
          role: caller.role,
          csrfToken: req.session.csrfToken,
          regionLocale,
        };
      },
    }),
  ];
}
