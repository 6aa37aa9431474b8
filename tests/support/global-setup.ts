import { execFileSync, spawn } from 'node:child_process';
import path from 'node:path';
import { TEST_STAND_IN_PORT } from '../../api/config';

const root = path.resolve(__dirname, '..', '..');

async function standInAnswers(): Promise<boolean> {
  try {
    const r = await fetch(`http://127.0.0.1:${TEST_STAND_IN_PORT}/.well-known/openid-configuration`);
    return r.ok;
  } catch {
    return false;
  }
}

/**
 * Starts the test cluster and builds the template database in a child process (Knex loads
 * the TypeScript migrations through tsx there, outside jest's module system), then the
 * OAuth stand-in (an ESM package) as a child process shared by every test file.
 */
export default async function globalSetup(): Promise<void> {
  execFileSync(process.execPath, ['--import', 'tsx', path.join(root, 'scripts', 'test-template.ts')], {
    cwd: root,
    stdio: 'inherit',
  });
  if (await standInAnswers()) return;
  const child = spawn(
    process.execPath,
    ['--import', 'tsx', path.join(root, 'scripts', 'stand-in.ts'), String(TEST_STAND_IN_PORT)],
    {
      cwd: root,
      stdio: ['ignore', 'ignore', 'inherit'],
      detached: false,
    },
  );
  (globalThis as { __standIn?: typeof child }).__standIn = child;
  for (let i = 0; i < 100; i++) {
    if (await standInAnswers()) return;
    if (child.exitCode !== null) throw new Error(`the OAuth stand-in exited with code ${child.exitCode}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('the OAuth stand-in did not answer within 10 s');
}
