import { StatePanel } from '@/components/state/state-panel';
import { TextLink } from '@/components/ui/text-link';

/** Why the server refused a sign-in (`/no-access?reason=…`). */
const REASONS: Record<string, { title: string; message: string }> = {
  not_invited: {
    title: 'This account has not been invited',
    message:
      'Crestwatch is open to people an administrator of the agency has invited. Ask one to invite the address you signed in with.',
  },
  deactivated: {
    title: 'This account has been deactivated',
    message: 'An administrator switched this account off. Ask one of them if you still need access.',
  },
};

const UNKNOWN = {
  title: 'No access with this account',
  message: 'The account you signed in with cannot use Crestwatch. Ask an administrator of the agency.',
};

export function NoAccessPanel({ reason }: { reason?: string }) {
  const words = (reason && REASONS[reason]) || UNKNOWN;
  return (
    <StatePanel tone="alert" title={words.title} message={words.message} testID="no-access">
      <TextLink href="/sign-in" label="Sign in with another account" />
    </StatePanel>
  );
}
