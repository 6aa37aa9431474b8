// The phone's Map | List choice on the region view, remembered across visits (local
// storage on the web, the page's lifetime elsewhere).
import { useCallback, useSyncExternalStore } from 'react';
import { StyleSheet, View } from 'react-native';

import { space } from '@/components/theme';

import { Chip } from './chip';

export type RegionView = 'map' | 'list';
const KEY = 'crestwatch.regionView';

function read(): RegionView {
  try {
    return globalThis.localStorage?.getItem(KEY) === 'map' ? 'map' : 'list';
  } catch {
    return 'list';
  }
}

let current: RegionView | null = null;
const listeners = new Set<() => void>();
const subscribe = (l: () => void) => {
  listeners.add(l);
  return () => listeners.delete(l);
};
const snapshot = () => (current ??= read());
const serverSnapshot = (): RegionView => 'list';

export function useRegionView(): [RegionView, (v: RegionView) => void] {
  const value = useSyncExternalStore(subscribe, snapshot, serverSnapshot);
  const set = useCallback((v: RegionView) => {
    current = v;
    try {
      globalThis.localStorage?.setItem(KEY, v);
    } catch {
      // private mode: remembered for this page only
    }
    listeners.forEach((l) => l());
  }, []);
  return [value, set];
}

export function MapListChoice({ value, onChange }: { value: RegionView; onChange: (v: RegionView) => void }) {
  return (
    <View style={styles.row} role="radiogroup" aria-label="Show the districts as">
      <Chip kind="radio" label="Map" on={value === 'map'} onPress={() => onChange('map')} testID="region-view-map" />
      <Chip
        kind="radio"
        label="List"
        on={value === 'list'}
        onPress={() => onChange('list')}
        testID="region-view-list"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: space.xs },
});
