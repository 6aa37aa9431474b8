import type { ChildProcess } from 'node:child_process';

/** Stops the OAuth stand-in; the test cluster stays up between runs (`npm test` stops it). */
export default async function globalTeardown(): Promise<void> {
  const g = globalThis as { __standIn?: ChildProcess };
  const child = g.__standIn;
  if (!child || child.exitCode !== null) return;
  await new Promise<void>((resolve) => {
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
    setTimeout(() => {
      child.kill('SIGKILL');
      resolve();
    }, 3000).unref();
  });
  g.__standIn = undefined;
}
