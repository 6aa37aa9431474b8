import { fitCurve, type CurveFit, type CurveRow, type FitCurveResult } from '../../api/estimation';

// Unit invariance (issue: numerics must not depend on the units of income or emissions).
// Invariance is a property of the method, not a reference value: the series below are
// invented (seeded generator, plumbing only) and each fit is compared with the same fit in
// other units. Expected relations (arithmetic of the model): with income × 10^k, level-form
// thresholds and interval ends scale by 10^k and log-form ones shift by k·ln 10; U-test
// p-values, standings, shapes, Fieller kinds and crossing years are unchanged. With
// emissions × 10^k nothing about the thresholds changes.

/** mulberry32: small seeded uniform generator. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** An invented district: income 6,000 → 40,000 with noise, emissions humped in ln income. */
function district(seed: number, cubic: number): CurveRow[] {
  const u = rng(seed);
  const rows: CurveRow[] = [];
  let lx = Math.log(6000);
  for (let t = 0; t < 36; t++) {
    lx += 0.055 + 0.02 * (u() - 0.5);
    const d = lx - Math.log(18000);
    const ly = 2 - 0.5 * d * d + cubic * d * d * d + 0.03 * (u() - 0.5);
    rows.push({ year: 1989 + t, x: Math.exp(lx), y: Math.exp(ly) });
  }
  return rows;
}

const COVARIANCES = ['classical', 'hc1', 'hc3', 'newey_west'] as const;
const FORMS = ['quadratic', 'cubic'] as const;
const TRANSFORMS = ['level', 'log'] as const;
const POWERS = [-3, -2, -1, 0, 1, 2, 3, 4, 5, 6, 7];

const ok = (r: FitCurveResult): CurveFit => {
  if (r.status !== 'ok') throw new Error(`${r.reason.code}: ${r.reason.message}`);
  return r;
};
const scaleRows = (rows: CurveRow[], fx: number, fy: number): CurveRow[] =>
  rows.map((r) => ({ ...r, x: r.x * fx, y: r.y * fy }));

/** Relative difference with a floor of 1 on the log scale (values there are O(10)). */
function rel(a: number | null, b: number | null, floor: number): number {
  if (a === null || b === null) return a === b ? 0 : Infinity;
  return Math.abs(a - b) / Math.max(Math.abs(b), floor);
}

/** Largest deviation of every threshold-scale quantity of `f` from `base` mapped by `map`. */
function thresholdDeviation(f: CurveFit, base: CurveFit, map: (v: number) => number, floor: number): number {
  let worst = 0;
  const m = (v: number | null) => (v === null ? null : map(v));
  expect(f.turningPoints.length).toBe(base.turningPoints.length);
  f.turningPoints.forEach((tp, i) => {
    const b = base.turningPoints[i];
    worst = Math.max(
      worst,
      rel(tp.x, m(b.x), floor),
      rel(tp.fieller.lo, m(b.fieller.lo), floor),
      rel(tp.fieller.hi, m(b.fieller.hi), floor),
      rel(tp.delta.lo, m(b.delta.lo), floor),
      rel(tp.delta.hi, m(b.delta.hi), floor),
    );
    tp.fieller.pieces.forEach((p, j) => {
      worst = Math.max(
        worst,
        rel(p.lo, m(base.turningPoints[i].fieller.pieces[j].lo), floor),
        rel(p.hi, m(base.turningPoints[i].fieller.pieces[j].hi), floor),
      );
    });
  });
  return worst;
}

function sameReading(f: CurveFit, base: CurveFit): void {
  expect(f.shape.shape).toBe(base.shape.shape);
  expect(f.standing.standing).toBe(base.standing.standing);
  expect(f.standing.turningPointIndex).toBe(base.standing.turningPointIndex);
  expect(f.turningPoints.map((t) => [t.kind, t.fieller.kind, t.inRange, t.fieller.pieces.length])).toEqual(
    base.turningPoints.map((t) => [t.kind, t.fieller.kind, t.inRange, t.fieller.pieces.length]),
  );
  expect(f.projection.status).toBe(base.projection.status);
  expect(f.projection.crossingYear).toBe(base.projection.crossingYear);
  expect(f.projection.range).toEqual(base.projection.range);
  expect(rel(f.uTest.pValue, base.uTest.pValue, 0)).toBeLessThan(1e-9);
  // the Wald statistic and its verdict (its far-tail p-value magnifies a relative change by about W/2)
  expect(rel(f.wald.fStatistic, base.wald.fStatistic, 0)).toBeLessThan(1e-9);
  expect(f.wald.rejects).toBe(base.wald.rejects);
}

const summary: string[] = [];
afterAll(() => {
  // printed for the record: the largest deviation seen per case
  console.log(['unit invariance, largest relative deviation over k = −3…7 (tolerance 1e-9)', ...summary].join('\n'));
});

describe.each(FORMS)('%s', (form) => {
  describe.each(TRANSFORMS)('%s form', (transform) => {
    test.each(COVARIANCES)('income × 10^k for k = −3…7, %s covariance', (covariance) => {
      const rows = district(form === 'cubic' ? 7 : 5, form === 'cubic' ? 0.25 : 0);
      const spec = { form, transform, covariance, controls: [] as string[] };
      const base = ok(fitCurve(rows, spec));
      expect(base.turningPoints.length).toBeGreaterThan(0);
      let worst = 0;
      for (const k of POWERS) {
        const f = ok(fitCurve(scaleRows(rows, 10 ** k, 1), spec));
        const map = transform === 'level' ? (v: number) => v * 10 ** k : (v: number) => v + k * Math.LN10;
        const dev = thresholdDeviation(f, base, map, transform === 'level' ? 0 : 1);
        worst = Math.max(worst, dev);
        expect(dev).toBeLessThan(1e-9);
        f.turningPoints.forEach((tp, i) =>
          expect(rel(tp.level, base.turningPoints[i].level! * 10 ** k, 0)).toBeLessThan(1e-9),
        );
        sameReading(f, base);
        expect(rel(f.gap.percent, base.gap.percent, 1)).toBeLessThan(1e-9);
      }
      summary.push(
        `  ${form} ${transform} ${covariance} income: ${worst.toExponential(2)} (shape ${base.shape.shape}, standing ${base.standing.standing})`,
      );
    });

    test.each(COVARIANCES)('emissions × 10^k leave the thresholds unchanged, %s covariance', (covariance) => {
      const rows = district(form === 'cubic' ? 7 : 5, form === 'cubic' ? 0.25 : 0);
      const spec = { form, transform, covariance, controls: [] as string[] };
      const base = ok(fitCurve(rows, spec));
      let worst = 0;
      for (const k of POWERS) {
        const f = ok(fitCurve(scaleRows(rows, 1, 10 ** k), spec));
        const dev = thresholdDeviation(f, base, (v) => v, transform === 'level' ? 0 : 1);
        worst = Math.max(worst, dev);
        expect(dev).toBeLessThan(1e-9);
        sameReading(f, base);
      }
      summary.push(`  ${form} ${transform} ${covariance} emissions: ${worst.toExponential(2)}`);
    });
  });
});
