import { StyleSheet, Text, View } from 'react-native';

import { standingColors, space, type } from '@/components/theme';
import type { Standing } from '@/contracts/estimates';
import { WORD_BREAK } from '@/components/ui/word-break';
import { STANDING_LABEL } from '@/lib/estimate-words';

/**
 * Each standing has a shape as well as a colour, so it reads without colour vision:
 * approaching ▲ (still climbing toward the crest), at the turn ◆ (on the crest), past the
 * turn ▼ (over it), no turn ▬ (a level bar), not estimable ○ (an empty ring). Drawn with
 * views, so the list needs no SVG.
 *
 * Its text alternative (WCAG 2.2 SC 1.1.1 Non-text Content) is the standing's word: the
 * mark is an image named by it, unless `decorative` says the word is written right beside
 * it (a badge, a chip, a row whose name already says it), where a name would repeat it.
 */
export function StandingMark({
  standing,
  size = 12,
  decorative = false,
}: {
  standing: Standing;
  size?: number;
  decorative?: boolean;
}) {
  const color = standingColors[standing];
  const half = size / 2;
  let mark;
  switch (standing) {
    case 'approaching':
      mark = (
        <View
          style={[
            styles.triangle,
            { borderLeftWidth: half, borderRightWidth: half, borderBottomWidth: size, borderBottomColor: color },
          ]}
        />
      );
      break;
    case 'past_turn':
      mark = (
        <View
          style={[
            styles.triangle,
            { borderLeftWidth: half, borderRightWidth: half, borderTopWidth: size, borderTopColor: color },
          ]}
        />
      );
      break;
    case 'at_turn': {
      const side = Math.round(size * 0.72);
      mark = <View style={{ width: side, height: side, backgroundColor: color, transform: [{ rotate: '45deg' }] }} />;
      break;
    }
    case 'no_turn':
      mark = (
        <View
          style={{ width: size, height: Math.max(3, Math.round(size / 3)), backgroundColor: color, borderRadius: 1 }}
        />
      );
      break;
    default:
      mark = <View style={{ width: size, height: size, borderRadius: half, borderWidth: 2, borderColor: color }} />;
  }
  return (
    <View
      {...(decorative ? { 'aria-hidden': true } : { role: 'img' as const, 'aria-label': STANDING_LABEL[standing] })}
      style={[styles.box, { width: size + 2, height: size + 2 }]}
      testID={`standing-mark-${standing}`}
    >
      {mark}
    </View>
  );
}

/** The mark and the standing's word, side by side. */
export function StandingBadge({
  standing,
  size = 12,
  compact = false,
}: {
  standing: Standing;
  size?: number;
  compact?: boolean;
}) {
  return (
    <View style={styles.badge}>
      <StandingMark standing={standing} size={size} decorative />
      <Text style={[compact ? styles.compactWord : styles.word, { color: standingColors[standing] }]} numberOfLines={1}>
        {STANDING_LABEL[standing]}
        {WORD_BREAK}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { alignItems: 'center', justifyContent: 'center' },
  triangle: {
    width: 0,
    height: 0,
    borderLeftColor: 'transparent',
    borderRightColor: 'transparent',
    borderStyle: 'solid',
  },
  badge: { flexDirection: 'row', alignItems: 'center', gap: space.xs + space.xxs },
  word: { ...type.bodyStrong },
  compactWord: { ...type.label },
});
