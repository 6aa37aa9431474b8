// Web: pages are pre-rendered without a window (width 0 → folded). While React hydrates that
// HTML the width does not count (useSyncExternalStore's server snapshot), as in
// use-layout-mode.web.ts; React then re-renders with the real width.
import { useSyncExternalStore } from 'react';
import { useWindowDimensions } from 'react-native';

import { breakpoints } from '@/components/theme';

const noSubscription = () => () => {};

/** True below 600 px, where a data table becomes a list of cards (true while hydrating). */
export function useFolded(): boolean {
  const { width } = useWindowDimensions();
  const hydrated = useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
  return !hydrated || width < breakpoints.fold;
}
