import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { colors, space, type } from '@/components/theme';

import { Button, type ButtonProps } from './button';

export type ConfirmActionProps = {
  label: string;
  /** The question asked before acting: "Put back the values this upload replaced?" */
  question: string;
  confirmLabel: string;
  onConfirm: () => void;
  busy?: boolean;
  busyLabel?: string;
  variant?: ButtonProps['variant'];
  disabled?: boolean;
  testID?: string;
};

/** A button that asks once before it acts, in place (no dialog to lose on a phone). */
export function ConfirmAction({
  label,
  question,
  confirmLabel,
  onConfirm,
  busy,
  busyLabel,
  variant = 'outline',
  disabled,
  testID,
}: ConfirmActionProps) {
  const [asking, setAsking] = useState(false);
  if (!asking || busy) {
    return (
      <Button
        label={label}
        variant={variant}
        busy={busy}
        busyLabel={busyLabel}
        disabled={disabled}
        onPress={() => setAsking(true)}
        testID={testID}
      />
    );
  }
  return (
    <View style={styles.ask} accessibilityLiveRegion="polite">
      <Text style={styles.question}>{question}</Text>
      <View style={styles.buttons}>
        <Button
          label={confirmLabel}
          variant={variant === 'outline' ? 'solid' : variant}
          onPress={() => {
            setAsking(false);
            onConfirm();
          }}
          testID={testID ? `${testID}-confirm` : undefined}
        />
        <Button
          label="Cancel"
          variant="outline"
          onPress={() => setAsking(false)}
          testID={testID ? `${testID}-cancel` : undefined}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  ask: { gap: space.sm, maxWidth: 420 },
  question: { ...type.body, fontFamily: type.label.fontFamily, color: colors.text },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
