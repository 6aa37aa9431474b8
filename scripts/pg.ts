/**
 * A PostgreSQL cluster owned by the project: Debian's server binaries, 127.0.0.1 only,
 * a project port, the socket inside the data directory. Idempotent start (reuses a server
 * that answers, clears a stale postmaster.pid), stop, status. Runs as root by dropping to
 * the postgres user, or as a normal user directly.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export interface ClusterOptions {
  /** Short name: 'demo' or 'test'. */
  name: string;
  port: number;
  /** fsync off for throwaway test clusters. */
  fast?: boolean;
}

export interface Cluster extends ClusterOptions {
  dataDir: string;
  logFile: string;
  binDir: string;
}

const projectRoot = path.resolve(__dirname, '..');
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

function log(msg: string): void {
  process.stderr.write(`[db] ${msg}\n`);
}

/** Highest installed /usr/lib/postgresql/<v>/bin that holds initdb, or null. */
function findBinDir(): string | null {
  const base = '/usr/lib/postgresql';
  if (!fs.existsSync(base)) return null;
  const versions = fs
    .readdirSync(base)
    .filter((v) => fs.existsSync(path.join(base, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], 'bin') : null;
}

export function ensureServerBinaries(): string {
  let bin = findBinDir();
  if (bin) return bin;
  if (!isRoot) {
    throw new Error('PostgreSQL server binaries are missing: run `sudo apt-get install -y postgresql` and try again.');
  }
  log('PostgreSQL server binaries missing; installing Debian package postgresql…');
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', 'postgresql'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  bin = findBinDir();
  if (!bin) throw new Error('apt-get install postgresql finished but no initdb was found under /usr/lib/postgresql.');
  return bin;
}

/** Debian's PostGIS package for the server version in binDir ("postgresql-15-postgis-3"). */
export function postgisPackage(binDir: string): string {
  return `postgresql-${path.basename(path.dirname(binDir))}-postgis-3`;
}

/**
 * PostGIS for the server in binDir: the boundaries migration creates the extension, so
 * its files must be on the server. Installed as root; otherwise a one-line apt-get hint.
 */
export function ensurePostgis(binDir: string): void {
  const version = path.basename(path.dirname(binDir));
  const control = `/usr/share/postgresql/${version}/extension/postgis.control`;
  if (fs.existsSync(control)) return;
  const pkg = postgisPackage(binDir);
  if (!isRoot) throw new Error(`PostGIS is missing: run \`sudo apt-get install -y ${pkg}\` and try again.`);
  log(`PostGIS missing; installing Debian package ${pkg}…`);
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', pkg], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  if (!fs.existsSync(control)) throw new Error(`apt-get install ${pkg} finished but ${control} was not found.`);
}

/** Can the postgres user enter every parent of dir? (Only matters when running as root.) */
function postgresCanReach(dir: string): boolean {
  const r = spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]);
  return r.status === 0;
}

function dataDirFor(name: string): string {
  const local = path.join(projectRoot, '.data', `pg-${name}`);
  if (!isRoot) return local;
  fs.mkdirSync(path.dirname(local), { recursive: true });
  // The socket path lives in the data dir and must stay under 107 bytes.
  if (postgresCanReach(path.dirname(local)) && local.length < 80) return local;
  const key = createHash('sha256').update(projectRoot).digest('hex').slice(0, 12);
  return path.join(os.tmpdir(), `crestwatch-${key}`, `pg-${name}`);
}

export function cluster(options: ClusterOptions): Cluster {
  const dataDir = dataDirFor(options.name);
  return { ...options, dataDir, logFile: path.join(path.dirname(dataDir), `pg-${options.name}.log`), binDir: '' };
}

/** Run a server binary, as the postgres user when we are root. */
function runPg(c: Cluster, tool: string, args: string[], opts: { allowFail?: boolean } = {}) {
  const exe = path.join(c.binDir, tool);
  const [cmd, argv] = isRoot ? ['runuser', ['-u', 'postgres', '--', exe, ...args]] : [exe, args];
  const r = spawnSync(cmd, argv, { encoding: 'utf8' });
  if (r.status !== 0 && !opts.allowFail) {
    throw new Error(`${tool} failed (${r.status}): ${(r.stderr || r.stdout || '').trim()}`);
  }
  return r;
}

export function isReady(c: Cluster): boolean {
  const bin = c.binDir || findBinDir();
  if (!bin) return false;
  const r = spawnSync(path.join(bin, 'pg_isready'), ['-q', '-h', '127.0.0.1', '-p', String(c.port)]);
  return r.status === 0;
}

