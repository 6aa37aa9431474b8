// The one place the app talks HTTP (the base address comes from lib/api-config.ts). Answers
// are read through their contracts (contracts/): a body that does not match is an ApiError
// `bad_response` naming the fields, never a half-read screen.
import type { ApiErrorBody } from '@/contracts/common';
import { MeResponseSchema } from '@/contracts/districts';
import { pick, safeParse, type Issue, type Schema } from '@/contracts/kit';

import { serverUrl } from './api-config';
import { clearOfflineCopies, noteOfflineCopy } from './offline-copies';

/** A failed API call: the server's error code and message, or one of ours for transport faults. */
export class ApiError extends Error {
  /** HTTP status; 0 when no response arrived (offline, refused, aborted). */
  readonly status: number;
  /** The server's stable error code (`not_found`, …), or `network_error` / `bad_response` / `offline`. */
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

export type ApiGetOptions<T> = {
  signal?: AbortSignal;
  /** The answer's contract: the body is parsed with it and returned typed. */
  schema?: Schema<T>;
};

/** Where a body departs from its contract, for the `bad_response` details (at most five fields). */
function mismatches(issues: Issue[]): { path: string; message: string }[] {
  return issues.slice(0, 5).map((i) => ({ path: i.path.map(String).join('.') || '(answer)', message: i.message }));
}

/** The body read through its contract; a mismatch is an ApiError `bad_response`. */
export function readAnswer<T>(path: string, status: number, body: unknown, schema: Schema<T> | undefined): T {
  if (!schema) return body as T;
  const parsed = safeParse(schema, body);
  if (!parsed.success) {
    throw new ApiError(status, 'bad_response', `Unexpected answer from ${path}.`, {
      fields: mismatches(parsed.issues),
    });
  }
  return parsed.data;
}

/** Sends the request; a fetch that throws (offline, refused) becomes ApiError `network_error`. */
async function send(path: string, init: RequestInit, signal?: AbortSignal): Promise<Response> {
  try {
    return await fetch(serverUrl(path), { ...init, credentials: 'same-origin', signal });
  } catch (cause) {
    if (signal?.aborted) throw cause;
    throw new ApiError(0, 'network_error', 'The Crestwatch server could not be reached.', {
      cause: cause instanceof Error ? cause.message : String(cause),
    });
  }
}

/** Bytes of a request body sent so far, and of the whole body. */
export type SendProgress = (sent: number, total: number) => void;

/**
 * The same request through XMLHttpRequest, whose upload events report the bytes sent
 * (fetch has none for a request body); its answer is turned into a Response so the rest
 * of this module reads it as any other.
 */
function sendWithProgress(path: string, init: RequestInit, onProgress: SendProgress, signal?: AbortSignal) {
  return new Promise<Response>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(init.method ?? 'POST', serverUrl(path));
    xhr.withCredentials = false;
    for (const [name, value] of Object.entries((init.headers ?? {}) as Record<string, string>))
      xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded, e.total);
    };
    xhr.onload = () => {
      const headers = new Headers();
      for (const line of xhr
        .getAllResponseHeaders()
        .trim()
        .split(/[\r\n]+/)) {
        const at = line.indexOf(':');
        if (at > 0) headers.append(line.slice(0, at).trim(), line.slice(at + 1).trim());
      }
      // A Response cannot carry a 1xx or a 204 with a body; the statuses here are final ones.
      const empty = xhr.status === 204 || xhr.status === 304;
      resolve(
        new Response(empty ? null : xhr.responseText, { status: xhr.status, statusText: xhr.statusText, headers }),
      );
    };
    const fail = () =>
      reject(
        signal?.aborted
          ? (signal.reason ?? new DOMException('Aborted', 'AbortError'))
          : new ApiError(0, 'network_error', 'The Crestwatch server could not be reached.', {
              cause: 'the upload was interrupted',
            }),
      );
    xhr.onerror = fail;
    xhr.onabort = fail;
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(init.body as XMLHttpRequestBodyInit | null);
  });
}

/** A non-2xx answer as an ApiError: the server's error shape when it sent one. */
function failure(response: Response, body: unknown): ApiError {
  // Signed out, or the session ended: answers kept for reading offline belong to someone
  // who is no longer signed in here.
  if (response.status === 401) void clearOfflineCopies();
  if (isErrorBody(body)) {
    return new ApiError(response.status, body.error.code, body.error.message, body.error.details);
  }
  return new ApiError(
    response.status,
    'http_error',
    `The server answered ${response.status}${response.statusText ? ` ${response.statusText}` : ''}.`,
  );
}

