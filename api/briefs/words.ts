/**
 * The words of briefs (our own): standing and shape labels, the cautions of docs/method.md,
 * and the names of models and covariance choices as a reader sees them. Standings, shapes
 * and cautions read exactly as on the district card and the method page
 * (lib/estimate-words.ts, lib/cautions.ts; tests/components/brief-views.test.tsx holds
 * them equal), so a brief never names a standing differently from the screen. Shape words
 * come from lib/plain-words.ts itself, the module the screens read.
 */
import { SHAPE_LABEL, SHAPE_TECHNICAL, shapeForOfficials, type ShapeKey } from '../../lib/plain-words';

export const STANDING_LABEL: Record<string, string> = {
  approaching: 'Approaching',
  at_turn: 'At the turn',
  past_turn: 'Past the turn',
  no_turn: 'No turn',
  not_estimable: 'Not estimable',
};

/** The region table's column is narrow: the same words serve. */
export const STANDING_SHORT: Record<string, string> = STANDING_LABEL;

/** The order standings are counted in on the region brief. */
export const STANDING_ORDER = ['approaching', 'at_turn', 'past_turn', 'no_turn', 'not_estimable'] as const;

export { SHAPE_LABEL };

/** Shapes whose trade name differs from the plain words, printed after them in brackets. */
const TURNING_SHAPES = new Set(['inverted_u', 'u', 'n_shape', 'inverted_n']);

export function standingLabel(standing: string): string {
  return STANDING_LABEL[standing] ?? standing;
}

/**
 * A shape as a brief says it (briefs are read by officials): plain words with the trade name
 * in brackets where they differ, and `flat` as what it means at the run's test level,
 * "No clear link with income at the 5% level" (`levelText` is the formatted α).
 */
export function shapeLabel(shape: string | null, levelText: string): string {
  if (!shape) return 'Not estimated';
  if (shape === 'flat') return shapeForOfficials(shape, levelText);
  const plain = SHAPE_LABEL[shape as ShapeKey] ?? shape;
  return TURNING_SHAPES.has(shape) ? `${plain} (${SHAPE_TECHNICAL[shape as ShapeKey]})` : plain;
}

/** The cautions every brief carries (docs/method.md, "Cautions"). */
export const CAUTIONS: readonly string[] = [
  'The curve is a statistical association in past data, not a causal law or a forecast; thresholds move when data are revised.',
  'Emissions can fall locally because production moved elsewhere; trade-adjusted (consumption-based) figures can tell a different story.',
  'Short series, trending variables and serial correlation make estimates fragile; read the interval, not the point.',
  'It does not replace statutory air-quality standards, the agency’s official methodology, or the judgement of qualified staff; local rules prevail.',
];

export const COVARIANCE_LABEL: Record<string, string> = {
  classical: 'classical errors',
  hc1: 'HC1 robust errors',
  hc3: 'HC3 robust errors',
  newey_west: 'Newey–West errors',
  cluster: 'district-clustered errors',
};

export const FIELLER_KIND_LABEL: Record<string, string> = {
  bounded: 'bounded',
  two_rays: 'two rays',
  whole_line: 'the whole line',
};

export function intervalMethodLabel(method: string): string {
  return method === 'delta' ? 'delta-method' : 'Fieller';
}

/** A name inside a sentence: "Real income per person" → "real income per person", "CO2 emissions" unchanged. */
export function inSentence(name: string): string {
  return /^[A-Z][a-z]/.test(name) ? name.charAt(0).toLowerCase() + name.slice(1) : name;
}
