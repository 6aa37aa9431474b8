/**
 * Upload progress: a large generated upload sent with ?progress=<key> is polled while it
 * runs; the phases come in the pipeline's order (read and check rows, check against stored
 * data, merge) with their counts, and a refused upload says where it stopped. Invented
 * values; every expected number is counted from the file written here (plumbing checks).
 */
import { randomBytes } from 'node:crypto';
import type TestAgent from 'supertest/lib/agent';
import { UPLOAD_PHASES, UploadProgressSchema, type UploadProgress } from '../../contracts/uploads';
import { DEMO, signInAs } from '../support/auth';
import { parseAnswer } from '../support/contract';
import { uploadWorld, type UploadWorld } from './upload-helpers';

jest.setTimeout(180_000);

let w: UploadWorld;
beforeAll(async () => {
  w = await uploadWorld();
});
afterAll(async () => w.close());

const INDICATORS = ['emissions_pc', 'income_pc', 'population', 'pop_density'];
const DISTRICTS = 600;
const YEARS = 50;
const ROWS = DISTRICTS * INDICATORS.length * YEARS;

function bigCsv(): Buffer {
  const lines = ['district_code,district_name,indicator,year,value'];
  for (let d = 1; d <= DISTRICTS; d++)
    for (let k = 0; k < INDICATORS.length; k++)
      for (let y = 1976; y < 1976 + YEARS; y++)
        lines.push(
          `P${String(d).padStart(4, '0')},Progress district ${d},${INDICATORS[k]},${y},${1000 * (k + 1) + d + (y - 1975) / 8}`,
        );
  return Buffer.from(lines.join('\n') + '\n', 'utf8');
}

const newKey = () => randomBytes(16).toString('hex');

function send(agent: TestAgent, body: Buffer, name: string, query: Record<string, string | boolean>) {
  return agent.post('/api/uploads').query(query).attach('file', body, { filename: name, contentType: 'text/csv' });
}

/** Polls the key every 20 ms until the upload answers; returns every answer read while it ran. */
async function pollWhile(agent: TestAgent, key: string, running: Promise<unknown>): Promise<UploadProgress[]> {
  const seen: UploadProgress[] = [];
  let finished = false;
  void running.finally(() => (finished = true));
  while (!finished) {
    const res = await agent.get(`/api/uploads/progress/${key}`);
    if (res.status === 200) seen.push(parseAnswer(UploadProgressSchema, res));
    else expect(res.status).toBe(404); // not started yet
    await new Promise((r) => setTimeout(r, 20));
  }
  return seen;
}

const phaseIndex = (p: string) => (UPLOAD_PHASES as readonly string[]).indexOf(p);

describe('progress of a large upload', () => {
  it('shows reading, checking and merging in order with their counts, then done', async () => {
    const csv = bigCsv();
    const key = newKey();
    // Nothing is known under a key before its upload starts.
    expect((await w.analyst.get(`/api/uploads/progress/${key}`)).status).toBe(404);

    // A supertest request is only thenable: then() sends it and gives a real promise.
    const running = send(w.analyst, csv, 'progress.csv', { commit: true, allowNewDistricts: true, progress: key }).then(
      (r) => r,
    );
    const seen = await pollWhile(w.analyst, key, running);
    const res = await running;
    expect(res.status).toBe(201);

    // Seen while running: phases never go back, and the rows read never shrink.
    expect(seen.some((s) => s.state === 'running')).toBe(true);
    for (let i = 1; i < seen.length; i++) {
      expect(phaseIndex(seen[i].phase)).toBeGreaterThanOrEqual(phaseIndex(seen[i - 1].phase));
      expect(seen[i].counts.rowsRead).toBeGreaterThanOrEqual(seen[i - 1].counts.rowsRead);
    }
    for (const s of seen) expect(s.counts.rowsRead).toBeLessThanOrEqual(ROWS);

    const last = parseAnswer(UploadProgressSchema, await w.analyst.get(`/api/uploads/progress/${key}`));
    expect(last.state).toBe('done');
    expect(last.commit).toBe(true);
    expect(last.stoppedAt).toBeNull();
    expect(last.phases.map((p) => p.phase)).toEqual(['reading', 'checking', 'merging']);
    const at = last.phases.map((p) => p.atMs);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    // Counted from the file written above: one value a data row, every one new.
    expect(last.counts).toEqual({
      bytesRead: csv.length,
      bytesTotal: csv.length,
      rowsRead: ROWS,
      values: ROWS,
      insert: ROWS,
      change: 0,
      unchanged: 0,
      derived: res.body.preview.derived.reduce((a: number, d: { insert: number }) => a + d.insert, 0),
    });
    expect(res.body.upload.counts.insert).toBe(ROWS);
  });

  it('is read only by the person who sent the upload, and only by staff', async () => {
    const key = newKey();
    const csv = Buffer.from('district_code,indicator,year,value\nD01,emissions_pc,1999,7.5\n');
    expect((await send(w.analyst, csv, 'one.csv', { progress: key })).status).toBe(200);
    expect((await w.analyst.get(`/api/uploads/progress/${key}`)).body.state).toBe('done');
    const admin = (await signInAs(w.server, DEMO.admin)).agent;
    expect((await admin.get(`/api/uploads/progress/${key}`)).status).toBe(404);
    expect((await w.official.get(`/api/uploads/progress/${key}`)).status).toBe(403);
    expect((await w.analyst.get('/api/uploads/progress/short')).status).toBe(400);
  });
});

describe('where a refused upload stopped', () => {
  it('names the reading phase and the line when the file cannot be read on', async () => {
    const key = newKey();
    // Line 4 opens a quote that never closes: reading stops there (RFC 4180, section 2, rule 5: a quoted field ends with a quote).
    const csv = Buffer.from(
      'district_code,indicator,year,value\nD01,emissions_pc,1999,7.5\nD01,emissions_pc,2000,7.6\nD01,"emissions_pc,2001,7.7\n',
    );
    const res = await send(w.analyst, csv, 'open-quote.csv', { progress: key });
    expect(res.status).toBe(422);
    expect(res.body.error.details.stoppedAt).toEqual({ phase: 'reading', line: 4 });
    const p = parseAnswer(UploadProgressSchema, await w.analyst.get(`/api/uploads/progress/${key}`));
    expect(p.state).toBe('failed');
    expect(p.stoppedAt).toEqual({ phase: 'reading', line: 4 });
    expect(p.phases.map((x) => x.phase)).toEqual(['reading']);
  });

  it('names the checking phase and the first bad line when rows fail their checks', async () => {
    const key = newKey();
    const csv = Buffer.from(
      'district_code,indicator,year,value\nD01,emissions_pc,1999,7.5\nD01,emissions_pc,2000,seven\nD01,emissions_pc,2001,x\n',
    );
    const res = await send(w.analyst, csv, 'words.csv', { progress: key, commit: true });
    expect(res.status).toBe(422);
    expect(res.body.error.details.stoppedAt).toEqual({ phase: 'checking', line: 3 });
    const p = parseAnswer(UploadProgressSchema, await w.analyst.get(`/api/uploads/progress/${key}`));
    expect(p.state).toBe('failed');
    expect(p.stoppedAt).toEqual({ phase: 'checking', line: 3 });
    expect(p.counts.rowsRead).toBe(3);
  });
});
