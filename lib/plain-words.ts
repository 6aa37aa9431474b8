// The words an official reads for a curve's shape and its indicator, in one place for the
// screens (lib/estimate-words.ts, lib/headline.ts, the card, the region view, alerts) and
// the briefs (api/briefs/words.ts and their contents). Analyst screens (run review, specs,
// diagnostics) keep the trade term: `flat` there means "the income terms are jointly not
// significant at the test level α", which an official cannot be expected to know, so an
// official reads what it means instead: "no clear link with income at the 5% level".
// Pure, and imported by the API as well: relative imports only, no formatting state.

export type ShapeKey = 'inverted_u' | 'u' | 'n_shape' | 'inverted_n' | 'increasing' | 'decreasing' | 'flat';

/** The shape as analysts name it (run review, specs, diagnostics); the method page too. */
export const SHAPE_LABEL: Record<ShapeKey, string> = {
  inverted_u: 'Rise then fall',
  u: 'Fall then rise',
  n_shape: 'Rise, fall, rise again',
  inverted_n: 'Fall, rise, fall again',
  increasing: 'Rising',
  decreasing: 'Falling',
  flat: 'Flat',
};

/** Trade name in brackets for readers who know it. */
export const SHAPE_TECHNICAL: Record<ShapeKey, string> = {
  inverted_u: 'inverted U',
  u: 'U',
  n_shape: 'N-shaped',
  inverted_n: 'inverted N',
  increasing: 'increasing',
  decreasing: 'decreasing',
  flat: 'flat',
};

/** Short shape words for officials, where room is short (filter chips, alerts without a run). */
export const SHAPE_PLAIN_SHORT: Record<ShapeKey, string> = { ...SHAPE_LABEL, flat: 'No clear link with income' };

const isShape = (s: string): s is ShapeKey => s in SHAPE_LABEL;

/**
 * "the 5% level" from the test level α (0.05 → "5%"), written by the caller's percent
 * formatter so screens and briefs keep their own number format.
 */
export function testLevelWords(alpha: number, percent: (fraction: number) => string): string {
  return `the ${percent(alpha)} level`;
}

/**
 * A shape as an official reads it: `flat` becomes "No clear link with income at the 5%
 * level" (the level from the run's α, already formatted by the caller: "5%", "5 %");
 * every other shape keeps its plain label.
 */
export function shapeForOfficials(shape: string, levelText: string): string {
  if (shape === 'flat') return `No clear link with income at the ${levelText} level`;
  return isShape(shape) ? SHAPE_LABEL[shape] : shape;
}

/**
 * Whether an indicator's name is a plural subject ("CO2 emissions per person" → yes,
 * "PM2.5 annual mean concentration" → no): the head noun is the word before " per ",
 * " in " or a bracket, else the last word; a plural ends in a single "s".
 */
export function isPluralName(name: string): boolean {
  const head =
    name
      .split(/ per | in | of |\s*\(/)[0]
      .trim()
      .split(/\s+/)
      .pop() ?? '';
  return /[^s]s$/i.test(head);
}

/** A verb agreeing with the indicator: verb(name, 'rises', 'rise'). */
export function agree(name: string, singular: string, plural: string): string {
  return isPluralName(name) ? plural : singular;
}

/** "PM2.5 annual mean concentration" inside a sentence stays; "Real income per person" → "real income per person". */
export function nameInSentence(name: string): string {
  return /^[A-Z][a-z]/.test(name) ? name.charAt(0).toLowerCase() + name.slice(1) : name;
}

/** The first letter up: sentence starts. */
export function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** The generic subject when no run names its indicator (no track known). */
export const GENERIC_PRESSURE = 'emissions';
