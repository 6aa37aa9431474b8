import { z } from 'zod';
import { idParams } from '../http/validate';
import type { AppContext } from '../context';
import { ADMIN, callerOf, ROLES, route, type RouteSpec } from '../http/routes';
import * as service from './service';
import {
  InviteAnswerSchema,
  PeopleResponseSchema,
  PersonAnswerSchema,
  PersonDeletedSchema,
} from '../../contracts/people';

const role = z.enum(ROLES);

export function peopleRoutes(ctx: AppContext): RouteSpec[] {
  const { db } = ctx;
  return [
    route({
      method: 'get',
      path: '/api/people',
      answer: PeopleResponseSchema,
      allow: ADMIN,
      tag: 'people',
      summary: 'Everyone with access, their role and status',
      handler: async () => ({ people: await service.listPeople(db) }),
    }),
    route({
      method: 'post',
      path: '/api/people/invitations',
      answer: InviteAnswerSchema,
      statuses: [201],
      allow: ADMIN,
      tag: 'people',
      summary: 'Invite an e-mail address with a role (sends the invitation by e-mail)',
      schemas: { body: z.object({ email: z.email().max(254), role, name: z.string().max(120).optional() }) },
      handler: async ({ body }, req, res) => {
        res.status(201);
        return service.invite(ctx, callerOf(req)!, body);
      },
    }),
    route({
      method: 'patch',
      path: '/api/people/:id',
      answer: PersonAnswerSchema,
      allow: ADMIN,
      tag: 'people',
      summary: 'Change a person’s role, name, or deactivate / reactivate them',
      schemas: {
        params: idParams,
        body: z
          .object({ role: role.optional(), active: z.boolean().optional(), name: z.string().max(120).optional() })
          .refine((b) => Object.keys(b).length > 0, 'give role, active or name'),
      },
      handler: async ({ params, body }, req) => ({
        person: await service.updatePerson(db, callerOf(req)!, params.id, body),
      }),
    }),
    route({
      method: 'delete',
      path: '/api/people/:id',
      answer: PersonDeletedSchema,
      allow: ADMIN,
      tag: 'people',
      summary:
        'Delete a person: ends their sessions, removes their subscriptions, keeps their audit entries under a pseudonym',
      schemas: { params: idParams },
      handler: async ({ params }, req) => ({ deleted: await service.deletePerson(db, callerOf(req)!, params.id) }),
    }),
    route({
      method: 'post',
      path: '/api/people/:id/invitation',
      allow: ADMIN,
      tag: 'people',
      summary: 'Re-send a pending or lapsed invitation, valid for the invitationDays setting from now (audited)',
      answer: InviteAnswerSchema,
      schemas: { params: idParams },
      handler: ({ params }, req) => service.resendInvitation(ctx, callerOf(req)!, params.id),
    }),
    route({
      method: 'post',
      path: '/api/people/:id/identity-reset',
      allow: ADMIN,
      tag: 'people',
      summary:
        'Forget the Google identity a person is pinned to; their next sign-in pins a new one (audited, ends their sessions)',
      answer: PersonAnswerSchema,
      schemas: { params: idParams },
      handler: async ({ params }, req) => ({ person: await service.resetIdentity(db, callerOf(req)!, params.id) }),
    }),
  ];
}
