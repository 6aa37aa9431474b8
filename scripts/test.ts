/**
 * npm test: its own PostgreSQL (own data dir and port), the web build, typecheck, lint, then
 * every jest project (app components, engine and reference checks, API against the real
 * database, browser tests in Debian's Chromium), and a one-line summary.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { TEST_CLUSTER } from '../tests/support/test-cluster';
import * as pg from './pg';
import { buildWebIfStale } from './web-build';

const root = path.resolve(__dirname, '..');
const artifacts = path.join(root, 'tests', 'artifacts');
const isRoot = process.getuid?.() === 0;
const bin = (name: string) => path.join(root, 'node_modules', '.bin', name);

function step(title: string): number {
  process.stdout.write(`\n=== ${title}\n`);
  return Date.now();
}

function ensureDebianPackage(binary: string, pkg: string): void {
  if (fs.existsSync(binary)) return;
  if (!isRoot) throw new Error(`${binary} is missing: run \`sudo apt-get install -y ${pkg}\` and try again.`);
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', pkg], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

function main(): number {
  const t0 = Date.now();
  fs.mkdirSync(artifacts, { recursive: true });

  let t = step('prerequisites: Debian chromium and poppler-utils, test PostgreSQL with PostGIS');
  ensureDebianPackage('/usr/bin/chromium', 'chromium');
  ensureDebianPackage('/usr/bin/pdftotext', 'poppler-utils');
  pg.start(TEST_CLUSTER);
  console.log(`ready in ${Date.now() - t} ms`);

  t = step('web build (expo export -p web, skipped when unchanged)');
  buildWebIfStale();
  console.log(`done in ${((Date.now() - t) / 1000).toFixed(1)} s`);

  t = step('typecheck (app and API)');
  for (const project of ['tsconfig.json', 'api/tsconfig.json']) {
    const r = spawnSync(bin('tsc'), ['-p', project, '--noEmit'], { cwd: root, stdio: 'inherit' });
    if (r.status !== 0) {
      console.error(`typecheck failed for ${project}`);
      return 1;
    }
  }
  console.log(`done in ${((Date.now() - t) / 1000).toFixed(1)} s`);

  t = step('lint (ESLint with the project rules: SQL only in stores, features through services; Prettier check)');
  const lint = spawnSync('npm', ['run', '--silent', 'lint'], { cwd: root, stdio: 'inherit' });
  if (lint.status !== 0) {
    console.error('lint failed: run `npm run lint` to see why (and `npm run format` for formatting)');
    pg.stop(TEST_CLUSTER);
    return 1;
  }
  console.log(`done in ${((Date.now() - t) / 1000).toFixed(1)} s`);

  t = step('jest: app, engine + reference checks, API, browser');
  const report = path.join(artifacts, 'jest-report.json');
  const jestArgs = ['--ci', '--maxWorkers=2', '--json', `--outputFile=${report}`, ...process.argv.slice(2)];
  const r = spawnSync(bin('jest'), jestArgs, {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, FORCE_COLOR: '0' },
  });
  let summary = '';
  if (fs.existsSync(report)) {
    const j = JSON.parse(fs.readFileSync(report, 'utf8'));
    summary = `${j.numPassedTests} passed, ${j.numFailedTests} failed`;
  }
  pg.stop(TEST_CLUSTER);
  console.log(
    `\njest finished in ${((Date.now() - t) / 1000).toFixed(1)} s; whole run ${((Date.now() - t0) / 1000).toFixed(1)} s`,
  );
  if (summary) console.log(`\n${summary}`);
  return r.status ?? 1;
}

try {
  process.exitCode = main();
} catch (err) {
  console.error(`npm test could not run: ${(err as Error).message}`);
  process.exitCode = 1;
}
