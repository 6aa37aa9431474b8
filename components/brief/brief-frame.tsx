// Native: the brief scrolls like any screen; printing goes through the PDF, which opens
// in the system viewer (its share sheet prints or sends it).
import { ScrollView, StyleSheet, View } from 'react-native';

import { ExternalLink } from '@/components/district/external-link';
import { colors, layout, space } from '@/components/theme';

import type { BriefFrameProps } from './brief-frame.types';

export function BriefFrame({ pdfPath, what, back, children }: BriefFrameProps) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} testID="brief-frame">
      <View style={styles.column}>
        <View style={styles.toolbar}>
          {back}
          <ExternalLink
            path={pdfPath}
            label="Open the PDF"
            accessibilityLabel={`Open the PDF: the ${what}`}
            testID="brief-pdf-link"
          />
        </View>
        <View style={styles.sheet}>{children}</View>
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  content: { padding: space.lg, paddingBottom: space.xxxl },
  column: { width: '100%', maxWidth: layout.detailMaxWidth, gap: space.md },
  toolbar: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.sm,
  },
  sheet: { backgroundColor: colors.surface, borderRadius: 8, padding: space.lg },
});
