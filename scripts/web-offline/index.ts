/**
 * The offline and install step of the web build, as one call for scripts/web-build.ts:
 * runs ./build.ts on the exported folder (font subsets, manifest and icons, service
 * worker) in a child process, since workbox-build only works asynchronously.
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';

/** Folders and files whose change makes the web build stale (beside the app's own). */
export const OFFLINE_INPUTS = [path.join('scripts', 'web-offline')];

export function addOfflineFiles(distDir: string): void {
  const r = spawnSync(process.execPath, ['--import', 'tsx', path.join(__dirname, 'build.ts'), distDir], {
    cwd: path.resolve(__dirname, '..', '..'),
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  if (r.status !== 0) throw new Error(`the offline step of the web build failed with exit code ${r.status}`);
}
