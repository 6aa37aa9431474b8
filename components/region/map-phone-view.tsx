// The phone's Map view of the region: the same header as the list (run line, Map | List),
// then the map, its legend-filter and summary, and the districts without a boundary.
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { space } from '@/components/theme';
import type { RegionRow } from '@/lib/region-list';

import { RegionMap } from './region-map';

export function MapPhoneView({
  header,
  districts,
  track = null,
}: {
  header: ReactNode;
  districts: QueryState<RegionRow[]>;
  track?: { code: string; name: string } | null;
}) {
  return (
    <ScrollView contentContainerStyle={styles.content} testID="region-map-view">
      <View style={styles.top}>{header}</View>
      <View style={styles.map}>
        <RegionMap districts={districts} track={track} />
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  content: { paddingBottom: space.xl },
  top: { paddingHorizontal: space.lg, paddingTop: space.md, gap: space.sm },
  map: { paddingHorizontal: space.lg, paddingTop: space.sm },
});
