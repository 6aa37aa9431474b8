import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';

import { CautionNote } from '@/components/district/caution-note';
import { ExternalLink } from '@/components/district/external-link';
import { briefPdfPath } from '@/hooks/use-briefs';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { colors, layout, radius, space, standingColors, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { STANDINGS, type RegionResponse, type Shape } from '@/contracts/estimates';
import {
  formatLevel,
  intervalText,
  notBoundedText,
  SHAPE_LABEL,
  SHAPE_PLAIN_SHORT,
  shapeWords,
  STANDING_LABEL,
  STANDING_MEANING,
} from '@/lib/estimate-words';
import { modelLineOfRun, runLine } from '@/lib/model-line';
import { countByStanding, type RegionRow } from '@/lib/region-list';

import { StandingMark } from './standing-mark';

/** The pooled curve's shape in an official's words ("no clear link with income at the 5% level"). */
function pooledShape(shape: Shape, alpha: number | null): string {
  const words = alpha === null ? SHAPE_PLAIN_SHORT[shape] : shapeWords(shape, alpha);
  return shape === 'flat' ? words.charAt(0).toLowerCase() + words.slice(1) : SHAPE_LABEL[shape].toLowerCase();
}

export type RegionOverviewProps = {
  region: QueryState<RegionResponse>;
  districts: QueryState<RegionRow[]>;
  /** The region map, shown beside the list (wide screens). */
  map?: ReactNode;
  /** The Refresh control, above the map. */
  refresh?: ReactNode;
};

/**
 * The wide home screen's right-hand side: the published run, districts per standing with
 * what each standing means, the regional pooled curve, the region brief and the cautions.
 */
export function RegionOverview({ region, districts, map, refresh }: RegionOverviewProps) {
  const run = region.data?.run ?? null;
  const track = region.data?.track ?? null;
  const incomeUnit = run?.units.driver.unit ?? 'per person';
  const counts = countByStanding(districts.data ?? []);
  const pooled = region.data?.pooled ?? null;
  const level = run?.model.level ?? null;
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.wrap} testID="region-overview">
      {refresh}
      {map ? <View style={styles.card}>{map}</View> : null}
      <View style={styles.card}>
        <Text role="heading" aria-level={1} style={styles.title}>
          The region at a glance
        </Text>
        {track ? (
          <Text style={styles.meta} testID="region-track">
            {track.name === track.indicator.name
              ? `${track.name}, in ${track.indicator.unit}`
              : `${track.name}: ${track.indicator.name}, in ${track.indicator.unit}`}
          </Text>
        ) : null}
        {region.status === 'pending' ? (
          <Skeleton width={360} height={20} />
        ) : region.status === 'error' && !region.data ? (
          <QueryErrorPanel
            what="the region"
            error={region.error}
            retrying={region.isFetching}
            onRetry={() => void region.refetch()}
            testID="region-error"
          />
        ) : run ? (
          <>
            <Text style={styles.meta} testID="region-run">
              {runLine(run)}
            </Text>
            <Text style={styles.meta}>{modelLineOfRun(run)}</Text>
          </>
        ) : (
          <Text style={styles.meta} testID="region-no-run">
            {track ? `No run has been published for ${track.name} yet` : 'No run has been published yet'}: standings
            appear once an analyst reviews and publishes one.
          </Text>
        )}
        <View style={styles.table} role="table" aria-label="Districts per standing">
          {STANDINGS.map((s) => (
            <View key={s} style={styles.countRow} role="row" testID={`region-count-${s}`}>
              <View style={styles.countHead} role="rowheader">
                <StandingMark standing={s} size={14} decorative />
                <Text style={[styles.countLabel, { color: standingColors[s] }]}>{STANDING_LABEL[s]}</Text>
              </View>
              <Text style={styles.countValue} role="cell">
                {districts.status === 'pending' ? '…' : counts[s]}
              </Text>
              <Text style={styles.countMeaning} role="cell">
                {STANDING_MEANING[s]}
              </Text>
            </View>
          ))}
        </View>
        {pooled ? (
          <Text style={styles.meta} testID="region-pooled">
            Regional pooled curve (all districts, fixed effects):{' '}
            {pooled.shape ? pooledShape(pooled.shape, run?.model.alpha ?? null) : 'no shape'}
            {pooled.threshold !== null && pooled.threshold > 0
              ? `, turning point ${formatLevel(pooled.threshold)} ${incomeUnit} (${pooled.fieller?.kind === 'bounded' ? intervalText('bounded', pooled.fieller.levelLo, pooled.fieller.levelHi) : notBoundedText(level)})`
              : ''}
            . Districts with too short a series are read against it, labelled as the regional substitute.
          </Text>
        ) : null}
        <View style={styles.links}>
          {run ? (
            <ExternalLink
              path={briefPdfPath.region(track?.code ?? null)}
              label="Region brief (PDF)"
              testID="region-brief-link"
            />
          ) : null}
          <TextLink href="/method" label="How Crestwatch estimates" />
        </View>
        <Text style={styles.hint}>Choose a district on the left to open its card.</Text>
      </View>
      <CautionNote withMethodLink={false} />
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1 },
  wrap: { padding: space.xl, gap: space.xl, maxWidth: layout.detailMaxWidth },
  card: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: space.xl,
    gap: space.md,
  },
  title: { ...type.heading, color: colors.text },
  meta: { ...type.body, color: colors.text },
  table: { gap: space.xs, borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.md },
  // Columns of at least a set width that grow with the text; the meaning goes under them when
  // a large text size leaves it no room.
  countRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', columnGap: space.md, minHeight: 32 },
  countHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minWidth: 150 },
  countLabel: { ...type.bodyStrong },
  countValue: {
    ...type.numeric,
    fontFamily: type.bodyStrong.fontFamily,
    color: colors.text,
    minWidth: 48,
    textAlign: 'right',
  },
  countMeaning: { ...type.caption, color: colors.textMuted, flexGrow: 1, flexShrink: 1, flexBasis: 200 },
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg, alignItems: 'center' },
  hint: { ...type.body, color: colors.textMuted },
});
