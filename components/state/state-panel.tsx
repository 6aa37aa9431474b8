import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';

export type StatePanelProps = {
  /** 'quiet' for empty results, 'alert' for failures (announced to screen readers). */
  tone?: 'quiet' | 'alert';
  title: string;
  message?: string;
  /** Buttons or links offered as the way out. */
  children?: ReactNode;
  testID?: string;
};

/** The panel shown instead of content when there is nothing to show or loading failed. */
export function StatePanel({ tone = 'quiet', title, message, children, testID }: StatePanelProps) {
  const alert = tone === 'alert';
  return (
    <View
      testID={testID}
      accessibilityRole={alert ? 'alert' : undefined}
      style={[styles.panel, alert ? styles.alert : styles.quiet]}
    >
      <Text role="heading" aria-level={2} style={[styles.title, alert && styles.alertTitle]}>
        {title}
      </Text>
      {message ? <Text style={styles.message}>{message}</Text> : null}
      {children ? <View style={styles.actions}>{children}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: {
    borderRadius: radius.lg,
    padding: space.xl,
    gap: space.sm,
    borderWidth: 1,
  },
  quiet: { backgroundColor: colors.surface, borderColor: colors.border, borderStyle: 'dashed' },
  alert: { backgroundColor: colors.dangerFill, borderColor: colors.danger },
  title: { ...type.title, color: colors.text },
  alertTitle: { color: colors.danger },
  message: { ...type.body, color: colors.textMuted },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, marginTop: space.sm },
});
