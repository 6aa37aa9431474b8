/**
 * The region brief: a summary page (counts per standing, districts that crossed since the
 * last publish, the largest threshold shifts, the regional pooled curve, the cautions),
 * then the table of every district across as many pages as it needs, its header row
 * repeated on each. Rows are measured and paginated before drawing, so every page gets
 * its footer (trace, page n of N) as it is drawn.
 */
import { DEFAULT_LOCALE, formatCount, inLocale } from '../format';
import { sourcesSentence } from '../trace';
import type { RegionBriefContent, RegionBriefRow } from '../../../contracts/briefs';
import { printable } from './fonts';
import {
  artifact,
  cautionsBox,
  container,
  createBriefDocument,
  drawScene,
  fillRect,
  footer,
  FOOTER_HEIGHT,
  geometry,
  heading as tagHeading,
  INK,
  measure,
  PAGE_TOP_END,
  pageTop,
  rule,
  textBlock,
  tagged,
  textLine,
  type StructParent,
  type TextStyle,
} from './page';

/** A count in the region's locale (the content carries it: the PDF is drawn in the compute pool). */
const countIn = (c: RegionBriefContent, n: number) => inLocale(c.trace.locale ?? DEFAULT_LOCALE, () => formatCount(n));

/** How many districts each summary list shows before "and n more". */
const LIST_LINES = 8;

/** Column widths as shares of the content width (they sum to 1). */
const COLUMN_SHARE: Record<keyof RegionBriefRow, number> = {
  code: 0.068,
  name: 0.228,
  standing: 0.115,
  gap: 0.087,
  threshold: 0.095,
  interval: 0.185,
  crossing: 0.222,
};
const RIGHT_ALIGNED = new Set<keyof RegionBriefRow>(['gap', 'threshold']);

const HEADING: TextStyle = { size: 11, face: 'bold' };
const CELL: TextStyle = { size: 7.3, color: INK.text };
const HEAD: TextStyle = { size: 7, face: 'bold', color: INK.muted };
const ROW_PAD = 3.2;
/** Names wrap to two lines at most, then end with an ellipsis. */
const NAME_LINES = 2;

function list(
  doc: PDFKit.PDFDocument,
  heading: string,
  items: { code: string; name: string; text: string }[],
  note: string | null,
  more: string,
  x: number,
  y: number,
  width: number,
): number {
  let cy = y;
  tagHeading(doc, 2, () => textLine(doc, heading, x, cy, { size: 8.5, face: 'bold' }));
  cy += 13;
  // The note says why the list is empty, or what it lists (e.g. the limit a shift passed).
  if (!items.length || note)
    cy += textBlock(doc, note ?? 'None.', x, cy, width, { size: 7.8, color: INK.muted }, 40) + 2;
  if (!items.length) return cy - y;
  for (const it of items.slice(0, LIST_LINES)) {
    const line = `${it.code}  ${it.name} — ${it.text}`;
    cy += textBlock(doc, line, x, cy, width, { size: 7.8, lineGap: 0.3 }, 20) + 2;
  }
  if (items.length > LIST_LINES) {
    cy +=
      textBlock(
        doc,
        `… and ${items.length - LIST_LINES} more ${more}.`,
        x,
        cy,
        width,
        { size: 7.5, color: INK.muted },
        20,
      ) + 2;
  }
  return cy - y;
}

