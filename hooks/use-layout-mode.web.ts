// Web: pages are pre-rendered without a window (width 0 → phone layout). While React
// hydrates that HTML it must produce the same tree, so during hydration the width does not
// count (useSyncExternalStore's server snapshot); React then re-renders with the real width.
// Screens mounted after hydration (client navigation) get the real width at once, no flash.
import { useSyncExternalStore } from 'react';
import { useWindowDimensions } from 'react-native';

import { breakpoints } from '@/components/theme';

import type { LayoutMode } from './use-layout-mode.types';

export type { LayoutMode } from './use-layout-mode.types';

const noSubscription = () => () => {};

/** 'wide' (list and detail side by side) at ≥ 1024 px, else 'phone'. */
export function useLayoutMode(): LayoutMode {
  const { width } = useWindowDimensions();
  const hydrated = useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
  return hydrated && width >= breakpoints.wide ? 'wide' : 'phone';
}

/** True at ≥ 1440 px, where a third column shows the caller's alerts (false while hydrating). */
export function useThirdColumn(): boolean {
  const { width } = useWindowDimensions();
  const hydrated = useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
  return hydrated && width >= breakpoints.full;
}
