// Native: a server document (a brief's PDF) opens in the system browser.
import { Linking, Pressable, StyleSheet, Text } from 'react-native';

import { colors, layout, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { serverUrl } from '@/lib/api-config';

import type { ExternalLinkProps } from './external-link.types';

export function ExternalLink({ path, label, accessibilityLabel, testID }: ExternalLinkProps) {
  return (
    <Pressable
      testID={testID}
      accessibilityRole="link"
      accessibilityLabel={accessibilityLabel ?? label}
      onPress={() => void Linking.openURL(serverUrl(path))}
      style={(state: InteractionState) => [styles.target, focusOutline(state)]}
    >
      <Text style={styles.text}>{label} ↗</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  target: {
    minHeight: layout.touchTarget,
    justifyContent: 'center',
    paddingHorizontal: space.xs,
    alignSelf: 'flex-start',
  },
  text: { ...type.bodyStrong, color: colors.link, textDecorationLine: 'underline' },
});
