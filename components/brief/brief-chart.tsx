import { lazy, Suspense } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { chartColors, colors, radius, space, type } from '@/components/theme';
import type { ChartScene } from '@/contracts/briefs';
import { useHydrated } from '@/hooks/use-hydrated';

import { loadSceneSvg } from './load-scene';

const SceneSvg = lazy(() => loadSceneSvg());

/**
 * One brief chart: its title, the drawing scaled to the column width (its box keeps the
 * scene's proportions, so the page does not shift when it arrives after mount), and the
 * chart in words.
 */
export function BriefChart({ scene, testID }: { scene: ChartScene; testID: string }) {
  const mounted = useHydrated();
  const placeholder = <View style={styles.placeholder} aria-hidden />;
  return (
    <View style={styles.wrap} testID={testID}>
      <Text role="heading" aria-level={3} style={styles.title}>
        {scene.title}
      </Text>
      <View style={[styles.box, { aspectRatio: scene.width / scene.height }]} role="img" aria-label={scene.description}>
        {mounted ? (
          <Suspense fallback={placeholder}>
            <SceneSvg scene={scene} />
          </Suspense>
        ) : (
          placeholder
        )}
      </View>
      <Text style={styles.caption}>{scene.description}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flex: 1, minWidth: 260, gap: space.xs },
  title: { ...type.label, color: colors.text },
  box: { width: '100%', backgroundColor: chartColors.surface, borderRadius: radius.sm },
  placeholder: { flex: 1 },
  caption: { ...type.caption, color: colors.textMuted },
});
