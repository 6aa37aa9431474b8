/**
 * A seeded corpus of hostile CSV files, generated at test time (nothing is committed as a
 * file): a plausible upload of the demo region (long or wide, any delimiter, quoting,
 * line ends, BOM) that is then broken in one of the ways third-party files break —
 * random bytes, truncated quotes, huge fields, mixed encodings, NULs, very wide rows, rows
 * cut short — or left alone. Every file is at most 1 MB; the same seed gives the same bytes.
 */

export const MAX_FUZZ_BYTES = 1 << 20;

export const KINDS = [
  'benign',
  'random-bytes',
  'random-splice',
  'truncated-quote',
  'huge-field',
  'mixed-encoding',
  'nul',
  'wide-row',
  'cut-short',
] as const;
export type FuzzKind = (typeof KINDS)[number];

export interface FuzzFile {
  name: string;
  kind: FuzzKind;
  bytes: Buffer;
  /** What the generator wrote before breaking it (the reference reader uses these, not the server's guesses). */
  format: 'long' | 'wide';
  delimiter: string;
  decimalComma: boolean;
}

/** mulberry32: small seeded uniform generator (common practice for reproducible test data). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type U = () => number;
const int = (u: U, lo: number, hi: number) => lo + Math.floor(u() * (hi - lo + 1));
const pick = <T>(u: U, xs: readonly T[]): T => xs[Math.floor(u() * xs.length)];
const chance = (u: U, p: number) => u() < p;

/** The demo region's catalogue and districts (api/demo/catalogue.ts, the seeded D01–D24). */
const INDICATORS = ['emissions_pc', 'income_pc', 'population', 'pop_density', 'industry_share', 'trade_openness'];
const KNOWN = Array.from({ length: 24 }, (_, i) => `D${String(i + 1).padStart(2, '0')}`);
const NAME_PARTS = ['Amber', 'Nord', 'Île', 'Groß', 'Søndre', 'Łąka', '河谷', 'O\'Neill "Bay"', 'Rivière', 'Vale'];

function randomBytes(u: U, n: number): Buffer {
  const b = Buffer.allocUnsafe(n);
  for (let i = 0; i < n; i += 4) {
    const x = (u() * 4294967296) >>> 0;
    for (let k = 0; k < 4 && i + k < n; k++) b[i + k] = (x >>> (8 * k)) & 0xff;
  }
  return b;
}

/** Sizes skewed small: most files a few kilobytes, some up to 1 MB. */
function size(u: U): number {
  const r = u();
  return r < 0.6 ? int(u, 1, 4096) : r < 0.9 ? int(u, 4096, 128 * 1024) : int(u, 128 * 1024, MAX_FUZZ_BYTES);
}

interface Base {
  rows: string[][];
  format: 'long' | 'wide';
  delimiter: string;
  decimalComma: boolean;
}

