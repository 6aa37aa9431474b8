// The district card's headline: one plain sentence on where the district stands, then a
// few short notes (what the standing means for the track's indicator, an unbounded interval, an
// extrapolated turn, the regional substitute). Pure: inputs are the engine's output shape
// (the card's EstimateRecord, or the list's EstimateSummary), nothing is fetched.
import type {
  EstimateRecord,
  EstimateStatus,
  EstimateSummary,
  FiellerKind,
  ProjectionStatus,
  Shape,
  Standing,
} from '@/contracts/estimates';
import { formatLevel, gapWords, levelPercent, notBoundedText, yearWithRange } from './estimate-words';
import { agree, capitalise, GENERIC_PRESSURE, nameInSentence } from './plain-words';
import { withUnit } from './units';

export type HeadlineInput = {
  status: EstimateStatus;
  standing: Standing;
  shape: Shape | null;
  /** kind of the turning point the standing is read from (N shapes read a peak like an inverted U, a trough like a U); null when unknown */
  turnKind?: 'peak' | 'trough' | null;
  /** X* in real units; null when the fit has no turning point. */
  threshold: number | null;
  intervalBounded: boolean | null;
  fiellerKind: FiellerKind | null;
  /** Ends of the standing's interval in real units (ray ends for two rays). */
  thresholdLo: number | null;
  thresholdHi: number | null;
  extrapolated: boolean;
  gapPercent: number | null;
  projection: {
    status: ProjectionStatus;
    crossingYear: number | null;
    earliest: number | null;
    latest: number | null;
  } | null;
  /** The run's confidence level, e.g. 0.95. */
  level: number;
  /** Why the district's own fit failed (not_estimable, substitute). */
  reason: string | null;
  /** The driver's unit from the catalogue ("constant 2020 currency units per person"); omitted: the figure alone. */
  incomeUnit?: string;
  /** The track's indicator as the catalogue names it ("PM2.5 annual mean concentration"); omitted: "emissions". */
  pressure?: string;
  /** The run's test level α (0.05): a curve with no clear link is said "at the 5% level"; omitted: no level named. */
  alpha?: number;
};

export type Headline = {
  /** The one sentence a reader takes away. */
  sentence: string;
  /** Short follow-ups, most important first. */
  notes: string[];
  /** The tone of the card's headline panel: 'caution' when the figure is weak or borrowed. */
  tone: 'plain' | 'caution';
};

export function headlineInputFromRecord(r: EstimateRecord): HeadlineInput {
  return {
    status: r.status,
    standing: r.standing.standing,
    shape: r.shape?.shape ?? null,
    turnKind: r.threshold?.kind ?? null,
    threshold: r.threshold?.level ?? null,
    intervalBounded: r.standing.intervalBounded,
    fiellerKind: r.threshold
      ? r.standing.intervalMethod === 'delta'
        ? r.threshold.intervalBounded
          ? 'bounded'
          : 'whole_line'
        : r.threshold.fieller.kind
      : null,
    thresholdLo: r.standing.levelLo,
    thresholdHi: r.standing.levelHi,
    extrapolated: r.threshold?.extrapolated ?? false,
    gapPercent: r.gapPercent,
    projection: r.projection,
    level: r.model.level,
    alpha: r.model.alpha,
    reason: r.reason?.message ?? null,
  };
}

export function headlineInputFromSummary(s: EstimateSummary, level: number, alpha?: number): HeadlineInput {
  return {
    status: s.status,
    standing: s.standing,
    shape: s.shape,
    threshold: s.threshold,
    intervalBounded: s.intervalBounded,
    fiellerKind: s.fiellerKind,
    thresholdLo: s.thresholdLo,
    thresholdHi: s.thresholdHi,
    extrapolated: s.extrapolated,
    gapPercent: s.gapPercent,
    projection: s.projectionStatus
      ? {
          status: s.projectionStatus,
          crossingYear: s.crossingYear,
          earliest: s.crossingEarliest,
          latest: s.crossingLatest,
        }
      : null,
    level,
    ...(alpha !== undefined ? { alpha } : {}),
    reason: null,
  };
}

