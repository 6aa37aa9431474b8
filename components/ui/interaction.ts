import type { PressableStateCallbackType, ViewStyle } from 'react-native';

import { focusRing } from '@/components/theme';

/** react-native-web also reports hover and focus to Pressable's style callback. */
export type InteractionState = PressableStateCallbackType & { hovered?: boolean; focused?: boolean };

/** The shared focus outline while an element has keyboard focus (web), else nothing. */
export function focusOutline(state: InteractionState): ViewStyle | null {
  return state.focused ? focusRing : null;
}
