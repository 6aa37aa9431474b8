// The region list's search, filters and order, kept for the page's lifetime so a phone
// reader who opens a district and comes back finds the list as they left it.
import { useCallback, useSyncExternalStore } from 'react';

import { EMPTY_FILTER, type RegionFilter } from '@/lib/region-list';

let current: RegionFilter = EMPTY_FILTER;
const listeners = new Set<() => void>();

const subscribe = (l: () => void) => {
  listeners.add(l);
  return () => listeners.delete(l);
};
const snapshot = () => current;
const serverSnapshot = () => EMPTY_FILTER;

/** Resets the kept filter (tests). */
export function resetRegionFilter(): void {
  current = EMPTY_FILTER;
  listeners.forEach((l) => l());
}

export function useRegionFilter(): [RegionFilter, (change: Partial<RegionFilter>) => void] {
  const value = useSyncExternalStore(subscribe, snapshot, serverSnapshot);
  const update = useCallback((change: Partial<RegionFilter>) => {
    current = { ...current, ...change };
    listeners.forEach((l) => l());
  }, []);
  return [value, update];
}
