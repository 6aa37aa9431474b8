import type { AppContext } from '../context';
import { route, type RouteSpec } from '../http/routes';
import { databaseAnswers } from './store';
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
        const database = (await databaseAnswers(db)) ? 'up' : 'down';
        res.status(database === 'up' ? 200 : 503).json({ status: database === 'up' ? 'ok' : 'degraded', database });
      },
    }),
  ];
}