const sentence = (s: string) => (/[.!?]$/.test(s) ? s : `${s}.`);

/** What the standing means for the track's indicator, by the curve's orientation. */
function meaningOf(
  standing: Standing,
  shape: Shape | null,
  turnKind: 'peak' | 'trough' | null | undefined,
  pressure: string,
): string | null {
  const trough = shape === 'u' || ((shape === 'n_shape' || shape === 'inverted_n') && turnKind === 'trough');
  const p = nameInSentence(pressure);
  const v = (singular: string, plural: string) => agree(pressure, singular, plural);
  switch (standing) {
    case 'approaching':
      return trough
        ? `${p} still ${v('tends', 'tend')} to fall as income grows`
        : `${p} still ${v('tends', 'tend')} to rise with income`;
    case 'at_turn':
      return trough
        ? `${p} ${v('is', 'are')} near the low point of the curve`
        : `${p} ${v('has', 'have')} about stopped rising with income`;
    case 'past_turn':
      return trough
        ? `${p} now ${v('tends', 'tend')} to rise again as income grows`
        : `${p} now ${v('tends', 'tend')} to fall as income grows`;
    default:
      return null;
  }
}

/** "at the recent trend it would reach it around 2031 (2028–2040)" and its kin. */
function projectionClause(p: HeadlineInput['projection'], gapPercent: number | null): string | null {
  if (!p) return null;
  if (p.status === 'not_on_current_trend')
    return 'at the recent income trend it would not reach it (not on current trend)';
  if (p.crossingYear === null) return null;
  const when = yearWithRange(p.crossingYear, p.earliest, p.latest);
  if (p.status === 'already_past') return `income passed it around ${when}`;
  if (p.status === 'projected') {
    return gapPercent !== null && gapPercent > 0
      ? `at the recent trend income would fall back to it around ${when}`
      : `at the recent trend it would reach it around ${when}`;
  }
  return null;
}

/** What an unbounded interval still says, in words. */
function unboundedNote(input: HeadlineInput): string {
  const head = capitalise(notBoundedText(input.level));
  const { fiellerKind: kind, thresholdLo: lo, thresholdHi: hi } = input;
  if (kind === 'two_rays') {
    if (lo !== null && hi !== null) {
      return `${head}: the data rule out only a turning point between ${formatLevel(lo)} and ${formatLevel(hi)}, so read the point with care.`;
    }
    if (lo !== null)
      return `${head}: the data rule out only a turning point above ${formatLevel(lo)}, so read the point with care.`;
    if (hi !== null)
      return `${head}: the data rule out only a turning point below ${formatLevel(hi)}, so read the point with care.`;
  }
  return `${head}: the data are consistent with a turning point at any income, so the point says little on its own.`;
}

function turnNoun(input: HeadlineInput): string {
  const low =
    input.shape === 'u' || ((input.shape === 'n_shape' || input.shape === 'inverted_n') && input.turnKind === 'trough');
  if (input.status === 'substitute') return low ? 'the regional low point' : 'the regional turning point';
  return low ? 'the estimated low point' : 'the estimated turning point';
}

function gapClause(input: HeadlineInput): string {
  const noun = turnNoun(input);
  const gap = input.gapPercent;
  if (input.standing === 'at_turn') {
    if (gap === null || Math.round(gap) === 0) return `Income is at ${noun}`;
    return input.intervalBounded
      ? `Income is at ${noun}: ${gapWords(gap)} it, inside its ${levelPercent(input.level)} interval`
      : `Income is at ${noun} (${gapWords(gap)} it)`;
  }
  if (gap === null) return `Income is ${input.standing === 'approaching' ? 'below' : 'above'} ${noun}`;
  return `Income is ${gapWords(gap)} ${noun}`;
}

