/**
 * Hostile boundary files: GeoJSON built to exhaust the server — nesting thousands of
 * levels deep, one coordinate array of a million positions, 49 MB in one feature, a file
 * past the size cap, a feature past the vertex cap — is each refused with a reason that
 * names what and where; and while the 49 MB feature is read (in a compute pool thread,
 * api/boundaries/read-file.ts), the health check keeps answering quickly. The files are
 * made here, in memory, never committed.
 */
import { uploadGeoJson } from '../api/boundaries-helpers';
import { uploadWorld, type UploadWorld } from '../api/upload-helpers';

jest.setTimeout(240_000);

let w: UploadWorld;
let reads = 0;
beforeAll(async () => {
  // One pool thread, the smallest pool: the reading still leaves the event loop free.
  w = await uploadWorld({ computePoolSize: 1 });
  // Count the boundary files handed to the pool.
  const pool = w.app.locals.ctx.compute;
  const run = pool.run.bind(pool);
  pool.run = ((task: Parameters<typeof pool.run>[0]) => {
    if (task.kind === 'boundary-read') reads++;
    return run(task);
  }) as typeof pool.run;
});
afterAll(async () => w?.close());

/** One closed ring of n positions on a small circle in the open ocean, as JSON text. */
function ringText(n: number): string {
  const parts: string[] = [];
  for (let i = 0; i < n - 1; i++) {
    const a = (2 * Math.PI * i) / (n - 1);
    parts.push(`[${(-131 + 0.05 * Math.cos(a)).toFixed(7)},${(-45 + 0.05 * Math.sin(a)).toFixed(7)}]`);
  }
  parts.push(parts[0]);
  return `[${parts.join(',')}]`;
}

function collectionText(geometry: string, code = 'D01'): string {
  return `{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"code":"${code}"},"geometry":${geometry}}]}`;
}

type Problem = { problem: string; feature: number | null; code: string | null; severity: string; reason: string };

it('refuses nesting 100,000 levels deep at the level past the limit, naming line and column', async () => {
  const depth = 100_000;
  const text = collectionText(`{"type":"Polygon","coordinates":${'['.repeat(depth)}${']'.repeat(depth)}}`);
  const r = await uploadGeoJson(w.analyst, text);
  expect(r.status).toBe(200);
  expect(r.body.accepted).toBe(false);
  const p = r.body.problems[0] as Problem;
  expect(p.problem).toBe('not_feature_collection');
  // The reader's depth limit is 12 (api/boundaries/json-reader.ts DEFAULT_JSON_LIMITS): the
  // 13th opening bracket is refused; the file is one line.
  expect(p.reason).toMatch(/line 1, column \d+: nesting deeper than 12 levels/);
});

it('refuses one coordinate array of a million positions at its 100,001st item', async () => {
  const text = collectionText(`{"type":"Polygon","coordinates":[${ringText(1_000_000)}]}`);
  expect(text.length).toBeGreaterThan(20_000_000);
  const r = await uploadGeoJson(w.analyst, text);
  expect(r.status).toBe(200);
  const p = r.body.problems[0] as Problem;
  // 100,001 items is the reader's array limit (json-reader.ts): one more than BOUNDARY_MAX_VERTICES' default.
  expect(p.reason).toMatch(/not readable JSON: line 1, column \d+: an array has more than 100,000 items/);
});

it('refuses a feature one vertex past BOUNDARY_MAX_VERTICES and takes one exactly at it', async () => {
  // Two polygons whose rings hold 50,000 and 50,001 positions: 100,001 vertices (the default cap is 100,000, README).
  const over = collectionText(`{"type":"MultiPolygon","coordinates":[[${ringText(50_000)}],[${ringText(50_001)}]]}`);
  const r = await uploadGeoJson(w.analyst, over);
  expect(r.body.accepted).toBe(false);
  expect(r.body.problems.find((p: Problem) => p.severity === 'error')).toMatchObject({
    feature: 0,
    code: 'D01',
    problem: 'too_many_vertices',
  });
  expect(r.body.problems[0].reason).toMatch(
    /feature 0 \(D01\) has more than 100,000 vertices \(BOUNDARY_MAX_VERTICES\)/,
  );

  const at = collectionText(`{"type":"Polygon","coordinates":[${ringText(100_000)}]}`);
  const ok = await uploadGeoJson(w.analyst, at);
  expect(ok.body.problems.filter((p: Problem) => p.severity === 'error')).toEqual([]);
  expect(ok.body.counts).toMatchObject({ features: 1, matched: 1, vertices: 100_000 });
});

it('refuses a file past BOUNDARY_MAX_BYTES with 413 before reading it', async () => {
  // 50 MB (52,428,800 bytes, the default cap, README) plus one: whitespace is valid JSON, so only the size can refuse it.
  const cap = 50 * 1024 * 1024;
  const head = collectionText(`{"type":"Polygon","coordinates":[${ringText(5)}]}`);
  const body = Buffer.alloc(cap + 1, 0x20);
  body.write(head, 0, 'utf8');
  const r = await uploadGeoJson(w.analyst, body);
  expect(r.status).toBe(413);
  expect(r.body.error.code).toBe('payload_too_large');
  expect(r.body.error.message).toBe(
    'The file is larger than the upload limit of 50 MB (set by BOUNDARY_MAX_BYTES); nothing was loaded.',
  );
});

it('reads 49 MB of one feature in a pool thread while the health check keeps answering quickly', async () => {
  // 30 polygons of 60,000 positions in one MultiPolygon: every array is within the reader's
  // limit, the file within the size cap; the feature is refused for its vertices once read.
  const ring = ringText(60_000);
  const polygons = Array.from({ length: 30 }, () => `[${ring}]`).join(',');
  const text = collectionText(`{"type":"MultiPolygon","coordinates":[${polygons}]}`);
  expect(text.length).toBeGreaterThan(45 * 1024 * 1024);
  expect(text.length).toBeLessThan(50 * 1024 * 1024);

  reads = 0;
  const t0 = performance.now();
  let uploadDone = 0;
  const upload = uploadGeoJson(w.analyst, text).then((r) => {
    uploadDone = performance.now() - t0;
    return r;
  });
  const health: { sentAt: number; ms: number; status: number }[] = [];
  while (uploadDone === 0) {
    const sentAt = performance.now() - t0;
    const res = await w.official.get('/api/health');
    health.push({ sentAt, ms: performance.now() - t0 - sentAt, status: res.status });
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  const r = await upload;
  expect(r.status).toBe(200);
  expect(r.body.accepted).toBe(false);
  expect(r.body.problems[0]).toMatchObject({ feature: 0, code: 'D01', problem: 'too_many_vertices' });

  const during = health.filter((h) => h.sentAt + h.ms < uploadDone);
  expect(during.every((h) => h.status === 200)).toBe(true);
  // Answered all along, not in one burst at the end.
  expect(during.length).toBeGreaterThanOrEqual(10);
  // Never stalled behind the reading: each answered within a fifth of the time the upload
  // took (a read holding the event loop would keep one waiting for most of it; the fifth is
  // our margin for a loaded machine, not a published figure).
  const slowest = Math.max(...during.map((h) => h.ms));
  expect(slowest).toBeLessThan(uploadDone / 5);
  // The file was read by the compute pool, not on the event loop.
  expect(reads).toBe(1);
  process.stdout.write(
    `49 MB feature refused after ${uploadDone.toFixed(0)} ms; ${during.length} health checks meanwhile, slowest ${slowest.toFixed(0)} ms\n`,
  );
});
