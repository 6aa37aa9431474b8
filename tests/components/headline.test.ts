// The card's headline across every standing and shape, the not-estimable and substitute
// cases, unbounded Fieller sets (whole line, two rays, one ray), "not on current trend"
// and extrapolated turns. Inputs follow the engine's output shape (EstimateRecord via
// headlineInputFromRecord). Expected words are the product's own (docs/method.md phrasing).
import {
  headline,
  headlineInputFromRecord,
  headlineInputFromSummary,
  headlineText,
  type HeadlineInput,
} from '@/lib/headline';

import { estimateRecord } from './support/estimates';

const base: HeadlineInput = {
  status: 'ok',
  standing: 'approaching',
  shape: 'inverted_u',
  threshold: 30000,
  intervalBounded: true,
  fiellerKind: 'bounded',
  thresholdLo: 26000,
  thresholdHi: 36000,
  extrapolated: false,
  gapPercent: -18.2,
  projection: { status: 'projected', crossingYear: 2031, earliest: 2028, latest: 2040 },
  level: 0.95,
  reason: null,
};
const h = (over: Partial<HeadlineInput>) => headline({ ...base, ...over });

describe('headline: inverted U', () => {
  it('approaching: gap below and the projected crossing with its range', () => {
    const r = h({});
    expect(r.sentence).toBe(
      'Income is 18% below the estimated turning point; at the recent trend it would reach it around 2031 (2028–2040).',
    );
    expect(r.notes[0]).toBe('Emissions still tend to rise with income.');
    expect(r.tone).toBe('plain');
  });

  it('at the turn: inside the interval, with the run’s level', () => {
    const r = h({
      standing: 'at_turn',
      gapPercent: 4.4,
      projection: { status: 'already_past', crossingYear: 2023, earliest: 2019, latest: 2027 },
    });
    expect(r.sentence).toBe(
      'Income is at the estimated turning point: 4% above it, inside its 95% interval; income passed it around 2023 (2019–2027).',
    );
    expect(r.notes[0]).toBe('Emissions have about stopped rising with income.');
  });

  it('past the turn: "times" wording for a large gap and the past crossing', () => {
    const r = h({
      standing: 'past_turn',
      gapPercent: 250,
      projection: { status: 'already_past', crossingYear: 2004, earliest: 1999, latest: 2009 },
    });
    expect(r.sentence).toBe(
      'Income is 3.5 times the estimated turning point; income passed it around 2004 (1999–2009).',
    );
    expect(r.notes[0]).toBe('Emissions now tend to fall as income grows.');
  });

  it('past the turn while income falls back toward it', () => {
    const r = h({
      standing: 'past_turn',
      gapPercent: 12,
      projection: { status: 'projected', crossingYear: 2030, earliest: 2027, latest: 2033 },
    });
    expect(r.sentence).toBe(
      'Income is 12% above the estimated turning point; at the recent trend income would fall back to it around 2030 (2027–2033).',
    );
  });

  it('not on current trend', () => {
    const r = h({ projection: { status: 'not_on_current_trend', crossingYear: null, earliest: null, latest: null } });
    expect(r.sentence).toBe(
      'Income is 18% below the estimated turning point; at the recent income trend it would not reach it (not on current trend).',
    );
  });

  it('extrapolated turn is flagged', () => {
    const r = h({ extrapolated: true });
    expect(r.notes).toContain('The turn lies beyond the observed incomes: an extrapolation.');
  });
});

describe('headline: U shape mirrors the meaning, not the positions', () => {
  it.each([
    [
      'approaching',
      -30,
      'Income is 30% below the estimated low point',
      'Emissions still tend to fall as income grows.',
    ],
    [
      'at_turn',
      2,
      'Income is at the estimated low point: 2% above it, inside its 95% interval',
      'Emissions are near the low point of the curve.',
    ],
    [
      'past_turn',
      75,
      'Income is 75% above the estimated low point',
      'Emissions now tend to rise again as income grows.',
    ],
  ] as const)('%s', (standing, gap, start, meaning) => {
    const r = h({ shape: 'u', standing, gapPercent: gap, projection: null });
    expect(r.sentence).toBe(`${start}.`);
    expect(r.notes[0]).toBe(meaning);
  });
});

