/**
 * Browser test of briefs over a published run: at a phone viewport an official opens a
 * district card, its Brief link is the PDF (new tab) and the PDF arrives; the print-friendly
 * views /brief/D24 and /brief/region show the brief content with its charts as SVG; and
 * printing them (Chromium's print-to-PDF, print media) gives the brief alone — no app
 * header, no buttons — read back with pdftotext. Screenshots and printed PDFs are kept
 * under tests/artifacts/. No request may leave 127.0.0.1.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import type { DistrictBriefContent, RegionBriefContent } from '../../contracts/briefs';
import { DEMO } from '../support/auth';
import { artifactsDir, offLoopback, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { flat, pdfInfo, pdfText, pdfWords, renderFirstPage, savePdf } from '../support/poppler';

jest.setTimeout(240_000);

let h: Harness;
beforeAll(async () => {
  h = await startHarness({ publishRun: true });
});
afterAll(async () => h?.close());

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(email)}`);
  await page.waitForURL(`${h.baseUrl}/`);
}

async function printed(page: Page, name: string, format: 'A4' | 'Letter'): Promise<string> {
  await page.emulateMedia({ media: 'print' });
  const pdf = await page.pdf({ format, printBackground: true, preferCSSPageSize: true });
  await page.emulateMedia({ media: 'screen' });
  return savePdf(name, pdf);
}

describe('briefs in the browser', () => {
  it('gives an official on a phone the district brief as PDF from the card', async () => {
    const { context, page } = await h.newPage(VIEWPORTS.phone);
    try {
      await signIn(page, DEMO.official);
      await page.goto(`${h.baseUrl}/district/D01`);
      const link = page.getByTestId('district-brief-link');
      await link.waitFor();
      // The card's brief is of the track it shows (the headline one here): the link carries it.
      const anchor = page.locator('a[href^="/api/briefs/district/D01.pdf?track="]');
      expect(await anchor.count()).toBeGreaterThan(0);
      expect(await anchor.first().getAttribute('target')).toBe('_blank');
      const res = await page.request.get(`${h.baseUrl}/api/briefs/district/D01.pdf`);
      expect(res.status()).toBe(200);
      expect(res.headers()['content-type']).toMatch(/^application\/pdf/);
      const file = savePdf('browser-D01', Buffer.from(await res.body()));
      expect(pdfInfo(file).pages).toBe(1);
      expect(flat(pdfText(file))).toContain('Amberlyn Reach');
    } finally {
      await context.close();
    }
  });

  it.each([
    ['phone', VIEWPORTS.phone],
    ['wide', VIEWPORTS.wide],
  ] as const)(
    'shows the district brief as a page at the %s viewport, and prints the brief alone',
    async (name, viewport) => {
      const { context, page } = await h.newPage(viewport);
      try {
        await signIn(page, DEMO.official);
        const content = (await (
          await page.request.get(`${h.baseUrl}/api/briefs/district/D24`)
        ).json()) as DistrictBriefContent;
        await page.goto(`${h.baseUrl}/brief/D24`);
        const brief = page.getByTestId('district-brief').first();
        await brief.waitFor();
        await page.getByRole('heading', { name: content.name }).first().waitFor();
        // The figures as the server worded them.
        for (const f of content.figures)
          expect(await brief.getByTestId(`brief-figure-${f.key}`).innerText()).toContain(f.value);
        // Both charts drawn as SVG from their scenes.
        // (A path can be a flat line with an empty box, which the browser calls hidden: wait for the svg.)
        await page.locator('[data-testid="brief-curve-chart"] svg').first().waitFor();
        const paths = await page.locator('[data-testid="brief-curve-chart"]').first().locator('svg path').count();
        expect(paths).toBeGreaterThan(5);
        expect(await page.locator('a[href^="/api/briefs/district/D24.pdf?track="]').count()).toBeGreaterThan(0);
        await page.screenshot({ path: path.join(artifactsDir, `${name}-brief-D24.png`), fullPage: true });

        const file = await printed(page, `print-${name}-D24`, 'A4');
        const text = flat(pdfText(file));
        expect(text).toContain(flat(content.name));
        expect(text).toContain(flat(content.headline));
        expect(text).toContain(flat(content.trace.line));
        for (const c of content.cautions) expect(text).toContain(flat(c));
        // Only the brief: not the app's header, navigation or the page's own buttons.
        for (const word of ['Open the PDF', 'Sign out', 'District card']) expect(text).not.toContain(word);
        renderFirstPage(file, `print-${name}-D24`);
      } finally {
        await context.close();
      }
    },
  );

  it('prints the region brief with the table header on every page that has rows', async () => {
    const { context, page } = await h.newPage(VIEWPORTS.wide);
    try {
      await signIn(page, DEMO.official);
      const content = (await (await page.request.get(`${h.baseUrl}/api/briefs/region`)).json()) as RegionBriefContent;
      await page.goto(`${h.baseUrl}/brief/region`);
      await page.getByTestId('region-brief').first().waitFor();
      await page.locator('[data-testid="brief-pooled-chart"] svg').first().waitFor();
      await page.screenshot({ path: path.join(artifactsDir, 'wide-brief-region.png'), fullPage: false });
      // Asked for Letter, printed on the settings' paper: the page's @page rule (A4 by
      // default, 595 × 842 pt) wins, so the print style sheet is in force.
      expect(content.paperSize).toBe('A4');
      const file = await printed(page, 'print-region', 'Letter');
      const info = pdfInfo(file);
      expect([Math.round(info.width), Math.round(info.height)]).toEqual([595, 842]);
      const all = flat(pdfText(file));
      for (const row of content.table.rows) expect(all).toContain(row.code);
      // Every page that carries rows starts them under the header row: the column titles
      // side by side on one line, above the page's first district code.
      const words = pdfWords(file);
      const codes = new Set(content.table.rows.map((r) => r.code));
      let pagesWithRows = 0;
      for (let p = 1; p <= info.pages; p++) {
        const onPage = words.filter((w) => w.page === p);
        const rows = onPage.filter((w) => codes.has(w.text));
        if (!rows.length) continue;
        pagesWithRows++;
        const head = ['Code', 'District', 'Standing', 'Gap', 'Threshold', 'Crossing'].map((t) =>
          onPage.find((w) => w.text === t),
        );
        expect(head.every(Boolean)).toBe(true);
        for (const w of head) expect(Math.abs(w!.yMin - head[0]!.yMin)).toBeLessThan(2);
        expect(Math.min(...rows.map((w) => w.yMin))).toBeGreaterThan(head[0]!.yMin);
      }
      expect(pagesWithRows).toBeGreaterThan(0);
      expect(all).not.toContain('Open the PDF');
      renderFirstPage(file, 'print-region');
    } finally {
      await context.close();
    }
  });

  it('sends no request beyond 127.0.0.1', () => {
    expect(h.requests.length).toBeGreaterThan(10);
    expect(offLoopback(h.requests)).toEqual([]);
  });
});
