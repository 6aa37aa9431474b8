// The region map: districts filled by their standing in the published run, a legend with
// the counts that doubles as the standing filter (shared with the list's chips), a text
// summary, and the districts without a boundary listed underneath. The drawing mounts
// after its size is known, behind a same-size placeholder. The list stays the keyboard
// and screen-reader way through the districts.
import { router } from '@/lib/router';
import { useMemo, useState } from 'react';
import { StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { colors, space, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { useMeQuery } from '@/hooks/use-auth';
import { useBoundariesQuery } from '@/hooks/use-boundaries';
import { useRegionFilter } from '@/hooks/use-region-filter';
import { STANDINGS, type Standing } from '@/contracts/estimates';
import { STANDING_LABEL } from '@/lib/estimate-words';
import { buildMapScene, mapAspect } from '@/lib/map-scene';
import { standingOf, toggle, type RegionRow } from '@/lib/region-list';
import { can } from '@/lib/roles';

import { Chip } from './chip';
import { MapCanvas } from './map-canvas';
import { StandingMark } from './standing-mark';

export type RegionMapProps = {
  districts: QueryState<RegionRow[]>;
  /** The track whose standings `districts` carry (named in the summary; district links keep it). */
  track?: { code: string; name: string } | null;
  /** Most width the map may take. */
  maxWidth?: number;
};

function plural(n: number, one: string, many = `${one}s`) {
  return `${n} ${n === 1 ? one : many}`;
}

export function RegionMap({ districts, track = null, maxWidth = 720 }: RegionMapProps) {
  const boundaries = useBoundariesQuery();
  const me = useMeQuery();
  const [filter, setFilter] = useRegionFilter();
  const [width, setWidth] = useState(0);
  const rows = useMemo(() => districts.data ?? [], [districts.data]);
  const byCode = useMemo(() => new Map(rows.map((r) => [r.code, r])), [rows]);
  const fc = boundaries.data;
  const w = Math.min(width, maxWidth);
  const h = fc && fc.features.length ? Math.round(w * mapAspect(fc)) : Math.round(w * 0.7);
  const scene = useMemo(
    () =>
      fc && w > 0
        ? buildMapScene({
            collection: fc,
            standingOf: (code) => (byCode.has(code) ? standingOf(byCode.get(code)!) : 'not_estimable'),
            width: w,
            height: h,
          })
        : null,
    [fc, w, h, byCode],
  );
  const mapped = new Set(fc?.features.map((f) => f.properties.code) ?? []);
  const without = rows.filter((r) => !mapped.has(r.code));
  const counts: Record<Standing, number> = { approaching: 0, at_turn: 0, past_turn: 0, no_turn: 0, not_estimable: 0 };
  for (const d of scene?.districts ?? []) counts[d.standing] += 1;
  const summary =
    scene && scene.districts.length > 0
      ? `Map of ${plural(scene.districts.length, 'district')} coloured by standing${track ? ` on ${track.name}` : ''}: ${STANDINGS.filter(
          (s) => counts[s] > 0,
        )
          .map((s) => `${counts[s]} ${STANDING_LABEL[s].toLowerCase()}`)
          .join(
            ', ',
          )}.${without.length ? ` ${plural(without.length, 'district')} without a boundary.` : ''} The list holds the same districts.`
      : '';

  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.floor(e.nativeEvent.layout.width));
  return (
    <View style={styles.wrap} onLayout={onLayout} testID="region-map">
      {boundaries.status === 'error' ? (
        <Text style={styles.note} testID="region-map-error">
          The map could not be loaded; the list has every district.
        </Text>
      ) : fc && fc.features.length === 0 ? (
        <View style={styles.empty} testID="region-map-empty">
          <Text style={styles.note}>
            No district boundaries have been loaded yet: an analyst can load them as GeoJSON.
          </Text>
          {can(me.data?.role, 'upload') ? (
            <TextLink href="/uploads/boundaries" label="Load district boundaries" />
          ) : null}
        </View>
      ) : scene ? (
        <MapCanvas
          scene={scene}
          shown={filter.standings}
          onOpen={(code) =>
            router.push({ pathname: '/district/[code]', params: track ? { code, track: track.code } : { code } })
          }
          testID="region-map-canvas"
        />
      ) : (
        <View style={{ width: w || '100%', height: h || 240 }} testID="region-map-placeholder">
          <Skeleton width={w || 320} height={h || 240} />
        </View>
      )}
      {scene && scene.districts.length > 0 ? (
        <>
          <View style={styles.legend} role="group" aria-label="Legend and filter: standings on the map">
            {STANDINGS.filter((s) => counts[s] > 0).map((s) => (
              <Chip
                key={s}
                label={`${STANDING_LABEL[s]} ${counts[s]}`}
                on={filter.standings.includes(s)}
                onPress={() => setFilter({ standings: toggle(filter.standings, s) })}
                leading={<StandingMark standing={s} size={12} decorative />}
                accessibilityLabel={`${STANDING_LABEL[s]}: ${counts[s]} districts; show only these`}
                testID={`map-legend-${s}`}
              />
            ))}
          </View>
          <Text style={styles.summary} testID="region-map-summary">
            {summary}
          </Text>
        </>
      ) : null}
      {fc && fc.features.length > 0 && without.length > 0 ? (
        <Text style={styles.note} testID="region-map-without">
          Without a boundary: {without.map((d) => `${d.name} (${d.code})`).join(', ')}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm, width: '100%' },
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  summary: { ...type.caption, color: colors.textMuted },
  note: { ...type.body, color: colors.textMuted },
  empty: { gap: space.xs },
});