/** A well-formed file's cells: unique keys, positive values, names only for new districts. */
function baseCells(u: U): Base {
  const format = chance(u, 0.5) ? 'long' : 'wide';
  const delimiter = pick(u, [',', ',', ',', ';', '\t']);
  const decimalComma = delimiter !== ',' && chance(u, 0.5);
  const withName = chance(u, 0.4);
  const districts = [
    ...KNOWN.filter(() => chance(u, 0.3)),
    ...(chance(u, 0.3) ? Array.from({ length: int(u, 1, 4) }, (_, i) => `Z${int(u, 100, 999)}${i}`) : []),
  ];
  if (districts.length === 0) districts.push(pick(u, KNOWN));
  const years = Array.from({ length: int(u, 1, 12) }, (_, i) => 2024 - i * int(u, 1, 3)).filter(
    (y, i, a) => a.indexOf(y) === i,
  );
  const indicators = INDICATORS.filter(() => chance(u, 0.5));
  if (indicators.length === 0) indicators.push(pick(u, INDICATORS));
  const num = () => {
    const v = (0.5 + 999 * u()).toFixed(int(u, 0, 4));
    const t = chance(u, 0.1) ? `${(Number(v) / 1000).toString()}e3` : v;
    return decimalComma ? t.replace('.', ',') : t;
  };
  // One name per new code (a second name for the same code is a conflict, not a benign file).
  const nameOf = (d: string) => (d.startsWith('Z') ? `${NAME_PARTS[Number(d.slice(1)) % NAME_PARTS.length]} ${d}` : '');
  let header: string[];
  const rows: string[][] = [];
  if (format === 'long') {
    header = ['district_code', ...(withName ? ['district_name'] : []), 'indicator', 'year', 'value'];
    for (const d of districts)
      for (const ind of indicators)
        for (const y of years) {
          if (!chance(u, 0.7)) continue;
          rows.push([d, ...(withName ? [nameOf(d)] : []), ind, String(y), num()]);
        }
  } else {
    header = ['district_code', ...(withName ? ['district_name'] : []), 'year', ...indicators];
    for (const d of districts)
      for (const y of years) {
        rows.push([
          d,
          ...(withName ? [nameOf(d)] : []),
          String(y),
          ...indicators.map(() => (chance(u, 0.15) ? '' : num())),
        ]);
      }
  }
  if (rows.length === 0)
    rows.push(
      format === 'long'
        ? [districts[0], ...(withName ? [''] : []), indicators[0], '2020', num()]
        : [districts[0], ...(withName ? [''] : []), '2020', ...indicators.map(num)],
    );
  // Columns in another order now and then (the header decides).
  if (chance(u, 0.2)) {
    const order = header.map((_, i) => i).sort(() => u() - 0.5);
    return { rows: [header, ...rows].map((r) => order.map((i) => r[i])), format, delimiter, decimalComma };
  }
  return { rows: [header, ...rows], format, delimiter, decimalComma };
}

/** Cells to text: quoting, spaces, line ends, blank lines and a BOM as spreadsheet exports vary them. */
function serialise(u: U, base: Base): Buffer {
  const eol = pick(u, ['\n', '\n', '\r\n', '\r']);
  const quoteP = pick(u, [0, 0, 0.3, 1]);
  const spaces = base.delimiter !== '\t' && chance(u, 0.2);
  const lines = base.rows.map((r) =>
    r
      .map((c) => {
        const mustQuote =
          c.includes(base.delimiter) || c.includes('"') || /[\r\n]/.test(c) || (spaces && c !== c.trim());
        const text = mustQuote || chance(u, quoteP) ? `"${c.replace(/"/g, '""')}"` : c;
        return spaces && chance(u, 0.3) ? ` ${text} ` : text;
      })
      .join(base.delimiter),
  );
  if (chance(u, 0.2)) lines.splice(int(u, 1, lines.length), 0, '', base.delimiter.repeat(int(u, 0, 3)));
  const text = lines.join(eol) + (chance(u, 0.8) ? eol : '');
  return Buffer.concat([
    chance(u, 0.15) ? Buffer.from([0xef, 0xbb, 0xbf]) : Buffer.alloc(0),
    Buffer.from(text, 'utf8'),
  ]);
}

function insertAt(b: Buffer, at: number, what: Buffer): Buffer {
  return Buffer.concat([b.subarray(0, at), what, b.subarray(at)]);
}

/** A position just after a delimiter or line end of a data row (the start of a cell), or anywhere. */
function cellStart(u: U, b: Buffer, delimiter: string): number {
  const firstBreak = Math.max(0, b.indexOf(10));
  for (let tries = 0; tries < 20; tries++) {
    const p = int(u, firstBreak, b.length);
    if (p === 0 || b[p - 1] === delimiter.charCodeAt(0) || b[p - 1] === 10) return p;
  }
  return int(u, 0, b.length);
}

function huge(u: U, n: number, decimalComma: boolean): Buffer {
  const sep = decimalComma ? ',' : '.';
  const digits = '7'.repeat(n);
  const forms = [
    `${digits}x`,
    `${digits}${sep}5x`,
    `1${sep}${digits}e5x`,
    `${digits}e+${digits}`,
    'a'.repeat(n),
    `"${'q'.repeat(n)}"`,
    ' '.repeat(n) + '1',
    `-${digits}`,
  ];
  return Buffer.from(pick(u, forms), 'latin1');
}

