// Web: the panel stays in view while the table beside it scrolls (CSS position: sticky
// inside the page's scrolling element), and scrolls on its own when it is taller than the
// window, so choosing a district far down the table shows it without scrolling back up.
import { ScrollView, StyleSheet, useWindowDimensions, View } from 'react-native';

import { space } from '@/components/theme';

import { STICKY_SIDE_CLEARANCE, type StickySideProps } from './sticky-side.types';

export function StickySide({ children, testID }: StickySideProps) {
  const { height } = useWindowDimensions();
  return (
    <View style={styles.sticky} testID={testID}>
      <ScrollView
        style={{ maxHeight: Math.max(320, height - STICKY_SIDE_CLEARANCE) }}
        contentContainerStyle={styles.content}
      >
        {children}
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  // 'sticky' is a react-native-web position value; React Native's own types do not list it.
  sticky: { position: 'sticky' as 'relative', top: space.lg },
  content: { gap: space.lg },
});