/** GET a JSON resource. Resolves with the body, or rejects with an ApiError. */
export async function apiGet<T>(path: string, options: ApiGetOptions<T> = {}): Promise<T> {
  const response = await send(path, { method: 'GET', headers: { Accept: 'application/json' } }, options.signal);
  const body = await readJson(response);
  if (!response.ok) throw failure(response, body);
  if (body === undefined) throw new ApiError(response.status, 'bad_response', `Unexpected answer from ${path}.`);
  const answer = readAnswer(path, response.status, body, options.schema);
  // The service worker answered from its offline copy: screens say how old it is.
  noteOfflineCopy(answer, response.headers);
  return answer;
}

// ---- State-changing calls --------------------------------------------------------------
// The server wants its session's CSRF token in this header on every POST, PUT, PATCH and
// DELETE (api/http/routes.ts). GET /api/me hands the token out; the auth hook passes it on
// here with `rememberCsrfToken`, and a send made before that fetches it once itself.

export const CSRF_HEADER = 'x-csrf-token';

/** The signed-in person's own answer, which carries the CSRF token (hooks/use-auth.ts reads it too). */
export const ME_PATH = '/api/me';

/** The one field of that answer this module needs. */
const CsrfTokenSchema = pick(MeResponseSchema, { csrfToken: true });

let csrfToken: string | null = null;
let csrfLookup: Promise<string | null> | null = null;

/** Keeps the token GET /api/me answered with (null after sign-out). */
export function rememberCsrfToken(token: string | null): void {
  csrfToken = token;
}

async function currentCsrfToken(refresh = false): Promise<string | null> {
  if (csrfToken && !refresh) return csrfToken;
  csrfLookup ??= apiGet(ME_PATH, { schema: CsrfTokenSchema })
    .then((me) => me.csrfToken)
    .catch(() => null)
    .finally(() => {
      csrfLookup = null;
    });
  csrfToken = await csrfLookup;
  return csrfToken;
}

export type ApiSendMethod = 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export type ApiSendOptions<T> = ApiGetOptions<T> & {
  /** A JSON body (sent as application/json). */
  json?: unknown;
  /** A multipart body (the browser sets its boundary). */
  form?: FormData;
  /** Bytes sent of a multipart body, as the browser reports them (sent through XMLHttpRequest then). */
  onUploadProgress?: SendProgress;
};

/**
 * A state-changing call with the CSRF header. Resolves with the decoded body (undefined
 * for 204 No Content), or rejects with an ApiError. A refusal for an outdated token
 * (`csrf_failed`, e.g. the session was renewed in another tab) fetches a fresh token and
 * tries once more.
 */
export async function apiSend<T = void>(
  method: ApiSendMethod,
  path: string,
  options: ApiSendOptions<T> = {},
): Promise<T> {
  // A change is never queued for later: without a network the app says so at once.
  if (typeof navigator !== 'undefined' && navigator.onLine === false) {
    throw new ApiError(
      0,
      'offline',
      'You are offline. This change needs a connection: nothing was sent or saved. Try again once you are back online.',
    );
  }
  const attempt = async (token: string | null) => {
    const headers: Record<string, string> = { Accept: 'application/json' };
    if (token) headers[CSRF_HEADER] = token;
    let body: BodyInit | undefined;
    if (options.form) body = options.form;
    else if (options.json !== undefined) {
      headers['Content-Type'] = 'application/json';
      body = JSON.stringify(options.json);
    }
    if (options.form && options.onUploadProgress && typeof XMLHttpRequest !== 'undefined')
      return sendWithProgress(path, { method, headers, body }, options.onUploadProgress, options.signal);
    return send(path, { method, headers, body }, options.signal);
  };
  let response = await attempt(await currentCsrfToken());
  let body = await readJson(response);
  if (response.status === 403 && isErrorBody(body) && body.error.code === 'csrf_failed') {
    response = await attempt(await currentCsrfToken(true));
    body = await readJson(response);
  }
  if (!response.ok) throw failure(response, body);
  if (options.schema && body === undefined)
    throw new ApiError(response.status, 'bad_response', `Unexpected answer from ${path}.`);
  return readAnswer(path, response.status, body, options.schema);
}
