/** A district's stored series, for the data tab and for export. */
import { z } from 'zod';
import type { AppContext } from '../context';
import { COMPUTE_LIMIT, route, SIGNED_IN, type RouteSpec } from '../http/routes';
import { districtCode, indicatorCode } from '../http/params';
import * as service from './service';
import { DistrictObservationsResponseSchema } from '../../contracts/districts';

const params = z.object({ code: districtCode });
const asOf = z.coerce.number().int().min(0).optional();
const query = z.object({
  /** Comma-separated indicator codes (default: every indicator the district has values for). */
  indicators: z
    .string()
    .transform((s) =>
      s
        .split(',')
        .map((c) => c.trim())
        .filter(Boolean),
    )
    .pipe(z.array(indicatorCode).min(1))
    .optional(),
  /** A data version (GET /api/data-version); default the current one. */
  asOf,
});

export function observationRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/districts/:code/observations',
      answer: DistrictObservationsResponseSchema,
      allow: SIGNED_IN,
      tag: 'districts',
      summary:
        "A district's yearly series for every indicator, gap years as nulls, each value with its upload; optionally as of a data version",
      schemas: { params, query },
      handler: ({ params: p, query: q }) => service.districtObservations(db, p.code, q),
    }),
    route({
      method: 'get',
      path: '/api/districts/:code/observations.csv',
      allow: SIGNED_IN,
      tag: 'districts',
      summary:
        "A district's uploaded series as a wide CSV (text cells escaped against formula injection); it can be uploaded again",
      produces: 'text/csv',
      rateLimit: COMPUTE_LIMIT,
      schemas: { params, query: z.object({ asOf }) },
      handler: async ({ params: p, query: q }, _req, res) => {
        const csv = await service.districtObservationsCsv(db, p.code, q);
        res.type('text/csv; charset=utf-8').attachment(`${p.code}-observations.csv`).send(csv);
      },
    }),
  ];
}
