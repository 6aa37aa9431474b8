import { useCallback, useMemo, useState } from 'react';
import { FlatList, StyleSheet, Text, View, type ListRenderItem } from 'react-native';

import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { StatePanel } from '@/components/state/state-panel';
import { colors, layout, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import type { DistrictSummary } from '@/lib/api-types';
import { searchDistricts } from '@/lib/district-search';

import { DistrictRow } from './district-row';
import { DistrictRowSkeleton } from './district-row-skeleton';
import { DistrictSearchField } from './district-search-field';

/** As many placeholder rows as a phone screen shows, so the page does not jump on load. */
const SKELETON_ROWS = 8;

export type DistrictListPanelProps = {
  districts: QueryState<DistrictSummary[]>;
  /** Code of the district open beside the list, highlighted (wide layout). */
  selectedCode?: string;
};

/** The region's districts: a search field, a count, and a virtualised list of rows. */
export function DistrictListPanel({ districts, selectedCode }: DistrictListPanelProps) {
  const [search, setSearch] = useState('');
  const all = districts.data;
  const shown = useMemo(() => (all ? searchDistricts(all, search) : []), [all, search]);
  // Opened at /district/X in a wide window: start the list with X in view (rows have a
  // fixed height, so FlatList can jump there without measuring).
  const selectedIndex = selectedCode ? shown.findIndex((d) => d.code === selectedCode) : -1;
  const initialScrollIndex = selectedIndex > 2 ? selectedIndex - 2 : undefined;

  const renderItem = useCallback<ListRenderItem<DistrictSummary>>(
    ({ item }) => <DistrictRow district={item} selected={item.code === selectedCode} />,
    [selectedCode],
  );

  return (
    <View style={styles.panel} testID="district-list-panel">
      <View style={styles.top}>
        <DistrictSearchField value={search} onChange={setSearch} />
        <Text style={styles.count} accessibilityLiveRegion="polite" testID="district-count">
          {countText(districts.status, all?.length ?? 0, shown.length, search)}
        </Text>
      </View>
      {districts.status === 'pending' ? (
        <View
          testID="district-list-loading"
          accessible
          accessibilityLabel="Loading the district list"
          style={styles.list}
        >
          {Array.from({ length: SKELETON_ROWS }, (_, i) => (
            <DistrictRowSkeleton key={i} index={i} />
          ))}
        </View>
      ) : districts.status === 'error' ? (
        <View style={styles.pad}>
          <QueryErrorPanel
            testID="district-list-error"
            what="the district list"
            error={districts.error}
            retrying={districts.isFetching}
            onRetry={() => void districts.refetch()}
          />
        </View>
      ) : all && all.length === 0 ? (
        <View style={styles.pad}>
          <StatePanel
            testID="district-list-empty"
            title="No districts yet"
            message="Crestwatch has no district series loaded. They appear here once an analyst applies an upload."
          />
        </View>
      ) : (
        <FlatList
          testID="district-list"
          style={styles.list}
          data={shown}
          renderItem={renderItem}
          keyExtractor={keyOf}
          getItemLayout={itemLayout}
          extraData={selectedCode}
          initialScrollIndex={initialScrollIndex}
          initialNumToRender={16}
          windowSize={7}
          keyboardShouldPersistTaps="handled"
          ListEmptyComponent={
            <View style={styles.pad}>
              <StatePanel
                testID="district-list-no-match"
                title={`Nothing matches “${search.trim()}”`}
                message="Search looks at district names and codes. Try fewer letters."
              >
                <Button label="Clear the search" variant="outline" onPress={() => setSearch('')} />
              </StatePanel>
            </View>
          }
        />
      )}
    </View>
  );
}

function countText(status: QueryState<unknown>['status'], total: number, shown: number, search: string): string {
  if (status === 'pending') return 'Loading districts…';
  if (status === 'error') return 'District list unavailable';
  if (search.trim() === '') return `${total} ${total === 1 ? 'district' : 'districts'}`;
  return `${shown} of ${total} ${total === 1 ? 'district' : 'districts'} match`;
}

const keyOf = (d: DistrictSummary) => d.code;

const itemLayout = (_: ArrayLike<DistrictSummary> | null | undefined, index: number) => ({
  length: layout.districtRowHeight,
  offset: layout.districtRowHeight * index,
  index,
});

const styles = StyleSheet.create({
  panel: { flex: 1, backgroundColor: colors.background },
  top: { paddingHorizontal: space.lg, paddingTop: space.lg, paddingBottom: space.sm, gap: space.sm },
  count: { ...type.caption, color: colors.textMuted },
  list: { flex: 1 },
  pad: { padding: space.lg },
});
