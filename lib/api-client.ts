// The one place the app talks HTTP. Paths are relative to the page's origin (the Express
// server serves both the web build and /api); a native build sets EXPO_PUBLIC_API_BASE_URL.
import type { ApiErrorBody } from './api-types';

const BASE_URL = process.env.EXPO_PUBLIC_API_BASE_URL ?? '';

/** A failed API call: the server's error code and message, or one of ours for transport faults. */
export class ApiError extends Error {
  /** HTTP status; 0 when no response arrived (offline, refused, aborted). */
  readonly status: number;
  /** The server's stable error code (`not_found`, …), or `network_error` / `bad_response`. */
  readonly code: string;
  readonly details?: unknown;

  constructor(status: number, code: string, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }

  /** The request itself was wrong (4xx): asking again gives the same answer. */
  get isClientError(): boolean {
    return this.status >= 400 && this.status < 500;
  }
}

function isErrorBody(body: unknown): body is ApiErrorBody {
  if (typeof body !== 'object' || body === null || !('error' in body)) return false;
  const error = (body as { error: unknown }).error;
  return (
    typeof error === 'object' &&
    error !== null &&
    typeof (error as { code?: unknown }).code === 'string' &&
    typeof (error as { message?: unknown }).message === 'string'
  );
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

export type ApiGetOptions = {
  signal?: AbortSignal;
  /**
   * Checks the decoded body and returns it typed; throws (or returns false) when the shape is
   * not what the caller expects, which surfaces as an ApiError `bad_response`.
   */
  accept?: (body: unknown) => boolean;
};

/** GET a JSON resource. Resolves with the body, or rejects with an ApiError. */
export async function apiGet<T>(path: string, options: ApiGetOptions = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(`${BASE_URL}${path}`, {
      method: 'GET',
      headers: { Accept: 'application/json' },
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (cause) {
    if (options.signal?.aborted) throw cause;
    throw new ApiError(0, 'network_error', 'The Crestwatch server could not be reached.', {
      cause: cause instanceof Error ? cause.message : String(cause),
    });
  }

  const body = await readJson(response);
  if (!response.ok) {
    if (isErrorBody(body)) {
      throw new ApiError(response.status, body.error.code, body.error.message, body.error.details);
    }
    throw new ApiError(
      response.status,
      'http_error',
      `The server answered ${response.status}${response.statusText ? ` ${response.statusText}` : ''}.`,
    );
  }
  if (body === undefined || (options.accept && !options.accept(body))) {
    throw new ApiError(response.status, 'bad_response', `Unexpected answer from ${path}.`);
  }
  return body as T;
}
