import { StyleSheet, Text, View } from 'react-native';

import { colors, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { useServiceWorker } from '@/hooks/use-service-worker';

/** A thin notice under the header on the first visit after a new version was deployed. */
export function UpdateNotice() {
  const { updated, dismiss } = useServiceWorker();
  if (!updated) return null;
  return (
    <View style={styles.bar} role="status" testID="update-notice">
      <Text style={styles.text}>Crestwatch was updated to a new version since your last visit.</Text>
      <Button label="Dismiss" variant="outline" onPress={dismiss} />
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    backgroundColor: colors.selected,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: space.md,
  },
  text: { ...type.caption, fontFamily: type.label.fontFamily, color: colors.text, flexShrink: 1 },
});
