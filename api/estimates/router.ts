import { z } from 'zod';
import type { AppContext } from '../context';
import { districtCode } from '../districts/router';
import { route, SIGNED_IN, type RouteSpec } from '../http/routes';
import * as service from './service';
import { DistrictEstimateResponseSchema, DistrictHistoryResponseSchema, RegionResponseSchema } from '../../contracts/estimates';

const byCode = { params: z.object({ code: districtCode }) };

export function estimateRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/region',
      answer: RegionResponseSchema,
      allow: SIGNED_IN,
      tag: 'estimates',
      summary: 'The region in the latest published run: each district’s standing, counts per standing, the pooled curve',
      handler: () => service.region(db),
    }),
    route({
      method: 'get',
      path: '/api/districts/:code/estimate',
      answer: DistrictEstimateResponseSchema,
      allow: SIGNED_IN,
      tag: 'estimates',
      summary: 'A district’s published estimate (card): curve, threshold and interval, standing, sensitivity variants, note',
      schemas: byCode,
      handler: ({ params }) => service.districtEstimate(db, params.code),
    }),
    route({
      method: 'get',
      path: '/api/districts/:code/history',
      answer: DistrictHistoryResponseSchema,
      allow: SIGNED_IN,
      tag: 'estimates',
      summary: 'A district’s estimates across published runs, newest first',
      schemas: byCode,
      handler: ({ params }) => service.districtHistory(db, params.code),
    }),
  ];
}
