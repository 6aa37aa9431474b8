/**
 * The route table: every API route is declared here-shaped — method, path, who may call
 * it, its request schemas and its handler. One list feeds the guard (deny by default),
 * the OpenAPI file and the role-matrix test, so they cannot drift apart.
 */
import { timingSafeEqual } from 'node:crypto';
import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { z } from 'zod';
import { AppError } from './errors';
import { personLimiter, type RateLimit } from './rate-limit';
import { validate, type Parsed } from './validate';

export { COMPUTE_LIMIT, type RateLimit } from './rate-limit';

import { ROLES, type NO_CONTENT, type REDIRECT, type Role } from '../../contracts/common';
import type { Schema } from '../../contracts/kit';

export { ROLES, type Role };

/** Who may call a route: nobody signed in needed, or one of these roles. */
export type Allow = 'public' | readonly Role[];
export const SIGNED_IN: readonly Role[] = ROLES;
export const STAFF: readonly Role[] = ['admin', 'analyst'];
export const ADMIN: readonly Role[] = ['admin'];

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * What a route answers on success: a contracts schema for a JSON body (contracts/), or one
 * of the markers for no body at all (204) and for a redirect. Routes with `produces` (PDF,
 * CSV, HTML) are described by that media type instead.
 */
export type Answer = Schema | typeof NO_CONTENT | typeof REDIRECT;

/** The signed-in person as the guard sees it (set on req.user by the auth layer). */
export interface Caller {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
}

export interface RouteSpec<
  P extends z.ZodType = z.ZodType,
  Q extends z.ZodType = z.ZodType,
  B extends z.ZodType = z.ZodType,
> {
  method: Method;
  /** Express path under the app root, e.g. `/api/districts/:code`. */
  path: string;
  allow: Allow;
  summary: string;
  tag: string;
  schemas?: { params?: P; query?: Q; body?: B };
  /** Middleware that runs after the guard and before validation (e.g. multer). */
  before?: RequestHandler[];
  /** Content type of a successful answer when it is not JSON. */
  produces?: string;
  /** The JSON answer's contract, or NO_CONTENT / REDIRECT (OpenAPI's responses come from it). */
  answer?: Answer;
  /** Success statuses of the answer when not just 200 (201 created, 202 queued; 503 for a health answer that reports a fault). */
  statuses?: readonly number[];
  /** State-changing routes open to anonymous callers must say why (checked by tests). */
  anonymousWriteReason?: string;
  /** A per-person limit on heavy routes (see COMPUTE_LIMIT); routes naming one bucket share it. */
  rateLimit?: RateLimit;
  /** Return a value to send it as JSON; or write to res yourself and return undefined. */
  handler: (input: Parsed<P, Q, B>, req: Request, res: Response) => unknown | Promise<unknown>;
}

/** Helper that keeps the schema types attached to the handler's input. */
export function route<P extends z.ZodType = z.ZodAny, Q extends z.ZodType = z.ZodAny, B extends z.ZodType = z.ZodAny>(
  spec: RouteSpec<P, Q, B>,
): RouteSpec {
  return spec as unknown as RouteSpec;
}

export function callerOf(req: Request): Caller | null {
  return ((req as { user?: unknown }).user as Caller | undefined) ?? null;
}

/** The guard for one route: 401 without a session, 403 for a deactivated person or a wrong role. */
export function guard(allow: Allow): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (allow === 'public') return next();
    const caller = callerOf(req);
    if (!caller) throw new AppError(401, 'unauthenticated', 'Sign in to continue.');
    if (!caller.active) throw new AppError(403, 'deactivated', 'This account has been deactivated.');
    if (!allow.includes(caller.role)) {
      throw new AppError(403, 'forbidden', `This needs one of these roles: ${allow.join(', ')}.`);
    }
    next();
  };
}

const UNSAFE: ReadonlySet<Method> = new Set(['post', 'put', 'patch', 'delete']);
export const CSRF_HEADER = 'x-csrf-token';

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/**
 * CSRF defence for state-changing routes: the session cookie is SameSite=Lax, a request
 * whose Origin is another site is refused, and the session's token must come back in the
 * X-CSRF-Token header (a cross-site form cannot set headers). Routes open to anonymous
 * writers (the e-mail unsubscribe) carry their own signed, expiring token instead.
 */
export function csrfCheck(spec: Pick<RouteSpec, 'anonymousWriteReason'>): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    const origin = req.get('origin');
    if (origin !== undefined) {
      let host: string | null = null;
      try {
        host = new URL(origin).host;
      } catch {
        host = null;
      }
      if (host !== req.get('host')) throw new AppError(403, 'csrf_failed', 'Cross-site request refused.');
    }
    if (spec.anonymousWriteReason) return next();
    const expected = (req as { session?: { csrfToken?: string } }).session?.csrfToken;
    const got = req.get(CSRF_HEADER);
    if (!expected || !got || !sameToken(expected, got)) {
      throw new AppError(403, 'csrf_failed', 'Missing or outdated security token: reload the page and try again.');
    }
    next();
  };
}

/** `limits` adjusts a declared bucket's figures from the configuration (e.g. a test's burst). */
export function mountRoutes(router: Router, specs: RouteSpec[], limits: Record<string, Partial<RateLimit>> = {}): void {
  const limiters = new Map<string, RequestHandler>();
  const limiterFor = (l: RateLimit) => {
    if (!limiters.has(l.bucket)) limiters.set(l.bucket, personLimiter({ ...l, ...limits[l.bucket] }));
    return limiters.get(l.bucket)!;
  };
  for (const spec of specs) {
    const handler: RequestHandler = async (req, res) => {
      const result = await spec.handler(res.locals.input as Parsed<z.ZodType, z.ZodType, z.ZodType>, req, res);
      if (result !== undefined && !res.headersSent) res.json(result);
    };
    const csrf = UNSAFE.has(spec.method) ? [csrfCheck(spec)] : [];
    const limit = spec.rateLimit ? [limiterFor(spec.rateLimit)] : [];
    router[spec.method](
      spec.path,
      guard(spec.allow),
      ...limit,
      ...csrf,
      ...(spec.before ?? []),
      validate(spec.schemas ?? {}),
      handler,
    );
  }
}
