/**
 * What every brief page shares: the document (paper size from the settings, embedded
 * fonts, metadata), the print palette, text blocks that measure themselves, vector chart
 * scenes drawn as pdfkit paths, and the footer with the trace and page numbers.
 */
import PDFDocument from 'pdfkit';
import type { BriefPaperSize, BriefTone, BriefTrace, ChartScene } from '../../../contracts/briefs';
import { printable, registerBriefFonts, type Face } from './fonts';

/** Print colours (chosen for paper and for grey-scale copiers: every pair differs in lightness too). */
export const INK = {
  text: '#1E2B2F',
  muted: '#4D5E63',
  rule: '#D5CDBC',
  fill: '#F3EFE6',
  accent: '#1F5A60',
  onAccent: '#FFFFFF',
  warn: '#9A4523',
} as const;

const TONE: Record<BriefTone, string> = {
  ink: INK.text,
  muted: INK.muted,
  grid: '#DDD7CB',
  curve: '#1F5A60',
  pooled: '#7D8B8F',
  band: '#D98B63',
  threshold: '#9A4523',
  latest: '#E0A030',
  point: '#4D5E63',
  projection: '#1F5A60',
  // the region map (our own palette: each standing's ink and a light tint of it)
  approaching: '#A0421A',
  at_turn: '#6A3F8F',
  past_turn: '#22663F',
  no_turn: '#4D5E63',
  not_estimable: '#5C5346',
  approaching_fill: '#D4AA98',
  at_turn_fill: '#BCA9CD',
  past_turn_fill: '#9CBAA9',
  no_turn_fill: '#CACFD0',
  not_estimable_fill: '#DEDDDA',
  land: '#DDD7CB',
  sea: '#FFFFFF',
};

export const MARGIN = 40;

export interface Geometry {
  width: number;
  height: number;
  left: number;
  right: number;
  contentWidth: number;
}

export function geometry(doc: PDFKit.PDFDocument): Geometry {
  const width = doc.page.width;
  const height = doc.page.height;
  return { width, height, left: MARGIN, right: width - MARGIN, contentWidth: width - 2 * MARGIN };
}

/** A document for a brief; `done` resolves to the PDF bytes once `doc.end()` is called. */
export function createBriefDocument(
  size: BriefPaperSize,
  info: { title: string; subject: string; lang?: string },
): { doc: PDFKit.PDFDocument; done: Promise<Buffer> } {
  const doc = new PDFDocument({
    // A tagged PDF (PDF/UA, ISO 14289-1; PDF 1.7 §14.8): a structure tree of headings,
    // paragraphs, tables and figures in reading order, page furniture marked as artifacts,
    // the document language (the region's locale) and the title shown in the window bar.
    pdfVersion: '1.7',
    tagged: true,
    size: size === 'LETTER' ? 'LETTER' : 'A4',
    // No margins for pdfkit: every block is placed and measured here, so pdfkit never
    // starts a page on its own (a district brief is one page by construction).
    margins: { top: 0, bottom: 0, left: 0, right: 0 },
    autoFirstPage: true,
    info: { Title: info.title, Subject: info.subject, Author: 'Crestwatch', Creator: 'Crestwatch briefs' },
    lang: info.lang ?? 'en-GB',
    displayTitle: true,
    // No default face: pdfkit would parse Helvetica's AFM file for every document, and a
    // default Inter would defeat pdfkit's font cache (every font() call re-opening the face).
    font: null as never,
  });
  registerBriefFonts(doc);
  // One Document element under the StructTreeRoot holds every other (PDF 1.7 §14.8.4.2).
  const root = doc.struct('Document');
  doc.addStructure(root);
  roots.set(doc, root);
  doc.font('regular');
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  return { doc, done };
}

// ---- Tagging (PDF 1.7 §14.8) ----------------------------------------------------------------
// Every text drawn outside a structure element or an artifact becomes a paragraph (P) of
// its own, so nothing is left untagged; headings, tables and figures say what they are.

