import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fitCurve, type CurveFit } from '../../api/estimation';
import { expectAbs, expectRel, loadPanelA } from './panel-a-loader';

// Residual diagnostics of panel A against R 4.2.2 + lmtest 0.9-40, computed by
// tests/fixtures/diagnostics/compute_diagnostics.R (each value's exact R call is stored
// beside it in panel_A_diagnostics.json). The tests do not need R.
// Tolerances: statistics relative 1e-8 (R's coefficients carry up to 9e-11 relative error,
// fixture README), p-values absolute 1e-9 (exact DW p 5e-8, see below), residuals absolute
// 1e-9, leverage relative 1e-9.
/* eslint-disable @typescript-eslint/no-explicit-any */
const fixture: any = JSON.parse(
  readFileSync(join(__dirname, '..', 'fixtures', 'diagnostics', 'panel_A_diagnostics.json'), 'utf8'),
);
const rows = loadPanelA();

describe.each(Object.keys(fixture.districts))('diagnostics of panel A district %s against R lmtest', (code) => {
  const r = fixture.districts[code];
  const res = fitCurve(
    rows
      .filter((x) => x.district === code)
      .map((x) => ({ year: x.year, y: x.emissions, x: x.income, controls: { pop_density: x.density } })),
    { form: 'quadratic', transform: 'log', covariance: 'classical' },
    { exactDurbinWatson: true },
  );
  const f = res as CurveFit;
  const dg = f.diagnostics!;

  test('Durbin–Watson statistic and its normal-approximation p (lmtest::dwtest)', () => {
    expect(res.status).toBe('ok');
    expectRel(dg.durbinWatson.statistic, r.durbin_watson.statistic, 1e-8, `${code} ${r.durbin_watson.call}`);
    expectAbs(
      dg.durbinWatson.pValue,
      r.durbin_watson.p_value_normal_approximation,
      1e-9,
      `${code} ${r.durbin_watson.call_approximate}`,
    );
    // exact p: Imhof's integral here, Pan's procedure (15 iterations) in lmtest; they differ by
    // up to 3.3e-8 on this panel (PA05), where a 30-digit evaluation of the integral sides with ours
    expectAbs(dg.durbinWatson.pValueExact, r.durbin_watson.p_value_exact, 5e-8, `${code} ${r.durbin_watson.call}`);
  });

  test('Breusch–Godfrey orders 1 and 2 (lmtest::bgtest)', () => {
    const [b1, b2] = dg.breuschGodfrey;
    expect(b1.order).toBe(1);
    expect(b2.order).toBe(2);
    expect(b1.df).toBe(r.breusch_godfrey_order_1.df);
    expect(b2.df).toBe(r.breusch_godfrey_order_2.df);
    expectRel(b1.statistic, r.breusch_godfrey_order_1.statistic, 1e-8, `${code} ${r.breusch_godfrey_order_1.call}`);
    expectAbs(b1.pValue, r.breusch_godfrey_order_1.p_value, 1e-9, `${code} ${r.breusch_godfrey_order_1.call} p`);
    expectRel(b2.statistic, r.breusch_godfrey_order_2.statistic, 1e-8, `${code} ${r.breusch_godfrey_order_2.call}`);
    expectAbs(b2.pValue, r.breusch_godfrey_order_2.p_value, 1e-9, `${code} ${r.breusch_godfrey_order_2.call} p`);
  });

  test('studentized Breusch–Pagan (lmtest::bptest)', () => {
    expect(dg.breuschPagan.df).toBe(r.breusch_pagan.df);
    expectRel(dg.breuschPagan.statistic, r.breusch_pagan.statistic, 1e-8, `${code} ${r.breusch_pagan.call}`);
    expectAbs(dg.breuschPagan.pValue, r.breusch_pagan.p_value, 1e-9, `${code} ${r.breusch_pagan.call} p`);
  });

  test('Jarque–Bera by its formula, largest leverage and residuals by year (R)', () => {
    expectRel(dg.jarqueBera.statistic, r.jarque_bera.statistic, 1e-8, `${code} ${r.jarque_bera.call}`);
    expectRel(dg.jarqueBera.skewness, r.jarque_bera.skewness, 1e-8, `${code} skewness (R formula)`);
    expectRel(dg.jarqueBera.kurtosis, r.jarque_bera.kurtosis, 1e-8, `${code} kurtosis (R formula)`);
    expectAbs(dg.jarqueBera.pValue, r.jarque_bera.p_value, 1e-9, `${code} JB p (R pchisq)`);
    expectRel(dg.largestLeverage!.value, r.largest_leverage.value, 1e-9, `${code} ${r.largest_leverage.call}`);
    expect(dg.largestLeverage!.year).toBe(r.largest_leverage.year); // R: d$year[which.max(hatvalues(fit))]
    expect(dg.residualsByYear.map((x) => x.year)).toEqual(r.years);
    dg.residualsByYear.forEach((x, i) =>
      expectAbs(x.residual, r.residuals.values[i], 1e-9, `${code} residual ${x.year} (R residuals(fit))`),
    );
  });
});
