import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { MutationNotice } from '@/components/form/mutation-notice';
import { colors, radius, space, type, type Tone } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { Pill } from '@/components/ui/pill';
import { formatDate } from '@/lib/format-time';
import { ROLE_LABELS } from '@/lib/roles';
import type { Role } from '@/contracts/common';
import type { Person, PersonPatch, PersonStatus } from '@/contracts/people';

const STATUS: Record<PersonStatus, { label: string; tone: Tone }> = {
  active: { label: 'Active', tone: 'success' },
  invited: { label: 'Invited, not signed in yet', tone: 'warning' },
  deactivated: { label: 'Deactivated', tone: 'neutral' },
};

const ROLES: Role[] = ['official', 'analyst', 'admin'];

export type PersonCardProps = {
  person: Person;
  /** The signed-in admin: they may not switch themselves off here. */
  isSelf: boolean;
  onChange: (patch: PersonPatch) => Promise<unknown>;
};

/** One person: status, role (changeable), deactivate or reactivate. */
export function PersonCard({ person, isSelf, onChange }: PersonCardProps) {
  const [state, setState] = useState<{ busy: string | null; error?: unknown; success?: string }>({ busy: null });
  const act = async (what: string, patch: PersonPatch, success: string) => {
    setState({ busy: what });
    try {
      await onChange(patch);
      setState({ busy: null, success });
    } catch (error) {
      setState({ busy: null, error });
    }
  };
  const status = STATUS[person.status];
  const who = person.name || person.email;
  return (
    <View style={[styles.card, !person.active && styles.inactive]} testID={`person-${person.id}`}>
      <View style={styles.head}>
        <View style={styles.names}>
          <Text style={styles.name}>
            {who}
            {isSelf ? ' (you)' : ''}
          </Text>
          {person.name ? <Text style={styles.email}>{person.email}</Text> : null}
        </View>
        <Pill label={status.label} tone={status.tone} testID={`person-status-${person.id}`} />
      </View>
      <Text style={styles.meta}>
        {person.lastSignInAt ? `Last signed in ${formatDate(person.lastSignInAt)}` : person.invitedAt ? `Invited ${formatDate(person.invitedAt)}` : `Added ${formatDate(person.createdAt)}`}
      </Text>
      <ChoiceGroup
        label="Role"
        choices={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
        value={person.role}
        disabled={!person.active || state.busy !== null}
        onChange={(r) => (r === person.role ? undefined : void act('role', { role: r }, `${who} is now ${ROLE_LABELS[r].toLowerCase()}.`))}
        testID={`person-role-${person.id}`}
      />
      <View style={styles.actions}>
        {person.active ? (
          isSelf ? null : (
            <ConfirmAction
              label="Deactivate"
              question={`Switch off ${who}? Their sessions end at once; they can be reactivated later.`}
              confirmLabel="Deactivate"
              variant="danger"
              busy={state.busy === 'active'}
              busyLabel="Deactivating…"
              onConfirm={() => void act('active', { active: false }, `${who} is deactivated.`)}
              testID={`person-deactivate-${person.id}`}
            />
          )
        ) : (
          <Button
            label="Reactivate"
            variant="outline"
            busy={state.busy === 'active'}
            busyLabel="Reactivating…"
            onPress={() => void act('active', { active: true }, `${who} can sign in again.`)}
            testID={`person-reactivate-${person.id}`}
          />
        )}
      </View>
      <MutationNotice error={state.error} success={state.success} testID={`person-${person.id}`} />
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    flexGrow: 1,
    flexBasis: 340,
    gap: space.sm,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  inactive: { backgroundColor: colors.background, borderStyle: 'dashed' },
  head: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', alignItems: 'flex-start', gap: space.sm },
  names: { flexShrink: 1, gap: space.xxs },
  name: { ...type.bodyStrong, color: colors.text },
  email: { ...type.caption, color: colors.textMuted },
  meta: { ...type.caption, color: colors.textMuted },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
