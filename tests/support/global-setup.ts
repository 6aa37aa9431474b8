import { execFileSync } from 'node:child_process';
import path from 'node:path';

/**
 * Starts the test cluster and builds the template database in a child process (Knex loads
 * the TypeScript migrations through tsx there, outside jest's module system).
 */
export default function globalSetup(): void {
  const root = path.resolve(__dirname, '..', '..');
  execFileSync(process.execPath, ['--import', 'tsx', path.join(root, 'scripts', 'test-template.ts')], {
    cwd: root,
    stdio: 'inherit',
  });
}
