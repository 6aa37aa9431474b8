// Web: a real anchor to the server document, opened in a new tab (the app stays open).
import { StyleSheet, Text, View } from 'react-native';

import { colors, layout, space, type } from '@/components/theme';

import type { ExternalLinkProps } from './external-link.types';

export function ExternalLink({ path, label, accessibilityLabel, testID }: ExternalLinkProps) {
  return (
    <View style={styles.target}>
      <Text
        testID={testID}
        role="link"
        // react-native-web renders a Text with href as an <a>; RN's types do not list it.
        {...({ href: path, hrefAttrs: { target: '_blank', rel: 'noopener' } } as object)}
        aria-label={`${accessibilityLabel ?? label} (opens in a new tab)`}
        style={styles.text}
      >
        {label} ↗
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  target: {
    minHeight: layout.touchTarget,
    justifyContent: 'center',
    paddingHorizontal: space.xs,
    alignSelf: 'flex-start',
    // A long label wraps within the line instead of running past a phone's edge.
    flexShrink: 1,
    maxWidth: '100%',
  },
  text: { ...type.bodyStrong, color: colors.link, textDecorationLine: 'underline' },
});
