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
  email_unverified: {
    title: 'This Google account’s address is not verified',
    message:
      'Google does not confirm that this account owns its e-mail address. Verify the address with Google, or sign in with the account your invitation was sent to.',
  },
  wrong_domain: {
    title: 'This account is outside the agency’s domain',
    message: 'Crestwatch accepts only the agency’s own Google accounts here. Sign in with your work account.',
  },
  identity_mismatch: {
    title: 'This address belongs to another Google account',
    message:
      'The address was first used from a different Google account, and Crestwatch keeps to that one. If your account really changed, ask an administrator to reset your Google identity on the People screen.',
  },
  invitation_expired: {
    title: 'This invitation has expired',
    message: 'Invitations can be used for a limited number of days. Ask an administrator to send yours again.',
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
