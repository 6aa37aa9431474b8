// The web app's Inter faces: one @font-face rule per script subset and weight, each with the
// unicode-range of its subset (the ranges @fontsource/inter publishes with its files), so a
// browser downloads only the subsets of the characters a page shows. expo-font cannot set
// unicode-range, so the rules are written into the root HTML (app/+html.tsx) and the web
// build copies the files (scripts/web-offline/). No app or alias imports: both sides use it.
import unicodeRanges from '@fontsource/inter/unicode.json';

/** Where the web build puts the font files, under the site's root. */
export const WEB_FONT_DIR = 'fonts';

/** The scripts the region writes in: Latin, Latin Extended, Greek and Cyrillic. */
export const WEB_FONT_SUBSETS = ['latin', 'latin-ext', 'greek', 'cyrillic'] as const;
export type WebFontSubset = (typeof WEB_FONT_SUBSETS)[number];

/** Subsets every page needs (the app's own words): precached by the service worker. */
export const PRECACHED_FONT_SUBSETS: readonly WebFontSubset[] = ['latin'];

/**
 * One family per weight, as on native (lib/font-sources.ts): text styles set the family and
 * never fontWeight, so a browser never synthesises a bolder face from an already bold one.
 */
export const WEB_FONT_WEIGHTS = [
  { weight: 400, family: 'CrestInter-Regular' },
  { weight: 600, family: 'CrestInter-SemiBold' },
  { weight: 700, family: 'CrestInter-Bold' },
] as const;

/** The file name of one subset and weight in @fontsource/inter's files/ folder (and ours). */
export function webFontFile(subset: WebFontSubset, weight: number): string {
  return `inter-${subset}-${weight}-normal.woff2`;
}

/** Every font file the web app uses. */
export function webFontFiles(): string[] {
  return WEB_FONT_WEIGHTS.flatMap(({ weight }) => WEB_FONT_SUBSETS.map((s) => webFontFile(s, weight)));
}

/** The unicode-range of a subset, as @fontsource/inter declares it. */
export function unicodeRangeOf(subset: WebFontSubset): string {
  const range = (unicodeRanges as Record<string, string | undefined>)[subset];
  if (!range) throw new Error(`@fontsource/inter declares no unicode-range for the subset "${subset}"`);
  return range;
}

/** The @font-face rules for the root HTML's <style>. */
export function webFontFaceCss(): string {
  const rules: string[] = [];
  for (const { weight, family } of WEB_FONT_WEIGHTS) {
    for (const subset of WEB_FONT_SUBSETS) {
      rules.push(
        `@font-face{font-family:'${family}';font-style:normal;font-weight:${weight};font-display:swap;` +
          `src:url(/${WEB_FONT_DIR}/${webFontFile(subset, weight)}) format('woff2');` +
          `unicode-range:${unicodeRangeOf(subset)}}`,
      );
    }
  }
  return rules.join('\n');
}
