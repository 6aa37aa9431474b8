// Fills of the region map: light tints of each standing's own colour (the mark on top
// carries the full colour and the shape), a muted fill for districts the filter hides.
import { colors, standingColors } from '@/components/theme';
import type { Standing } from '@/contracts/estimates';

/** Mixes a #rrggbb colour with white: t = 0 keeps it, 1 is white. */
function tint(hex: string, t: number): string {
  const n = parseInt(hex.slice(1), 16);
  const mix = (c: number) => Math.round(c + (255 - c) * t);
  const [r, g, b] = [(n >> 16) & 255, (n >> 8) & 255, n & 255].map(mix);
  return `#${((1 << 24) | (r << 16) | (g << 8) | b).toString(16).slice(1)}`;
}

const isHex = (c: string) => /^#[0-9a-f]{6}$/i.test(c);

export const mapFill: Record<Standing, string> = {
  approaching: isHex(standingColors.approaching) ? tint(standingColors.approaching, 0.55) : standingColors.approaching,
  at_turn: isHex(standingColors.at_turn) ? tint(standingColors.at_turn, 0.55) : standingColors.at_turn,
  past_turn: isHex(standingColors.past_turn) ? tint(standingColors.past_turn, 0.55) : standingColors.past_turn,
  no_turn: isHex(standingColors.no_turn) ? tint(standingColors.no_turn, 0.7) : standingColors.no_turn,
  not_estimable: isHex(standingColors.not_estimable)
    ? tint(standingColors.not_estimable, 0.8)
    : standingColors.not_estimable,
};

export const mapInk = {
  hidden: colors.border,
  border: colors.surface,
  highlight: colors.text,
  sea: colors.background,
};
