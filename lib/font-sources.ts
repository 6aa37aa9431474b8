// Native: iOS and Android cannot register woff2, so they load the full-coverage Inter TTFs
// from @expo-google-fonts/inter (one file per weight covers Latin Extended too).
import type { FontFamilies, FontSourceMap } from './font-sources.types';

export const fontSources: FontSourceMap = {
  'CrestInter-Regular': require('@expo-google-fonts/inter/400Regular/Inter_400Regular.ttf'),
  'CrestInter-SemiBold': require('@expo-google-fonts/inter/600SemiBold/Inter_600SemiBold.ttf'),
  'CrestInter-Bold': require('@expo-google-fonts/inter/700Bold/Inter_700Bold.ttf'),
};

export const fontFamilies: FontFamilies = {
  regular: 'CrestInter-Regular',
  semibold: 'CrestInter-SemiBold',
  bold: 'CrestInter-Bold',
};
