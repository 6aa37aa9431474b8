// The web fonts' @font-face rules (lib/web-fonts.ts): one per script subset and weight, each
// with the unicode-range @fontsource/inter's own stylesheets give that file, so a browser
// fetches a subset only for characters in its range.
import fs from 'node:fs';
import path from 'node:path';

import { fontFamilies } from '@/lib/font-sources.web';
import { WEB_FONT_SUBSETS, WEB_FONT_WEIGHTS, webFontFaceCss, webFontFiles } from '@/lib/web-fonts';

const pkg = path.dirname(require.resolve('@fontsource/inter/package.json'));

type Face = { family: string; weight: number; file: string; range: string };

function faces(css: string): Face[] {
  return [...css.matchAll(/@font-face\s*\{([^}]*)\}/g)].map(([, body]) => ({
    family: /font-family:\s*'([^']+)'/.exec(body)?.[1] ?? '',
    weight: Number(/font-weight:\s*(\d+)/.exec(body)?.[1]),
    file: /url\((?:\.\/files\/|\/fonts\/)([^)]+\.woff2)\)/.exec(body)?.[1] ?? '',
    range: /unicode-range:\s*([^;}]+)/.exec(body)?.[1].trim() ?? '',
  }));
}

/** Whether a code point falls in a CSS unicode-range list ("U+0400-045F,U+2116"). */
function inRange(range: string, codePoint: number): boolean {
  return range.split(',').some((part) => {
    const [lo, hi] = part.trim().replace('U+', '').split('-');
    return codePoint >= parseInt(lo, 16) && codePoint <= parseInt(hi ?? lo, 16);
  });
}

const ours = faces(webFontFaceCss());

it('declares the four script subsets at each of the three weights', () => {
  expect(ours).toHaveLength(WEB_FONT_SUBSETS.length * WEB_FONT_WEIGHTS.length);
  expect(ours.map((f) => f.file).sort()).toEqual(webFontFiles().sort());
  for (const file of webFontFiles()) expect(fs.existsSync(path.join(pkg, 'files', file))).toBe(true);
});

it('gives each file the unicode-range its package declares for it', () => {
  for (const { weight } of WEB_FONT_WEIGHTS) {
    const theirs = faces(fs.readFileSync(path.join(pkg, `${weight}.css`), 'utf8'));
    for (const face of ours.filter((f) => f.weight === weight)) {
      expect({ file: face.file, range: face.range }).toEqual({
        file: face.file,
        range: theirs.find((t) => t.file === face.file)?.range,
      });
    }
  }
});

it('sends Cyrillic and Greek letters to their own subsets, not the Latin one', () => {
  const rangeOf = (subset: string) => ours.find((f) => f.file === `inter-${subset}-400-normal.woff2`)!.range;
  // Code points from the Unicode charts: Ж U+0416, Ά U+0386, Ł U+0141, A U+0041.
  expect(inRange(rangeOf('cyrillic'), 0x0416)).toBe(true);
  expect(inRange(rangeOf('latin'), 0x0416)).toBe(false);
  expect(inRange(rangeOf('greek'), 0x0386)).toBe(true);
  expect(inRange(rangeOf('latin-ext'), 0x0141)).toBe(true);
  expect(inRange(rangeOf('latin'), 0x0041)).toBe(true);
});

it('names in each weight the family the text styles use', () => {
  const families = new Set(ours.map((f) => f.family));
  for (const stack of Object.values(fontFamilies)) expect(families.has(stack.split(',')[0].trim())).toBe(true);
});
