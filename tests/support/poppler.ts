/**
 * Reading PDFs back with poppler-utils (pdfinfo, pdftotext, pdffonts, pdftoppm), the way
 * a reader's viewer would: page count and size, the text in reading order, word boxes,
 * the fonts embedded, and page images for people to look at.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export const ARTIFACTS = path.resolve(__dirname, '..', 'artifacts', 'briefs');

const run = (cmd: string, args: string[]) => execFileSync(cmd, args, { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });

/** Writes the PDF into the artifacts folder and returns its path. */
export function savePdf(name: string, pdf: Buffer): string {
  mkdirSync(ARTIFACTS, { recursive: true });
  const file = path.join(ARTIFACTS, `${name}.pdf`);
  writeFileSync(file, pdf);
  return file;
}

export interface PdfInfo {
  pages: number;
  width: number;
  height: number;
  title: string | null;
}

export function pdfInfo(file: string): PdfInfo {
  const out = run('pdfinfo', [file]);
  const pages = Number(/^Pages:\s+(\d+)/m.exec(out)?.[1]);
  const size = /^Page size:\s+([\d.]+) x ([\d.]+) pts/m.exec(out);
  return {
    pages,
    width: Number(size?.[1]),
    height: Number(size?.[2]),
    title: /^Title:\s+(.*)$/m.exec(out)?.[1] ?? null,
  };
}

/** Text of the given pages (all by default), in reading order. */
export function pdfText(file: string, page?: { first: number; last: number }): string {
  const range = page ? ['-f', String(page.first), '-l', String(page.last)] : [];
  return run('pdftotext', ['-enc', 'UTF-8', ...range, file, '-']);
}

/** Text as one line: whitespace collapsed, and no break kept after a hyphen, dash or slash. */
export function flat(text: string): string {
  return text
    .replace(/\s+/g, ' ')
    .replace(/([-–/]) /g, '$1')
    .trim();
}

export interface WordBox {
  page: number;
  xMin: number;
  yMin: number;
  xMax: number;
  yMax: number;
  text: string;
}

/** Every word with its box (points, origin top left), from `pdftotext -bbox`. */
export function pdfWords(file: string): WordBox[] {
  const html = run('pdftotext', ['-bbox', '-enc', 'UTF-8', file, '-']);
  const words: WordBox[] = [];
  let page = 0;
  const decode = (s: string) =>
    s
      .replace(/&lt;/g, '<')
      .replace(/&gt;/g, '>')
      .replace(/&quot;/g, '"')
      .replace(/&#39;/g, "'")
      .replace(/&amp;/g, '&');
  for (const line of html.split('\n')) {
    if (line.includes('<page ')) page++;
    const m = /<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">(.*)<\/word>/.exec(line);
    if (m)
      words.push({
        page,
        xMin: Number(m[1]),
        yMin: Number(m[2]),
        xMax: Number(m[3]),
        yMax: Number(m[4]),
        text: decode(m[5]),
      });
  }
  return words;
}

export interface PdfFont {
  name: string;
  type: string;
  embedded: boolean;
  subset: boolean;
  unicode: boolean;
}

export function pdfFonts(file: string): PdfFont[] {
  const lines = run('pdffonts', [file])
    .split('\n')
    .slice(2)
    .filter((l) => l.trim());
  return lines.map((l) => {
    const cols = l.trim().split(/\s+/);
    // name type… encoding emb sub uni object ID
    const [emb, sub, uni] = cols.slice(-5, -2);
    return {
      name: cols[0],
      type: cols.slice(1, -6).join(' '),
      embedded: emb === 'yes',
      subset: sub === 'yes',
      unicode: uni === 'yes',
    };
  });
}

/** Renders page 1 to `<name>.png` in the artifacts folder; returns its path. */
export function renderFirstPage(file: string, name: string, dpi = 100): string {
  const base = path.join(ARTIFACTS, name);
  run('pdftoppm', ['-png', '-r', String(dpi), '-f', '1', '-l', '1', '-singlefile', file, base]);
  return `${base}.png`;
}
