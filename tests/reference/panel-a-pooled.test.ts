import { fitPanel, ols, type PanelFit } from '../../api/estimation';
import { expectAbs, expectRel, fiellerKind, loadPanelA, loadPanelAResults, orientation } from './panel-a-loader';

// Pooled two-way fixed effects of panel A against R 4.2.2 + plm 2.6-2 / sandwich 3.0-2
// (tests/fixtures/reference/panel-A/panel_A_results.json, pooled_two_way_fe):
// plm(ln_e ~ lx + lx2 + ld, model = "within", effect = "twoways") with
// vcovHC(method = "arellano", type = "HC1", cluster = "group") as the primary covariance.
// R's pooled values carry ≤ 7e-13 relative error (Rmpfr check in the fixture), so the
// README's tolerances (coefficients 1e-8, clustered SEs and intervals 1e-6, t 1e-6 abs,
// p 1e-8 abs) apply as written.

const ref = loadPanelAResults().pooled_two_way_fe;
const rows = loadPanelA().map((r) => ({
  district: r.district,
  year: r.year,
  y: r.emissions,
  x: r.income,
  controls: { pop_density: r.density },
}));
const names = ['ln_income', 'ln_income_sq', 'ln_pop_density'];

const variants = [
  { fixture: 'plm_arellano_HC1', adjustment: 'n_over_n_minus_k' as const },
  { fixture: 'plm_arellano_HC0', adjustment: 'none' as const },
  { fixture: 'plm_arellano_sss', adjustment: 'combined' as const },
  { fixture: 'lsdv_vcovCL_HC0', adjustment: 'g_over_g_minus_1' as const },
];

function pooled(adjustment: (typeof variants)[number]['adjustment'], criticalValue: 't' | 'normal'): PanelFit {
  const r = fitPanel(rows, {
    form: 'quadratic',
    transform: 'log',
    covariance: 'cluster',
    clusterAdjustment: adjustment,
    criticalValue,
  });
  if (r.status !== 'ok') throw new Error(r.reason.message);
  return r;
}

