import type { AppContext } from '../context';
import { route, type RouteSpec } from '../http/routes';
import { HealthResponseSchema } from '../../contracts/districts';

export function healthRoutes({ db }: AppContext): RouteSpec[] {
  return [
    route({
      method: 'get',
      path: '/api/health',
      answer: HealthResponseSchema,
      statuses: [200, 503],
      allow: 'public',
      tag: 'system',
      summary: 'The server answers and says whether the database does',
      handler: async (_input, _req, res) => {
        let database: 'up' | 'down' = 'up';
        try {
          await db.raw('SELECT 1');
        } catch {
          database = 'down';
        }
        res.status(database === 'up' ? 200 : 503).json({ status: database === 'up' ? 'ok' : 'degraded', database });
      },
    }),
  ];
}
