// The method page's "The series and where they come from": every catalogue indicator with
// its unit, who publishes it and under which terms; the watched ones name their tracks.
import { StyleSheet, Text, View } from 'react-native';

import type { QueryState } from '@/components/state/query-state';
import { colors, radius, space, type } from '@/components/theme';
import type { CatalogueIndicator } from '@/contracts/settings';
import type { Track } from '@/contracts/tracks';

/** The catalogue's source and licence fields (absent from older answers). */
type Provenance = { source?: string | null; licence?: string | null };

export function IndicatorSources({
  indicators,
  tracks,
}: {
  indicators: QueryState<CatalogueIndicator[]>;
  tracks: Track[];
}) {
  if (indicators.status === 'pending') return <Text style={styles.muted}>Loading the indicator catalogue…</Text>;
  if (!indicators.data)
    return <Text style={styles.muted}>The indicator catalogue could not be loaded; sign in to see it.</Text>;
  const open = tracks.filter((t) => t.state !== 'archived');
  return (
    <View style={styles.list} testID="indicator-sources">
      {indicators.data.map((i) => {
        const watchedBy = open.filter((t) => t.indicator.code === i.code);
        const label = watchedBy[0]?.indicator;
        const own = i as CatalogueIndicator & Provenance;
        const source = own.source ?? label?.source ?? null;
        const licence = own.licence ?? label?.licence ?? null;
        return (
          <View key={i.code} style={styles.item} testID={`indicator-source-${i.code}`}>
            <Text style={styles.name}>
              {i.name} <Text style={styles.unit}>({i.unit})</Text>
            </Text>
            {watchedBy.length ? (
              <Text style={styles.line}>Watched as {watchedBy.map((t) => t.name).join(', ')}.</Text>
            ) : null}
            <Text style={styles.line}>Published by: {source ?? 'not recorded in the catalogue'}</Text>
            <Text style={styles.line}>Terms of use: {licence ?? 'not recorded in the catalogue'}</Text>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  item: {
    gap: space.xxs,
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    padding: space.md,
  },
  name: { ...type.bodyStrong, color: colors.text },
  unit: { fontFamily: type.body.fontFamily, color: colors.textMuted },
  line: { ...type.caption, color: colors.text },
  muted: { ...type.body, color: colors.textMuted },
});
