/**
 * A small seeded pseudo-random generator (mulberry32) with a normal draw (Box–Muller),
 * so the demo region is the same on every machine.
 */
export interface Random {
  uniform(): number;
  normal(): number;
  between(lo: number, hi: number): number;
}

export function seededRandom(seed: number): Random {
  let state = seed >>> 0;
  let spare: number | null = null;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (): number => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    let u = 0;
    while (u === 0) u = uniform();
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
  return { uniform, normal, between: (lo, hi) => lo + (hi - lo) * uniform() };
}
