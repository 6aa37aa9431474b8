// Native: the page's scroll view moves the panel with the table; there is no sticky
// positioning, and the wide layout is a tablet at most, so the panel simply follows.
import { View } from 'react-native';

import type { StickySideProps } from './sticky-side.types';

export function StickySide({ children, testID }: StickySideProps) {
  return <View testID={testID}>{children}</View>;
}
