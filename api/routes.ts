/** Every feature's routes in one list: the route table the guard, OpenAPI and tests read. */
import { alertRoutes } from './alerts/router';
import { auditRoutes } from './audit/router';
import { boundaryRoutes } from './boundaries/router';
import { briefRoutes } from './briefs/router';
import { authRoutes } from './auth/router';
import type { createPassport } from './auth/passport';
import type { AppContext } from './context';
import { districtRoutes } from './districts/router';
import { curveRoutes } from './what-if/router';
import { estimateRoutes } from './estimates/router';
import { healthRoutes } from './health/router';
import { indicatorRoutes } from './indicators/router';
import { observationRoutes } from './observations/router';
import { uploadRoutes } from './uploads/router';
import { openApiDocument } from './http/openapi';
import { route, type RouteSpec } from './http/routes';
import { mailboxRoutes } from './mail/router';
import { peopleRoutes } from './people/router';
import { runRoutes } from './runs/router';
import { settingsRoutes } from './settings/router';
import { specRoutes } from './specs/router';
import { subscriptionRoutes } from './subscriptions/router';
import { trackRoutes } from './tracks/router';
import { SOFTWARE_VERSION } from './version';
import { OpenApiDocumentSchema } from '../contracts/common';

export function routeTable(ctx: AppContext, passport: ReturnType<typeof createPassport>): RouteSpec[] {
  const routes: RouteSpec[] = [
    ...healthRoutes(ctx),
    ...authRoutes(ctx, passport),
    ...peopleRoutes(ctx),
    ...auditRoutes(ctx),
    ...mailboxRoutes(ctx),
    ...districtRoutes(ctx),
    ...indicatorRoutes(ctx),
    ...observationRoutes(ctx),
    ...uploadRoutes(ctx),
    ...boundaryRoutes(ctx),
    ...estimateRoutes(ctx),
    ...curveRoutes(ctx),
    ...settingsRoutes(ctx),
    ...specRoutes(ctx),
    ...trackRoutes(ctx),
    ...runRoutes(ctx),
    ...alertRoutes(ctx),
    ...subscriptionRoutes(ctx),
    ...briefRoutes(ctx),
  ];
  routes.push(
    route({
      method: 'get',
      path: '/api/openapi.json',
      answer: OpenApiDocumentSchema,
      allow: 'public',
      tag: 'system',
      summary: 'This API described as OpenAPI 3.1 (generated from the route table)',
      handler: () => openApiDocument(routes, SOFTWARE_VERSION),
    }),
  );
  return routes;
}
