import { z } from 'zod';
import type { AppContext } from '../context';
import { ADMIN, route, type RouteSpec } from '../http/routes';
import * as audit from './service';
import { AuditResponseSchema } from '../../contracts/people';

const query = z.object({
  action: z.string().max(64).optional(),
  actor: z.string().max(200).optional(),
  targetType: z.string().max(64).optional(),
  since: z.iso.datetime({ offset: true }).or(z.iso.date()).optional(),
  until: z.iso.datetime({ offset: true }).or(z.iso.date()).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  beforeId: z.coerce.number().int().positive().optional(),
});

export function auditRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/audit',
      answer: AuditResponseSchema,
      allow: ADMIN,
      tag: 'people',
      summary: 'The audit log, newest first, filtered by action, actor, target type and time',
      schemas: { query },
      handler: async ({ query }) => ({ entries: await audit.list(db, query) }),
    }),
  ];
}
