import type { ReactNode } from 'react';

import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { TextLink } from '@/components/ui/text-link';
import type { MeResponse } from '@/contracts/districts';
import { can, roleLabel, type Capability } from '@/lib/roles';

import { Page } from './page';

/** Who may use each capability, in words for the refusal panel. */
const WHO: Record<Capability, string> = {
  read: 'everyone signed in',
  upload: 'analysts and admins',
  specs: 'analysts and admins',
  runs: 'analysts and admins',
  'settings.read': 'analysts and admins',
  'settings.write': 'admins',
  people: 'admins',
  audit: 'admins',
  mailbox: 'admins',
};

export type RoleGateProps = {
  me: QueryState<MeResponse>;
  need: Capability;
  /** The screen, for the panels: "the upload screen". */
  what: string;
  children: (me: MeResponse) => ReactNode;
};

/**
 * Shows a screen only to the roles that may use it. The server refuses the same calls
 * (403) whatever the app shows; this keeps people from screens that could only fail.
 */
export function RoleGate({ me, need, what, children }: RoleGateProps) {
  if (me.status === 'pending') return <Skeleton width="100%" height={120} />;
  if (me.status === 'error' || !me.data) {
    return (
      <QueryErrorPanel
        what={what}
        error={me.error}
        retrying={me.isFetching}
        onRetry={() => void me.refetch()}
        testID="role-gate-error"
      />
    );
  }
  if (!can(me.data.role, need)) {
    return (
      <StatePanel
        testID="role-gate-refused"
        title={`Not available to ${roleLabel(me.data.role).toLowerCase()}s`}
        message={`This is ${what}, for ${WHO[need]}. Ask an admin if your work needs it.`}
      >
        <TextLink href="/" label="Go to the region" />
      </StatePanel>
    );
  }
  return <>{children(me.data)}</>;
}

export type GatedPageProps = RoleGateProps & { title: string };

/**
 * A whole screen for some roles only: the screen itself for them, else a page with the
 * screen's title and the loading, sign-in or "not for your role" panel.
 */
export function GatedPage({ title, me, need, what, children }: GatedPageProps) {
  if (me.data && can(me.data.role, need)) return <>{children(me.data)}</>;
  return (
    <Page title={title}>
      <RoleGate me={me} need={need} what={what}>
        {() => null}
      </RoleGate>
    </Page>
  );
}
