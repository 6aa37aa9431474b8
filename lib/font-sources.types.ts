import type { FontSource } from 'expo-font';

/** Font files handed to expo-font's useFonts, keyed by the family name they register. */
export type FontSourceMap = Record<string, FontSource>;

/**
 * The fontFamily value for each weight. Weights are separate families (each file registers
 * its own name), so text styles set the family and never fontWeight — a fontWeight on top
 * of an already-bold face makes browsers synthesise a heavier one.
 */
export type FontFamilies = { regular: string; semibold: string; bold: string };
