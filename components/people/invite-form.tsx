import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { ChoiceGroup } from '@/components/form/choice-group';
import { fieldErrorsOf, MutationNotice } from '@/components/form/mutation-notice';
import { TextField } from '@/components/form/text-field';
import { colors, radius, space } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/roles';
import type { Role } from '@/contracts/common';
import type { InviteAnswer, InviteInput } from '@/contracts/people';

const ROLES: Role[] = ['official', 'analyst', 'admin'];
const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

/** Invite an address with a role; the server e-mails the invitation. */
export function InviteForm({ onInvite }: { onInvite: (input: InviteInput) => Promise<InviteAnswer> }) {
  const [email, setEmail] = useState('');
  const [name, setName] = useState('');
  const [role, setRole] = useState<Role>('official');
  const [problems, setProblems] = useState<Record<string, string>>({});
  const [state, setState] = useState<{ busy: boolean; error?: unknown; success?: string }>({ busy: false });

  const submit = async () => {
    const address = email.trim();
    if (!EMAIL.test(address)) {
      setProblems({ email: 'An e-mail address, such as name@agency.example.' });
      return;
    }
    setProblems({});
    setState({ busy: true });
    try {
      const a = await onInvite({ email: address, role, ...(name.trim() ? { name: name.trim() } : {}) });
      setState({
        busy: false,
        success: a.mail.sent
          ? `Invited ${a.user.email} as ${ROLE_LABELS[a.user.role].toLowerCase()}; the invitation e-mail is on its way.`
          : undefined,
        error: a.mail.sent
          ? undefined
          : new Error(a.mail.error ?? 'The invitation is saved but the e-mail could not be sent.'),
      });
      if (a.mail.sent) {
        setEmail('');
        setName('');
      }
    } catch (error) {
      setProblems(fieldErrorsOf(error));
      setState({ busy: false, error });
    }
  };

  return (
    <View style={styles.box} testID="invite-form">
      <View style={styles.row}>
        <View style={styles.cell}>
          <TextField
            label="E-mail address"
            value={email}
            onChangeText={setEmail}
            keyboardType="email-address"
            error={problems.email}
            placeholder="name@agency.example"
            testID="invite-email"
            onSubmitEditing={() => void submit()}
          />
        </View>
        <View style={styles.cell}>
          <TextField
            label="Name (optional)"
            value={name}
            onChangeText={setName}
            autoCapitalize="words"
            maxLength={120}
            testID="invite-name"
          />
        </View>
      </View>
      <ChoiceGroup
        label="Role"
        choices={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r], hint: ROLE_DESCRIPTIONS[r] }))}
        value={role}
        onChange={setRole}
        testID="invite-role"
      />
      <Button
        label="Send invitation"
        busy={state.busy}
        busyLabel="Sending…"
        onPress={() => void submit()}
        testID="invite-send"
      />
      <MutationNotice error={state.error} success={state.success} testID="invite" />
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: space.md,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  cell: { flexGrow: 1, flexBasis: 240 },
});
