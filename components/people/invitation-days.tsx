import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { MutationNotice } from '@/components/form/mutation-notice';
import { TextField } from '@/components/form/text-field';
import { colors, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';

export type InvitationDaysProps = {
  /** The `invitationDays` setting; null while it loads. */
  days: number | null;
  onSave: (days: number) => Promise<unknown>;
};

/** How long a new or re-sent invitation can be used (the admin setting `invitationDays`). */
export function InvitationDays({ days, onSave }: InvitationDaysProps) {
  const [draft, setDraft] = useState(days === null ? '' : String(days));
  const [problem, setProblem] = useState<string | undefined>();
  const [state, setState] = useState<{ busy: boolean; error?: unknown; success?: string }>({ busy: false });
  // When the saved setting arrives or changes, the draft follows it (state adjusted during render, not in an effect).
  const [shownDays, setShownDays] = useState(days);
  if (days !== shownDays) {
    setShownDays(days);
    if (days !== null) setDraft(String(days));
  }

  const save = async () => {
    const n = Number(draft.trim());
    if (!/^\d+$/.test(draft.trim()) || n < 1 || n > 365) {
      setProblem('A whole number of days from 1 to 365.');
      return;
    }
    setProblem(undefined);
    setState({ busy: true });
    try {
      await onSave(n);
      setState({ busy: false, success: `New and re-sent invitations can be used for ${n} day${n === 1 ? '' : 's'}.` });
    } catch (error) {
      setState({ busy: false, error });
    }
  };

  return (
    <View style={styles.wrap} testID="invitation-days">
      <Text style={styles.note}>
        An invitation not used in time lapses and shows as expired below; re-send it to renew it. The first admin and
        the demo accounts never lapse.
      </Text>
      <View style={styles.row}>
        <View style={styles.field}>
          <TextField
            label="Invitations can be used for (days)"
            value={draft}
            onChangeText={setDraft}
            keyboardType="number-pad"
            hint="Default 14"
            error={problem}
            editable={days !== null}
            testID="invitation-days-input"
          />
        </View>
        <Button
          label="Save"
          variant="outline"
          busy={state.busy}
          busyLabel="Saving…"
          disabled={days === null}
          onPress={() => void save()}
          testID="invitation-days-save"
        />
      </View>
      <MutationNotice error={state.error} success={state.success} testID="invitation-days" />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  note: { ...type.body, color: colors.textMuted },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', gap: space.sm },
  field: { flexGrow: 1, flexBasis: 220, maxWidth: 320 },
});
