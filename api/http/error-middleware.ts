import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, NotFoundError } from './errors';
import { redactUrl } from './redact-url';

/** Unknown /api paths answer 404 in the error shape, never the web app. */
export const apiNotFound: RequestHandler = (req) => {
  throw new NotFoundError(`No API route for ${req.method} ${req.path}`);
};

export function errorMiddleware(log: (msg: string) => void): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    if (err instanceof AppError) {
      res.status(err.status).json({ error: { code: err.code, message: err.message, details: err.details } });
      return;
    }
    // body-parser and multer errors carry a status and a type.
    const status =
      typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 500;
    if (status >= 400 && status < 500) {
      const code =
        err.type === 'entity.too.large'
          ? 'payload_too_large'
          : err.type === 'entity.parse.failed'
            ? 'malformed_json'
            : 'bad_request';
      res.status(status).json({ error: { code, message: err.expose === false ? 'Bad request' : String(err.message) } });
      return;
    }
    log(`error on ${req.method} ${redactUrl(req.originalUrl)}: ${err?.stack ?? err}`);
    res.status(500).json({ error: { code: 'internal_error', message: 'Something went wrong on the server.' } });
  };
}
