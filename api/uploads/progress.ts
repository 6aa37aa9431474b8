/**
 * Upload progress: the pipeline reports its phase (reading and checking rows, checking
 * against stored data, merging) and its counts into an in-process registry, under a key the
 * client chose (`POST /api/uploads?progress=<key>`); `GET /api/uploads/progress/:key` reads
 * it while the upload runs. Entries are kept a few minutes after the answer so the last poll
 * sees the end, and only the person who started the upload may read them.
 *
 * A tracker without a key records nothing and still knows its phase: a refusal says where
 * it stopped either way.
 */
import type { UploadPhase, UploadPhaseCounts, UploadProgress, UploadStop } from '../../contracts/uploads';
import type { Problem } from './problems';

/** A finished upload's entry is kept this long for the client's last poll. */
export const PROGRESS_KEEP_MS = 10 * 60_000;
/** At most this many entries; the oldest finished ones go first. */
export const PROGRESS_MAX_ENTRIES = 500;

interface Entry {
  owner: number | null;
  startedAt: number;
  updatedAt: number;
  progress: UploadProgress;
}

const registry = new Map<string, Entry>();

function prune(now: number): void {
  for (const [key, e] of registry) {
    if (e.progress.state !== 'running' && now - e.updatedAt > PROGRESS_KEEP_MS) registry.delete(key);
  }
  if (registry.size < PROGRESS_MAX_ENTRIES) return;
  const oldest = [...registry.entries()].sort(
    (a, b) =>
      Number(a[1].progress.state === 'running') - Number(b[1].progress.state === 'running') ||
      a[1].updatedAt - b[1].updatedAt,
  );
  for (const [key] of oldest.slice(0, registry.size - PROGRESS_MAX_ENTRIES + 1)) registry.delete(key);
}

/** The entry under this key, for its owner only (null otherwise: an unknown and a foreign key look alike). */
export function readProgress(key: string, owner: number | null): UploadProgress | null {
  const e = registry.get(key);
  if (!e || e.owner !== owner) return null;
  return structuredClone(e.progress);
}

/** The first error's line among the problems (null when none has a line). */
function firstErrorLine(problems: readonly Problem[]): number | null {
  let line: number | null = null;
  for (const p of problems) {
    if (p.severity !== 'error' || p.line === null) continue;
    if (line === null || p.line < line) line = p.line;
  }
  return line;
}

export class ProgressTracker {
  private readonly entry: Entry | null;
  private current: UploadPhase;

  /** `key` null: nothing is recorded (the upload was sent without ?progress). */
  constructor(
    key: string | null,
    owner: number | null,
    init: { bytesTotal: number; commit: boolean; phase?: UploadPhase },
    now = Date.now(),
  ) {
    this.current = init.phase ?? 'reading';
    if (key === null) {
      this.entry = null;
      return;
    }
    prune(now);
    this.entry = {
      owner,
      startedAt: now,
      updatedAt: now,
      progress: {
        key,
        state: 'running',
        phase: this.current,
        phases: [{ phase: this.current, atMs: 0 }],
        counts: {
          bytesRead: 0,
          bytesTotal: init.bytesTotal,
          rowsRead: 0,
          values: 0,
          insert: null,
          change: null,
          unchanged: null,
          derived: null,
        },
        commit: init.commit,
        stoppedAt: null,
      },
    };
    registry.set(key, this.entry);
  }

  get phase(): UploadPhase {
    return this.current;
  }

  private touch(): void {
    if (this.entry) this.entry.updatedAt = Date.now();
  }

  /** Adds to the counts of the current phase. */
  count(counts: Partial<UploadPhaseCounts>): void {
    if (!this.entry) return;
    Object.assign(this.entry.progress.counts, counts);
    this.touch();
  }

  /** Moves to the next phase (a phase never repeats or goes back). */
  enter(phase: UploadPhase, counts: Partial<UploadPhaseCounts> = {}): void {
    this.current = phase;
    if (!this.entry) return;
    const p = this.entry.progress;
    if (p.phase !== phase) {
      p.phase = phase;
      p.phases.push({ phase, atMs: Date.now() - this.entry.startedAt });
    }
    this.count(counts);
  }

  /** Where the work stopped, from the phase it was in and the problems found. */
  stopPoint(problems: readonly Problem[] = []): UploadStop {
    return { phase: this.current, line: firstErrorLine(problems) };
  }

  done(): void {
    if (!this.entry || this.entry.progress.state !== 'running') return;
    this.entry.progress.state = 'done';
    this.touch();
  }

  /** Marks the upload failed; `stop` from a refusal's details, else the current phase without a line. */
  failed(stop?: UploadStop | null): void {
    if (!this.entry || this.entry.progress.state !== 'running') return;
    this.entry.progress.state = 'failed';
    this.entry.progress.stoppedAt = stop ?? { phase: this.current, line: null };
    this.touch();
  }
}
