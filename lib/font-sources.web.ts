// Web: the Inter faces are declared in the root HTML with one @font-face rule per script
// subset and weight (lib/web-fonts.ts, app/+html.tsx), so nothing is loaded through
// expo-font here; each weight is its own family, falling back to the system font.
import type { FontFamilies, FontSourceMap } from './font-sources.types';

/** Nothing to hand to expo-font on the web. */
export const fontSources: FontSourceMap = {};

// "System" is replaced by react-native-web with the platform's system font stack.
export const fontFamilies: FontFamilies = {
  regular: 'CrestInter-Regular, System',
  semibold: 'CrestInter-SemiBold, System',
  bold: 'CrestInter-Bold, System',
};
