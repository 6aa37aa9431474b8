/** The OpenAPI 3.1 document, generated from the route table. */
import { z } from 'zod';
import type { RouteSpec } from './routes';

function jsonSchema(schema: z.ZodType): Record<string, unknown> {
  return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;
}

function parameters(schema: z.ZodType | undefined, where: 'path' | 'query') {
  if (!schema) return [];
  const js = jsonSchema(schema) as { properties?: Record<string, unknown>; required?: string[] };
  return Object.entries(js.properties ?? {}).map(([name, s]) => ({
    name,
    in: where,
    required: where === 'path' || (js.required ?? []).includes(name),
    schema: s,
  }));
}

export function openApiDocument(specs: RouteSpec[], version: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const spec of specs) {
    const p = spec.path.replace(/:([A-Za-z0-9_]+)/g, '{$1}');
    const op: Record<string, unknown> = {
      summary: spec.summary,
      tags: [spec.tag],
      'x-allow': spec.allow === 'public' ? 'public' : [...spec.allow],
      ...(spec.rateLimit ? { 'x-rate-limit': { perMinute: spec.rateLimit.perMinute, inFlight: spec.rateLimit.inFlight, bucket: spec.rateLimit.bucket } } : {}),
      security: spec.allow === 'public' ? [] : [{ session: [] }],
      parameters: [...parameters(spec.schemas?.params, 'path'), ...parameters(spec.schemas?.query, 'query')],
      responses: {
        '200': { description: 'Success', content: { [spec.produces ?? 'application/json']: {} } },
        '4XX': { description: 'Error', content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } },
      },
    };
    if (spec.schemas?.body) {
      op.requestBody = { required: true, content: { 'application/json': { schema: jsonSchema(spec.schemas.body) } } };
    }
    (paths[p] ??= {})[spec.method] = op;
  }
  return {
    openapi: '3.1.0',
    info: { title: 'Crestwatch API', version },
    components: {
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'cw.sid' } },
      schemas: {
        Error: {
          type: 'object',
          required: ['error'],
          properties: {
            error: {
              type: 'object',
              required: ['code', 'message'],
              properties: { code: { type: 'string' }, message: { type: 'string' }, details: {} },
            },
          },
        },
      },
    },
    paths,
  };
}
