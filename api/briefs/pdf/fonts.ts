/**
 * The fonts of PDF briefs: the project's own copies of Inter (assets/fonts/pdf/, OFL),
 * whose one file covers Latin Extended, Greek and Cyrillic, so a district name in any of
 * them prints without a missing glyph (pdfkit has no fallback font).
 *
 * Speed: each pdfkit document would otherwise parse the TTF again, and fontkit's shaping of
 * Inter with every default OpenType feature (contextual alternates, ligatures) costs about
 * 0.5 ms per distinct word — a 3,000-district region brief spent seconds there. The faces
 * are parsed once per process and shaped with kerning, glyph composition and mark
 * positioning only (about 0.08 ms per word), which is all that Latin, Greek and Cyrillic
 * text needs once normalised to NFC. Shaped words are also kept across documents.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import PDFDocument from 'pdfkit';

export const FONT_DIR = path.resolve(__dirname, '..', '..', '..', 'assets', 'fonts', 'pdf');
export const FACES = { regular: 'Inter-Regular.ttf', bold: 'Inter-Bold.ttf' } as const;
export type Face = keyof typeof FACES;

/** Features applied when shaping; the rest of Inter's defaults are turned off. */
const FEATURES: Record<string, boolean> = {
  kern: true,
  ccmp: true,
  locl: true,
  mark: true,
  mkmk: true,
  calt: false,
  clig: false,
  liga: false,
  rlig: false,
  rclt: false,
  curs: false,
};

/** The part of a fontkit face this module uses (pdfkit accepts any object with `layout`). */
interface FontkitFace {
  layout(text: string, features?: unknown): GlyphRunLike;
  hasGlyphForCodePoint(cp: number): boolean;
  getGlyph(id: number, codePoints?: number[]): { codePoints: number[] };
}

interface GlyphPosition {
  xAdvance: number;
  yAdvance: number;
  xOffset: number;
  yOffset: number;
}

interface GlyphRunLike {
  glyphs: unknown[];
  positions: GlyphPosition[];
  readonly advanceWidth: number;
}

let faces: Record<Face, FontkitFace> | null = null;

/** Shaped words kept across documents (a word is shaped once per process, not per brief). */
const LAYOUT_CACHE_LIMIT = 50_000;

/**
 * A run as pdfkit expects it, with positions of its own: pdfkit scales a run's positions
 * in place, so every caller gets fresh copies of the cached ones.
 */
function freshRun(run: { glyphs: unknown[]; positions: GlyphPosition[] }): GlyphRunLike {
  const positions = run.positions.map((p) => ({
    xAdvance: p.xAdvance,
    yAdvance: p.yAdvance,
    xOffset: p.xOffset,
    yOffset: p.yOffset,
  }));
  return {
    glyphs: run.glyphs,
    positions,
    get advanceWidth() {
      let w = 0;
      for (const p of positions) w += p.xAdvance;
      return w;
    },
  };
}

function loadFace(file: string): FontkitFace {
  // pdfkit parses the file with its own fontkit; take the parsed face from a scratch
  // document rather than depending on fontkit directly.
  const scratch = new PDFDocument({ autoFirstPage: false });
  scratch.registerFont('face', readFileSync(path.join(FONT_DIR, file)));
  scratch.font('face');
  const parsed = (scratch as unknown as { _font: { font: FontkitFace } })._font.font;
  const face = Object.create(parsed) as FontkitFace;
  // fontkit keeps one glyph object per id with the code points it was first made with; a
  // glyph first met as a component of another (Inter builds "i" from "ı" and a dot) has
  // none, and pdfkit then writes no text for it (a reader's search and copy lose the
  // letter). Give such a glyph the code points it is now asked for.
  face.getGlyph = function getGlyph(this: FontkitFace, id: number, codePoints: number[] = []) {
    const glyph = parsed.getGlyph.call(this, id, codePoints);
    if (glyph && codePoints.length && !glyph.codePoints.length) glyph.codePoints = codePoints;
    return glyph;
  };
  const cache = new Map<string, { glyphs: unknown[]; positions: GlyphPosition[] }>();
  face.layout = function layout(this: FontkitFace, text: string, features?: unknown) {
    if (features !== undefined) return parsed.layout.call(this, text, features);
    let run = cache.get(text);
    if (!run) {
      const shaped = parsed.layout.call(this, text, FEATURES);
      run = { glyphs: shaped.glyphs, positions: shaped.positions.map((p) => ({ ...p })) };
      if (cache.size >= LAYOUT_CACHE_LIMIT) cache.clear();
      cache.set(text, run);
    }
    return freshRun(run);
  };
  return face;
}

export function briefFaces(): Record<Face, FontkitFace> {
  if (!faces) faces = { regular: loadFace(FACES.regular), bold: loadFace(FACES.bold) };
  return faces;
}

/** Registers both faces on a document as 'regular' and 'bold'. */
export function registerBriefFonts(doc: PDFKit.PDFDocument): void {
  const f = briefFaces();
  doc.registerFont('regular', f.regular as never);
  doc.registerFont('bold', f.bold as never);
}

/**
 * Text as it will be drawn: NFC, without soft hyphens, and any character the face lacks
 * replaced by its compatibility decomposition when the face has every part of it (ǅ → Dž).
 * Characters with no such form are kept (and would print as a missing glyph).
 */
export function printable(text: string): string {
  const face = briefFaces().regular;
  const s = text.normalize('NFC').replace(/\u00AD/g, '');
  let out = '';
  for (const ch of s) {
    const cp = ch.codePointAt(0)!;
    if (cp < 0x80 || face.hasGlyphForCodePoint(cp)) {
      out += ch;
      continue;
    }
    const alt = ch.normalize('NFKD');
    out += [...alt].every((c) => face.hasGlyphForCodePoint(c.codePointAt(0)!)) ? alt.normalize('NFC') : ch;
  }
  return out;
}

/** Code points of `text` (after `printable`) the face cannot draw. */
export function missingGlyphs(text: string): string[] {
  const face = briefFaces().regular;
  return [
    ...new Set(
      [...printable(text)].filter((c) => c.codePointAt(0)! >= 0x20 && !face.hasGlyphForCodePoint(c.codePointAt(0)!)),
    ),
  ];
}
