/** The scheduled-run watch as the app reads it: staff only. */
import type { AppContext } from '../context';
import { route, STAFF, type RouteSpec } from '../http/routes';
import * as service from './service';
import { RunNoticesResponseSchema } from '../../contracts/run-watch';

export function runWatchRoutes({ db }: AppContext): RouteSpec[] {
  return [
    // Listed before the runs' own routes, so /api/runs/:id never reads "notices" as an id.
    route({
      method: 'get',
      path: '/api/runs/notices',
      answer: RunNoticesResponseSchema,
      allow: STAFF,
      tag: 'runs',
      summary:
        'Scheduled runs that need a person: failed, not started within an hour of their time, or in review longer than the reviewWaitDays setting',
      handler: () => service.runNotices(db),
    }),
  ];
}
