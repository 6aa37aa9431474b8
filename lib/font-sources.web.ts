// Web: the Inter woff2 files shipped in assets/fonts (latin + latin-ext, 400/600/700).
// expo-font gives every file its own family name and cannot set unicode-range, so each
// weight is a CSS stack "<latin>, <latin-ext>, system" and the browser falls through to the
// extension file only for the characters the latin file lacks.
import { FontDisplay } from 'expo-font';

import type { FontFamilies, FontSourceMap } from './font-sources.types';

// fontfaceobserver measures a test string; the latin-ext files have no glyphs for its
// default ("BESbswy"), so they get one of their own or the load would time out.
const EXT_TEST = 'ĄćĘłŃőŚžŻ';

export const fontSources: FontSourceMap = {
  'CrestInter-Regular': { uri: require('../assets/fonts/inter-latin-400-normal.woff2'), display: FontDisplay.SWAP },
  'CrestInter-RegularExt': {
    uri: require('../assets/fonts/inter-latin-ext-400-normal.woff2'),
    display: FontDisplay.SWAP,
    testString: EXT_TEST,
  },
  'CrestInter-SemiBold': { uri: require('../assets/fonts/inter-latin-600-normal.woff2'), display: FontDisplay.SWAP },
  'CrestInter-SemiBoldExt': {
    uri: require('../assets/fonts/inter-latin-ext-600-normal.woff2'),
    display: FontDisplay.SWAP,
    testString: EXT_TEST,
  },
  'CrestInter-Bold': { uri: require('../assets/fonts/inter-latin-700-normal.woff2'), display: FontDisplay.SWAP },
  'CrestInter-BoldExt': {
    uri: require('../assets/fonts/inter-latin-ext-700-normal.woff2'),
    display: FontDisplay.SWAP,
    testString: EXT_TEST,
  },
};

// "System" is replaced by react-native-web with the platform's system font stack.
export const fontFamilies: FontFamilies = {
  regular: 'CrestInter-Regular, CrestInter-RegularExt, System',
  semibold: 'CrestInter-SemiBold, CrestInter-SemiBoldExt, System',
  bold: 'CrestInter-Bold, CrestInter-BoldExt, System',
};
