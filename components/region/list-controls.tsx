import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';

import { colors, layout, space, type } from '@/components/theme';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { SHAPES, type Shape } from '@/contracts/estimates';
import { SHAPE_PLAIN_SHORT } from '@/lib/estimate-words';
import { SORT_LABEL, type SortKey } from '@/lib/region-list';

import { Chip } from './chip';

const SORT_SHORT: Record<SortKey, string> = { name: 'Name', gap: 'Gap', crossing: 'Crossing' };
const SORTS: SortKey[] = ['name', 'gap', 'crossing'];

export type ListControlsProps = {
  sort: SortKey;
  onSort: (key: SortKey) => void;
  shapes: Shape[];
  onToggleShape: (shape: Shape) => void;
};

/** Sort options, and shape filters behind a disclosure so the phone list keeps its room. */
export function ListControls({ sort, onSort, shapes, onToggleShape }: ListControlsProps) {
  const [open, setOpen] = useState(shapes.length > 0);
  return (
    <View style={styles.wrap}>
      <View style={styles.line}>
        <Text style={styles.label} nativeID="sort-label">
          Sort
        </Text>
        <View style={styles.options} role="radiogroup" aria-labelledby="sort-label">
          {SORTS.map((key) => (
            <Chip
              key={key}
              kind="radio"
              testID={`sort-${key}`}
              label={SORT_SHORT[key]}
              accessibilityLabel={`Sort by ${SORT_LABEL[key]}`}
              on={sort === key}
              onPress={() => onSort(key)}
            />
          ))}
        </View>
        <Pressable
          testID="shape-filter-toggle"
          accessibilityRole="button"
          accessibilityState={{ expanded: open }}
          accessibilityLabel={`Filter by shape${shapes.length ? `, ${shapes.length} chosen` : ''}`}
          onPress={() => setOpen((o) => !o)}
          style={(state: InteractionState) => [styles.disclosure, focusOutline(state)]}
        >
          <Text style={styles.disclosureText}>
            Shape{shapes.length ? ` (${shapes.length})` : ''} {open ? '▴' : '▾'}
          </Text>
        </Pressable>
      </View>
      {open ? (
        <View style={styles.shapes} role="group" aria-label="Filter by shape">
          {SHAPES.map((s) => (
            <Chip
              key={s}
              testID={`shape-filter-${s}`}
              label={SHAPE_PLAIN_SHORT[s]}
              on={shapes.includes(s)}
              onPress={() => onToggleShape(s)}
            />
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  line: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  label: { ...type.label, color: colors.textMuted },
  options: { flexDirection: 'row', gap: space.xs },
  disclosure: {
    minHeight: layout.touchTarget - 8,
    justifyContent: 'center',
    paddingHorizontal: space.sm,
    marginLeft: 'auto',
  },
  disclosureText: { ...type.label, color: colors.link, textDecorationLine: 'underline' },
  shapes: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
});
