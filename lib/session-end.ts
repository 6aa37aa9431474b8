// A session the server ended for a limit answers 401 `session_expired` with
// details.reason 'idle' (unused too long) or 'lifetime' (open too long); the app says which.
import { ApiError } from './api-client';

export type SessionEndReason = 'idle' | 'lifetime';

/** The reason a request was refused because the session ended, or null for any other outcome. */
export function sessionEndReason(error: unknown): SessionEndReason | null {
  if (!(error instanceof ApiError) || error.status !== 401 || error.code !== 'session_expired') return null;
  const reason = (error.details as { reason?: unknown } | null | undefined)?.reason;
  return reason === 'idle' || reason === 'lifetime' ? reason : null;
}

/** Titles per reason; the message is the server's, which names the limit in minutes or hours. */
export const SESSION_END_TITLES: Record<SessionEndReason, string> = {
  idle: 'Signed out after a while without activity',
  lifetime: 'Your session reached its time limit',
};

/** Words for a change refused because the session ended. */
export const SESSION_END_CHANGE_WORDS: Record<SessionEndReason, string> = {
  idle: 'Your session ended after a while without activity. Sign in again, then repeat the change.',
  lifetime: 'Your session reached its time limit. Sign in again, then repeat the change.',
};
