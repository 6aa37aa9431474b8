import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';

import { colors, layout, space, type } from '@/components/theme';

import { StickySide } from './sticky-side';

export type PageProps = {
  title: string;
  /** One or two sentences under the title: what the screen is for. */
  intro?: string;
  /** Buttons or links beside the title (below it on a phone). */
  actions?: ReactNode;
  children: ReactNode;
  /** Use the whole window width (a wide table beside a side panel), not the reading width. */
  fill?: boolean;
  testID?: string;
};

/** The frame of a staff screen: a scrolling column with its heading, up to the page width. */
export function Page({ title, intro, actions, children, fill = false, testID }: PageProps) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} testID={testID}>
      <View style={[styles.column, fill && styles.fill]}>
        <View style={styles.head}>
          <View style={styles.titles}>
            <Text role="heading" aria-level={1} style={styles.title}>
              {title}
            </Text>
            {intro ? <Text style={styles.intro}>{intro}</Text> : null}
          </View>
          {actions ? <View style={styles.actions}>{actions}</View> : null}
        </View>
        {children}
      </View>
    </ScrollView>
  );
}

export type SectionProps = { title: string; children: ReactNode; aside?: ReactNode; testID?: string };

/** A titled block inside a page. */
export function Section({ title, children, aside, testID }: SectionProps) {
  return (
    <View style={styles.section} testID={testID}>
      <View style={styles.sectionHead}>
        <Text role="heading" aria-level={2} style={styles.sectionTitle}>
          {title}
        </Text>
        {aside}
      </View>
      {children}
    </View>
  );
}

/**
 * Two columns in the wide layout (main and a fixed-width side panel that stays in view while
 * the main column scrolls); one above the other on a phone.
 */
export function SplitColumns({ wide, main, side }: { wide: boolean; main: ReactNode; side: ReactNode | null }) {
  if (!wide) {
    return (
      <View style={styles.stack}>
        {main}
        {side}
      </View>
    );
  }
  return (
    <View style={styles.split}>
      <View style={styles.splitMain}>{main}</View>
      {side ? (
        <View style={styles.splitSide}>
          <StickySide>{side}</StickySide>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  content: { padding: space.lg, paddingBottom: space.xxxl },
  column: { width: '100%', maxWidth: layout.pageMaxWidth, gap: space.xl },
  fill: { maxWidth: '100%' },
  head: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    justifyContent: 'space-between',
    gap: space.md,
  },
  titles: { gap: space.xs, flexShrink: 1, minWidth: 240, maxWidth: 720 },
  title: { ...type.heading, color: colors.text },
  intro: { ...type.body, color: colors.textMuted },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  section: { gap: space.md },
  sectionHead: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.sm,
  },
  sectionTitle: { ...type.title, color: colors.text },
  stack: { gap: space.xl },
  // Stretch (not flex-start): a sticky child needs a side column as tall as the table.
  split: { flexDirection: 'row', alignItems: 'stretch', gap: space.xl },
  splitMain: { flex: 1, minWidth: 0, gap: space.xl },
  splitSide: { width: layout.sidePanelWidth, gap: space.lg },
});
