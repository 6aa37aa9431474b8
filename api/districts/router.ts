import type { AppContext } from '../context';
import { districtParams } from '../http/params';
import { route, SIGNED_IN, type RouteSpec } from '../http/routes';
import * as service from './service';
import { DistrictDetailResponseSchema } from '../../contracts/districts';

export function districtRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/districts/:code',
      answer: DistrictDetailResponseSchema,
      allow: SIGNED_IN,
      tag: 'districts',
      summary: 'One district with its yearly series (gap years as nulls)',
      schemas: { params: districtParams },
      handler: ({ params }) => service.getDistrict(db, params.code),
    }),
  ];
}
