/**
 * Request validation with zod in one middleware: the parsed value goes to
 * `res.locals.input` (Express 5's req.query cannot be assigned).
 */
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { z } from 'zod';
import { ValidationError } from './errors';

export interface RequestSchemas<P extends z.ZodType, Q extends z.ZodType, B extends z.ZodType> {
  params?: P;
  query?: Q;
  body?: B;
}

export type Parsed<P extends z.ZodType, Q extends z.ZodType, B extends z.ZodType> = {
  params: z.infer<P>;
  query: z.infer<Q>;
  body: z.infer<B>;
};

export function validate<
  P extends z.ZodType = z.ZodAny,
  Q extends z.ZodType = z.ZodAny,
  B extends z.ZodType = z.ZodAny,
>(schemas: RequestSchemas<P, Q, B>): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const input: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (!result.success) {
        const issues = result.error.issues.map((i) => ({ path: [part, ...i.path].join('.'), message: i.message }));
        throw new ValidationError(`Invalid ${part}: ${issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`, {
          issues,
        });
      }
      input[part] = result.data;
    }
    res.locals.input = input;
    next();
  };
}

/** Kept for the routers that still import it from here; the schema lives in `./params`. */
export { idParams } from './params';
