import type { ReactNode } from 'react';
import { StyleSheet, Text } from 'react-native';

/**
 * Words for screen readers only: clipped to nothing on screen but read as part of the
 * control or paragraph around them (the usual "visually hidden" pattern). A control whose
 * name comes from its content keeps its visible words first and adds these after, so its
 * name always contains its visible label (WCAG 2.2 SC 2.5.3 Label in Name).
 */
export function ScreenReaderText({ children }: { children: ReactNode }) {
  // Marked so layout checks (the 200% text test) know it is hidden on purpose.
  return (
    <Text style={styles.hidden} {...({ dataSet: { screenReaderOnly: 'true' } } as object)}>
      {children}
    </Text>
  );
}

const styles = StyleSheet.create({
  hidden: {
    position: 'absolute',
    width: 1,
    height: 1,
    margin: -1,
    padding: 0,
    borderWidth: 0,
    overflow: 'hidden',
  },
});
