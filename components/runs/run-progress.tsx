import { StyleSheet, Text, View } from 'react-native';

import { colors, radius, space, type } from '@/components/theme';
import type { RunView } from '@/contracts/runs';

/** How far a queued or running run has got: chunks done of chunks planned. */
export function RunProgress({ run }: { run: RunView }) {
  const { chunksDone, chunksTotal, districts } = run.progress;
  const share = chunksTotal ? Math.min(1, chunksDone / chunksTotal) : 0;
  const words =
    run.state === 'queued'
      ? 'Queued: waiting for a worker to pick it up.'
      : chunksTotal
        ? `Fitting districts: ${chunksDone} of ${chunksTotal} chunks done${districts ? ` (${districts} districts)` : ''}.`
        : 'Reading the data version and planning the chunks…';
  return (
    <View style={styles.wrap} testID="run-progress">
      <View
        style={styles.track}
        role="progressbar"
        aria-valuemin={0}
        aria-valuemax={chunksTotal ?? 1}
        aria-valuenow={chunksDone}
        aria-label="Run progress"
      >
        <View style={[styles.fill, { width: `${Math.round(share * 100)}%` }]} />
      </View>
      <Text style={styles.words} accessibilityLiveRegion="polite">
        {words}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  track: { height: 12, borderRadius: radius.pill, backgroundColor: colors.surfaceSunken, overflow: 'hidden' },
  fill: { height: '100%', backgroundColor: colors.action, borderRadius: radius.pill },
  words: { ...type.body, color: colors.text },
});
