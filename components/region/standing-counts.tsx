import { ScrollView, StyleSheet, View } from 'react-native';

import { space } from '@/components/theme';
import { STANDINGS, type Standing } from '@/lib/estimate-types';
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
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.row} accessibilityLabel="Districts per standing; choose to filter">
      <View style={styles.row} role="group" aria-label="Filter by standing" testID="standing-counts">
        {STANDINGS.map((s) => (
          <Chip
            key={s}
            testID={`standing-filter-${s}`}
            label={`${STANDING_LABEL[s]} ${counts[s]}`}
            accessibilityLabel={`${STANDING_LABEL[s]}: ${counts[s]} ${counts[s] === 1 ? 'district' : 'districts'}`}
            on={selected.includes(s)}
            onPress={() => onToggle(s)}
            leading={<StandingMark standing={s} size={10} />}
          />
        ))}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: space.sm, paddingVertical: space.xxs },
});
