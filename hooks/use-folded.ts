// Native: the window width decides at once (there is no server-rendered HTML to match).
import { useWindowDimensions } from 'react-native';

import { breakpoints } from '@/components/theme';

/** True below 600 px, where a data table becomes a list of cards (nothing scrolls sideways). */
export function useFolded(): boolean {
  const { width } = useWindowDimensions();
  return width < breakpoints.fold;
}
