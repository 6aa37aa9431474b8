import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fitCurve, type CurveFit, type CurveRow, type TurningPoint } from '../../api/estimation';

// Cubic and level-form district curves against R (tests/fixtures/reference-cubic): five
// invented series (series.csv, scripts/generate_series.R, set.seed(20261204)) and the
// reference values of scripts/compute_reference.R — R 4.2.2, lm(y ~ X - 1, tol = 1e-13),
// vcov(fit), sandwich::vcovHC(fit, type = 'HC1' / 'HC3'), sandwich::NeweyWest(fit, lag =
// floor(4·(n/100)^(2/9)), prewhite = FALSE, adjust = TRUE), recomputed in 256-bit MPFR
// (Rmpfr) from the same double design; every expected number below is that recomputation
// rounded to double (the JSON's reference fields), cross-checked against sandwich in double
// (≤ 1.6e-6 on the raw log-cubic design, ≤ 3.5e-11 on a centred design mapped back).
//
// Tolerances (the expected values are exact to double for the double design, so these
// bound the engine's own error): coefficients, classical SEs, covariance entries (relative
// to √(Vii·Vjj)), R², residual SE, turning points: relative 1e-9; robust SEs, delta SEs and
// CI ends, Fieller ends, slope SEs, elasticity: relative 1e-8; t values and U-test
// statistics: absolute 1e-8 (they are O(1)–O(20)); p-values: absolute 1e-10; Wald F:
// relative 1e-8; Newey–West lag, kinds, orientation and set shapes: exact.

/* eslint-disable @typescript-eslint/no-explicit-any */
const dir = join(__dirname, '..', 'fixtures', 'reference-cubic');
const ref: any = JSON.parse(readFileSync(join(dir, 'results.json'), 'utf8'));

interface SeriesRow {
  case: string;
  year: number;
  emissions: number;
  income: number;
  density: number;
}
function loadSeries(): SeriesRow[] {
  const lines = readFileSync(join(dir, 'series.csv'), 'utf8').trim().split(/\r?\n/);
  const header = lines[0].split(',');
  const at = (name: string) => header.indexOf(name);
  return lines.slice(1).map((line) => {
    const f = line.split(',');
    return {
      case: f[at('case')],
      year: Number(f[at('year')]),
      emissions: Number(f[at('emissions')]),
      income: Number(f[at('income')]),
      density: Number(f[at('density')]),
    };
  });
}
const series = loadSeries();

const COV = [
  { fixture: 'classical', engine: 'classical' as const },
  { fixture: 'HC1', engine: 'hc1' as const },
  { fixture: 'HC3', engine: 'hc3' as const },
  { fixture: 'NeweyWest', engine: 'newey_west' as const },
];
const TOL = { tight: 1e-9, robust: 1e-8, t: 1e-8, p: 1e-10 };

/** Collects every comparison; a test fails with the full list of misses. */
class Checker {
  misses: string[] = [];
  worst = new Map<string, number>();
  private note(what: string, d: number) {
    this.worst.set(what, Math.max(this.worst.get(what) ?? 0, d));
  }
  rel(what: string, actual: number | null | undefined, expected: number, tol: number, label: string) {
    const d =
      typeof actual === 'number'
        ? expected === 0
          ? Math.abs(actual)
          : Math.abs(actual - expected) / Math.abs(expected)
        : Infinity;
    this.note(what, d);
    if (!(d <= tol))
      this.misses.push(`${label}: expected ${expected}, got ${actual} (relative ${d.toExponential(2)} > ${tol})`);
  }
  abs(what: string, actual: number | null | undefined, expected: number, tol: number, label: string) {
    const d = typeof actual === 'number' ? Math.abs(actual - expected) : Infinity;
    this.note(what, d);
    if (!(d <= tol))
      this.misses.push(`${label}: expected ${expected}, got ${actual} (absolute ${d.toExponential(2)} > ${tol})`);
  }
  same(actual: unknown, expected: unknown, label: string) {
    if (JSON.stringify(actual) !== JSON.stringify(expected))
      this.misses.push(`${label}: expected ${JSON.stringify(expected)}, got ${JSON.stringify(actual)}`);
  }
}
const worstOverall = new Map<string, number>();

