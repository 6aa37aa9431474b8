import { useCallback, useMemo, useRef, type ReactNode } from 'react';
import { FlatList, StyleSheet, Text, View, type ListRenderItem } from 'react-native';

import { ListControls } from '@/components/region/list-controls';
import { StandingCounts } from '@/components/region/standing-counts';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { StatePanel } from '@/components/state/state-panel';
import { colors, layout, space, type } from '@/components/theme';
import { Button } from '@/components/ui/button';
import { useRegionFilter } from '@/hooks/use-region-filter';
import { useTextScale } from '@/hooks/use-text-scale';
import { applyRegionFilter, countByStanding, toggle, type RegionRow } from '@/lib/region-list';

import { DistrictRow } from './district-row';
import { DistrictRowSkeleton } from './district-row-skeleton';
import { DistrictSearchField } from './district-search-field';
import { FreshnessNotice, type Freshness } from './freshness-notice';

/** As many placeholder rows as a phone screen shows, so the page does not jump on load. */
const SKELETON_ROWS = 8;

export type DistrictListPanelProps = {
  districts: QueryState<RegionRow[]> & Partial<Freshness>;
  /** Drawn above the controls (the phone home's run line). */
  header?: ReactNode;
  /** Code of the district open beside the list, highlighted (wide layout). */
  selectedCode?: string;
  /** The published run's confidence level (for "interval not bounded at 95%" in row labels). */
  level?: number | null;
  /** The chosen track, carried by each row's link (null: the headline track). */
  track?: string | null;
};

/**
 * The region's districts: counts per standing (each a filter), search, sort and shape
 * filters, and a virtualised list of rows (3,000 districts scroll smoothly).
 */
export function DistrictListPanel({
  districts,
  selectedCode,
  level = null,
  header,
  track = null,
}: DistrictListPanelProps) {
  const [filter, setFilter] = useRegionFilter();
  const listRef = useRef<FlatList<RegionRow>>(null);
  const all = districts.data;
  const shown = useMemo(() => (all ? applyRegionFilter(all, filter) : []), [all, filter]);
  const counts = useMemo(() => countByStanding(all ?? []), [all]);
  const filtered = filter.search.trim() !== '' || filter.standings.length > 0 || filter.shapes.length > 0;
  // Opened at /district/X in a wide window: start the list with X in view.
  const selectedIndex = selectedCode ? shown.findIndex((d) => d.code === selectedCode) : -1;
  const initialScrollIndex = selectedIndex > 2 ? selectedIndex - 2 : undefined;

  // At the default text size rows keep one height, so the list places 3,000 of them without
  // measuring (a rare name too long for one line makes its row a little taller, which only
  // nudges the estimate). With a larger text setting names wrap in most rows, so the list
  // measures them instead of trusting one height (WCAG 2.2 SC 1.4.4: text grows, rows follow).
  const textScale = useTextScale();
  const rowHeight = Math.ceil(layout.districtRowHeight * textScale);
  const itemLayout = useCallback(
    (_: ArrayLike<RegionRow> | null | undefined, index: number) => ({
      length: rowHeight,
      offset: rowHeight * index,
      index,
    }),
    [rowHeight],
  );
  const renderItem = useCallback<ListRenderItem<RegionRow>>(
    ({ item }) => (
      <DistrictRow
        district={item}
        selected={item.code === selectedCode}
        level={level}
        height={rowHeight}
        track={track}
      />
    ),
    [selectedCode, level, rowHeight, track],
  );

  // With a larger text setting the controls alone can fill a phone's height, leaving the
  // list no room: they then scroll away with the rows, as the list's header.
  const listShown = !(districts.status === 'pending' || (districts.status === 'error' && !all) || all?.length === 0);
  const top = (
    <View style={styles.top}>
      {header}
      {districts.fetchStatus !== undefined ? (
        <FreshnessNotice freshness={districts as Freshness} what="the district list" />
      ) : null}
      <StandingCounts
        counts={counts}
        selected={filter.standings}
        onToggle={(s) => setFilter({ standings: toggle(filter.standings, s) })}
      />
      <DistrictSearchField value={filter.search} onChange={(search) => setFilter({ search })} />
      <ListControls
        sort={filter.sort}
        onSort={(sort) => setFilter({ sort })}
        shapes={filter.shapes}
        onToggleShape={(s) => setFilter({ shapes: toggle(filter.shapes, s) })}
      />
      <Text style={styles.count} accessibilityLiveRegion="polite" testID="district-count">
        {countText(districts.status, all?.length ?? 0, shown.length, filtered)}
      </Text>
    </View>
  );

  return (
    <View style={styles.panel} testID="district-list-panel">
      {listShown && textScale > 1 ? null : top}
      {districts.status === 'pending' ? (
        <View
          testID="district-list-loading"
          role="progressbar"
          accessible
          accessibilityLabel="Loading the district list"
          style={styles.list}
        >
          {Array.from({ length: SKELETON_ROWS }, (_, i) => (
            <DistrictRowSkeleton key={i} index={i} height={rowHeight} />
          ))}
        </View>
      ) : districts.status === 'error' && !all ? (
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
          ListHeaderComponent={textScale > 1 ? top : undefined}
          getItemLayout={textScale === 1 ? itemLayout : undefined}
          onScrollToIndexFailed={({ index, averageItemLength }) =>
            listRef.current?.scrollToOffset({ offset: index * averageItemLength, animated: false })
          }
          ref={listRef}
          extraData={`${selectedCode}:${rowHeight}:${track}`}
          initialScrollIndex={initialScrollIndex}
          initialNumToRender={10}
          maxToRenderPerBatch={10}
          windowSize={5}
          keyboardShouldPersistTaps="handled"
          ListEmptyComponent={
            <View style={styles.pad}>
              <StatePanel
                testID="district-list-no-match"
                title={
                  filter.search.trim()
                    ? `Nothing matches “${filter.search.trim()}”`
                    : 'No district matches these filters'
                }
                message="Search looks at district names and codes; standing and shape filters narrow it further."
              >
                <Button
                  label="Clear search and filters"
                  variant="outline"
                  onPress={() => setFilter({ search: '', standings: [], shapes: [] })}
                />
              </StatePanel>
            </View>
          }
        />
      )}
    </View>
  );
}

function countText(status: QueryState<unknown>['status'], total: number, shown: number, filtered: boolean): string {
  if (status === 'pending') return 'Loading districts…';
  if (status === 'error' && total === 0) return 'District list unavailable';
  const noun = total === 1 ? 'district' : 'districts';
  if (!filtered) return `${total} ${noun}`;
  return `${shown} of ${total} ${noun} shown`;
}

const keyOf = (d: RegionRow) => d.code;

const styles = StyleSheet.create({
  panel: { flex: 1, backgroundColor: colors.background },
  top: { paddingHorizontal: space.lg, paddingTop: space.md, paddingBottom: space.sm, gap: space.sm },
  count: { ...type.caption, color: colors.textMuted },
  list: { flex: 1 },
  pad: { padding: space.lg },
});
