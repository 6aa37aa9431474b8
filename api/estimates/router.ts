import type { AppContext } from '../context';
import { districtParams } from '../http/params';
import { route, SIGNED_IN, type RouteSpec } from '../http/routes';
import { sendPublished } from './published-cache';
import * as service from './service';
import { DistrictListResponseSchema } from '../../contracts/districts';
import {
  DistrictEstimateResponseSchema,
  DistrictHistoryResponseSchema,
  RegionResponseSchema,
} from '../../contracts/estimates';

const byCode = { params: districtParams };

export function estimateRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/districts',
      allow: SIGNED_IN,
      tag: 'districts',
      summary: 'Every district with its years covered, latest values and standing in the latest published run',
      answer: DistrictListResponseSchema,
      handler: (_input, req, res) => sendPublished(db, req, res, 'districts', () => service.listDistricts(db)),
    }),
    route({
      method: 'get',
      path: '/api/region',
      answer: RegionResponseSchema,
      allow: SIGNED_IN,
      tag: 'estimates',
      summary:
        'The region in the latest published run: each district’s standing, counts per standing, the pooled curve',
      handler: (_input, req, res) => sendPublished(db, req, res, 'region', () => service.region(db)),
    }),
    route({
      method: 'get',
      path: '/api/districts/:code/estimate',
      answer: DistrictEstimateResponseSchema,
      allow: SIGNED_IN,
      tag: 'estimates',
      summary:
        'A district’s published estimate (card): curve, threshold and interval, standing, sensitivity variants, note',
      schemas: byCode,
      handler: ({ params }, req, res) =>
        sendPublished(db, req, res, `estimate ${params.code}`, () => service.districtEstimate(db, params.code)),
    }),
    route({
      method: 'get',
      path: '/api/districts/:code/history',
      answer: DistrictHistoryResponseSchema,
      allow: SIGNED_IN,
      tag: 'estimates',
      summary: 'A district’s estimates across published runs, newest first',
      schemas: byCode,
      handler: ({ params }, req, res) =>
        sendPublished(db, req, res, `history ${params.code}`, () => service.districtHistory(db, params.code)),
    }),
  ];
}
