import { StyleSheet, Text, View } from 'react-native';

import { radius, space, toneColors, type, type Tone } from '@/components/theme';
import { textSize } from '@/lib/text-size';

export type PillProps = { label: string; tone?: Tone; testID?: string; accessibilityLabel?: string };

/** A short status word on a tinted fill: run states, upload status, roles, "new". */
export function Pill({ label, tone = 'neutral', testID, accessibilityLabel }: PillProps) {
  const c = toneColors[tone];
  return (
    <View style={[styles.pill, { backgroundColor: c.fill }]} testID={testID} accessibilityLabel={accessibilityLabel}>
      <Text style={[styles.text, { color: c.ink }]} numberOfLines={1}>
        {label}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  pill: {
    alignSelf: 'flex-start',
    borderRadius: radius.pill,
    paddingHorizontal: space.sm,
    paddingVertical: space.xxs,
  },
  text: { ...type.label, fontSize: textSize(12), lineHeight: textSize(16) },
});
