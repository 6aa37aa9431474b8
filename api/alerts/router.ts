import { z } from 'zod';
import type { AppContext } from '../context';
import { districtCode, idParams, trackCode } from '../http/params';
import { callerOf, route, SIGNED_IN, type RouteSpec } from '../http/routes';
import * as service from './service';
import { AlertFeedResponseSchema, DistrictAlertsResponseSchema } from '../../contracts/alerts';
import { NO_CONTENT } from '../../contracts/common';

export function alertRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/alerts',
      answer: AlertFeedResponseSchema,
      allow: SIGNED_IN,
      tag: 'alerts',
      summary: 'Your alerts feed (what your subscriptions cover), newest first, unread marked',
      schemas: {
        query: z.object({
          district: districtCode.optional(),
          track: trackCode.optional(),
          unread: z.enum(['true', 'false']).optional(),
          limit: z.coerce.number().int().min(1).max(500).default(100),
        }),
      },
      handler: async ({ query }, req) => {
        const alerts = await service.feed(db, callerOf(req)!, {
          districtCode: query.district,
          track: query.track,
          limit: query.limit,
          unreadOnly: query.unread === 'true',
        });
        return { alerts, unread: alerts.filter((a) => !a.read).length };
      },
    }),
    route({
      method: 'post',
      path: '/api/alerts/:id/read',
      answer: NO_CONTENT,
      allow: SIGNED_IN,
      tag: 'alerts',
      summary: 'Mark an alert as read',
      schemas: { params: idParams },
      handler: async ({ params }, req, res) => {
        await service.markRead(db, callerOf(req)!, params.id);
        res.status(204).end();
      },
    }),
    route({
      method: 'get',
      path: '/api/districts/:code/alerts',
      answer: DistrictAlertsResponseSchema,
      allow: SIGNED_IN,
      tag: 'alerts',
      summary: 'Every alert published for one district (optionally one track’s), newest first',
      schemas: {
        params: z.object({ code: districtCode }),
        query: z.object({
          limit: z.coerce.number().int().min(1).max(200).default(50),
          track: trackCode.optional(),
        }),
      },
      handler: async ({ params, query }) => ({
        alerts: await service.districtAlerts(db, params.code, query.limit, query.track),
      }),
    }),
  ];
}