/** How deep each document is inside a structure element's or an artifact's content. */
const depth = new WeakMap<PDFKit.PDFDocument, number>();
const inside = (doc: PDFKit.PDFDocument) => (depth.get(doc) ?? 0) > 0;
/** Each document's Document element, the parent of top-level headings, paragraphs, tables and figures. */
const roots = new WeakMap<PDFKit.PDFDocument, PDFKit.PDFStructureElement>();

function within<T>(doc: PDFKit.PDFDocument, draw: () => T): T {
  depth.set(doc, (depth.get(doc) ?? 0) + 1);
  try {
    return draw();
  } finally {
    depth.set(doc, (depth.get(doc) ?? 1) - 1);
  }
}

export type StructParent = PDFKit.PDFStructureElement;

function attach(doc: PDFKit.PDFDocument, element: StructParent, parent?: StructParent): void {
  const to = parent ?? roots.get(doc);
  if (to) to.add(element);
  else doc.addStructure(element);
}

/**
 * Draws `draw` as the content of a structure element of `type` (H1, H2, P, TH, TD, Figure…),
 * under `parent` (an attached element) or the document's root; returns what `draw` returns.
 */
export function tagged<T>(
  doc: PDFKit.PDFDocument,
  type: string,
  draw: () => T,
  parent?: StructParent,
  options: { alt?: string; scope?: 'Row' | 'Column' | 'Both' } = {},
): T {
  let out: T | undefined;
  const element = doc.struct(type, options as PDFKit.Mixins.StructureElementOptions, () => {
    out = within(doc, draw);
  });
  attach(doc, element, parent);
  return out as T;
}

/** An empty structure element (Table, TR, L…) attached under `parent` or the root, to add children to. */
export function container(doc: PDFKit.PDFDocument, type: string, parent?: StructParent): StructParent {
  const element = doc.struct(type);
  attach(doc, element, parent);
  return element;
}

/** Draws page furniture (rules, fills, page tops and footers, a repeated header row) as an artifact. */
export function artifact<T>(doc: PDFKit.PDFDocument, draw: () => T, type: 'Pagination' | 'Layout' = 'Layout'): T {
  if (inside(doc)) return draw();
  doc.markContent('Artifact', { type });
  try {
    return within(doc, draw);
  } finally {
    doc.endMarkedContent();
  }
}

/** A heading: H1 for the brief's title, H2 for its sections. */
export function heading<T>(doc: PDFKit.PDFDocument, level: 1 | 2, draw: () => T): T {
  return inside(doc) ? draw() : tagged(doc, `H${level}`, draw);
}

/** Text as a paragraph of its own unless it is already inside a structure element or an artifact. */
function paragraph<T>(doc: PDFKit.PDFDocument, draw: () => T): T {
  return inside(doc) ? draw() : tagged(doc, 'P', draw);
}

export interface TextStyle {
  size: number;
  face?: Face;
  color?: string;
  lineGap?: number;
  align?: 'left' | 'right' | 'center';
}

function apply(doc: PDFKit.PDFDocument, s: TextStyle): void {
  doc
    .font(s.face ?? 'regular')
    .fontSize(s.size)
    .fillColor(s.color ?? INK.text);
}

/** Height a wrapped text takes at `width`. */
export function measure(doc: PDFKit.PDFDocument, text: string, width: number, s: TextStyle): number {
  apply(doc, s);
  return doc.heightOfString(printable(text), { width, lineGap: s.lineGap ?? 0 });
}

/**
 * Draws wrapped text at (x, y) within `width`; with `maxHeight` it stops there and ends
 * the last line with an ellipsis. Returns the height used.
 */
