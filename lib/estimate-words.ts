// Words for published estimates, shared by the list, the card, the charts' text summaries
// and the method page: one place, so a standing reads the same everywhere.
import type { AlertKind } from '@/contracts/alerts';
import type { FiellerKind, IntervalMethod, Shape, Standing, VariantName } from '@/contracts/estimates';
import { formatDecimal, formatIncome, formatPercentOf } from './format';
import { shapeForOfficials } from './plain-words';

/** Standing as a word (the list, the card's badge, the filters). */
export const STANDING_LABEL: Record<Standing, string> = {
  approaching: 'Approaching',
  at_turn: 'At the turn',
  past_turn: 'Past the turn',
  no_turn: 'No turn',
  not_estimable: 'Not estimable',
};

/** One line saying what the standing means (card, method page). */
export const STANDING_MEANING: Record<Standing, string> = {
  approaching: 'Latest income is below the threshold’s interval.',
  at_turn: 'Latest income is inside the threshold’s interval.',
  past_turn: 'Latest income is above the threshold’s interval.',
  no_turn: 'The curve rises, falls or stays flat over the observed incomes: no turn to stand against.',
  not_estimable: 'The series is too short, or the fit failed: no standing of its own.',
};

// Shape words live in lib/plain-words.ts (the briefs read the same module).
export { SHAPE_LABEL, SHAPE_PLAIN_SHORT, SHAPE_TECHNICAL } from './plain-words';

/**
 * A shape as an official reads it (card, region view, chart summaries): `flat` says what it
 * means, "No clear link with income at the 5% level", with the run's test level α.
 * Analyst screens keep SHAPE_LABEL's term.
 */
export function shapeWords(shape: Shape, alpha: number): string {
  return shapeForOfficials(shape, levelPercent(alpha));
}

export const METHOD_LABEL: Record<IntervalMethod, string> = {
  fieller: 'Fieller',
  delta: 'delta method',
};

export const FIELLER_KIND_LABEL: Record<FiellerKind, string> = {
  bounded: 'bounded',
  two_rays: 'two rays',
  whole_line: 'the whole line',
};

export const VARIANT_LABEL: Record<VariantName, string> = {
  no_controls: 'Without controls',
  cubic: 'Cubic',
  last20: 'Last 20 years only',
  level: 'Level form',
};

export const VARIANT_ORDER: VariantName[] = ['no_controls', 'cubic', 'last20', 'level'];

export const ALERT_KIND_LABEL: Record<AlertKind, string> = {
  crossing: 'Standing moved',
  threshold_shift: 'Threshold shifted',
  shape_change: 'Shape changed',
  significance_change: 'Turn test flipped',
};

export const COVARIANCE_LABEL: Record<string, string> = {
  classical: 'classical',
  hc1: 'HC1',
  hc3: 'HC3',
  newey_west: 'Newey–West',
  cluster: 'district-clustered',
};

/** "95%" from 0.95 (one decimal where needed: 0.975 → "97.5%"). */
export function levelPercent(level: number | null): string {
  return level === null ? 'level not set' : formatPercentOf(Math.round(level * 1000) / 1000);
}

/** The method page's phrase, with the run's confidence level (said as not set when an answer carries none). */
export function notBoundedText(level: number | null): string {
  return level === null
    ? 'interval not bounded (confidence level not set)'
    : `interval not bounded at ${levelPercent(level)}`;
}

/** Income levels: whole units, and a plain bound for absurd interval ends. */
export function formatLevel(value: number): string {
  if (value >= 1e7) return 'over 10 million';
  if (value <= -1e7) return 'below −10 million';
  return formatIncome(value);
}

/**
 * An interval of real income levels in words, by what the Fieller set is. Bounded:
 * "14,395–36,456"; two rays: "below 26,577 or above 55,017"; one ray (one end null):
 * "above 26,577"; the whole line: "any income (unbounded)".
 */
export function intervalText(kind: FiellerKind | null, lo: number | null, hi: number | null): string {
  if (kind === 'whole_line') return 'any income (the whole line)';
  if (kind === 'two_rays') {
    if (lo !== null && hi !== null) return `below ${formatLevel(lo)} or above ${formatLevel(hi)}`;
    if (lo !== null) return `below ${formatLevel(lo)}`;
    if (hi !== null) return `above ${formatLevel(hi)}`;
    return 'unbounded';
  }
  if (lo === null || hi === null) return 'not available';
  return `${formatLevel(lo)}–${formatLevel(hi)}`;
}

/** A gap in percent as words: "18% below", "72% above", "4.0 times", "at". */
export function gapWords(gapPercent: number): string {
  const rounded = Math.round(gapPercent);
  if (rounded === 0) return 'level with';
  if (gapPercent >= 9900) return 'over 100 times';
  if (gapPercent >= 200) return `${formatDecimal(1 + gapPercent / 100, 1, 1)} times`;
  return `${formatPercentOf(Math.abs(rounded) / 100)} ${gapPercent < 0 ? 'below' : 'above'}`;
}

/** Signed short gap for tables: "−18%", "+72%", "×4.0", "×100+". */
export function gapShort(gapPercent: number | null): string {
  if (gapPercent === null) return '—';
  if (gapPercent >= 9900) return '×100+';
  if (gapPercent >= 200) return `×${formatDecimal(1 + gapPercent / 100, 1, 1)}`;
  const r = Math.round(gapPercent);
  if (r === 0) return formatPercentOf(0);
  return `${r > 0 ? '+' : '−'}${formatPercentOf(Math.abs(r) / 100)}`;
}

/** "2031 (2028–2040)", "2031", or "2031 (from 2028)" for a half-open range. */
export function yearWithRange(year: number, earliest: number | null, latest: number | null): string {
  if (earliest !== null && latest !== null) {
    if (earliest === latest && earliest === year) return String(year);
    return `${year} (${earliest}–${latest})`;
  }
  if (earliest !== null) return `${year} (not before ${earliest})`;
  if (latest !== null) return `${year} (not after ${latest})`;
  return String(year);
}

/** Shapes in the order the method page explains them. */
export const SHAPES_IN_ORDER = [
  'inverted_u',
  'u',
  'n_shape',
  'inverted_n',
  'increasing',
  'decreasing',
  'flat',
] as const;
