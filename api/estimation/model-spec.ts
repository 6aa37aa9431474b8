import { z } from 'zod';

/**
 * The model specification shared by the engine (fitCurve, fitPanel), POST /api/estimate
 * and the saved specs of runs. Plain zod 4 schema; parse with `ModelSpec.parse(value)` (or
 * let fitCurve do it) to get every default filled in.
 *
 * Fields: form 'quadratic' | 'cubic'; transform 'log' (ln of y, x and every control not in
 * levelControls) | 'level'; covariance 'classical' | 'hc1' | 'hc3' | 'newey_west' | 'cluster'
 * (cluster is the pooled panel's; fitPanel always clusters by district); lag (Newey–West,
 * default floor(4(n/100)^(2/9))); level (confidence, 0.95); alpha (test level, 0.05);
 * criticalValue 't' (n − k df, G − 1 for the panel) | 'normal'; intervalMethod 'fieller' |
 * 'delta' (the interval that sets the standing); controls (which controls, in this order;
 * default every control in the rows, sorted by name); levelControls (controls kept in
 * levels under the log transform); minYears (default k + 5); trendYears (window of the
 * income trend, 10); clusterAdjustment (panel small-sample factor, default N/(N−k)).
 * Reference: docs/method.md (the product's conventions).
 *
 * Throws: `ModelSpec.parse` throws a ZodError; fitCurve turns it into an
 * EstimationInputError `invalid_argument` with the issues in details.
 *
 * Example:
 *   ModelSpec.parse({ form: 'quadratic', transform: 'log', covariance: 'newey_west' })
 *   // → { form: 'quadratic', transform: 'log', covariance: 'newey_west', level: 0.95, alpha: 0.05,
 *   //     criticalValue: 't', intervalMethod: 'fieller', levelControls: [], trendYears: 10,
 *   //     clusterAdjustment: 'n_over_n_minus_k' }
 */
export const ModelSpec = z
  .object({
    form: z
      .enum(['quadratic', 'cubic'])
      .describe('Polynomial in the driver: quadratic (one turning point) or cubic (up to two)'),
    transform: z
      .enum(['log', 'level'])
      .describe('log: ln of emissions, driver and controls (except levelControls); level: raw values'),
    covariance: z
      .enum(['classical', 'hc1', 'hc3', 'newey_west', 'cluster'])
      .describe('Coefficient covariance; cluster is for the pooled panel'),
    lag: z.number().int().min(0).optional().describe('Newey–West lag in rows; default floor(4·(n/100)^(2/9))'),
    level: z.number().gt(0).lt(1).default(0.95).describe('Confidence level of intervals'),
    alpha: z.number().gt(0).lt(1).default(0.05).describe('Test level for the U-test, the Wald test and shapes'),
    criticalValue: z
      .enum(['t', 'normal'])
      .default('t')
      .describe('t with n−k df (G−1 for the panel) or standard normal'),
    intervalMethod: z.enum(['fieller', 'delta']).default('fieller').describe('Interval that sets the standing'),
    controls: z
      .array(z.string().min(1))
      .optional()
      .describe('Controls to use, in order; default all controls in the rows, sorted'),
    levelControls: z.array(z.string().min(1)).default([]).describe('Controls kept in levels under the log transform'),
    minYears: z.number().int().min(1).optional().describe('Minimum rows for a district fit; default k + 5'),
    trendYears: z.number().int().min(2).default(10).describe('Years in the income-trend window'),
    clusterAdjustment: z
      .enum(['n_over_n_minus_k', 'none', 'g_over_g_minus_1', 'combined'])
      .default('n_over_n_minus_k')
      .describe('Panel cluster small-sample factor: N/(N−k), 1, G/(G−1), or G/(G−1)·(N−1)/(N−k)'),
  })
  .strict();

/** A parsed model spec (defaults filled in). */
export type ModelSpec = z.output<typeof ModelSpec>;
/** What a caller may pass (defaults optional). */
export type ModelSpecInput = z.input<typeof ModelSpec>;

/** One yearly row of a district, in original units. */
export const CurveRow = z.object({
  year: z.number().int(),
  y: z.number(),
  x: z.number(),
  controls: z.record(z.string(), z.number()).optional(),
});
export type CurveRow = z.output<typeof CurveRow>;

/** One row of the pooled panel. */
export const PanelRow = CurveRow.extend({ district: z.string().min(1) });
export type PanelRow = z.output<typeof PanelRow>;
