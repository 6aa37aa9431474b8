import { z } from 'zod';
import type { AppContext } from '../context';
import { NotFoundError } from '../http/errors';
import { ADMIN, route, type RouteSpec } from '../http/routes';
import { MailboxResponseSchema } from '../../contracts/people';

export function mailboxRoutes({ db, config }: AppContext): RouteSpec[] {
  const available = () => {
    if (config.mode === 'production' || config.smtpUrl) throw new NotFoundError('The mail catcher runs only in demo and test mode.');
  };
  return [
    route({
      method: 'get',
      path: '/api/mailbox',
      answer: MailboxResponseSchema,
      allow: ADMIN,
      tag: 'mail',
      summary: 'Demo mode: the messages the local mail catcher received, newest first',
      schemas: { query: z.object({ to: z.string().max(254).optional(), limit: z.coerce.number().int().min(1).max(200).default(50) }) },
      handler: async ({ query }) => {
        available();
        const q = db('caught_mail').orderBy('id', 'desc').limit(query.limit);
        if (query.to) q.whereRaw('? = ANY(envelope_to)', [query.to.toLowerCase()]);
        const rows = await q.select('*');
        return {
          messages: rows.map((r: Record<string, unknown>) => ({
            id: Number(r.id),
            receivedAt: new Date(r.received_at as string).toISOString(),
            from: r.envelope_from,
            to: r.envelope_to,
            subject: r.subject,
            text: r.text_body,
            attachments: r.attachments,
          })),
        };
      },
    }),
  ];
}
