/**
 * Scratch memory for the hot path. V8 gives every Float64Array longer than 8 elements its
 * own off-heap backing store, which costs 0.6–2 µs to allocate — more than a whole 40 × 4
 * QR. A fit therefore takes its work arrays as zero-filled views of one buffer borrowed
 * from a small pool and returned when the fit ends; everything a fit returns is copied
 * into plain arrays first, so no result ever aliases pooled memory.
 *
 * Like double-double.ts this is a kernel file exporting a few small functions together.
 * The pool is a cache of memory only: it changes no result.
 *
 * Throws: nothing. `take` with no workspace (or when the buffer is exhausted) simply
 * allocates.
 *
 * Example:
 *   const ws = acquireWorkspace(1024);
 *   try { const v = take(ws, 40); v[0] = 1; } finally { releaseWorkspace(ws); }
 */
export interface Workspace {
  buffer: Float64Array;
  offset: number;
}

const pool: Float64Array[] = [];

/** Borrows a buffer of at least `size` doubles. */
export function acquireWorkspace(size: number): Workspace {
  for (let i = pool.length - 1; i >= 0; i--) {
    if (pool[i].length >= size) {
      const buffer = pool[i];
      pool.splice(i, 1);
      return { buffer, offset: 0 };
    }
  }
  return { buffer: new Float64Array(Math.max(size, 4096)), offset: 0 };
}

/** Returns a borrowed buffer to the pool (at most 8 are kept). */
export function releaseWorkspace(ws: Workspace): void {
  if (pool.length < 8 && ws.buffer.length <= 1 << 16) pool.push(ws.buffer);
  ws.offset = ws.buffer.length; // any later take() on this workspace allocates
}

/** A zero-filled Float64Array of `length`, from the workspace when there is room. */
export function take(ws: Workspace | undefined, length: number): Float64Array {
  if (ws === undefined || ws.offset + length > ws.buffer.length) return new Float64Array(length);
  const a = ws.buffer.subarray(ws.offset, ws.offset + length);
  ws.offset += length;
  a.fill(0);
  return a;
}

/** Copies a typed array into a plain array (Array.from on a typed array is far slower). */
export function toArray(a: ArrayLike<number>): number[] {
  const n = a.length;
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = a[i];
  return out;
}