export function textBlock(
  doc: PDFKit.PDFDocument,
  text: string,
  x: number,
  y: number,
  width: number,
  s: TextStyle,
  maxHeight?: number,
): number {
  const t = printable(text);
  apply(doc, s);
  const full = doc.heightOfString(t, { width, lineGap: s.lineGap ?? 0 });
  const height = maxHeight !== undefined ? Math.min(full, maxHeight) : full;
  if (height < doc.currentLineHeight(true) - 0.01) return 0;
  paragraph(doc, () =>
    doc.text(t, x, y, {
      width,
      height: height + 0.5,
      lineGap: s.lineGap ?? 0,
      align: s.align ?? 'left',
      ellipsis: full > height + 0.5 ? '…' : undefined,
    }),
  );
  return height;
}

/** One line of text, no wrapping; anchored at its start, middle or end. */
export function textLine(
  doc: PDFKit.PDFDocument,
  text: string,
  x: number,
  y: number,
  s: TextStyle,
  anchor: 'start' | 'middle' | 'end' = 'start',
): number {
  const t = printable(text);
  apply(doc, s);
  const w = doc.widthOfString(t);
  const left = anchor === 'end' ? x - w : anchor === 'middle' ? x - w / 2 : x;
  paragraph(doc, () => doc.text(t, left, y, { lineBreak: false }));
  return w;
}

export function rule(
  doc: PDFKit.PDFDocument,
  x0: number,
  x1: number,
  y: number,
  color: string = INK.rule,
  width = 0.6,
): void {
  artifact(doc, () => doc.save().moveTo(x0, y).lineTo(x1, y).lineWidth(width).strokeColor(color).stroke().restore());
}

/** A filled rectangle behind content (a shaded row, a box): furniture, an artifact. */
export function fillRect(doc: PDFKit.PDFDocument, x: number, y: number, w: number, h: number, color: string): void {
  artifact(doc, () => doc.save().rect(x, y, w, h).fillColor(color).fill().restore());
}

/** Draws a chart scene with its top-left corner at (x, y). */
export function drawScene(doc: PDFKit.PDFDocument, scene: ChartScene, x: number, y: number): void {
  // A chart is a Figure whose alternate text is the scene's own description (its words).
  if (!inside(doc)) {
    tagged(doc, 'Figure', () => drawScene(doc, scene, x, y), undefined, { alt: scene.description || scene.title });
    return;
  }
  doc.save();
  doc.translate(x, y);
  for (const item of scene.items) {
    doc.save();
    if (item.kind === 'path') {
      doc.path(item.d);
      if (item.dash) doc.dash(item.dash[0], { space: item.dash[1] });
      if (item.fill && item.stroke) {
        doc
          .lineWidth(item.width ?? 1)
          .fillColor(TONE[item.fill], item.opacity ?? 1)
          .strokeColor(TONE[item.stroke], item.opacity ?? 1)
          .fillAndStroke();
      } else if (item.fill) {
        doc.fillColor(TONE[item.fill], item.opacity ?? 1).fill();
      } else {
        doc
          .lineWidth(item.width ?? 1)
          .strokeColor(TONE[item.stroke ?? 'ink'], item.opacity ?? 1)
          .lineJoin('round')
          .lineCap('round')
          .stroke();
      }
    } else if (item.kind === 'circle') {
      doc.circle(item.cx, item.cy, item.r);
      if (item.fill && item.stroke)
        doc
          .lineWidth(item.width ?? 0.6)
          .fillColor(TONE[item.fill], item.opacity ?? 1)
          .strokeColor(TONE[item.stroke])
          .fillAndStroke();
      else if (item.fill) doc.fillColor(TONE[item.fill], item.opacity ?? 1).fill();
      else
        doc
          .lineWidth(item.width ?? 0.6)
          .strokeColor(TONE[item.stroke ?? 'ink'])
          .stroke();
    } else {
      const t = printable(item.text);
      doc
        .font(item.bold ? 'bold' : 'regular')
        .fontSize(item.size)
        .fillColor(TONE[item.tone]);
      const w = doc.widthOfString(t);
      const left = item.anchor === 'end' ? item.x - w : item.anchor === 'middle' ? item.x - w / 2 : item.x;
      doc.text(t, left, item.y, { lineBreak: false, baseline: 'alphabetic' });
    }
    doc.restore();
  }
  doc.restore();
}

