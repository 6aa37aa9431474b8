import { idParams } from '../http/params';
import type { AppContext } from '../context';
import { callerOf, route, STAFF, type RouteSpec } from '../http/routes';
import { SavedSpecInput } from './schema';
import * as service from './service';
import { NO_CONTENT } from '../../contracts/common';
import { SpecAnswerSchema, SpecsResponseSchema } from '../../contracts/settings';

const byId = idParams;

export function specRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/specs',
      answer: SpecsResponseSchema,
      allow: STAFF,
      tag: 'runs',
      summary: 'Saved model specs (those a track uses first), with the headline track’s spec',
      handler: async () => ({
        specs: await service.listSpecs(db),
        headlineSpecId: await service.headlineSpecId(db),
      }),
    }),
    route({
      method: 'post',
      path: '/api/specs',
      answer: SpecAnswerSchema,
      statuses: [201],
      allow: STAFF,
      tag: 'runs',
      summary: 'Save a new model spec',
      schemas: { body: SavedSpecInput },
      handler: async ({ body }, req, res) => {
        res.status(201);
        return { spec: await service.createSpec(db, callerOf(req)!, body) };
      },
    }),
    route({
      method: 'put',
      path: '/api/specs/:id',
      answer: SpecAnswerSchema,
      allow: STAFF,
      tag: 'runs',
      summary: 'Replace a saved model spec',
      schemas: { params: byId, body: SavedSpecInput },
      handler: async ({ params, body }, req) => ({
        spec: await service.updateSpec(db, callerOf(req)!, params.id, body),
      }),
    }),
    route({
      method: 'delete',
      path: '/api/specs/:id',
      answer: NO_CONTENT,
      allow: STAFF,
      tag: 'runs',
      summary: 'Archive a saved model spec (runs keep their copy)',
      schemas: { params: byId },
      handler: async ({ params }, req, res) => {
        await service.archiveSpec(db, callerOf(req)!, params.id);
        res.status(204).end();
      },
    }),
  ];
}
