/**
 * The compute pool: CPU-heavy work (what-if fits, run district fits, PDFs) runs in
 * worker threads (piscina), so one heavy request never stalls the event loop that answers
 * every other reader. Threads load the TypeScript worker through tsx (`--import tsx`); a
 * bare `new Worker('x.ts')` cannot load TypeScript on Node 20.
 *
 * Size 0 runs every task inline on the main thread: the behaviour before the pool, kept
 * only to measure the difference (bench/starvation.ts).
 */
import fs from 'node:fs';
import path from 'node:path';
import Piscina from 'piscina';
import { runTask, type Task, type TaskResults } from './tasks';

export interface ComputePool {
  readonly size: number;
  run<K extends Task['kind']>(task: Extract<Task, { kind: K }>): Promise<TaskResults[K]>;
  close(): Promise<void>;
}

/** The worker file beside this one: `.ts` from source (tsx, ts-jest), `.js` if compiled. */
function workerFile(): string {
  for (const ext of ['.ts', '.js']) {
    const f = path.join(__dirname, `worker${ext}`);
    if (fs.existsSync(f)) return f;
  }
  throw new Error(`compute worker not found beside ${__dirname}`);
}

export function createComputePool(size: number, options: { warm?: boolean } = {}): ComputePool {
  if (size === 0) {
    return {
      size,
      run: (task) => runTask(task) as never,
      close: async () => {},
    };
  }
  const file = workerFile();
  const piscina = new Piscina({
    filename: file,
    // A warm pool starts every thread now (a thread loading the engine through tsx takes
    // a while, too long to wait for in the middle of a run); otherwise threads beyond
    // the first start on demand and end after a quiet minute.
    minThreads: options.warm ? size : 1,
    maxThreads: size,
    idleTimeout: 60_000,
    execArgv: file.endsWith('.ts') ? ['--import', 'tsx'] : [],
  });
  return {
    size,
    run: (task) => piscina.run(task) as never,
    close: () => piscina.destroy(),
  };
}