export const FOOTER_HEIGHT = 30;

/** The footer of a page: the trace line, when it was generated, and the page number. */
export function footer(doc: PDFKit.PDFDocument, trace: BriefTrace, page: number, pages: number): void {
  artifact(doc, () => footerContent(doc, trace, page, pages), 'Pagination');
}

function footerContent(doc: PDFKit.PDFDocument, trace: BriefTrace, page: number, pages: number): void {
  const g = geometry(doc);
  const y = g.height - FOOTER_HEIGHT + 4;
  rule(doc, g.left, g.right, y);
  const s: TextStyle = { size: 6.5, color: INK.muted };
  const pageText = `Page ${page} of ${pages}`;
  apply(doc, s);
  const pageWidth = doc.widthOfString(pageText);
  textBlock(doc, trace.line, g.left, y + 4, g.contentWidth - pageWidth - 12, s, 8);
  textLine(doc, pageText, g.right, y + 4, { ...s, face: 'bold' }, 'end');
  textBlock(
    doc,
    `Generated on ${trace.generatedAt} from this published run only; figures rounded for reading, intervals outward.`,
    g.left,
    y + 13,
    g.contentWidth,
    s,
    8,
  );
}

const PAGE_TOP = 30;
/** Where content starts under the top line. */
export const PAGE_TOP_END = PAGE_TOP + 22;

/** The top line of a page: the product name and the brief's subtitle. Returns PAGE_TOP_END. */
export function pageTop(doc: PDFKit.PDFDocument, subtitle: string): number {
  return artifact(doc, () => pageTopContent(doc, subtitle), 'Pagination');
}

function pageTopContent(doc: PDFKit.PDFDocument, subtitle: string): number {
  const g = geometry(doc);
  const y = PAGE_TOP;
  textLine(doc, 'Crestwatch', g.left, y, { size: 9, face: 'bold', color: INK.accent });
  textLine(doc, subtitle, g.right, y + 1.5, { size: 7.5, color: INK.muted }, 'end');
  rule(doc, g.left, g.right, y + 15, INK.accent, 1.2);
  return PAGE_TOP_END;
}

/** A filled label, e.g. the standing. Returns its width. */
export function chip(doc: PDFKit.PDFDocument, text: string, x: number, y: number, color: string = INK.accent): number {
  const t = printable(text.toUpperCase());
  doc.font('bold').fontSize(7.5);
  const w = doc.widthOfString(t) + 12;
  artifact(doc, () => doc.save().roundedRect(x, y, w, 14, 3).fillColor(color).fill().restore());
  paragraph(doc, () =>
    doc
      .font('bold')
      .fontSize(7.5)
      .fillColor(INK.onAccent)
      .text(t, x + 6, y + 3.6, { lineBreak: false }),
  );
  return w;
}

/** The cautions box; returns its height. With `draw: false` only measures. */
export function cautionsBox(
  doc: PDFKit.PDFDocument,
  cautions: string[],
  x: number,
  y: number,
  width: number,
  draw = true,
): number {
  const s: TextStyle = { size: 7, color: INK.text, lineGap: 0.6 };
  const inner = width - 16;
  const texts = cautions.map((c) => `•  ${c}`);
  let h = 8 + 11;
  for (const t of texts) h += measure(doc, t, inner, s) + 1.5;
  h += 5;
  if (!draw) return h;
  fillRect(doc, x, y, width, h, INK.fill);
  fillRect(doc, x, y, 2.5, h, INK.warn);
  heading(doc, 2, () => textLine(doc, 'Read with care', x + 8, y + 7, { size: 8, face: 'bold', color: INK.warn }));
  let cy = y + 8 + 11;
  for (const t of texts) cy += textBlock(doc, t, x + 8, cy, inner, s) + 1.5;
  return h;
}
