import { z } from 'zod';
import type { AppContext } from '../context';
import { route, SIGNED_IN, type RouteSpec } from '../http/routes';
import * as service from './service';
import { DISTRICT_CODE, DISTRICT_CODE_RULE } from '../../contracts/patterns';
import { DistrictDetailResponseSchema, DistrictListResponseSchema } from '../../contracts/districts';

export const districtCode = z.string().regex(DISTRICT_CODE, DISTRICT_CODE_RULE);

export function districtRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/districts',
      answer: DistrictListResponseSchema,
      allow: SIGNED_IN,
      tag: 'districts',
      summary: 'Every district with its years covered, latest values and standing in the latest published run',
      handler: () => service.listDistricts(db),
    }),
    route({
      method: 'get',
      path: '/api/districts/:code',
      answer: DistrictDetailResponseSchema,
      allow: SIGNED_IN,
      tag: 'districts',
      summary: 'One district with its yearly series (gap years as nulls)',
      schemas: { params: z.object({ code: districtCode }) },
      handler: ({ params }) => service.getDistrict(db, params.code),
    }),
  ];
}
