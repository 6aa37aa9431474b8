/**
 * Reads a supertest answer through its contract (contracts/): the parsed body, typed, or a
 * failure that names the answer's status and every field that did not match.
 */
import { describeIssues, safeParse, type Schema } from '../../contracts/kit';

export function parseAnswer<T>(schema: Schema<T>, res: { status: number; body: unknown }): T {
  const parsed = safeParse(schema, res.body);
  if (!parsed.success) {
    throw new Error(
      `The HTTP ${res.status} answer does not match its contract:\n${describeIssues(parsed.issues).split('; ').join('\n')}`,
    );
  }
  return parsed.data;
}
