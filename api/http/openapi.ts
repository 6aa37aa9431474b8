/**
 * The OpenAPI 3.1 document, generated from the route table: parameters and request bodies
 * from the routers' zod schemas, answers from the contracts (contracts/) through zod 4's
 * JSON Schema output. A named contract becomes a component, so a generated client gets one
 * type per answer.
 */
import { z } from 'zod';
import * as alerts from '../../contracts/alerts';
import * as briefs from '../../contracts/briefs';
import * as common from '../../contracts/common';
import * as districts from '../../contracts/districts';
import * as estimates from '../../contracts/estimates';
import * as people from '../../contracts/people';
import * as runs from '../../contracts/runs';
import * as settings from '../../contracts/settings';
import * as uploads from '../../contracts/uploads';
import type { Schema } from '../../contracts/kit';
import { toZod } from './contract-zod';
import type { Answer, RouteSpec } from './routes';

type JsonSchema = Record<string, unknown>;

function jsonSchema(schema: z.ZodType, io: 'input' | 'output' = 'input'): JsonSchema {
  const { $schema: _dialect, ...js } = z.toJSONSchema(schema, { io, unrepresentable: 'any' }) as JsonSchema;
  return js;
}

/** Every exported `...Schema` of the contracts, by the name it gets in components.schemas. */
function contractNames(): Map<Schema, string> {
  const names = new Map<Schema, string>();
  for (const mod of [common, districts, estimates, alerts, runs, uploads, people, settings, briefs]) {
    for (const [key, value] of Object.entries(mod)) {
      if (
        key.endsWith('Schema') &&
        typeof value === 'object' &&
        value !== null &&
        'node' in value &&
        !names.has(value as Schema)
      ) {
        names.set(value as Schema, key.slice(0, -'Schema'.length));
      }
    }
  }
  return names;
}

function isSchema(answer: Answer): answer is Schema {
  return 'node' in answer;
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

/** The success responses of one route. */
function successes(spec: RouteSpec, ref: (schema: Schema) => JsonSchema): Record<string, unknown> {
  if (spec.produces) {
    const binary = !spec.produces.startsWith('text/');
    const schema = binary ? { type: 'string', contentMediaType: spec.produces } : { type: 'string' };
    return { '200': { description: `A ${spec.produces} document`, content: { [spec.produces]: { schema } } } };
  }
  const answer = spec.answer;
  if (!answer) return { '200': { description: 'Success (answer not described)' } };
  if (!isSchema(answer)) {
    return 'noContent' in answer
      ? { '204': { description: 'Done; no content' } }
      : { '302': { description: 'Redirect to the next step of signing in' } };
  }
  const out: Record<string, unknown> = {};
  for (const status of spec.statuses ?? [200]) {
    out[String(status)] = {
      description:
        status === 202 ? 'Accepted' : status === 201 ? 'Created' : status >= 500 ? 'Fault reported' : 'Success',
      content: { 'application/json': { schema: ref(answer) } },
    };
  }
  return out;
}

export function openApiDocument(specs: RouteSpec[], version: string) {
  const names = contractNames();
  const components: Record<string, JsonSchema> = {};
  const ref = (schema: Schema): JsonSchema => {
    const name = names.get(schema);
    if (!name) return jsonSchema(toZod(schema), 'output');
    components[name] ??= jsonSchema(toZod(schema), 'output');
    return { $ref: `#/components/schemas/${name}` };
  };
  const paths: Record<string, Record<string, unknown>> = {};
  for (const spec of specs) {
    const p = spec.path.replace(/:([A-Za-z0-9_]+)/g, '{$1}');
    const op: Record<string, unknown> = {
      summary: spec.summary,
      tags: [spec.tag],
      'x-allow': spec.allow === 'public' ? 'public' : [...spec.allow],
      ...(spec.rateLimit
        ? {
            'x-rate-limit': {
              perMinute: spec.rateLimit.perMinute,
              inFlight: spec.rateLimit.inFlight,
              bucket: spec.rateLimit.bucket,
            },
          }
        : {}),
      security: spec.allow === 'public' ? [] : [{ session: [] }],
      parameters: [...parameters(spec.schemas?.params, 'path'), ...parameters(spec.schemas?.query, 'query')],
      responses: {
        ...successes(spec, ref),
        '4XX': {
          description: 'Error',
          content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } },
        },
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
      schemas: { Error: jsonSchema(toZod(common.ApiErrorBodySchema), 'output'), ...components },
    },
    paths,
  };
}