describe('headline: no turn', () => {
  it('rising, with an extrapolated turn, its gap and projection', () => {
    const r = h({
      standing: 'no_turn',
      shape: 'increasing',
      threshold: 45226,
      extrapolated: true,
      gapPercent: -57.4,
      projection: { status: 'projected', crossingYear: 2048, earliest: 2026, latest: 2086 },
      // the demo catalogue's income unit (api/demo/catalogue.ts)
      incomeUnit: 'constant 2020 currency units per person',
    });
    expect(r.sentence).toBe('Emissions rise with income across the observed incomes, with no turning point there.');
    expect(r.notes[0]).toBe(
      'The fitted curve would turn at 45,226 constant 2020 currency units per person, beyond the observed incomes; income is 57% below it and at the recent trend it would reach it around 2048 (2026–2086).',
    );
    expect(r.notes).toContain('That turn is an extrapolation (turn beyond observed range).');
  });

  it('falling, turn inside the range but not confirmed by the test', () => {
    const r = h({
      standing: 'no_turn',
      shape: 'decreasing',
      threshold: 20000,
      gapPercent: 24.7,
      projection: { status: 'already_past', crossingYear: 2020, earliest: 2008, latest: 2032 },
    });
    expect(r.sentence).toBe('Emissions fall as income grows across the observed incomes, with no turning point there.');
    expect(r.notes[0]).toBe(
      'The fitted curve would turn at 20,000, inside the observed incomes, though the test does not confirm a turn; income is 25% above it and passed it around 2020 (2008–2032).',
    );
  });

  it('flat: no link, and no talk of a turn', () => {
    const r = h({
      standing: 'no_turn',
      shape: 'flat',
      intervalBounded: false,
      fiellerKind: 'whole_line',
      thresholdLo: null,
      thresholdHi: null,
      extrapolated: true,
      gapPercent: 3009,
    });
    expect(r.sentence).toBe('No clear link between income and emissions over the observed incomes.');
    expect(r.notes).toEqual([]);
  });

  it('rising with no turning point at all', () => {
    const r = h({
      standing: 'no_turn',
      shape: 'increasing',
      threshold: null,
      fiellerKind: null,
      intervalBounded: null,
      gapPercent: null,
      projection: null,
    });
    expect(r.sentence).toBe('Emissions rise with income across the observed incomes, with no turning point there.');
    expect(r.notes).toEqual([]);
  });
});

describe('headline: unbounded intervals never read as bounded', () => {
  it('whole line', () => {
    const r = h({
      standing: 'past_turn',
      gapPercent: 40,
      intervalBounded: false,
      fiellerKind: 'whole_line',
      thresholdLo: null,
      thresholdHi: null,
      projection: null,
    });
    expect(r.notes).toContain(
      'Interval not bounded at 95%: the data are consistent with a turning point at any income, so the point says little on its own.',
    );
    expect(r.tone).toBe('caution');
    expect(headlineText(r)).not.toMatch(/inside its/);
  });

  it('two rays', () => {
    const r = h({ intervalBounded: false, fiellerKind: 'two_rays', thresholdLo: 26577, thresholdHi: 55017 });
    expect(r.notes).toContain(
      'Interval not bounded at 95%: the data rule out only a turning point between 26,577 and 55,017, so read the point with care.',
    );
  });

  it('one ray (two rays with one end null)', () => {
    const r = h({ intervalBounded: false, fiellerKind: 'two_rays', thresholdLo: null, thresholdHi: 21000 });
    expect(r.notes).toContain(
      'Interval not bounded at 95%: the data rule out only a turning point below 21,000, so read the point with care.',
    );
  });

  it('uses the run’s confidence level', () => {
    const r = h({
      level: 0.9,
      intervalBounded: false,
      fiellerKind: 'whole_line',
      thresholdLo: null,
      thresholdHi: null,
    });
    expect(headlineText(r)).toMatch(/Interval not bounded at 90%/);
  });

  it('at the turn with an unbounded interval does not claim "inside its interval"', () => {
    const r = h({
      standing: 'at_turn',
      gapPercent: 3,
      intervalBounded: false,
      fiellerKind: 'whole_line',
      thresholdLo: null,
      thresholdHi: null,
      projection: null,
    });
    expect(r.sentence).toBe('Income is at the estimated turning point (3% above it).');
  });
});

