// Answers for the mocked apiGet: a table of path → body, or an ApiError to throw.
import { ApiError } from '@/lib/api-client';

export type Answer = unknown | ApiError | (() => Promise<unknown>);

export function answerWith(table: Record<string, Answer>) {
  return async (path: string): Promise<unknown> => {
    if (!(path in table)) throw new ApiError(404, 'not_found', `No route ${path} in the test table`);
    const answer = table[path];
    if (answer instanceof ApiError) throw answer;
    if (typeof answer === 'function') return (answer as () => Promise<unknown>)();
    return answer;
  };
}

/** A promise that never settles, to hold a query in its loading state. */
export const never = () => new Promise<never>(() => {});
