import type { PressableStateCallbackType, ViewStyle } from 'react-native';

import { focusRing, focusRingInset } from '@/components/theme';

/** react-native-web also reports hover and focus to Pressable's style callback. */
export type InteractionState = PressableStateCallbackType & { hovered?: boolean; focused?: boolean };

/** The shared focus outline while an element has keyboard focus (web), else nothing. */
export function focusOutline(state: InteractionState, placement: 'outside' | 'inside' = 'outside'): ViewStyle | null {
  if (!state.focused) return null;
  return placement === 'inside' ? focusRingInset : focusRing;
}
