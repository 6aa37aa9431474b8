import { z } from 'zod';
import type { AppContext } from '../context';
import { districtCode } from '../http/params';
import { CurveRow, ModelSpec } from '../estimation';
import { COMPUTE_LIMIT, route, SIGNED_IN, type RouteSpec } from '../http/routes';
import * as service from './service';
import { MAX_CONTROLS } from './service';
import { INDICATOR_CODE, INDICATOR_CODE_RULE } from '../../contracts/patterns';
import { WhatIfAnswerSchema } from '../../contracts/settings';

const indicator = z.string().regex(INDICATOR_CODE, INDICATOR_CODE_RULE);

/** The model as saved specs allow it: at most 8 controls. */
const EstimateModel = ModelSpec.extend({ controls: z.array(z.string().min(1)).max(MAX_CONTROLS).optional() });
/** A row with at most 8 controls. */
const EstimateRow = CurveRow.refine((r) => r.controls === undefined || Object.keys(r.controls).length <= MAX_CONTROLS, {
  message: `at most ${MAX_CONTROLS} controls a row`,
  path: ['controls'],
});

export const EstimateRequest = z.union(
  [
    z.object({ model: EstimateModel, rows: z.array(EstimateRow).min(1).max(1000) }).strict(),
    z
      .object({
        model: EstimateModel,
        district: districtCode,
        emissions: indicator.default('emissions_pc'),
        driver: indicator.default('income_pc'),
        controls: z.array(indicator).max(MAX_CONTROLS).default([]),
        firstYear: z.number().int().min(1900).max(2100).optional(),
        lastYear: z.number().int().min(1900).max(2100).optional(),
      })
      .strict(),
  ],
  {
    // Name the field of the form the caller meant (rows in the body, or a district), not just "invalid input".
    error: (iss) => {
      if (iss.code !== 'invalid_union' || !('errors' in iss)) return undefined;
      const input = iss.input as Record<string, unknown> | undefined;
      const branch = iss.errors[input && typeof input === 'object' && 'rows' in input ? 0 : 1] ?? [];
      return branch.map((i) => `${i.path.join('.') || '(body)'}: ${i.message}`).join('; ') || undefined;
    },
  },
);

export function curveRoutes({ db, compute }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'post',
      path: '/api/estimate',
      answer: WhatIfAnswerSchema,
      allow: SIGNED_IN,
      tag: 'estimation',
      rateLimit: COMPUTE_LIMIT,
      summary: 'Fit one curve (fitCurve over HTTP): rows in the body, or a district read from the current data',
      schemas: { body: EstimateRequest },
      handler: async ({ body }) => {
        if ('rows' in body) {
          // Refused before any work: the body's rows set n.
          service.checkLag(body.rows.length, body.model.lag);
          return { source: 'rows', result: await service.estimate(compute, body.rows, body.model) };
        }
        const { rows, droppedYears, dataVersion } = await service.rowsForDistrict(db, body);
        return {
          source: 'district',
          district: body.district,
          dataVersion,
          droppedYears,
          result: await service.estimate(compute, rows, { ...body.model, controls: body.controls }),
        };
      },
    }),
  ];
}
