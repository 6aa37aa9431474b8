import SwaggerParser from '@apidevtools/swagger-parser';
import request from 'supertest';
import { freshDatabase, type TestDatabase } from '../support/test-db';
import { testApp } from '../support/test-app';

let t: TestDatabase;
beforeAll(async () => {
  t = await freshDatabase();
});
afterAll(async () => t.drop());

type Operation = { responses: Record<string, { content?: Record<string, { schema?: unknown }> }> };

async function openApi(): Promise<{
  paths: Record<string, Record<string, Operation>>;
  components: { schemas: Record<string, unknown> };
}> {
  const res = await request(testApp(t.db)).get('/api/openapi.json');
  expect(res.status).toBe(200);
  return res.body;
}

describe('GET /api/openapi.json', () => {
  it('is a valid OpenAPI 3.1 document (swagger-parser validates it and resolves every $ref)', async () => {
    const doc = await openApi();
    // validate() throws on a schema or reference error; it mutates its argument, so give it a copy.
    await expect(SwaggerParser.validate(structuredClone(doc) as never)).resolves.toBeDefined();
  });

  it('describes a success answer for every operation: a JSON schema, a media type, no content or a redirect', async () => {
    const doc = await openApi();
    const missing: string[] = [];
    let operations = 0;
    let jsonAnswers = 0;
    for (const [path, methods] of Object.entries(doc.paths)) {
      for (const [method, op] of Object.entries(methods)) {
        operations++;
        const ok = Object.entries(op.responses).filter(([status]) => /^2\d\d$/.test(status));
        const described = ok.some(([status, r]) => {
          if (status === '204') return true;
          const media = Object.entries(r.content ?? {});
          if (media.some(([type, m]) => type === 'application/json' && m.schema !== undefined)) {
            jsonAnswers++;
            return true;
          }
          return media.some(([type, m]) => type !== 'application/json' && m.schema !== undefined);
        });
        // Signing in with Google answers with redirects only (to Google, then back into the app).
        const redirect =
          ok.length === 0 &&
          Object.keys(op.responses).some((s) => /^3\d\d$/.test(s)) &&
          path.startsWith('/api/auth/google');
        if (!described && !redirect) missing.push(`${method.toUpperCase()} ${path}`);
      }
    }
    expect(missing).toEqual([]);
    // The route table had 58 operations when answers were first described; more may come, not fewer.
    expect(operations).toBeGreaterThanOrEqual(58);
    expect(jsonAnswers).toBeGreaterThanOrEqual(40);
  });

  it('takes answers from the contracts as named components', async () => {
    const doc = await openApi();
    const estimate =
      doc.paths['/api/districts/{code}/estimate'].get.responses['200'].content!['application/json'].schema;
    expect(estimate).toEqual({ $ref: '#/components/schemas/DistrictEstimateResponse' });
    const component = doc.components.schemas.DistrictEstimateResponse as {
      required: string[];
      properties: Record<string, unknown>;
    };
    expect(component.required).toEqual(expect.arrayContaining(['district', 'run', 'main', 'variants', 'note']));
    const pdf = doc.paths['/api/briefs/region.pdf'].get.responses['200'].content!;
    expect(Object.keys(pdf)).toEqual(['application/pdf']);
  });
});
