import { StyleSheet, Text, View } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { TextLink } from '@/components/ui/text-link';
import type { AuthOptionsResponse, MeResponse } from '@/contracts/districts';
import { SESSION_END_TITLES, sessionEndReason } from '@/lib/session-end';

import { QueryErrorPanel } from '../state/query-error-panel';

/** Why the server sent the browser back here (`/sign-in?error=…`). */
const SIGN_IN_ERRORS: Record<string, string> = {
  no_email: 'The account did not share an e-mail address, so Crestwatch could not match it to an invitation.',
  failed: 'Sign-in did not complete. Please try again.',
};

export type SignInPanelProps = {
  options: QueryState<AuthOptionsResponse>;
  me: QueryState<MeResponse>;
  /** The `error` query parameter the server's callback adds, if any. */
  errorCode?: string;
  onContinue: (signInUrl: string) => void;
};

export function SignInPanel({ options, me, errorCode, onContinue }: SignInPanelProps) {
  if (me.status === 'success' && me.data) {
    return (
      <StatePanel title="You are signed in" message={`Signed in as ${me.data.name ?? me.data.email}.`}>
        <TextLink href="/" label="Go to the region list" />
      </StatePanel>
    );
  }
  const problem = errorCode ? (SIGN_IN_ERRORS[errorCode] ?? SIGN_IN_ERRORS.failed) : null;
  const ended = me.status === 'error' ? sessionEndReason(me.error) : null;
  return (
    <View style={styles.wrap} testID="sign-in">
      <Text role="heading" aria-level={1} style={styles.title}>
        Sign in to Crestwatch
      </Text>
      <Text style={styles.body}>
        District series, thresholds and alerts are open to the agency’s invited staff. Sign in with the account your
        invitation was sent to.
      </Text>
      {ended && !problem ? (
        <StatePanel
          title={SESSION_END_TITLES[ended]}
          message={(me.error as Error).message}
          testID={`sign-in-session-${ended}`}
        />
      ) : null}
      {problem ? (
        <StatePanel tone="alert" title="Sign-in did not work" message={problem} testID="sign-in-problem" />
      ) : null}
      {options.status === 'pending' ? (
        <Skeleton width={200} height={44} />
      ) : options.status === 'error' || !options.data ? (
        <QueryErrorPanel
          what="the sign-in settings"
          error={options.error}
          retrying={options.isFetching}
          onRetry={() => void options.refetch()}
        />
      ) : (
        <View style={styles.action}>
          <Button label="Continue to sign-in" onPress={() => onContinue(options.data!.signInUrl)} />
          {options.data.provider === 'stand-in' ? (
            <Text style={styles.note}>
              Demo mode: a local stand-in signs you in as a demo account; nothing leaves this machine.
            </Text>
          ) : null}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg, maxWidth: 560 },
  title: { ...type.heading, color: colors.text },
  body: { ...type.body, color: colors.text },
  action: { gap: space.sm },
  note: { ...type.caption, color: colors.textMuted },
});
