/**
 * Which (district, indicator, year) keys a file has given so far, for the duplicate
 * check: one 256-bit bitmap per (district, indicator) pair, found through a small offset
 * table per district. A million keys over 20,000 pairs cost under 1 MB and touch memory
 * in file order (a hash table of a million entries costs 16 MB or more and a cache miss
 * per row). The line of the first occurrence is looked up afterwards, in the staged rows,
 * for the few duplicates that are reported.
 */
export class KeySet {
  private bits = new Uint32Array(8 * 1024);
  private pairs = 0;
  /** Every district's table of pair offsets by indicator position (-1 = none yet), end to end: one array, not one per district. */
  private tables = new Int32Array(1024).fill(-1);
  private tablesUsed = 0;

  constructor(private readonly indicatorCount: number) {}

  /** A table for one district; returns where it starts. */
  newDistrict(): number {
    const at = this.tablesUsed;
    this.tablesUsed += this.indicatorCount;
    if (this.tablesUsed > this.tables.length) {
      const next = new Int32Array(Math.max(this.tables.length * 2, this.tablesUsed)).fill(-1);
      next.set(this.tables);
      this.tables = next;
    }
    return at;
  }

  /** Marks the key; false if it was marked already. `offset` is 0–255. */
  add(district: number, indicator: number, offset: number): boolean {
    const tables = this.tables;
    let base = tables[district + indicator];
    if (base < 0) {
      base = this.pairs * 8;
      this.pairs++;
      if (base + 8 > this.bits.length) {
        const next = new Uint32Array(this.bits.length * 2);
        next.set(this.bits);
        this.bits = next;
      }
      tables[district + indicator] = base;
    }
    const w = base + (offset >>> 5);
    const m = 1 << (offset & 31);
    const word = this.bits[w];
    if (word & m) return false;
    this.bits[w] = word | m;
    return true;
  }
}
