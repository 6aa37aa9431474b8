import type { AppContext } from '../context';
import { districtParams, trackQuery } from '../http/params';
import { route, SIGNED_IN, type RouteSpec } from '../http/routes';
import { sendPublished } from './published-cache';
import * as service from './service';
import { DistrictListResponseSchema } from '../../contracts/districts';
import {
  DistrictEstimateResponseSchema,
  DistrictHistoryResponseSchema,
  RegionResponseSchema,
} from '../../contracts/estimates';

const byCode = { params: districtParams, query: trackQuery };
/** The cache key of a read: the route, its parameters and the track asked for ('' = the headline). */
const keyOf = (what: string, track?: string) => `${what} track=${track ?? ''}`;

export function estimateRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/districts',
      allow: SIGNED_IN,
      tag: 'districts',
      summary:
        'Every district’s code and name, by name (what the search needs; standings come with /api/region, details with each district’s answers)',
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
        'The region in a track’s latest published run (?track=, else the headline track): each district’s standing, counts per standing, the pooled curve',
      schemas: { query: trackQuery },
      handler: ({ query }, req, res) =>
        sendPublished(db, req, res, keyOf('region', query.track), () => service.region(db, query.track)),
    }),
    route({
      method: 'get',
      path: '/api/districts/:code/estimate',
      answer: DistrictEstimateResponseSchema,
      allow: SIGNED_IN,
      tag: 'estimates',
      summary:
        'A district’s published estimate in a track (card; ?track=, else the headline): curve, threshold and interval, standing, variants, note, and a row per shown track',
      schemas: byCode,
      handler: ({ params, query }, req, res) =>
        sendPublished(db, req, res, keyOf(`estimate ${params.code}`, query.track), () =>
          service.districtEstimate(db, params.code, query.track),
        ),
    }),
    route({
      method: 'get',
      path: '/api/districts/:code/history',
      answer: DistrictHistoryResponseSchema,
      allow: SIGNED_IN,
      tag: 'estimates',
      summary: 'A district’s estimates across a track’s published runs (?track=, else the headline), newest first',
      schemas: byCode,
      handler: ({ params, query }, req, res) =>
        sendPublished(db, req, res, keyOf(`history ${params.code}`, query.track), () =>
          service.districtHistory(db, params.code, query.track),
        ),
    }),
  ];
}
