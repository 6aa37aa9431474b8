// Native: a server document (a brief's PDF) opens in the system browser.
import { Linking, Pressable, StyleSheet, Text } from 'react-native';

import { colors, layout, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';

import type { ExternalLinkProps } from './external-link.types';

const BASE_URL = process.env.EXPO_PUBLIC_API_BASE_URL ?? '';

export function ExternalLink({ path, label, accessibilityLabel, testID }: ExternalLinkProps) {
  return (
    <Pressable
      testID={testID}
      accessibilityRole="link"
      accessibilityLabel={accessibilityLabel ?? label}
      onPress={() => void Linking.openURL(`${BASE_URL}${path}`)}
      style={(state: InteractionState) => [styles.target, focusOutline(state)]}
    >
      <Text style={styles.text}>{label} ↗</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  target: { minHeight: layout.touchTarget, justifyContent: 'center', paddingHorizontal: space.xs, alignSelf: 'flex-start' },
  text: { ...type.bodyStrong, color: colors.link, textDecorationLine: 'underline' },
});