/** True when pid names a live (not zombie) postgres process. */
function isLivePostgres(pid: number): boolean {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const comm = stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')'));
    const state = stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3);
    return state !== 'Z' && comm.startsWith('postgres');
  } catch {
    return false;
  }
}

function initCluster(c: Cluster): void {
  fs.mkdirSync(c.dataDir, { recursive: true, mode: 0o700 });
  if (isRoot) {
    execFileSync('chown', ['-R', 'postgres:postgres', path.dirname(c.dataDir)]);
  }
  fs.chmodSync(c.dataDir, 0o700);
  log(`initialising cluster in ${c.dataDir}`);
  runPg(c, 'initdb', ['-D', c.dataDir, '-U', 'postgres', '-A', 'trust', '-E', 'UTF8', '--no-locale']);
  const conf = [
    '',
    '# Crestwatch settings',
    `listen_addresses = '127.0.0.1'`,
    `port = ${c.port}`,
    `unix_socket_directories = '${c.dataDir}'`,
    'max_connections = 200',
    'shared_buffers = 128MB',
    `fsync = ${c.fast ? 'off' : 'on'}`,
    `synchronous_commit = ${c.fast ? 'off' : 'on'}`,
    `full_page_writes = ${c.fast ? 'off' : 'on'}`,
    "timezone = 'UTC'",
    '',
  ].join('\n');
  fs.appendFileSync(path.join(c.dataDir, 'postgresql.conf'), conf);
  if (isRoot) execFileSync('chown', ['postgres:postgres', path.join(c.dataDir, 'postgresql.conf')]);
}

function clearStalePid(c: Cluster): void {
  const pidFile = path.join(c.dataDir, 'postmaster.pid');
  if (!fs.existsSync(pidFile)) return;
  const pid = Number(fs.readFileSync(pidFile, 'utf8').split('\n')[0]);
  if (Number.isFinite(pid) && pid > 0 && isLivePostgres(pid)) return;
  log(`removing stale postmaster.pid (pid ${pid} is not a live postgres process)`);
  fs.rmSync(pidFile, { force: true });
}

function sleep(ms: number): void {
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}

/** Start the cluster if it is not answering already. Returns the cluster (with binDir). */
export function start(options: ClusterOptions): Cluster {
  const c = cluster(options);
  c.binDir = ensureServerBinaries();
  ensurePostgis(c.binDir);
  if (isReady(c)) return c;
  if (!fs.existsSync(path.join(c.dataDir, 'PG_VERSION'))) initCluster(c);
  for (let attempt = 1; attempt <= 3; attempt++) {
    clearStalePid(c);
    const r = runPg(c, 'pg_ctl', ['-D', c.dataDir, '-l', c.logFile, '-w', '-t', '60', 'start'], { allowFail: true });
    if (r.status === 0 && waitReady(c, 30_000)) return c;
    if (isReady(c)) return c;
    // After a kill -9 the old backends can hold shared memory for a moment: wait and retry.
    log(`start attempt ${attempt} failed: ${(r.stderr || r.stdout).trim().split('\n').pop()}`);
    sleep(1500 * attempt);
  }
  let tail = '';
  try {
    tail = fs.readFileSync(c.logFile, 'utf8').trim().split('\n').slice(-5).join('\n');
  } catch {
    /* no log yet */
  }
  throw new Error(`PostgreSQL (${c.name}) did not start on 127.0.0.1:${c.port}. Log tail:\n${tail}`);
}

function waitReady(c: Cluster, ms: number): boolean {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (isReady(c)) return true;
    sleep(100);
  }
  return false;
}

export function stop(options: ClusterOptions): void {
  const c = cluster(options);
  const bin = findBinDir();
  if (!bin || !fs.existsSync(path.join(c.dataDir, 'PG_VERSION'))) {
    log(`no ${c.name} cluster to stop`);
    return;
  }
  c.binDir = bin;
  clearStalePid(c);
  if (!fs.existsSync(path.join(c.dataDir, 'postmaster.pid'))) {
    log(`${c.name} cluster is not running`);
    return;
  }
  runPg(c, 'pg_ctl', ['-D', c.dataDir, '-m', 'fast', '-w', 'stop']);
  log(`${c.name} cluster stopped`);
}

export function status(options: ClusterOptions): { running: boolean; dataDir: string; port: number } {
  const c = cluster(options);
  return { running: isReady(c), dataDir: c.dataDir, port: c.port };
}