/** The sentence of a curve with no turn, naming the track's indicator and, for no clear link, the test level. */
function noTurnSentence(shape: 'increasing' | 'decreasing' | 'flat', input: HeadlineInput): string {
  const pressure = input.pressure ?? GENERIC_PRESSURE;
  const p = nameInSentence(pressure);
  const v = (singular: string, plural: string) => agree(pressure, singular, plural);
  if (shape === 'increasing')
    return `${capitalise(p)} ${v('rises', 'rise')} with income across the observed incomes, with no turning point there`;
  if (shape === 'decreasing')
    return `${capitalise(p)} ${v('falls', 'fall')} as income grows across the observed incomes, with no turning point there`;
  const at = input.alpha !== undefined ? ` at the ${levelPercent(input.alpha)} level` : '';
  return `No clear link between income and ${p} over the observed incomes${at}`;
}

/** The headline for one district's published estimate. */
export function headline(input: HeadlineInput): Headline {
  const notes: string[] = [];
  let tone: Headline['tone'] = 'plain';

  if (input.status === 'not_estimable') {
    const why = input.reason ? `: ${input.reason.replace(/\.$/, '')}` : '';
    return {
      sentence: sentence(`No curve could be estimated for this district${why}`),
      notes: ['Its standing is not estimable until the series is long enough or the data are corrected.'],
      tone: 'caution',
    };
  }
  if (input.status === 'substitute') {
    tone = 'caution';
    notes.push(
      'Regional substitute: this district’s own series is too short, so the regional pooled curve stands in for it.',
    );
  }

  if (input.standing === 'not_estimable') {
    return {
      sentence: 'The curve’s shape suggests a turn, but no turning point could be estimated.',
      notes: [...notes, 'Its standing is not estimable in this run.'],
      tone: 'caution',
    };
  }

  const hasTurn = input.threshold !== null && input.threshold > 0;
  const unbounded = hasTurn && input.intervalBounded === false;

  if (input.standing === 'approaching' || input.standing === 'at_turn' || input.standing === 'past_turn') {
    const projection = projectionClause(input.projection, input.gapPercent);
    const head = gapClause(input);
    const main = sentence(projection ? `${head}; ${projection}` : head);
    const meaning = meaningOf(input.standing, input.shape, input.turnKind, input.pressure ?? GENERIC_PRESSURE);
    if (meaning) notes.splice(input.status === 'substitute' ? 1 : 0, 0, sentence(capitalise(meaning)));
    if (unbounded) {
      notes.push(unboundedNote(input));
      tone = 'caution';
    }
    if (input.extrapolated) notes.push('The turn lies beyond the observed incomes: an extrapolation.');
    return { sentence: main, notes, tone };
  }

  // no_turn: rising, falling or flat over the observed range.
  const shape = input.shape === 'increasing' || input.shape === 'decreasing' ? input.shape : 'flat';
  const main = sentence(noTurnSentence(shape, input));
  if (shape !== 'flat' && hasTurn && input.gapPercent !== null) {
    const where = input.extrapolated
      ? 'beyond the observed incomes'
      : 'inside the observed incomes, though the test does not confirm a turn';
    const projection = projectionClause(input.projection, input.gapPercent);
    notes.push(
      sentence(
        `The fitted curve would turn at ${withUnit(formatLevel(input.threshold!), input.incomeUnit ?? '')}, ${where}; income is ${gapWords(input.gapPercent)} it` +
          (projection ? ` and ${projection.replace(/^income /, '')}` : ''),
      ),
    );
    if (input.extrapolated) notes.push('That turn is an extrapolation (turn beyond observed range).');
    if (unbounded) {
      notes.push(unboundedNote(input));
      tone = 'caution';
    }
  }
  return { sentence: main, notes, tone };
}

/** Sentence and notes as one text (screen readers, briefs, tests). */
export function headlineText(h: Headline): string {
  return [h.sentence, ...h.notes].join(' ');
}
