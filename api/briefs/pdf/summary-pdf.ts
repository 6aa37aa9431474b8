/**
 * The district summary brief as PDF: a first page with every track's standing side by side
 * (a table: track and indicator, standing, gap, threshold, projected crossing, run), then
 * each track's own district brief, one page each.
 */
import type { DistrictSummaryContent } from '../summary-content';
import { drawDistrictPage } from './district-pdf';
import {
  artifact,
  cautionsBox,
  container,
  createBriefDocument,
  FOOTER_HEIGHT,
  geometry,
  heading,
  INK,
  measure,
  pageTop,
  rule,
  tagged,
  textBlock,
  textLine,
  type TextStyle,
} from './page';

const COLUMNS: {
  key: 'track' | 'standing' | 'gap' | 'threshold' | 'crossing' | 'run';
  label: string;
  share: number;
}[] = [
  { key: 'track', label: 'Track', share: 0.27 },
  { key: 'standing', label: 'Standing', share: 0.16 },
  { key: 'gap', label: 'Gap', share: 0.08 },
  { key: 'threshold', label: 'Threshold', share: 0.19 },
  { key: 'crossing', label: 'Projected crossing', share: 0.13 },
  { key: 'run', label: 'Published run', share: 0.17 },
];

function summaryPage(doc: PDFKit.PDFDocument, c: DistrictSummaryContent, pages: number): void {
  const g = geometry(doc);
  const x = g.left;
  const width = g.contentWidth;
  let y = pageTop(doc, c.subtitle);
  y += heading(doc, 1, () => textBlock(doc, c.name, x, y, width, { size: 18, face: 'bold', lineGap: 1 }, 48)) + 6;
  y += textBlock(doc, c.headline, x, y, width, { size: 10.5, lineGap: 1.2 }, 60) + 12;
  const head: TextStyle = { size: 6.8, face: 'bold', color: INK.muted };
  const cell: TextStyle = { size: 8.3, lineGap: 0.5 };
  const small: TextStyle = { size: 7, color: INK.muted, lineGap: 0.4 };
  const gap = 6;
  const cols = COLUMNS.map((col, i) => ({
    ...col,
    x: x + COLUMNS.slice(0, i).reduce((sum, c2) => sum + c2.share * width, 0),
    w: col.share * width - gap,
  }));
  // The tracks side by side as a Table: a header row of TH, a TR of TD per track.
  const table = container(doc, 'Table');
  const headTr = container(doc, 'TR', table);
  for (const col of cols)
    tagged(doc, 'TH', () => textLine(doc, col.label.toUpperCase(), col.x, y, head), headTr, { scope: 'Column' });
  headTr.end();
  y += 11;
  rule(doc, x, x + width, y);
  y += 5;
  for (const row of c.rows) {
    const texts: Record<string, string> = {
      track: row.track.name,
      standing: row.standing,
      gap: row.gap,
      threshold: row.threshold,
      crossing: row.crossing,
      run: row.run,
    };
    const heights = cols.map((col) =>
      col.key === 'track'
        ? measure(doc, texts.track, col.w, { ...cell, face: 'bold' }) + 1 + measure(doc, row.indicator, col.w, small)
        : measure(doc, texts[col.key], col.w, col.key === 'standing' ? { ...cell, face: 'bold' } : cell),
    );
    const tr = container(doc, 'TR', table);
    for (const col of cols) {
      tagged(
        doc,
        'TD',
        () => {
          if (col.key === 'track') {
            const h = textBlock(doc, texts.track, col.x, y, col.w, { ...cell, face: 'bold' });
            textBlock(doc, row.indicator, col.x, y + h + 1, col.w, small);
          } else {
            textBlock(doc, texts[col.key], col.x, y, col.w, col.key === 'standing' ? { ...cell, face: 'bold' } : cell);
          }
        },
        tr,
      );
    }
    tr.end();
    y += Math.max(...heights) + 6;
    rule(doc, x, x + width, y - 3);
  }
  table.end();
  y += 8;
  textBlock(doc, c.note, x, y, width, { size: 8, color: INK.text, lineGap: 0.6 });
  const cautionsH = cautionsBox(doc, c.cautions, x, 0, width, false);
  cautionsBox(doc, c.cautions, x, g.height - FOOTER_HEIGHT - 6 - cautionsH, width);
  // The first page's footer: no single run stands behind it (each row names its own).
  artifact(doc, () => firstFooter(doc, c, pages), 'Pagination');
}

function firstFooter(doc: PDFKit.PDFDocument, c: DistrictSummaryContent, pages: number): void {
  const g = geometry(doc);
  const x = g.left;
  const width = g.contentWidth;
  const fy = g.height - FOOTER_HEIGHT + 4;
  rule(doc, g.left, g.right, fy);
  const s: TextStyle = { size: 6.5, color: INK.muted };
  textBlock(
    doc,
    `Generated on ${c.generatedAt}; each row read from its track’s latest published run.`,
    x,
    fy + 4,
    width - 60,
    s,
    8,
  );
  textLine(doc, `Page 1 of ${pages}`, g.right, fy + 4, { ...s, face: 'bold' }, 'end');
}

export async function renderSummaryPdf(c: DistrictSummaryContent): Promise<Buffer> {
  const { doc, done } = createBriefDocument(c.paperSize, {
    title: `${c.name} (${c.code}) · district summary`,
    subject: `Crestwatch district summary, ${c.rows.length} tracks`,
    lang: c.locale,
  });
  const pages = 1 + c.pages.length;
  summaryPage(doc, c, pages);
  c.pages.forEach((p, i) => {
    doc.addPage();
    drawDistrictPage(doc, p, i + 2, pages);
  });
  doc.end();
  return done;
}
