import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import { formatLevel } from '@/lib/estimate-words';
import type { Movement } from '@/contracts/runs';

import { levelDelta, percentShort } from './run-words';

const pct = (part: number | null, base: number | null) =>
  part === null || base === null || base === 0 ? null : (100 * part) / base;

/**
 * Why the threshold moved: the previous spec refitted on this run's data splits the change
 * into the part the data revisions made and the part the spec change made (docs/method.md).
 */
export function MovementSplit({
  movement,
  previousRunId,
}: {
  movement: Movement | null;
  previousRunId: number | null;
}) {
  if (!movement || previousRunId === null) {
    return (
      <Text style={styles.lead} testID="movement-none">
        No published run to compare with: this is the first estimate of the threshold.
      </Text>
    );
  }
  const { previous, current, previousSpecOnNewData: mid, dataPart, specPart } = movement;
  if (previous === null || current === null) {
    return (
      <Text style={styles.lead} testID="movement-none">
        {previous === null && current === null
          ? 'Neither run has a threshold for this district (no turn in the observed range, or not estimable).'
          : previous === null
            ? `The published run #${previousRunId} had no threshold here; this run finds one at ${formatLevel(current!)}.`
            : `The published run #${previousRunId} had a threshold at ${formatLevel(previous)}; this run finds none.`}
      </Text>
    );
  }
  const total = current - previous;
  return (
    <View style={styles.wrap} testID="movement">
      <Text style={styles.lead}>
        Threshold {formatLevel(previous)} → {formatLevel(current)} ({percentShort(pct(total, previous))}) against
        published run #{previousRunId}.
      </Text>
      <View style={styles.parts}>
        <Part
          testID="movement-data"
          title="Data revisions"
          value={levelDelta(dataPart)}
          share={percentShort(pct(dataPart, previous))}
          line={
            mid === null
              ? 'The previous spec cannot be refitted on the new data.'
              : `The previous spec on the new data gives ${formatLevel(mid)}.`
          }
        />
        <Part
          testID="movement-spec"
          title="Spec change"
          value={movement.specChanged ? levelDelta(specPart) : '0'}
          share={movement.specChanged ? percentShort(pct(specPart, previous)) : 'same spec'}
          line={
            movement.specChanged
              ? 'From refitting with this run’s spec instead of the previous one.'
              : 'Both runs used the same spec.'
          }
        />
      </View>
      {movement.softwareChanged ? (
        <Text style={styles.note} testID="movement-software">
          The software changed too (previous run: {movement.previousSoftware}); a small part of the move may come from
          that.
        </Text>
      ) : null}
    </View>
  );
}

function Part({
  title,
  value,
  share,
  line,
  testID,
}: {
  title: string;
  value: string;
  share: string;
  line: string;
  testID: string;
}) {
  return (
    <View style={styles.part} testID={testID}>
      <Text style={styles.partTitle}>{title}</Text>
      <Text style={styles.partValue}>
        {value} <Text style={styles.partShare}>({share})</Text>
      </Text>
      <Text style={styles.note}>{line}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  lead: { ...type.body, color: colors.text },
  parts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  part: {
    flexGrow: 1,
    flexBasis: 160,
    gap: space.xxs,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.md,
    padding: space.md,
  },
  partTitle: { ...type.label, color: colors.textMuted },
  partValue: { ...type.title, fontVariant: ['tabular-nums'], color: colors.text },
  partShare: { ...type.body, color: colors.textMuted },
  note: { ...type.caption, color: colors.textMuted },
});