function summaryPage(doc: PDFKit.PDFDocument, c: RegionBriefContent): void {
  const g = geometry(doc);
  const x = g.left;
  const width = g.contentWidth;
  let y = pageTop(doc, c.subtitle);
  tagHeading(doc, 1, () => textLine(doc, 'Region brief', x, y, { size: 20, face: 'bold' }));
  y += 28;
  y += textBlock(doc, c.headline, x, y, width, { size: 10.5, lineGap: 1.2 }, 44) + 8;

  // Counts per standing, one box each.
  const boxes = c.counts;
  const gap = 6;
  const bw = (width - gap * (boxes.length - 1)) / boxes.length;
  boxes.forEach((b, i) => {
    const bx = x + i * (bw + gap);
    fillRect(doc, bx, y, bw, 40, INK.fill);
    textLine(doc, countIn(c, b.count), bx + 7, y + 5, {
      size: 15,
      face: 'bold',
      color: b.count ? INK.text : INK.muted,
    });
    textBlock(doc, b.label, bx + 7, y + 24, bw - 10, { size: 6.6, color: INK.muted }, 16);
  });
  y += 50;

  // With boundaries loaded, the standings map takes a third column beside the two lists.
  const map = c.map ?? null;
  const mapW = map ? map.width : 0;
  const colW = (width - 16 - (map ? mapW + 16 : 0)) / 2;
  const hLeft = list(
    doc,
    'Crossed since the last publish',
    c.crossed,
    c.crossedNote,
    'in the alerts of this run',
    x,
    y,
    colW,
  );
  const hRight = list(doc, 'Largest threshold shifts', c.shifts, c.shiftsNote, 'in the table', x + colW + 16, y, colW);
  let hMap = 0;
  if (map) {
    const mx = x + width - mapW;
    tagHeading(doc, 2, () => textLine(doc, map.title, mx, y, { size: 8.5, face: 'bold' }));
    drawScene(doc, map, mx, y + 14);
    hMap = 14 + map.height + 6;
  }
  y += Math.max(hLeft, hRight, hMap);
  y += 6;
  rule(doc, x, x + width, y);
  y += 8;

  // The regional pooled curve.
  tagHeading(doc, 2, () => textLine(doc, 'Regional pooled curve', x, y, { size: 8.5, face: 'bold' }));
  y += 13;
  const figs = c.pooled.figures;
  if (figs.length) {
    const fw = (width - 14 * (figs.length - 1)) / figs.length;
    let fh = 0;
    figs.forEach((f, i) => {
      const fx = x + i * (fw + 14);
      let h = textBlock(doc, f.label.toUpperCase(), fx, y, fw, { size: 6.8, face: 'bold', color: INK.muted });
      h += textBlock(doc, f.value, fx, y + h + 1, fw, { size: 11.5, face: 'bold' }) + 1;
      if (f.detail) h += textBlock(doc, f.detail, fx, y + h + 1, fw, { size: 6.8, color: INK.muted, lineGap: 0.4 }, 26);
      fh = Math.max(fh, h);
    });
    y += fh + 8;
  }
  // The model line, then who publishes each series it reads (and under which terms).
  const bottomModel = `Model. ${c.modelLine}${c.sources?.length ? `\nSources. ${sourcesSentence(c.sources)}` : ''}`;
  const modelStyle: TextStyle = { size: 6.8, color: INK.muted, lineGap: 0.4 };
  const cautionsH = cautionsBox(doc, c.cautions, x, 0, width, false);
  const cautionsY = g.height - FOOTER_HEIGHT - 6 - cautionsH;
  const modelH = Math.min(measure(doc, bottomModel, width, modelStyle), 52);
  const modelY = cautionsY - 6 - modelH;
  if (c.pooled.chart) {
    const chart = c.pooled.chart;
    const scale = Math.min(1, (modelY - 8 - y - 12) / chart.height, width / chart.width);
    if (scale > 0.45) {
      tagged(
        doc,
        'Figure',
        () => {
          doc.save();
          doc.translate(x, y);
          doc.scale(scale);
          drawScene(doc, chart, 0, 0);
          doc.restore();
        },
        undefined,
        { alt: chart.description || chart.title },
      );
      y += chart.height * scale + 4;
    }
  }
  if (c.pooled.note)
    y += textBlock(doc, c.pooled.note, x, y, width, { size: 7, color: INK.muted }, Math.max(0, modelY - 4 - y));
  textBlock(doc, bottomModel, x, modelY, width, modelStyle, 52);
  cautionsBox(doc, c.cautions, x, cautionsY, width);
}

interface Column {
  key: keyof RegionBriefRow;
  label: string;
  x: number;
  width: number;
}

function columns(c: RegionBriefContent, x: number, width: number): Column[] {
  let cx = x;
  return c.table.columns.map((col) => {
    const w = COLUMN_SHARE[col.key] * width;
    const out = { key: col.key, label: col.label, x: cx, width: w };
    cx += w;
    return out;
  });
}

/**
 * The header row: on the table's first page a TR of TH cells (column scope); repeated on
 * later pages as page furniture (an artifact), so a reader hears the header once.
 */
function headerRow(
  doc: PDFKit.PDFDocument,
  cols: Column[],
  x: number,
  y: number,
  width: number,
  table: StructParent | null,
): number {
  const h = 16;
  fillRect(doc, x, y, width, h, INK.fill);
  const cell = (col: Column) =>
    textLine(
      doc,
      col.label,
      RIGHT_ALIGNED.has(col.key) ? col.x + col.width - 4 : col.x + 3,
      y + 4.8,
      HEAD,
      RIGHT_ALIGNED.has(col.key) ? 'end' : 'start',
    );
  if (table) {
    const tr = container(doc, 'TR', table);
    for (const col of cols) tagged(doc, 'TH', () => cell(col), tr, { scope: 'Column' });
    tr.end();
  } else {
    artifact(doc, () => cols.forEach(cell), 'Pagination');
  }
  rule(doc, x, x + width, y + h, INK.muted, 0.6);
  return h;
}

/** A row ready to draw: its cells as drawn (printable), their widths, and its height. */
interface PreparedRow {
  cells: string[];
  widths: number[];
  lines: number;
  height: number;
}

/**
 * Measures every row once (widths of every cell, lines of a long name), so the table can
 * be paginated before anything is drawn: the page count is known up front, each page gets
 * its footer as it is drawn, and pdfkit writes finished pages out instead of holding all.
 */
