/**
 * The district brief as one PDF page (A4 or US Letter): the name, the standing, the
 * headline, six figures, the curve and path charts as vectors, the reading, the analyst's
 * note, the model line, the cautions and the trace footer. Blocks below the charts are
 * fitted into the room left above the bottom-anchored model line, cautions and footer, so
 * the brief never runs onto a second page.
 */
import type { BriefFigure, DistrictBriefContent } from '../../../contracts/briefs';
import { CHART_WIDTH } from '../district-content';
import { sourcesSentence } from '../trace';
import {
  cautionsBox,
  chip,
  createBriefDocument,
  drawScene,
  footer,
  FOOTER_HEIGHT,
  geometry,
  heading,
  INK,
  measure,
  pageTop,
  rule,
  textBlock,
  textLine,
  type TextStyle,
} from './page';

/** Title sizes tried in turn, with the most lines each may take. */
const TITLE_STEPS: { size: number; lines: number }[] = [
  { size: 20, lines: 1 },
  { size: 17, lines: 2 },
  { size: 14, lines: 2 },
  { size: 12, lines: 3 },
  { size: 10.5, lines: 4 },
];

const STANDING_COLOUR: Record<string, string> = {
  approaching: '#1F5A60',
  at_turn: '#B06A00',
  past_turn: '#2F6B3A',
  no_turn: '#4D5E63',
  not_estimable: '#9A4523',
};

/** The name at the largest size that fits its line budget; returns the height used. */
function title(doc: PDFKit.PDFDocument, name: string, x: number, y: number, width: number): number {
  for (const step of TITLE_STEPS) {
    const s: TextStyle = { size: step.size, face: 'bold', lineGap: 1 };
    const h = measure(doc, name, width, s);
    const line = step.size * 1.21 + 1;
    if (h <= step.lines * line + 0.5 || step === TITLE_STEPS[TITLE_STEPS.length - 1]) {
      return heading(doc, 1, () => textBlock(doc, name, x, y, width, s, step.lines * line + 0.5));
    }
  }
  return 0;
}

function figureCell(
  doc: PDFKit.PDFDocument,
  f: BriefFigure,
  x: number,
  y: number,
  width: number,
  draw: boolean,
): number {
  const label: TextStyle = { size: 6.8, face: 'bold', color: INK.muted };
  const value: TextStyle = { size: 12.5, face: 'bold', color: INK.text };
  const detail: TextStyle = { size: 7, color: INK.muted, lineGap: 0.4 };
  const lh = measure(doc, f.label.toUpperCase(), width, label);
  const vh = measure(doc, f.value, width, value);
  const dh = f.detail ? Math.min(measure(doc, f.detail, width, detail), 36) : 0;
  if (draw) {
    textBlock(doc, f.label.toUpperCase(), x, y, width, label);
    textBlock(doc, f.value, x, y + lh + 1, width, value);
    if (f.detail) textBlock(doc, f.detail, x, y + lh + vh + 2, width, detail, 36);
  }
  return lh + vh + 2 + dh;
}

function figures(doc: PDFKit.PDFDocument, list: BriefFigure[], x: number, y: number, width: number): number {
  const cols = 3;
  const gap = 14;
  const w = (width - gap * (cols - 1)) / cols;
  let cy = y;
  for (let i = 0; i < list.length; i += cols) {
    const row = list.slice(i, i + cols);
    const h = Math.max(...row.map((f) => figureCell(doc, f, 0, 0, w, false)));
    row.forEach((f, j) => figureCell(doc, f, x + j * (w + gap), cy, w, true));
    cy += h + 9;
  }
  return cy - y;
}

export async function renderDistrictPdf(c: DistrictBriefContent): Promise<Buffer> {
  const { doc, done } = createBriefDocument(c.paperSize, {
    title: `${c.name} (${c.code}) · district brief`,
    subject: `Crestwatch district brief, run #${c.trace.runId}`,
    lang: c.trace.locale,
  });
  drawDistrictPage(doc, c);
  doc.end();
  return done;
}

