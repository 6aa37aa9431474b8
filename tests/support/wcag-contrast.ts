/**
 * WCAG 2.2 contrast, from the definitions in the Recommendation's glossary:
 * "relative luminance" L = 0.2126 R + 0.7152 G + 0.0722 B, each channel linearised as
 * c/12.92 when c ≤ 0.04045, else ((c + 0.055)/1.055)^2.4 (c = sRGB value / 255); and
 * "contrast ratio" (L1 + 0.05) / (L2 + 0.05), L1 the lighter of the two.
 * https://www.w3.org/TR/WCAG22/#dfn-relative-luminance, #dfn-contrast-ratio
 */

/** Channels of a #rgb or #rrggbb colour, 0–255. */
export function parseHex(hex: string): [number, number, number] {
  const m = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(hex.trim());
  if (!m) throw new Error(`not a #rgb or #rrggbb colour: ${hex}`);
  const h = m[1].length === 3 ? [...m[1]].map((c) => c + c).join('') : m[1];
  const n = parseInt(h, 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

function linear(channel: number): number {
  const c = channel / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

export function relativeLuminance(hex: string): number {
  const [r, g, b] = parseHex(hex).map(linear);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}
