/**
 * Crestwatch's app icon, drawn here (our own design, no one else's mark): on the ridge
 * colour, a pale crest — the rising-then-falling curve the product is about — over a ground
 * line, with a clay dot at its turning point. Written as SVG and as PNG at 192 and 512 px
 * (the sizes install prompts ask for). Everything sits inside the central circle of radius
 * 0.4 × size, the safe zone of a "maskable" icon (launchers may crop it to a circle).
 */
import { deflateSync } from 'node:zlib';

export type IconColours = { background: string; crest: string; ground: string; dot: string };

// Geometry in a unit square (y down). The crest is the parabola y = 0.34 + k (x − 0.5)²
// from x = 0.22 to 0.78, which is exactly the quadratic Bézier with these three points
// (control y = 2 × 0.34 − 0.66).
const CREST = { from: [0.22, 0.66], control: [0.5, 0.02], to: [0.78, 0.66], width: 0.075 } as const;
const GROUND = { from: [0.26, 0.75], to: [0.74, 0.75], width: 0.035 } as const;
const DOT = { centre: [0.5, 0.34], radius: 0.06, ring: 0.028 } as const;

export function iconSvg(c: IconColours): string {
  const p = (xy: readonly number[]) => xy.map((v) => +(v * 512).toFixed(2)).join(' ');
  return [
    '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512" width="512" height="512">',
    `<rect width="512" height="512" fill="${c.background}"/>`,
    `<path d="M${p(GROUND.from)} L${p(GROUND.to)}" stroke="${c.ground}" stroke-width="${GROUND.width * 512}" stroke-linecap="round" fill="none"/>`,
    `<path d="M${p(CREST.from)} Q${p(CREST.control)} ${p(CREST.to)}" stroke="${c.crest}" stroke-width="${CREST.width * 512}" stroke-linecap="round" fill="none"/>`,
    `<circle cx="${DOT.centre[0] * 512}" cy="${DOT.centre[1] * 512}" r="${(DOT.radius + DOT.ring) * 512}" fill="${c.crest}"/>`,
    `<circle cx="${DOT.centre[0] * 512}" cy="${DOT.centre[1] * 512}" r="${DOT.radius * 512}" fill="${c.dot}"/>`,
    '</svg>',
    '',
  ].join('\n');
}

function rgb(hex: string): [number, number, number] {
  const m = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!m) throw new Error(`icon colour "${hex}" is not a #rrggbb colour`);
  const n = parseInt(m[1], 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

type Point = readonly [number, number];

function segmentDistance(px: number, py: number, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const t = Math.max(0, Math.min(1, ((px - a[0]) * dx + (py - a[1]) * dy) / (dx * dx + dy * dy || 1)));
  return Math.hypot(px - (a[0] + t * dx), py - (a[1] + t * dy));
}

function crestPolyline(steps = 200): Point[] {
  const out: Point[] = [];
  for (let i = 0; i <= steps; i++) {
    const t = i / steps;
    const u = 1 - t;
    out.push([
      u * u * CREST.from[0] + 2 * u * t * CREST.control[0] + t * t * CREST.to[0],
      u * u * CREST.from[1] + 2 * u * t * CREST.control[1] + t * t * CREST.to[1],
    ]);
  }
  return out;
}

let crcTable: Uint32Array | null = null;
function crc32(bytes: Uint8Array): number {
  if (!crcTable) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  let c = 0xffffffff;
  for (const b of bytes) c = crcTable[(c ^ b) & 255] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

/** The icon as an RGB PNG of `size` × `size` pixels, edges smoothed by pixel coverage. */
export function iconPng(size: number, c: IconColours): Buffer {
  const bg = rgb(c.background);
  const layers: { colour: [number, number, number]; coverage: (x: number, y: number) => number }[] = [];
  const px = 1 / size;
  const cover = (distanceOutside: number) => Math.max(0, Math.min(1, 0.5 - distanceOutside / px));
  const crest = crestPolyline();
  layers.push({
    colour: rgb(c.ground),
    coverage: (x, y) => cover(segmentDistance(x, y, GROUND.from, GROUND.to) - GROUND.width / 2),
  });
  layers.push({
    colour: rgb(c.crest),
    coverage: (x, y) => {
      if (y < 0.25 || y > 0.72) return 0;
      let d = Infinity;
      for (let i = 1; i < crest.length; i++) d = Math.min(d, segmentDistance(x, y, crest[i - 1], crest[i]));
      return cover(d - CREST.width / 2);
    },
  });
  const r = (x: number, y: number) => Math.hypot(x - DOT.centre[0], y - DOT.centre[1]);
  layers.push({ colour: rgb(c.crest), coverage: (x, y) => cover(r(x, y) - DOT.radius - DOT.ring) });
  layers.push({ colour: rgb(c.dot), coverage: (x, y) => cover(r(x, y) - DOT.radius) });
  const raw = Buffer.alloc(size * (size * 3 + 1));
  for (let row = 0; row < size; row++) {
    raw[row * (size * 3 + 1)] = 0; // filter: none
    for (let col = 0; col < size; col++) {
      const x = (col + 0.5) / size;
      const y = (row + 0.5) / size;
      let pixel: [number, number, number] = [...bg];
      for (const layer of layers) {
        const a = layer.coverage(x, y);
        if (a > 0) pixel = [0, 1, 2].map((i) => pixel[i] + (layer.colour[i] - pixel[i]) * a) as typeof pixel;
      }
      const at = row * (size * 3 + 1) + 1 + col * 3;
      raw[at] = Math.round(pixel[0]);
      raw[at + 1] = Math.round(pixel[1]);
      raw[at + 2] = Math.round(pixel[2]);
    }
  }
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header[8] = 8; // bit depth
  header[9] = 2; // colour type: RGB
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(raw, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}
