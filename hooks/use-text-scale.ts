// Native: the system text size as a factor (1 = default), for boxes whose height is fixed
// in advance (virtualised rows) and must grow with the text they hold.
import { useWindowDimensions } from 'react-native';

export function useTextScale(): number {
  return useWindowDimensions().fontScale || 1;
}