function rowsOf(id: string): CurveRow[] {
  const useDensity = (ref.cases[id].model.controls as string[]).includes('density');
  return series
    .filter((r) => r.case === id)
    .map((r) => ({
      year: r.year,
      y: r.emissions,
      x: r.income,
      ...(useDensity ? { controls: { density: r.density } } : {}),
    }));
}

function fit(id: string, covariance: (typeof COV)[number]['engine']): CurveFit {
  const m = ref.cases[id].model;
  const res = fitCurve(rowsOf(id), { form: m.form, transform: m.transform, covariance });
  if (res.status !== 'ok') throw new Error(`${id} ${covariance}: not estimable (${res.reason.message})`);
  return res;
}

/** The Fieller set as the engine reports it for one turning point, from the R pieces. */
function expectedFieller(
  pieces: Array<{ lo: number | null; hi: number | null }>,
  containing: { lo: number | null; hi: number | null } | null,
) {
  if (pieces.length === 1 && pieces[0].lo === null && pieces[0].hi === null)
    return { kind: 'whole_line', lo: null, hi: null };
  if (containing && containing.lo !== null && containing.hi !== null)
    return { kind: 'bounded', lo: containing.lo, hi: containing.hi };
  const left = pieces.find((p) => p.lo === null);
  const right = pieces.find((p) => p.hi === null);
  return { kind: 'two_rays', lo: left ? left.hi : null, hi: right ? right.lo : null };
}

function checkTurningPoint(c: Checker, label: string, tp: TurningPoint | undefined, r: any, fieller: any) {
  if (!tp) {
    c.misses.push(`${label}: the engine has no turning point where R has one at ${r.x}`);
    return;
  }
  c.rel('turning point', tp.x, r.x, TOL.tight, `${label} x* (R: root of the slope, MPFR)`);
  c.same(tp.kind, r.kind, `${label} kind (R: sign of s'(x*))`);
  c.same(tp.inRange, r.in_range, `${label} inside [x_min, x_max] (R)`);
  r.gradient.forEach((g: number, j: number) =>
    c.rel('delta gradient', tp.gradient[j], g, TOL.robust, `${label} delta gradient[${j}] (R)`),
  );
  c.rel('delta se', tp.delta.se, r.delta_se, TOL.robust, `${label} delta SE (R: √(gᵀVg), MPFR)`);
  c.rel('delta CI end', tp.delta.lo, r.delta_ci[0], TOL.robust, `${label} delta CI lower (R: x* − t·se)`);
  c.rel('delta CI end', tp.delta.hi, r.delta_ci[1], TOL.robust, `${label} delta CI upper (R: x* + t·se)`);
  const want = expectedFieller(fieller.pieces, r.fieller_piece_containing_x);
  c.same(tp.fieller.kind, want.kind, `${label} Fieller kind (R: sign of the quartic between its real roots)`);
  if (want.lo !== null)
    c.rel(
      'Fieller end',
      tp.fieller.lo,
      want.lo,
      TOL.robust,
      `${label} Fieller lower end (R: real root of the Fieller polynomial, MPFR Newton)`,
    );
  else c.same(tp.fieller.lo, null, `${label} Fieller lower end is infinite (R)`);
  if (want.hi !== null) c.rel('Fieller end', tp.fieller.hi, want.hi, TOL.robust, `${label} Fieller upper end (R)`);
  else c.same(tp.fieller.hi, null, `${label} Fieller upper end is infinite (R)`);
  c.same(tp.fieller.pieces.length, fieller.pieces.length, `${label} number of pieces of the Fieller set (R)`);
  fieller.pieces.forEach((p: any, i: number) => {
    const e = tp.fieller.pieces[i];
    if (!e) return;
    if (p.lo === null) c.same(e.lo, null, `${label} Fieller piece ${i} lower end infinite (R)`);
    else c.rel('Fieller end', e.lo, p.lo, TOL.robust, `${label} Fieller piece ${i} lower (R)`);
    if (p.hi === null) c.same(e.hi, null, `${label} Fieller piece ${i} upper end infinite (R)`);
    else c.rel('Fieller end', e.hi, p.hi, TOL.robust, `${label} Fieller piece ${i} upper (R)`);
  });
}

