/** Every feature's routes in one list: the route table the guard, OpenAPI and tests read. */
import type { AppContext } from './context';
import { districtRoutes } from './districts/router';
import { healthRoutes } from './health/router';
import { openApiDocument } from './http/openapi';
import { route, type RouteSpec } from './http/routes';
import { SOFTWARE_VERSION } from './version';

export function routeTable(ctx: AppContext): RouteSpec[] {
  const routes: RouteSpec[] = [...healthRoutes(ctx), ...districtRoutes(ctx)];
  routes.push(
    route({
      method: 'get',
      path: '/api/openapi.json',
      allow: 'public',
      tag: 'system',
      summary: 'This API described as OpenAPI 3.1 (generated from the route table)',
      handler: () => openApiDocument(routes, SOFTWARE_VERSION),
    }),
  );
  return routes;
}