describe('panel A pooled two-way fixed effects against R plm', () => {
  test('slopes, within R², sizes (plm within twoways; lm with dummies)', () => {
    const f = pooled('n_over_n_minus_k', 't');
    expect(f.terms).toEqual(['x', 'x2', 'pop_density']);
    expect(f.n).toBe(ref.n);
    expect(f.districts).toBe(ref.n_districts);
    expect(f.years).toBe(ref.n_years);
    expect(f.balanced).toBe(ref.balanced);
    expect(f.dfResidual).toBe(ref.df_residual_plm); // plm df.residual: N − G − T + 1 − k
    expect(f.absorption.converged).toBe(true);
    names.forEach((t, j) => expectRel(f.coefficients[j], ref.coefficients[t], 1e-10, `pooled coef ${t} (R plm)`));
    names.forEach((t, j) =>
      expectRel(f.coefficients[j], ref.coefficients_lsdv_lm[t], 1e-10, `pooled coef ${t} (R lm with dummies)`),
    );
    expectRel(f.rSquaredWithin, ref.r_squared_within_plm, 1e-9, 'within R² (R plm summary)');
    expectRel(f.adjRSquaredWithin, ref.adj_r_squared_within_plm, 1e-9, 'within adj R² (R plm summary)');
    expectRel(
      f.covarianceInfo.factor,
      ref.small_sample_factors.plm_arellano_HC1,
      1e-15,
      'plm HC1 factor N/(N−k) = 280/277',
    );
    expect(f.covarianceInfo.clusters).toBe(8);
  });

  test.each(variants)(
    '$fixture: clustered covariance, turning point, delta, Fieller, U-test (t(G−1) and normal)',
    ({ fixture, adjustment }) => {
      const V = ref.vcov[fixture].matrix as number[][];
      const ci = ref.coef_inference[fixture];
      const qi = ref.quadratic_inference[fixture];
      for (const crit of ['t', 'normal'] as const) {
        const f = pooled(adjustment, crit);
        const src = `pooled ${fixture} ${crit}`;
        expectRel(f.covarianceInfo.factor, ref.small_sample_factors[fixture], 1e-14, `${src} small-sample factor (R)`);
        for (let a = 0; a < 3; a++)
          for (let b = 0; b < 3; b++) {
            expectAbs(
              f.covariance[a][b],
              V[a][b],
              1e-8 * Math.sqrt(V[a][a] * V[b][b]),
              `${src} vcov[${a}][${b}] (R ${fixture})`,
            );
          }
        names.forEach((t, j) => expectRel(f.standardErrors[j], ci.se[t], 1e-8, `${src} SE ${t} (R ${fixture})`));
        names.forEach((t, j) =>
          expectAbs(
            f.pValues[j],
            crit === 't' ? ci.p_two_sided_t_G_minus_1[t] : ci.p_two_sided_normal[t],
            1e-8,
            `${src} p ${t} (R pt(df = G−1) / pnorm)`,
          ),
        );
        expect(f.df).toBe(crit === 't' ? ref.coef_inference_df_used : null);
        const tp = f.turningPoints[0];
        expectRel(tp.x, qi.turning_point.log_scale_point, 1e-8, `${src} x* (R)`);
        expectRel(tp.level!, qi.turning_point.exp_point, 1e-8, `${src} exp(x*) (R)`);
        expectRel(
          tp.delta.se,
          qi.turning_point.delta_method.se_log_scale,
          1e-6,
          `${src} delta SE (R msm::deltamethod)`,
        );
        const dci = qi.turning_point.delta_method.ci.find(
          (c: { critical_value_kind: string }) => c.critical_value_kind === crit,
        );
        expectRel(f.critical.value, dci.critical_value, 1e-12, `${src} critical value (R qt(0.975, 7) / qnorm)`);
        expectRel(tp.delta.lo, dci.log_scale[0], 1e-6, `${src} delta lo (R)`);
        expectRel(tp.delta.hi, dci.log_scale[1], 1e-6, `${src} delta hi (R)`);
        expectRel(tp.delta.levelLo, dci.exponentiated[0], 1e-6, `${src} delta lo exp (R)`);
        expectRel(tp.delta.levelHi, dci.exponentiated[1], 1e-6, `${src} delta hi exp (R)`);
        const fr = qi.fieller.find((c: { critical_value_kind: string }) => c.critical_value_kind === crit);
        expect(tp.fieller.kind).toBe(fiellerKind(fr.type)); // R compute_reference.R
        if (fr.type === 'two_disjoint_rays') {
          expectRel(tp.fieller.lo, fr.pieces_log_scale[0].upper, 1e-6, `${src} Fieller left ray end (R)`);
          expectRel(tp.fieller.hi, fr.pieces_log_scale[1].lower, 1e-6, `${src} Fieller right ray start (R)`);
          expectRel(
            tp.fieller.levelHi,
            fr.pieces_exponentiated[1].lower,
            1e-6,
            `${src} Fieller right ray start exp (R)`,
          );
        } else if (fr.type === 'bounded') {
          expectRel(tp.fieller.lo, fr.pieces_log_scale[0].lower, 1e-6, `${src} Fieller lo (R)`);
          expectRel(tp.fieller.hi, fr.pieces_log_scale[0].upper, 1e-6, `${src} Fieller hi (R)`);
        } else {
          expect(tp.fieller.lo).toBeNull();
          expect(tp.fieller.hi).toBeNull();
        }
        const lm = qi.lind_mehlum;
        expect(f.uTest.orientation).toBe(orientation(lm.orientation_tested));
        expectAbs(f.uTest.tAtMin, lm.t_at_min, 1e-6, `${src} t at x_min (R)`);
        expectAbs(f.uTest.tAtMax, lm.t_at_max, 1e-6, `${src} t at x_max (R)`);
        expectAbs(f.uTest.statistic, lm.statistic, 1e-6, `${src} U-test statistic (R)`);
        expectAbs(
          f.uTest.pValue,
          crit === 't' ? lm.p_value_t : lm.p_value_normal,
          1e-8,
          `${src} U-test p, df G−1 = 7 (R)`,
        );
        expect(f.uTest.df).toBe(crit === 't' ? 7 : null);
        expectRel(f.range.xMin, ref.income_range.ln_min, 1e-15, `${src} x_min over all rows (R)`);
        expectRel(f.range.xMax, ref.income_range.ln_max, 1e-15, `${src} x_max over all rows (R)`);
      }
    },
  );

  test('lsdv_vcovCL_HC1: ols on the dummy design with cluster factor G/(G−1)·(N−1)/(N−K), K = 45 (sandwich::vcovCL)', () => {
    const districts = [...new Set(rows.map((r) => r.district))].sort();
    const years = [...new Set(rows.map((r) => r.year))].sort((a, b) => a - b);
    const X = rows.map((r) => {
      const lx = Math.log(r.x);
      return [
        1,
        ...districts.slice(1).map((d) => (r.district === d ? 1 : 0)),
        ...years.slice(1).map((t) => (r.year === t ? 1 : 0)),
        lx,
        lx * lx,
        Math.log(r.controls.pop_density),
      ];
    });
    const fit = ols(
      X,
      rows.map((r) => Math.log(r.y)),
      { covariance: 'cluster', clusters: rows.map((r) => r.district), clusterAdjustment: 'combined' },
    );
    expect(fit.k).toBe(ref.lsdv_n_parameters); // R: 45 parameters in the dummy regression
    const V = ref.vcov.lsdv_vcovCL_HC1.matrix as number[][];
    const off = fit.k - 3;
    names.forEach((t, j) =>
      expectRel(fit.coefficients[off + j], ref.coefficients_lsdv_lm[t], 1e-9, `LSDV coef ${t} (R lm)`),
    );
    for (let a = 0; a < 3; a++) {
      expectRel(
        fit.standardErrors[off + a],
        ref.coef_inference.lsdv_vcovCL_HC1.se[names[a]],
        1e-8,
        `LSDV SE ${names[a]} (R sandwich::vcovCL HC1)`,
      );
      for (let b = 0; b < 3; b++)
        expectAbs(
          fit.covariance[off + a][off + b],
          V[a][b],
          1e-8 * Math.sqrt(V[a][a] * V[b][b]),
          `LSDV vcov[${a}][${b}] (R vcovCL)`,
        );
    }
    expectRel(fit.covarianceInfo.factor, ref.small_sample_factors.lsdv_vcovCL_HC1, 1e-14, 'vcovCL HC1 factor (R)');
  });

  test('unbalanced panel: alternating projections give the dummy-regression slopes (lm with dummies, recomputed here by ols)', () => {
    // drop a scattering of rows so the panel is unbalanced but connected
    const kept = rows.filter((_, i) => i % 7 !== 3 && i % 11 !== 5);
    const f = fitPanel(kept, { form: 'quadratic', transform: 'log', covariance: 'cluster' });
    if (f.status !== 'ok') throw new Error(f.reason.message);
    expect(f.balanced).toBe(false);
    expect(f.absorption.iterations).toBeGreaterThan(2);
    const districts = [...new Set(kept.map((r) => r.district))].sort();
    const years = [...new Set(kept.map((r) => r.year))].sort((a, b) => a - b);
    const X = kept.map((r) => {
      const lx = Math.log(r.x);
      return [
        1,
        ...districts.slice(1).map((d) => (r.district === d ? 1 : 0)),
        ...years.slice(1).map((t) => (r.year === t ? 1 : 0)),
        lx,
        lx * lx,
        Math.log(r.controls.pop_density),
      ];
    });
    const lsdv = ols(
      X,
      kept.map((r) => Math.log(r.y)),
      { covariance: 'cluster', clusters: kept.map((r) => r.district), clusterParameterCount: 3 },
    );
    const off = lsdv.k - 3;
    expect(f.dfResidual).toBe(lsdv.df); // N − K of the dummy regression
    for (let j = 0; j < 3; j++) {
      expectRel(f.coefficients[j], lsdv.coefficients[off + j], 1e-9, `unbalanced slope ${j} (LSDV by ols)`);
      expectRel(
        f.standardErrors[j],
        lsdv.standardErrors[off + j],
        1e-7,
        `unbalanced clustered SE ${j} (LSDV by ols, same factor)`,
      );
    }
  });
});
