import { StyleSheet, Text, View } from 'react-native';

import { ExternalLink } from '@/components/district/external-link';
import { briefPdfPath } from '@/hooks/use-briefs';
import type { QueryState } from '@/components/state/query-state';
import { colors, space, type } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { formatDay } from '@/lib/alert-text';
import type { PublishedRunMeta } from '@/contracts/estimates';

/** The phone home's top line: which run the standings come from, the region brief, the method page. */
export function RegionStrip({
  run: published,
  track = null,
}: {
  run: QueryState<PublishedRunMeta | null>;
  /** the chosen track's code (null: the headline), carried by the brief link */
  track?: string | null;
}) {
  const run = published.data ?? null;
  return (
    <View style={styles.wrap} testID="region-strip">
      <View style={styles.head}>
        <Text role="heading" aria-level={1} style={styles.title}>
          Districts
        </Text>
        <View style={styles.links}>
          {run ? (
            <ExternalLink path={briefPdfPath.region(track)} label="Region brief" testID="region-brief-link" />
          ) : null}
          <TextLink href="/method" label="Method" />
        </View>
      </View>
      <Text style={styles.meta}>
        {published.status === 'pending'
          ? 'Loading the published run…'
          : run
            ? `Standings from run #${run.id}, published ${formatDay(run.publishedAt)}`
            : published.status === 'error'
              ? 'The published run could not be loaded.'
              : 'No run published yet for this indicator'}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xxs },
  head: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    columnGap: space.sm,
  },
  title: { ...type.heading, color: colors.text },
  meta: { ...type.caption, color: colors.textMuted },
  links: { flexDirection: 'row', gap: space.md, alignItems: 'center', flexWrap: 'wrap' },
});
