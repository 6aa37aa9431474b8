/**
 * Benchmark of hostile uploads (not part of the test run): `npm run bench:hostile`.
 *
 * The server runs as its own process (`api/server.ts`, test mode) on a PostgreSQL cluster
 * of the bench's own (127.0.0.1:54389, fsync off), so its resident memory is measured
 * alone: /proc/<pid>/status VmRSS before the upload and VmHWM (the kernel's high-water
 * mark of resident memory over the process's life) after it. Each worst case is a file
 * of up to 50 MB (the upload limit), written to a temp dir in pieces, sent as a dry run
 * with new districts allowed, signed in as the demo analyst:
 *   - 4 million distinct new district codes (stopped by UPLOAD_MAX_NEW_DISTRICTS);
 *   - exactly 50,000 new districts (the cap), each with a 200-character name, filling 50 MB;
 *   - a distinct unknown indicator on every row;
 *   - an invalid number in every cell (problems beyond the listed 1,000 are counted);
 *   - lines of 1 MB of digits and `x` (the time to refuse the first is printed alone too).
 * Each case gets a fresh server process. Prints, per case, the answer, its time and the
 * server's peak RSS (goal < 300 MB), with the load average. Options: --only <case index>,
 * --keep-cluster.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createDb } from '../api/db';
import { seedDemoIfEmpty } from '../api/demo/seed';
import { CSRF_HEADER } from '../api/http/routes';
import { ensureDemoAccounts } from '../api/people/service';
import { dropDatabase, ensureDatabase, migrate } from '../scripts/database';
import * as pg from '../scripts/pg';
import { DEMO, startSignIn } from '../tests/support/auth';

const CLUSTER: pg.ClusterOptions = { name: 'bench-hostile', port: 54389, fast: true };
const STAND_IN_PORT = 54399;
const SERVER_PORT = 54398;
const DB = 'crestwatch_bench_hostile';
const LIMIT = 50 * 1024 * 1024;
const ONLY = process.argv.includes('--only') ? Number(process.argv[process.argv.indexOf('--only') + 1]) : null;
const url = `postgres://postgres@127.0.0.1:${CLUSTER.port}/${DB}`;

/** Writes lines from `next` (null = done) in 1 MB pieces until the file would pass `max` bytes. */
function writeFile(file: string, header: string, next: (i: number) => string | null, max = LIMIT): number {
  const fd = fs.openSync(file, 'w');
  let chunk = header;
  let bytes = 0;
  for (let i = 0; ; i++) {
    const line = next(i);
    if (line === null || bytes + chunk.length + line.length > max) break;
    chunk += line;
    if (chunk.length > 1 << 20) {
      bytes += fs.writeSync(fd, chunk);
      chunk = '';
    }
  }
  bytes += fs.writeSync(fd, chunk);
  fs.closeSync(fd);
  return bytes;
}

interface Case {
  name: string;
  write(file: string): number;
  decimalComma?: boolean;
}

const name200 = (i: number) => `District ${i} `.padEnd(200, 'x');
const CASES: Case[] = [
  {
    name: '4 million distinct new codes',
    write: (f) =>
      writeFile(f, 'district_code,year,population\n', (i) => (i < 4_000_000 ? `${i.toString(36)},2020,1\n` : null)),
  },
  {
    name: '50,000 new districts (the cap), 200-character names',
    write: (f) =>
      writeFile(f, 'district_code,district_name,indicator,year,value\n', (i) => {
        const d = i % 50_000;
        const year = 2024 - Math.floor(i / 50_000);
        return year >= 1900 ? `N${d},${name200(d)},population,${year},${1000 + (i % 997)}\n` : null;
      }),
  },
  {
    name: 'a distinct unknown indicator on every row',
    write: (f) => writeFile(f, 'district_code,indicator,year,value\n', (i) => `D01,unknown_${i},2020,1\n`),
  },
  {
    name: 'an invalid number in every cell',
    write: (f) =>
      writeFile(
        f,
        'district_code,year,population,income_pc,emissions_pc\n',
        (i) => `D${String((i % 24) + 1).padStart(2, '0')},${1900 + (i % 120)},1.2.3,4e,${'9'.repeat(60)}x\n`,
      ),
  },
  {
    name: '1 MB lines of digits and x',
    write: (f) =>
      writeFile(f, 'district_code,indicator,year,value\n', () => `D01,population,2020,${'7'.repeat(1 << 20)}x\n`),
  },
];

function statusKb(pid: number, key: 'VmRSS' | 'VmHWM'): number {
  const m = new RegExp(`^${key}:\\s+(\\d+) kB`, 'm').exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
  return m ? Number(m[1]) : NaN;
}
const mb = (kb: number) => kb / 1024;

