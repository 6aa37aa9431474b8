/**
 * Reads a supertest answer through its contract (contracts/): the parsed body, typed, or a
 * failure that names the answer's status and every field that did not match.
 */
import { z, type core } from 'zod/mini';

export function parseAnswer<S extends core.$ZodType>(schema: S, res: { status: number; body: unknown }): z.infer<S> {
  const parsed = z.safeParse(schema, res.body);
  if (!parsed.success) {
    throw new Error(`The HTTP ${res.status} answer does not match its contract:\n${z.prettifyError(parsed.error)}`);
  }
  return parsed.data as z.infer<S>;
}
