import { EstimationInputError, fitPanel, fixedEffectsRank, ols, twoWayWithin, type PanelRow } from './index';

// Synthetic panels; expected values follow from the definitions (the dummy-variable
// regression gives the same slopes as the within transformation).

function panel(G: number, T: number, drop: (g: number, t: number) => boolean = () => false): PanelRow[] {
  const rows: PanelRow[] = [];
  for (let g = 0; g < G; g++)
    for (let t = 0; t < T; t++) {
      if (drop(g, t)) continue;
      const lx = 9 + 0.04 * t + (0.3 * g) / G + 0.05 * Math.sin(g * 3 + t);
      const ly = 0.2 * g + 0.01 * t + 6 * lx - 0.3 * lx * lx + 0.02 * Math.cos(5 * g + 7 * t);
      rows.push({ district: `D${g}`, year: 2000 + t, y: Math.exp(ly), x: Math.exp(lx) });
    }
  return rows;
}
const M = { form: 'quadratic', transform: 'log', covariance: 'cluster' } as const;

describe('fitPanel', () => {
  test('unbalanced panel: slopes equal the dummy regression; df from the fixed-effects rank', () => {
    const rows = panel(6, 15, (g, t) => (g * 7 + t) % 5 === 0);
    const f = fitPanel(rows, M);
    if (f.status !== 'ok') throw new Error(f.reason.message);
    expect(f.balanced).toBe(false);
    expect(f.absorption.converged).toBe(true);
    const ds = [...new Set(rows.map((r) => r.district))],
      ys = [...new Set(rows.map((r) => r.year))];
    const X = rows.map((r) => [
      1,
      ...ds.slice(1).map((d) => (r.district === d ? 1 : 0)),
      ...ys.slice(1).map((y) => (r.year === y ? 1 : 0)),
      Math.log(r.x),
      Math.log(r.x) ** 2,
    ]);
    const o = ols(
      X,
      rows.map((r) => Math.log(r.y)),
    );
    expect(f.coefficients[0]).toBeCloseTo(o.coefficients[o.k - 2], 9);
    expect(f.coefficients[1]).toBeCloseTo(o.coefficients[o.k - 1], 9);
    expect(f.dfResidual).toBe(o.df);
    expect(f.df).toBe(5); // G − 1
    expect(f.uTest.df).toBe(5);
    expect(f.covarianceInfo.type).toBe('cluster');
    expect(f.covarianceInfo.factor).toBeCloseTo(rows.length / (rows.length - 2), 14); // N/(N−k), k = 2 slopes
  });

  test('fewer than 2 districts is not_estimable; duplicate district–year is an error naming the row', () => {
    expect(fitPanel(panel(1, 20), M).status).toBe('not_estimable');
    const rows = panel(3, 10);
    rows.push({ ...rows[4] });
    try {
      fitPanel(rows, M);
      throw new Error('no error');
    } catch (e) {
      const err = e as EstimationInputError;
      expect(err.code).toBe('duplicate_row');
      expect(err.details).toMatchObject({ row: 30, firstRow: 4, district: 'D0', year: 2004 });
    }
  });
});

describe('twoWayWithin and fixedEffectsRank', () => {
  test('balanced 2 × 2 panel: z − z̄_i − z̄_t + z̄ (one sweep, confirmed by the second)', () => {
    const col = Float64Array.from([1, 2, 3, 5]);
    const r = twoWayWithin([col], Int32Array.from([0, 0, 1, 1]), Int32Array.from([0, 1, 0, 1]), 2, 2);
    expect(Array.from(col)).toEqual([0.25, -0.25, -0.25, 0.25]);
    expect(r).toEqual({ iterations: 2, converged: true, maxRelativeChange: 0 });
  });
  test('rank G + T − C: connected and disconnected designs', () => {
    expect(fixedEffectsRank(Int32Array.from([0, 0, 1, 1]), Int32Array.from([0, 1, 0, 1]), 2, 2)).toEqual({
      rank: 3,
      components: 1,
    });
    expect(fixedEffectsRank(Int32Array.from([0, 1]), Int32Array.from([0, 1]), 2, 2)).toEqual({
      rank: 2,
      components: 2,
    });
  });
});
