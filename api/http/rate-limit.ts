/**
 * Per-person limits for heavy routes, declared in the route table (`rateLimit` on a
 * route): so many requests a minute (express-rate-limit, keyed by the signed-in person,
 * not the address, so people behind one proxy do not share a bucket) and so many at once.
 * Either limit answers 429 `rate_limited` with `Retry-After` and
 * `details.retryAfterSeconds`. Routes naming the same bucket share its counts.
 */
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { rateLimit as expressRateLimit } from 'express-rate-limit';
import { RateLimitedError } from './errors';

export interface RateLimit {
  /** Routes with the same bucket share one count per person. */
  bucket: string;
  /** Requests a person may start in one minute. */
  perMinute: number;
  /** Requests a person may have unanswered at once. */
  inFlight: number;
}

/** Fits, briefs, exports and reproductions: 30 a minute and 2 at once per person. */
export const COMPUTE_LIMIT: RateLimit = { bucket: 'compute', perMinute: 30, inFlight: 2 };

/** The person's id (the route guard has run); anonymous callers of a public route share one key. */
function personKey(req: Request): string {
  const user = (req as { user?: { id?: number } }).user;
  return user?.id === undefined ? 'anonymous' : `person:${user.id}`;
}

function refuse(res: Response, next: NextFunction, seconds: number, message: string): void {
  const s = Math.max(1, Math.ceil(seconds));
  res.set('Retry-After', String(s));
  next(new RateLimitedError(message, s));
}

export function personLimiter(limit: RateLimit): RequestHandler {
  const perMinute = expressRateLimit({
    windowMs: 60_000,
    limit: limit.perMinute,
    keyGenerator: personKey,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (req, res, next) => {
      const reset = (req as { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const seconds = reset ? (reset.getTime() - Date.now()) / 1000 : 60;
      refuse(
        res,
        next,
        seconds,
        `Too many heavy requests: at most ${limit.perMinute} a minute per person. Try again shortly.`,
      );
    },
  });
  const open = new Map<string, number>();
  const inFlight: RequestHandler = (req, res, next) => {
    const key = personKey(req);
    const n = open.get(key) ?? 0;
    if (n >= limit.inFlight) {
      refuse(res, next, 1, `At most ${limit.inFlight} heavy requests at once per person: wait for one to finish.`);
      return;
    }
    open.set(key, n + 1);
    let released = false;
    res.once('close', () => {
      if (released) return;
      released = true;
      const left = (open.get(key) ?? 1) - 1;
      if (left > 0) open.set(key, left);
      else open.delete(key);
    });
    next();
  };
  return (req, res, next) => {
    inFlight(req, res, (err?: unknown) => {
      if (err) return next(err);
      void perMinute(req, res, next);
    });
  };
}
