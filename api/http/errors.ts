/**
 * One error base class: an HTTP status and a stable machine code. Services throw these;
 * the error middleware turns them into `{ error: { code, message, details } }`.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class NotFoundError extends AppError {
  constructor(message: string, details?: unknown) {
    super(404, 'not_found', message, details);
  }
}

export class ValidationError extends AppError {
  constructor(message: string, details?: unknown) {
    super(400, 'invalid_request', message, details);
  }
}

/** 429: too many requests from one person; `Retry-After` says when to try again. */
export class RateLimitedError extends AppError {
  constructor(message: string, retryAfterSeconds: number) {
    super(429, 'rate_limited', message, { retryAfterSeconds });
  }
}
