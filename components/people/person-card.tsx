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
  expired: { label: 'Invitation expired', tone: 'danger' },
  deactivated: { label: 'Deactivated', tone: 'neutral' },
};

const ROLES: Role[] = ['official', 'analyst', 'admin'];

export type PersonCardProps = {
  person: Person;
  /** The signed-in admin: they may not switch themselves off here. */
  isSelf: boolean;
  onChange: (patch: PersonPatch) => Promise<unknown>;
  /** Sends a pending or lapsed invitation again (new expiry). */
  onResend?: () => Promise<unknown>;
  /** Forgets the Google identity the account is pinned to. */
  onResetIdentity?: () => Promise<unknown>;
};

/** The line under the name: last sign-in, or the invitation and when it lapses. */
function metaLine(person: Person): string {
  if (person.lastSignInAt) return `Last signed in ${formatDate(person.lastSignInAt)}`;
  if (person.invitedAt) {
    const expires = person.invitationExpiresAt;
    if (!expires) return `Invited ${formatDate(person.invitedAt)}`;
    return `Invited ${formatDate(person.invitedAt)} · ${person.status === 'expired' ? 'expired' : 'expires'} ${formatDate(expires)}`;
  }
  return `Added ${formatDate(person.createdAt)}`;
}

/** One person: status, role (changeable), re-send an invitation, reset the Google identity, deactivate or reactivate. */
export function PersonCard({ person, isSelf, onChange, onResend, onResetIdentity }: PersonCardProps) {
  const [state, setState] = useState<{ busy: string | null; error?: unknown; success?: string }>({ busy: null });
  const run = async (what: string, call: () => Promise<unknown>, success: string) => {
    setState({ busy: what });
    try {
      await call();
      setState({ busy: null, success });
    } catch (error) {
      setState({ busy: null, error });
    }
  };
  const act = (what: string, patch: PersonPatch, success: string) => run(what, () => onChange(patch), success);
  // Only a real invitation (sent by e-mail) can be re-sent: the first admin and demo accounts have none.
  const pending =
    person.active &&
    !person.lastSignInAt &&
    person.invitedAt !== null &&
    (person.status === 'invited' || person.status === 'expired');
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
      <Text style={styles.meta} testID={`person-meta-${person.id}`}>
        {metaLine(person)}
      </Text>
      <ChoiceGroup
        label="Role"
        choices={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
        value={person.role}
        disabled={!person.active || state.busy !== null}
        onChange={(r) =>
          r === person.role
            ? undefined
            : void act('role', { role: r }, `${who} is now ${ROLE_LABELS[r].toLowerCase()}.`)
        }
        testID={`person-role-${person.id}`}
      />
      <View style={styles.actions}>
        {pending && onResend ? (
          <Button
            label="Re-send invitation"
            variant="outline"
            busy={state.busy === 'resend'}
            busyLabel="Sending…"
            disabled={state.busy !== null}
            onPress={() => void run('resend', onResend, `The invitation to ${person.email} is sent again.`)}
            testID={`person-resend-${person.id}`}
          />
        ) : null}
        {person.identityPinned && onResetIdentity && !isSelf ? (
          <ConfirmAction
            label="Reset Google identity"
            question={`Forget the Google account ${who} signs in with? Their sessions end; the next Google account that signs in with ${person.email} is kept instead. Do this only when their account really changed.`}
            confirmLabel="Reset identity"
            variant="danger"
            busy={state.busy === 'identity'}
            busyLabel="Resetting…"
            onConfirm={() =>
              void run(
                'identity',
                onResetIdentity,
                `The next Google account that signs in as ${person.email} is kept for ${who}.`,
              )
            }
            testID={`person-reset-identity-${person.id}`}
          />
        ) : null}
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
  head: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    justifyContent: 'space-between',
    alignItems: 'flex-start',
    gap: space.sm,
  },
  names: { flexShrink: 1, gap: space.xxs },
  name: { ...type.bodyStrong, color: colors.text },
  email: { ...type.caption, color: colors.textMuted },
  meta: { ...type.caption, color: colors.textMuted },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