describe.each(Object.keys(ref.cases))('case %s against R (reference-cubic)', (id) => {
  const R = ref.cases[id];

  test.each(COV)(
    'covariance $fixture: coefficients, covariance, turning points, Fieller, U-test, Wald, elasticity',
    ({ fixture, engine }) => {
      const c = new Checker();
      const f = fit(id, engine);
      const V = R.covariances[fixture];
      const label = `${id} ${fixture}`;
      c.same(f.terms, R.model.terms, `${label} terms (R design columns)`);
      c.same([f.n, f.k, f.df], [R.n, R.k, R.df], `${label} n, k, df (R)`);
      (R.model.terms as string[]).forEach((t, j) =>
        c.rel('coefficient', f.coefficients[j], R.coefficients[t], TOL.tight, `${label} coefficient ${t} (R lm, MPFR)`),
      );
      c.rel('R²', f.rSquared, R.fit.r_squared, TOL.tight, `${label} R² (R)`);
      c.rel('residual SE', f.residualStandardError, R.fit.residual_se, TOL.tight, `${label} residual SE (R)`);
      const seTol = fixture === 'classical' ? TOL.tight : TOL.robust;
      (V.se as number[]).forEach((s, j) =>
        c.rel(`SE ${fixture}`, f.standardErrors[j], s, seTol, `${label} SE ${R.model.terms[j]} (R ${fixture}, MPFR)`),
      );
      const M = V.matrix as number[][];
      M.forEach((row, a) =>
        row.forEach((v, b) => {
          const scale = Math.sqrt(M[a][a] * M[b][b]);
          c.abs(
            `covariance ${fixture} (÷√(ViiVjj))`,
            f.covariance[a][b] / scale,
            v / scale,
            seTol,
            `${label} V[${a}][${b}] (R ${fixture}, MPFR)`,
          );
        }),
      );
      if (engine === 'newey_west')
        c.same(f.covarianceInfo.lag, R.newey_west_lag, `${label} Newey–West lag floor(4·(n/100)^(2/9)) (R)`);
      c.rel('critical value', f.critical.value, R.critical_value_t, 1e-12, `${label} t critical value (R qt)`);
      c.rel('range', f.range.xMin, R.range.x_min, 1e-15, `${label} x_min (R)`);
      c.rel('range', f.range.xMax, R.range.x_max, 1e-15, `${label} x_max (R)`);

      // turning points (sorted by x in both)
      c.same(
        f.turningPoints.length,
        V.turning_points.length,
        `${label} number of turning points (R: real roots of the slope)`,
      );
      (V.turning_points as any[]).forEach((r, i) =>
        checkTurningPoint(c, `${label} turning point ${i + 1}`, f.turningPoints[i], r, V.fieller),
      );
      if (R.model.form === 'quadratic') {
        const q = V.fieller.quadratic;
        const tp = f.turningPoints[0];
        c.same(
          tp?.fieller.kind,
          V.fieller.type === 'two_disjoint_rays' ? 'two_rays' : V.fieller.type,
          `${label} Fieller type (R: sign of A, D)`,
        );
        c.rel('Fieller A, B, C, D', tp?.fieller.A, q.A, TOL.robust, `${label} Fieller A = 4b2² − 4c²V22 (R)`);
        c.rel('Fieller A, B, C, D', tp?.fieller.B, q.B, TOL.robust, `${label} Fieller B = 4b1b2 − 4c²V12 (R)`);
        c.rel('Fieller A, B, C, D', tp?.fieller.C, q.C, TOL.robust, `${label} Fieller C = b1² − c²V11 (R)`);
        c.rel(
          'Fieller A, B, C, D',
          tp?.fieller.discriminant,
          q.discriminant,
          TOL.robust,
          `${label} Fieller D = B² − 4AC (R)`,
        );
      }

      // Lind–Mehlum U-test over the observed range
      const u = V.u_test;
      c.rel('U-test slope', f.uTest.slopeAtMin, u.slope_at_min, TOL.robust, `${label} slope at x_min (R)`);
      c.rel('U-test slope', f.uTest.slopeAtMax, u.slope_at_max, TOL.robust, `${label} slope at x_max (R)`);
      c.rel(
        'U-test slope SE',
        f.uTest.seAtMin,
        u.se_at_min,
        TOL.robust,
        `${label} se of slope at x_min (R: √(aᵀVa), MPFR)`,
      );
      c.rel('U-test slope SE', f.uTest.seAtMax, u.se_at_max, TOL.robust, `${label} se of slope at x_max (R)`);
      c.abs('U-test t', f.uTest.tAtMin, u.t_at_min, TOL.t, `${label} t at x_min (R)`);
      c.abs('U-test t', f.uTest.tAtMax, u.t_at_max, TOL.t, `${label} t at x_max (R)`);
      c.same(f.uTest.orientation, u.orientation, `${label} U-test orientation (R: s(x_max) < s(x_min) → inverted U)`);
      c.abs('U-test statistic', f.uTest.statistic, u.statistic, TOL.t, `${label} U-test statistic (R)`);
      c.abs('p-value', f.uTest.pValue, u.p_value, TOL.p, `${label} U-test p (R pt, n − k df)`);
      c.abs(
        'U-test statistic',
        f.uTest.bothOrientations.inverted_u.statistic,
        u.both.inverted_u.statistic,
        TOL.t,
        `${label} inverted-U statistic (R)`,
      );
      c.abs(
        'U-test statistic',
        f.uTest.bothOrientations.u.statistic,
        u.both.u.statistic,
        TOL.t,
        `${label} U statistic (R)`,
      );
      c.same(f.uTest.df, R.df, `${label} U-test df (R)`);

      // Wald F test of the slope terms, slope at the midpoint, elasticity now
      c.rel('Wald', f.wald.fStatistic, V.wald.f_statistic, TOL.robust, `${label} Wald F = W/q (R, MPFR)`);
      c.abs('p-value', f.wald.pValue, V.wald.p_value, TOL.p, `${label} Wald p (R pf)`);
      c.same(f.wald.q, V.wald.q, `${label} Wald q (R)`);
      c.rel(
        'midpoint slope',
        f.shape.slopeAtMidpoint.value,
        V.slope_at_midpoint.value,
        TOL.robust,
        `${label} slope at the midpoint (R)`,
      );
      c.rel(
        'midpoint slope',
        f.shape.slopeAtMidpoint.se,
        V.slope_at_midpoint.se,
        TOL.robust,
        `${label} se of the slope at the midpoint (R)`,
      );
      c.rel('elasticity', f.elasticity.value, V.elasticity_now.value, TOL.robust, `${label} elasticity now (R)`);
      c.rel(
        'elasticity',
        f.elasticity.se,
        V.elasticity_now.se,
        TOL.robust,
        `${label} elasticity SE (R, delta over all coefficients)`,
      );
      c.rel('elasticity', f.elasticity.lo, V.elasticity_now.lo, TOL.robust, `${label} elasticity CI lower (R)`);
      c.rel('elasticity', f.elasticity.hi, V.elasticity_now.hi, TOL.robust, `${label} elasticity CI upper (R)`);

      for (const [k, v] of c.worst) worstOverall.set(k, Math.max(worstOverall.get(k) ?? 0, v));
      expect(c.misses).toEqual([]);
    },
  );
});

test('the default Newey–West lag at n = 20 is floor(4·0.2^(2/9)) = 2, not the rounded 3 (R: floor(4 * (20/100)^(2/9)))', () => {
  for (const id of Object.keys(ref.cases).filter((k) => ref.cases[k].n === 20)) {
    expect(ref.cases[id].newey_west_lag).toBe(2); // compute_reference.R
    expect(fit(id, 'newey_west').covarianceInfo.lag).toBe(2);
  }
});

afterAll(() => {
  const lines = [...worstOverall.entries()].map(([k, v]) => `  ${k.padEnd(34)} ${v.toExponential(2)}`);
  console.log(
    ['largest difference from the R/MPFR reference per quantity (relative unless noted):', ...lines].join('\n'),
  );
});