describe('headline: not estimable and substitute', () => {
  it('not estimable says why', () => {
    const r = h({
      status: 'not_estimable',
      standing: 'not_estimable',
      shape: null,
      threshold: null,
      gapPercent: null,
      projection: null,
      reason: 'Only 6 usable years; the model needs at least 9.',
    });
    expect(r.sentence).toBe(
      'No curve could be estimated for this district: Only 6 usable years; the model needs at least 9.',
    );
    expect(r.tone).toBe('caution');
  });

  it('not estimable without a reason', () => {
    expect(h({ status: 'not_estimable', standing: 'not_estimable', reason: null }).sentence).toBe(
      'No curve could be estimated for this district.',
    );
  });

  it('a u / inverted-U shape without a turning point is not estimable', () => {
    const r = h({ standing: 'not_estimable', threshold: null });
    expect(r.sentence).toBe('The curve’s shape suggests a turn, but no turning point could be estimated.');
  });

  it('substitute is labelled and speaks of the regional turning point', () => {
    const r = h({ status: 'substitute', gapPercent: -3.3 });
    expect(r.notes[0]).toBe(
      'Regional substitute: this district’s own series is too short, so the regional pooled curve stands in for it.',
    );
    expect(r.sentence).toMatch(/^Income is 3% below the regional turning point;/);
    expect(r.tone).toBe('caution');
  });
});

describe('inputs from the engine’s output', () => {
  it('reads an EstimateRecord', () => {
    const r = headline(headlineInputFromRecord(estimateRecord({})));
    expect(r.sentence).toBe(
      'Income is 18% below the estimated turning point; at the recent trend it would reach it around 2031 (2028–2040).',
    );
  });

  it('reads a list summary with the run’s level', () => {
    const input = headlineInputFromSummary(
      {
        status: 'ok',
        standing: 'past_turn',
        intervalBounded: false,
        intervalMethod: 'fieller',
        shape: 'inverted_u',
        threshold: 20000,
        thresholdLo: null,
        thresholdHi: null,
        fiellerKind: 'whole_line',
        extrapolated: false,
        gapPercent: 50,
        crossingYear: 2010,
        crossingEarliest: null,
        crossingLatest: null,
        projectionStatus: 'already_past',
        lastYear: 2025,
        levelNow: 30000,
      },
      0.99,
    );
    const r = headline(input);
    expect(r.sentence).toBe('Income is 50% above the estimated turning point; income passed it around 2010.');
    expect(headlineText(r)).toMatch(/Interval not bounded at 99%/);
  });
});

// Plain words (issue 17): an official reads what `flat` means, at the run's own test level,
// and the track's indicator by the catalogue's name instead of a generic "emissions".
// Subject–verb agreement follows English grammar ("concentration rises", "emissions rise").
describe('headline: plain words and the track’s indicator', () => {
  const flatCase: Partial<HeadlineInput> = {
    standing: 'no_turn',
    shape: 'flat',
    threshold: null,
    intervalBounded: null,
    fiellerKind: null,
    gapPercent: null,
    projection: null,
  };

  it('flat says "no clear link" at the level from the run’s α, not a fixed 5%', () => {
    expect(h({ ...flatCase, alpha: 0.05 }).sentence).toBe(
      'No clear link between income and emissions over the observed incomes at the 5% level.',
    );
    expect(h({ ...flatCase, alpha: 0.1 }).sentence).toBe(
      'No clear link between income and emissions over the observed incomes at the 10% level.',
    );
  });

  it('names a PM2.5 track’s indicator, singular verbs', () => {
    const pressure = 'PM2.5 annual mean concentration';
    expect(h({ ...flatCase, alpha: 0.05, pressure }).sentence).toBe(
      'No clear link between income and PM2.5 annual mean concentration over the observed incomes at the 5% level.',
    );
    expect(h({ ...flatCase, shape: 'increasing', pressure }).sentence).toBe(
      'PM2.5 annual mean concentration rises with income across the observed incomes, with no turning point there.',
    );
    expect(h({ pressure }).notes[0]).toBe('PM2.5 annual mean concentration still tends to rise with income.');
    expect(h({ standing: 'at_turn', gapPercent: 0, pressure }).notes[0]).toBe(
      'PM2.5 annual mean concentration has about stopped rising with income.',
    );
  });

  it('names an SO2 track’s indicator, plural verbs', () => {
    const pressure = 'SO2 emissions per person';
    expect(h({ standing: 'past_turn', gapPercent: 40, pressure }).notes[0]).toBe(
      'SO2 emissions per person now tend to fall as income grows.',
    );
    expect(h({ ...flatCase, shape: 'decreasing', pressure }).sentence).toBe(
      'SO2 emissions per person fall as income grows across the observed incomes, with no turning point there.',
    );
  });

  it('reads α from the record', () => {
    const record = estimateRecord({});
    expect(headlineInputFromRecord(record).alpha).toBe(record.model.alpha);
  });
});