async function waitFor(check: () => Promise<boolean>, what: string, child: ChildProcess): Promise<void> {
  for (let i = 0; i < 600; i++) {
    if (await check()) return;
    if (child.exitCode !== null) throw new Error(`${what} exited with code ${child.exitCode}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`${what} did not answer within 60 s`);
}

async function buildDatabase(): Promise<void> {
  await dropDatabase(CLUSTER.port, DB);
  await ensureDatabase(CLUSTER.port, DB);
  await migrate(url);
  const db = createDb(url, { pool: { min: 0, max: 2 } });
  try {
    await seedDemoIfEmpty(db);
    await ensureDemoAccounts(db);
  } finally {
    await db.destroy();
  }
}

async function main(): Promise<void> {
  const wasRunning = pg.isReady(pg.cluster(CLUSTER));
  pg.start(CLUSTER);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'crestwatch-hostile-'));
  const root = path.join(__dirname, '..');
  const children: ChildProcess[] = [];
  try {
    await buildDatabase();
    const standIn = spawn(
      process.execPath,
      ['--import', 'tsx', path.join(root, 'scripts', 'stand-in.ts'), String(STAND_IN_PORT)],
      { stdio: ['ignore', 'ignore', 'inherit'] },
    );
    children.push(standIn);
    await waitFor(
      () =>
        fetch(`http://127.0.0.1:${STAND_IN_PORT}/.well-known/openid-configuration`).then(
          (r) => r.ok,
          () => false,
        ),
      'the OAuth stand-in',
      standIn,
    );
    const base = `http://127.0.0.1:${SERVER_PORT}`;
    const lines: string[] = [];
    let refuseMs: number | null = null;
    let worst = 0;
    for (const [k, c] of CASES.entries()) {
      if (ONLY !== null && k !== ONLY) continue;
      const file = path.join(dir, 'case.csv');
      const bytes = c.write(file);
      // A fresh server per case, so each high-water mark is that case's alone.
      const server = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'api', 'server.ts')], {
        cwd: root,
        stdio: ['ignore', 'ignore', 'inherit'],
        env: {
          ...process.env,
          CRESTWATCH_MODE: 'test',
          DATABASE_URL: url,
          PORT: String(SERVER_PORT),
          OAUTH_STAND_IN_PORT: String(STAND_IN_PORT),
          LOG_REQUESTS: '0',
        },
      });
      try {
        await waitFor(
          () =>
            fetch(`${base}/api/health`).then(
              (r) => r.ok,
              () => false,
            ),
          'the server',
          server,
        );
        const pid = server.pid!;
        const agent = request.agent(base);
        await agent.get(await startSignIn(agent, DEMO.analyst));
        const me = await agent.get('/api/me');
        if (me.status !== 200) throw new Error(`sign-in failed: /api/me answered ${me.status}`);
        agent.set(CSRF_HEADER, me.body.csrfToken);
        const idle = mb(statusKb(pid, 'VmRSS'));
        const t0 = performance.now();
        const res = await agent.post('/api/uploads').query({ allowNewDistricts: true }).attach('file', file);
        const ms = performance.now() - t0;
        const hwm = mb(statusKb(pid, 'VmHWM'));
        worst = Math.max(worst, hwm);
        const first = res.body?.error?.details?.problems?.[0];
        const answer =
          res.status === 200
            ? `200, ${res.body.preview.values.toLocaleString('en')} values, ${res.body.preview.newDistricts.length.toLocaleString('en')} new districts`
            : `${res.status} ${first ? `${first.code} at line ${first.line}, column ${first.column}` : res.body?.error?.code}`;
        lines.push(
          `  ${c.name.padEnd(54)} ${(bytes / 1024 / 1024).toFixed(1).padStart(5)} MB  ${(ms / 1000).toFixed(2).padStart(6)} s  server RSS ${idle.toFixed(0)} MB idle, peak ${hwm.toFixed(0).padStart(4)} MB  ${answer}`,
        );
        console.log(lines[lines.length - 1]);
        if (res.status >= 500) throw new Error(`${c.name}: answered ${res.status}`);
        if (c.name.startsWith('1 MB lines')) {
          // The same refusal for a file of just the header and one such line.
          const one = path.join(dir, 'one-line.csv');
          fs.writeFileSync(one, `district_code,indicator,year,value\nD01,population,2020,${'7'.repeat(1 << 20)}x\n`);
          const t1 = performance.now();
          const r = await agent.post('/api/uploads').attach('file', one);
          refuseMs = performance.now() - t1;
          if (r.status !== 422) throw new Error(`the 1 MB line was answered ${r.status}`);
        }
      } finally {
        server.kill('SIGTERM');
        await new Promise((r) => server.once('exit', r));
      }
    }
    console.log(`
hostile ingest bench: ${os.cpus().length} cores, load ${os
      .loadavg()
      .map((l) => l.toFixed(2))
      .join(' ')}
${lines.join('\n')}
  worst server peak RSS (VmHWM)   ${worst.toFixed(0)} MB   (goal < 300 MB)
  time to refuse one 1 MB line of digits and x (header + that line, dry run, round trip)   ${refuseMs === null ? '—' : `${refuseMs.toFixed(0)} ms`}`);
  } finally {
    for (const c of children) c.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 1000));
    fs.rmSync(dir, { recursive: true, force: true });
    await dropDatabase(CLUSTER.port, DB).catch(() => {});
    if (!wasRunning && !process.argv.includes('--keep-cluster')) pg.stop(CLUSTER);
  }
}

main().catch((err: Error) => {
  console.error(`bench:hostile failed: ${err.stack ?? err.message}`);
  process.exit(1);
});
