import { z } from 'zod';
import type { AppContext } from '../context';
import { districtCode } from '../districts/router';
import { CurveRow, ModelSpec } from '../estimation';
import { route, SIGNED_IN, type RouteSpec } from '../http/routes';
import * as service from './service';
import { INDICATOR_CODE, INDICATOR_CODE_RULE } from '../../contracts/patterns';
import { WhatIfAnswerSchema } from '../../contracts/settings';

const indicator = z.string().regex(INDICATOR_CODE, INDICATOR_CODE_RULE);

export const EstimateRequest = z.union([
  z.object({ model: ModelSpec, rows: z.array(CurveRow).min(1).max(1000) }).strict(),
  z
    .object({
      model: ModelSpec,
      district: districtCode,
      emissions: indicator.default('emissions_pc'),
      driver: indicator.default('income_pc'),
      controls: z.array(indicator).max(8).default([]),
      firstYear: z.number().int().min(1900).max(2100).optional(),
      lastYear: z.number().int().min(1900).max(2100).optional(),
    })
    .strict(),
]);

export function curveRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'post',
      path: '/api/estimate',
      answer: WhatIfAnswerSchema,
      allow: SIGNED_IN,
      tag: 'estimation',
      summary: 'Fit one curve (fitCurve over HTTP): rows in the body, or a district read from the current data',
      schemas: { body: EstimateRequest },
      handler: async ({ body }) => {
        if ('rows' in body) return { source: 'rows', result: service.estimate(body.rows, body.model) };
        const { rows, droppedYears, dataVersion } = await service.rowsForDistrict(db, body);
        return {
          source: 'district',
          district: body.district,
          dataVersion,
          droppedYears,
          result: service.estimate(rows, { ...body.model, controls: body.controls }),
        };
      },
    }),
  ];
}
