import { forwardRef, type ReactNode } from 'react';
import { Pressable, type PressableProps, type StyleProp, type View, type ViewStyle } from 'react-native';

import type { InteractionState } from './interaction';

export type LinkTargetProps = Omit<PressableProps, 'style' | 'children'> & {
  /** Style for the current hover / focus / press state. */
  stateStyle: (state: InteractionState) => StyleProp<ViewStyle>;
  children: ReactNode | ((state: InteractionState) => ReactNode);
};

/**
 * The child of `<Link asChild>`. Link's slot merges `style` as a plain object, which drops
 * a Pressable style *function*; this component takes the state-dependent style under its
 * own prop and hands Pressable the function itself, so hover and focus rings survive.
 */
export const LinkTarget = forwardRef<View, LinkTargetProps & { style?: StyleProp<ViewStyle> }>(function LinkTarget(
  { stateStyle, style, children, ...rest },
  ref,
) {
  return (
    <Pressable ref={ref} {...rest} style={(state) => [style, stateStyle(state as InteractionState)]}>
      {children as PressableProps['children']}
    </Pressable>
  );
});
