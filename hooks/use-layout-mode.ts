// Native: the window width decides at once (there is no server-rendered HTML to match).
import { useWindowDimensions } from 'react-native';

import { breakpoints } from '@/components/theme';

import type { LayoutMode } from './use-layout-mode.types';

export type { LayoutMode } from './use-layout-mode.types';

/** 'wide' (list and detail side by side) at ≥ 1024 px, else 'phone'. */
export function useLayoutMode(): LayoutMode {
  const { width } = useWindowDimensions();
  return width >= breakpoints.wide ? 'wide' : 'phone';
}

/** True at ≥ 1440 px, where a third column shows the caller's alerts. */
export function useThirdColumn(): boolean {
  const { width } = useWindowDimensions();
  return width >= breakpoints.full;
}
