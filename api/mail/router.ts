import { z } from 'zod';
import type { AppContext } from '../context';
import { NotFoundError } from '../http/errors';
import { ADMIN, route, type RouteSpec } from '../http/routes';
import { listCaughtMail } from './store';
import { MailboxResponseSchema } from '../../contracts/people';

export function mailboxRoutes({ db, config }: AppContext): RouteSpec[] {
  const available = () => {
    if (config.mode === 'production' || config.smtpUrl)
      throw new NotFoundError('The mail catcher runs only in demo and test mode.');
  };
  return [
    route({
      method: 'get',
      path: '/api/mailbox',
      answer: MailboxResponseSchema,
      allow: ADMIN,
      tag: 'mail',
      summary: 'Demo mode: the messages the local mail catcher received, newest first',
      schemas: {
        query: z.object({
          to: z.string().max(254).optional(),
          limit: z.coerce.number().int().min(1).max(200).default(50),
        }),
      },
      handler: async ({ query }) => {
        available();
        return { messages: await listCaughtMail(db, query) };
      },
    }),
  ];
}
