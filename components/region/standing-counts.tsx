import { StyleSheet, View } from 'react-native';

import { space } from '@/components/theme';
import { STANDINGS, type Standing } from '@/contracts/estimates';
import { STANDING_LABEL } from '@/lib/estimate-words';

import { Chip } from './chip';
import { StandingMark } from './standing-mark';

export type StandingCountsProps = {
  counts: Record<Standing, number>;
  selected: Standing[];
  onToggle: (standing: Standing) => void;
};

/** Districts per standing, at the top of the region list; each count also filters the list. */
export function StandingCounts({ counts, selected, onToggle }: StandingCountsProps) {
  return (
    <View
      style={styles.row}
      role="group"
      aria-label="Districts per standing; choose one or more to filter"
      testID="standing-counts"
    >
      {STANDINGS.map((s) => (
        <Chip
          key={s}
          testID={`standing-filter-${s}`}
          label={`${STANDING_LABEL[s]} ${counts[s]}`}
          accessibilityLabel={`${STANDING_LABEL[s]}: ${counts[s]} ${counts[s] === 1 ? 'district' : 'districts'}`}
          on={selected.includes(s)}
          onPress={() => onToggle(s)}
          leading={<StandingMark standing={s} size={10} decorative />}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
});
