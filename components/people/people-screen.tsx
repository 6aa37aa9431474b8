import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { Page, Section } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, space, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import type { InviteAnswer, InviteInput, Person, PersonPatch } from '@/contracts/people';

import { InvitationDays } from './invitation-days';
import { InviteForm } from './invite-form';
import { PersonCard } from './person-card';

export type PeopleScreenProps = {
  people: QueryState<Person[]>;
  selfId: number | string;
  demo: boolean;
  onInvite: (input: InviteInput) => Promise<InviteAnswer>;
  onChange: (id: number, patch: PersonPatch) => Promise<unknown>;
  onResend?: (id: number) => Promise<unknown>;
  onResetIdentity?: (id: number) => Promise<unknown>;
  /** The `invitationDays` setting (null while loading); omit both to hide the control. */
  invitationDays?: number | null;
  onInvitationDays?: (days: number) => Promise<unknown>;
};

type Show = 'current' | 'all' | 'deactivated';

/** Who has access: invite people with a role, re-send lapsed invitations, change roles, reset a Google identity, switch people off. */
export function PeopleScreen({
  people,
  selfId,
  demo,
  onInvite,
  onChange,
  onResend,
  onResetIdentity,
  invitationDays,
  onInvitationDays,
}: PeopleScreenProps) {
  const [show, setShow] = useState<Show>('current');
  const rows = useMemo(() => {
    const all = people.data ?? [];
    if (show === 'all') return all;
    return all.filter((p) => (show === 'deactivated' ? !p.active : p.active));
  }, [people.data, show]);
  return (
    <Page
      title="People"
      intro="Everyone with access to Crestwatch and their role. Every change here is written to the audit log."
      testID="people-screen"
    >
      <Section title="Invite someone">
        <InviteForm onInvite={onInvite} />
        {demo ? (
          <View style={styles.noteRow}>
            <Text style={styles.note}>Demo mode: invitations go to the local mail catcher.</Text>
            <TextLink href="/mailbox" label="Read them in the mailbox" />
          </View>
        ) : null}
        {onInvitationDays && invitationDays !== undefined ? (
          <InvitationDays days={invitationDays} onSave={onInvitationDays} />
        ) : null}
      </Section>
      <Section title="People with access">
        <ChoiceGroup
          label="Show"
          choices={[
            { value: 'current', label: 'Active and invited' },
            { value: 'deactivated', label: 'Deactivated' },
            { value: 'all', label: 'Everyone' },
          ]}
          value={show}
          onChange={setShow}
        />
        {people.status === 'pending' ? (
          <Skeleton width="100%" height={160} />
        ) : people.status === 'error' || !people.data ? (
          <QueryErrorPanel
            what="the people"
            error={people.error}
            retrying={people.isFetching}
            onRetry={() => void people.refetch()}
            testID="people-error"
          />
        ) : rows.length === 0 ? (
          <StatePanel testID="people-empty" title="Nobody here" message="No one matches this choice." />
        ) : (
          <View style={styles.grid} testID="people-list">
            {rows.map((p) => (
              <PersonCard
                key={p.id}
                person={p}
                isSelf={String(p.id) === String(selfId)}
                onChange={(patch) => onChange(p.id, patch)}
                onResend={onResend ? () => onResend(p.id) : undefined}
                onResetIdentity={onResetIdentity ? () => onResetIdentity(p.id) : undefined}
              />
            ))}
          </View>
        )}
      </Section>
    </Page>
  );
}

const styles = StyleSheet.create({
  noteRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  note: { ...type.body, color: colors.textMuted },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
});