function mutate(u: U, kind: FuzzKind, b: Buffer, base: Base): Buffer {
  switch (kind) {
    case 'benign':
      return b;
    case 'random-bytes':
      return randomBytes(u, size(u));
    case 'random-splice': {
      const at = int(u, 0, b.length);
      return Buffer.concat([
        b.subarray(0, at),
        randomBytes(u, int(u, 1, 512)),
        b.subarray(Math.min(b.length, at + int(u, 0, 64))),
      ]);
    }
    case 'truncated-quote': {
      if (chance(u, 0.5)) return insertAt(b, cellStart(u, b, base.delimiter), Buffer.from('"'));
      const q = b.indexOf(34, int(u, 0, b.length));
      return q > 0 ? b.subarray(0, q + 1 + int(u, 0, 3)) : Buffer.concat([b, Buffer.from('"unclosed')]);
    }
    case 'huge-field': {
      const n = Math.min(int(u, 9_000, 900_000), MAX_FUZZ_BYTES - b.length - 16);
      return insertAt(b, cellStart(u, b, base.delimiter), huge(u, Math.max(1, n), base.decimalComma));
    }
    case 'mixed-encoding': {
      const r = u();
      if (r < 0.25) return Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(b.toString('utf8'), 'utf16le')]);
      // The same text saved as Latin-1 (letters outside it become '?'-like garbage, as in a careless export).
      if (r < 0.5) return Buffer.from(b.toString('utf8'), 'latin1');
      const odd = [
        [0xe9],
        [0xc3],
        [0x80],
        [0xc0, 0xaf],
        [0xed, 0xa0, 0x80],
        [0xf8, 0x88, 0x80, 0x80, 0x80],
        [0x93],
        [0xe2, 0x80],
      ];
      let out = b;
      for (let k = int(u, 1, 5); k > 0; k--) out = insertAt(out, int(u, 0, out.length), Buffer.from(pick(u, odd)));
      return out;
    }
    case 'nul': {
      let out = b;
      for (let k = int(u, 1, 40); k > 0; k--) out = insertAt(out, int(u, 0, out.length), Buffer.alloc(int(u, 1, 3)));
      return out;
    }
    case 'wide-row': {
      const n = int(u, 50, 6000);
      const cell = chance(u, 0.5) ? '1' : '';
      const row = Array.from({ length: n }, () => cell).join(base.delimiter);
      const at = chance(u, 0.2) ? 0 : cellStart(u, b, '\n');
      return insertAt(b, at, Buffer.from(`${row}\n`));
    }
    case 'cut-short': {
      if (chance(u, 0.4)) return b.subarray(0, int(u, 0, b.length));
      const lines = b.toString('utf8').split('\n');
      for (let k = int(u, 1, 4); k > 0; k--) {
        const i = int(u, 1, Math.max(1, lines.length - 1));
        if (lines[i] !== undefined)
          lines[i] = lines[i]
            .split(base.delimiter)
            .slice(0, -int(u, 1, 3))
            .join(base.delimiter);
      }
      return Buffer.from(lines.join('\n'), 'utf8');
    }
  }
}

/** File i of the corpus for `seed`. */
export function fuzzFile(seed: number, i: number): FuzzFile {
  const u = rng(seed * 1_000_003 + i * 7919);
  const kind = KINDS[i % KINDS.length];
  const base = baseCells(u);
  let bytes = mutate(u, kind, serialise(u, base), base);
  if (bytes.length > MAX_FUZZ_BYTES) bytes = bytes.subarray(0, MAX_FUZZ_BYTES);
  return {
    name: `fuzz-${seed}-${String(i).padStart(3, '0')}-${kind}.csv`,
    kind,
    bytes,
    format: base.format,
    delimiter: base.delimiter,
    decimalComma: base.decimalComma,
  };
}