/** One district brief on the current page (page `page` of `pages`: the summary brief adds pages). */
export function drawDistrictPage(doc: PDFKit.PDFDocument, c: DistrictBriefContent, page = 1, pages = 1): void {
  const g = geometry(doc);
  const x = g.left;
  const width = g.contentWidth;

  // Bottom-anchored blocks first: footer, cautions, model line.
  footer(doc, c.trace, page, pages);
  const cautionsH = cautionsBox(doc, c.cautions, x, 0, width, false);
  const cautionsY = g.height - FOOTER_HEIGHT - 6 - cautionsH;
  const modelStyle: TextStyle = { size: 6.8, color: INK.muted, lineGap: 0.4 };
  const modelH = Math.min(measure(doc, `Model. ${c.modelLine}`, width, modelStyle), 28);
  const modelY = cautionsY - 6 - modelH;
  // Who publishes each series the model reads, and under which terms.
  const sourcesText = c.sources?.length ? `Sources. ${sourcesSentence(c.sources)}` : '';
  const sourcesH = sourcesText ? Math.min(measure(doc, sourcesText, width, modelStyle), 26) : 0;
  const sourcesY = modelY - (sourcesH ? 4 + sourcesH : 0);
  const limit = sourcesY - 6;
  // Placed first, drawn last: the structure tree follows the reading order (PDF 1.7 §14.8.2.3).
  const bottomBlocks = () => {
    if (sourcesText) textBlock(doc, sourcesText, x, sourcesY, width, modelStyle, 26);
    textBlock(doc, `Model. ${c.modelLine}`, x, modelY, width, modelStyle, 28);
    cautionsBox(doc, c.cautions, x, cautionsY, width);
  };

  let y = pageTop(doc, c.subtitle);
  // The locator sits at the top right, beside the name, the standing and the headline.
  const locator = c.locator ?? null;
  const locatorBottom = locator ? y + locator.height + 10 : 0;
  if (locator) drawScene(doc, locator, x + width - locator.width, y);
  const textW = locator ? width - locator.width - 12 : width;
  y += title(doc, c.name, x, y, textW) + 4;
  const chipW = chip(doc, c.standing.label, x, y, STANDING_COLOUR[c.standing.key] ?? INK.accent);
  if (c.standing.note)
    textLine(doc, c.standing.note, x + chipW + 8, y + 3.5, { size: 7.5, face: 'bold', color: INK.warn });
  y += 20;
  y += textBlock(doc, c.headline, x, y, textW, { size: 10.5, lineGap: 1.2 }, 58) + 10;
  y = Math.max(y, locatorBottom);
  rule(doc, x, x + width, y - 4);
  y += figures(doc, c.figures, x, y + 3, width) + 2;

  // The two charts side by side, each under its title.
  const gap = width - 2 * CHART_WIDTH;
  const charts = [c.charts.curve, c.charts.path];
  charts.forEach((scene, i) => {
    const cx = x + i * (CHART_WIDTH + gap);
    heading(doc, 2, () => textLine(doc, scene.title, cx, y, { size: 8.5, face: 'bold' }));
    drawScene(doc, scene, cx, y + 14);
  });
  y += 14 + Math.max(c.charts.curve.height, c.charts.path.height) + 10;

  const room = () => Math.max(0, limit - y);
  if (c.substitute) {
    const s: TextStyle = { size: 7.5, face: 'bold', color: INK.warn };
    y += textBlock(doc, c.substitute, x, y, width, s, room()) + 5;
  }
  if (room() > 20) {
    heading(doc, 2, () => textLine(doc, 'Reading', x, y, { size: 8.5, face: 'bold' }));
    y += 12;
    for (const line of c.reading) {
      const h = textBlock(doc, `•  ${line}`, x, y, width, { size: 8.3, lineGap: 0.8 }, room());
      y += h + 2;
    }
    y += 4;
  }
  if (c.correctionNotice && room() > 20) {
    heading(doc, 2, () => textLine(doc, 'Correction', x, y, { size: 8.5, face: 'bold' }));
    y += 12;
    y += textBlock(doc, c.correctionNotice, x, y, width, { size: 8, lineGap: 0.6, color: INK.text }, room()) + 4;
  }
  if (c.analystNote && room() > 20) {
    heading(doc, 2, () => textLine(doc, 'Analyst’s note for this run', x, y, { size: 8.5, face: 'bold' }));
    y += 12;
    y += textBlock(doc, c.analystNote, x, y, width, { size: 8, lineGap: 0.6, color: INK.text }, room()) + 4;
  }
  bottomBlocks();
}
