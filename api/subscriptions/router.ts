import { z } from 'zod';
import type { AppContext } from '../context';
import { districtCode, idParams, trackCode } from '../http/params';
import { callerOf, route, SIGNED_IN, type RouteSpec } from '../http/routes';
import { ALERT_KINDS } from '../common/alert-kinds';
import { confirmPage, resultPage } from './pages';
import * as service from './service';
import { SubscriptionAnswerSchema, SubscriptionsResponseSchema } from '../../contracts/alerts';
import { NO_CONTENT } from '../../contracts/common';

const body = z.object({
  scope: z.enum(['district', 'districts', 'region']),
  districtCodes: z.array(districtCode).max(5000).default([]),
  kinds: z.array(z.enum(ALERT_KINDS)).default([]),
  delivery: z.enum(['instant', 'digest']).default('instant'),
  attachBrief: z.boolean().default(false),
  /** 'all' (every track, including tracks created later) or the chosen track codes */
  tracks: z.union([z.literal('all'), z.array(trackCode).min(1).max(100)]).default('all'),
});

export function subscriptionRoutes({ db, config }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/subscriptions',
      answer: SubscriptionsResponseSchema,
      allow: SIGNED_IN,
      tag: 'alerts',
      summary: 'Your alert subscriptions',
      handler: async (_i, req) => ({ subscriptions: await service.listOwn(db, callerOf(req)!) }),
    }),
    route({
      method: 'post',
      path: '/api/subscriptions',
      answer: SubscriptionAnswerSchema,
      statuses: [201],
      allow: SIGNED_IN,
      tag: 'alerts',
      summary:
        'Subscribe to a district, a set of districts or the region, in all tracks or chosen ones: alert kinds, instant or digest, brief attached',
      schemas: { body },
      handler: async ({ body }, req, res) => {
        res.status(201);
        return { subscription: await service.subscribe(db, callerOf(req)!, body) };
      },
    }),
    route({
      method: 'delete',
      path: '/api/subscriptions/:id',
      answer: NO_CONTENT,
      allow: SIGNED_IN,
      tag: 'alerts',
      summary: 'Remove one of your subscriptions',
      schemas: { params: idParams },
      handler: async ({ params }, req, res) => {
        await service.unsubscribeOwn(db, callerOf(req)!, params.id);
        res.status(204).end();
      },
    }),
    route({
      method: 'get',
      path: '/api/subscriptions/unsubscribe',
      allow: 'public',
      tag: 'alerts',
      produces: 'text/html',
      summary: 'The page an e-mail’s unsubscribe link opens: asks to confirm',
      schemas: { query: z.object({ token: z.string().max(400) }) },
      handler: ({ query }, _req, res) => {
        res.type('html').send(confirmPage(query.token));
      },
    }),
    route({
      method: 'post',
      path: '/api/subscriptions/unsubscribe',
      allow: 'public',
      tag: 'alerts',
      produces: 'text/html',
      anonymousWriteReason: 'e-mail unsubscribe: carries a signed, expiring token instead of a session',
      summary: 'Confirm an unsubscribe from an e-mail link (signed, expiring token; no sign-in)',
      schemas: { body: z.object({ token: z.string().max(400) }) },
      handler: async ({ body }, _req, res) => {
        const r = await service.unsubscribeByToken(db, config.sessionSecret, body.token);
        res
          .status(r.ok ? 200 : 400)
          .type('html')
          .send(resultPage(r.ok, r.message));
      },
    }),
  ];
}
