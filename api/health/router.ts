import type { AppContext } from '../context';
import { route, type RouteSpec } from '../http/routes';
import { databaseIsUp } from './service';
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
      summary: 'The server answers and says whether the database does (asked at most once a second)',
      handler: async (_input, _req, res) => {
        const database = (await databaseIsUp(db)) ? 'up' : 'down';
        res.status(database === 'up' ? 200 : 503).json({ status: database === 'up' ? 'ok' : 'degraded', database });
      },
    }),
  ];
}
