import { Button } from '@/components/ui/button';
import { TextLink } from '@/components/ui/text-link';
import { ApiError } from '@/lib/api-client';
import { SESSION_END_TITLES, sessionEndReason } from '@/lib/session-end';

import { StatePanel } from './state-panel';

export type QueryErrorPanelProps = {
  /** What failed to load, for the title: "the district list". */
  what: string;
  error: unknown;
  onRetry: () => void;
  retrying?: boolean;
  testID?: string;
};

/** Words for a failed request; the server's own message for refusals (4xx). */
export function describeLoadError(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 0) return 'The Crestwatch server could not be reached. Check the connection, then try again.';
    if (error.isClientError) return error.message;
    if (error.code === 'bad_response') return 'The server sent an answer this screen cannot read.';
    return `The server could not answer just now (${error.status} ${error.code}). Try again in a moment.`;
  }
  return 'Something unexpected went wrong while loading.';
}

/**
 * Error state with a Retry button (not offered for 4xx: asking again gets the same refusal).
 * A 401 means nobody is signed in: the way out is the sign-in page, not a retry.
 */
export function QueryErrorPanel({ what, error, onRetry, retrying = false, testID }: QueryErrorPanelProps) {
  const ended = sessionEndReason(error);
  if (ended) {
    return (
      <StatePanel
        testID={testID ? `${testID}-session-ended` : undefined}
        title={SESSION_END_TITLES[ended]}
        message={(error as ApiError).message}
      >
        <TextLink href="/sign-in" label="Sign in again" />
      </StatePanel>
    );
  }
  if (error instanceof ApiError && error.status === 401) {
    return (
      <StatePanel
        testID={testID ? `${testID}-sign-in` : undefined}
        title={`Sign in to see ${what}`}
        message="District figures are shown to the agency’s invited staff."
      >
        <TextLink href="/sign-in" label="Sign in" />
      </StatePanel>
    );
  }
  const canRetry = !(error instanceof ApiError && error.isClientError);
  return (
    <StatePanel tone="alert" title={`Could not load ${what}`} message={describeLoadError(error)} testID={testID}>
      {canRetry ? (
        <Button
          label="Retry"
          busy={retrying}
          busyLabel="Retrying…"
          onPress={onRetry}
          accessibilityHint={`Loads ${what} again`}
        />
      ) : null}
    </StatePanel>
  );
}
