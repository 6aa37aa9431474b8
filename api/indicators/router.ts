/** The indicator catalogue: everyone signed in reads it, analysts and admins edit it. */
import type { AppContext } from '../context';
import { callerOf, route, SIGNED_IN, STAFF, type RouteSpec } from '../http/routes';
import { createIndicatorBody, indicatorParams, updateIndicatorBody } from './schema';
import * as service from './service';
import { IndicatorAnswerSchema, IndicatorsResponseSchema } from '../../contracts/settings';

export function indicatorRoutes({ db }: AppContext): RouteSpec[] {
  const whoOf = (req: Parameters<typeof callerOf>[0]) => {
    const c = callerOf(req);
    return { id: c?.id ?? null, email: c?.email ?? null };
  };
  return [
    route({
      method: 'get',
      path: '/api/indicators',
      answer: IndicatorsResponseSchema,
      allow: SIGNED_IN,
      tag: 'indicators',
      summary: 'The indicator catalogue: units, positivity rule, derivation, and how much data each has',
      handler: () => service.listIndicators(db),
    }),
    route({
      method: 'post',
      path: '/api/indicators',
      answer: IndicatorAnswerSchema,
      statuses: [201],
      allow: STAFF,
      tag: 'indicators',
      summary:
        'Add an indicator; a derived one (per person, or real from nominal) is computed at once from its sources',
      schemas: { body: createIndicatorBody },
      handler: async ({ body }, req, res) => {
        const answer = await service.createIndicator(db, body, whoOf(req));
        res.status(201);
        return answer;
      },
    }),
    route({
      method: 'patch',
      path: '/api/indicators/:code',
      answer: IndicatorAnswerSchema,
      allow: STAFF,
      tag: 'indicators',
      summary: 'Change an indicator; a new or changed derivation recomputes its series as a change set of its own',
      schemas: { params: indicatorParams, body: updateIndicatorBody },
      handler: ({ params, body }, req) => service.updateIndicator(db, params.code, body, whoOf(req)),
    }),
  ];
}