function prepareRows(doc: PDFKit.PDFDocument, c: RegionBriefContent, cols: Column[]): PreparedRow[] {
  doc.font('regular').fontSize(CELL.size);
  const lh = doc.currentLineHeight(true);
  return c.table.rows.map((row) => {
    const cells = cols.map((col) => printable(row[col.key]));
    const widths = cells.map((t) => doc.widthOfString(t));
    let lines = 1;
    cols.forEach((col, k) => {
      if (widths[k] <= col.width - 6) return;
      const need =
        col.key === 'name' ? Math.ceil(doc.heightOfString(cells[k], { width: col.width - 6 }) / lh - 0.01) : 2;
      lines = Math.max(lines, Math.min(NAME_LINES, need));
    });
    return { cells, widths, lines, height: lines * lh + 2 * ROW_PAD };
  });
}

/** Start and end (exclusive) of the rows on each table page. */
function paginate(rows: PreparedRow[], firstY: number, bottom: number): [number, number][] {
  const pages: [number, number][] = [];
  let start = 0;
  let y = firstY;
  rows.forEach((r, i) => {
    if (y + r.height > bottom && i > start) {
      pages.push([start, i]);
      start = i;
      y = firstY;
    }
    y += r.height;
  });
  pages.push([start, rows.length]);
  return pages;
}

/** Where the header row of a table page starts: under the page top and the table title. */
const TABLE_TOP = PAGE_TOP_END + 17;

function drawRow(
  doc: PDFKit.PDFDocument,
  r: PreparedRow,
  cols: Column[],
  y: number,
  shaded: boolean,
  x: number,
  width: number,
  table: StructParent,
): void {
  if (shaded) fillRect(doc, x, y, width, r.height, '#FAF8F3');
  doc.font('regular').fontSize(CELL.size).fillColor(INK.text);
  const lh = doc.currentLineHeight(true);
  const tr = container(doc, 'TR', table);
  cols.forEach((col, k) => tagged(doc, 'TD', () => drawCell(col, k), tr));
  tr.end();
  function drawCell(col: Column, k: number): void {
    doc.font('regular').fontSize(CELL.size).fillColor(INK.text);
    const t = r.cells[k];
    const right = RIGHT_ALIGNED.has(col.key);
    if (r.widths[k] <= col.width - 6) {
      doc.text(t, right ? col.x + col.width - 3 - r.widths[k] : col.x + 3, y + ROW_PAD, { lineBreak: false });
    } else {
      doc.text(t, col.x + 3, y + ROW_PAD, {
        width: col.width - 6,
        height: r.lines * lh + 0.5,
        ellipsis: '…',
        align: right ? 'right' : 'left',
      });
    }
  }
}

export async function renderRegionPdf(c: RegionBriefContent): Promise<Buffer> {
  const { doc, done } = createBriefDocument(c.paperSize, {
    title: `Region brief · run #${c.trace.runId}`,
    subject: `Crestwatch region brief, run #${c.trace.runId}`,
    lang: c.trace.locale,
  });
  const g = geometry(doc);
  const x = g.left;
  const width = g.contentWidth;
  const cols = columns(c, x, width);
  const rows = prepareRows(doc, c, cols);
  const bottom = g.height - FOOTER_HEIGHT - 8;
  const pages = paginate(rows, TABLE_TOP + 16 + 2, bottom);
  const total = 1 + pages.length;

  summaryPage(doc, c);
  footer(doc, c.trace, 1, total);
  // One Table structure element across the table's pages (PDF 1.7 §14.8.4.3.4).
  let table: StructParent | null = null;
  for (let p = 0; p < pages.length; p++) {
    const [from, to] = pages[p];
    // Let the server answer other requests (and the collector work) between pages.
    await new Promise((resolve) => setImmediate(resolve));
    doc.addPage();
    let y = pageTop(doc, c.subtitle);
    const tableTitle = () => textLine(doc, p === 0 ? 'All districts' : 'All districts (continued)', x, y, HEADING);
    if (p === 0) tagHeading(doc, 2, tableTitle);
    else artifact(doc, tableTitle, 'Pagination');
    y += 17;
    const first = table === null;
    table ??= container(doc, 'Table');
    y += headerRow(doc, cols, x, y, width, first ? table : null) + 2;
    for (let i = from; i < to; i++) {
      drawRow(doc, rows[i], cols, y, i % 2 === 1, x, width, table);
      y += rows[i].height;
    }
    if (p === pages.length - 1) {
      table.end();
      rule(doc, x, x + width, y, INK.muted, 0.6);
      if (y + 14 < bottom)
        textLine(
          doc,
          `${countIn(c, c.table.rows.length)} districts. Gap: income now against the threshold. “Regional curve”: the pooled curve stands in for a short series.`,
          x,
          y + 5,
          { size: 6.8, color: INK.muted },
        );
    }
    footer(doc, c.trace, p + 2, total);
  }
  doc.end();
  return done;
}
