/**
 * Browser test of tables that fold: at a phone viewport (390×844) every screen with a data
 * table — runs, run review and one district's variants, uploads, an upload's detail (problems and what it changes),
 * people, audit, the boundary screen (problems, dry run, versions), a district's yearly
 * values and the region brief — shows its rows as cards and nothing on the page scrolls
 * sideways (WCAG 2.2 SC 1.4.10 Reflow: content at 320 CSS px needs no scrolling in two
 * dimensions; 390 px is the phone the app is designed for). At 1440×900 the same screens
 * still show tables. Screenshots at both sizes are kept under tests/artifacts/screenshots.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEMO } from '../support/auth';
import { offLoopback, root, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { signIn } from '../support/staff-steps';

jest.setTimeout(360_000);

const BAD_BOUNDARIES = path.join(root, 'assets', 'demo-data', 'boundaries-with-problems.geojson');
const GOOD_BOUNDARIES = path.join(root, 'assets', 'demo-data', 'boundaries.geojson');

let h: Harness;
let runId: number;
let csv: string;
beforeAll(async () => {
  h = await startHarness({ publishRun: true });
  const [run] = await h.t.db('runs').where({ state: 'published' }).orderBy('id', 'desc').limit(1).select('id');
  runId = Number(run.id);
  // A long-layout file whose one value jumps far beyond the stored one: the check warns
  // (a "large change"), so the upload has a problem to list and a preview to show.
  csv = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'fold-')), 'jump.csv');
  fs.writeFileSync(csv, 'district_code,indicator,year,value\nD03,emissions_pc,2021,99.5\nD04,emissions_pc,2021,2.5\n');
});
afterAll(async () => {
  if (csv) fs.rmSync(path.dirname(csv), { recursive: true, force: true });
  await h?.close();
});

type Overflow = { scrollWidth: number; innerWidth: number; scrollers: string[] };

/**
 * The page's width against the window's, and every element that scrolls sideways itself
 * (overflow-x auto or scroll with more content than room).
 */
async function overflow(page: Page): Promise<Overflow> {
  return page.evaluate(() => {
    const scrollers: string[] = [];
    for (const el of Array.from(document.querySelectorAll<HTMLElement>('body *'))) {
      const { overflowX } = getComputedStyle(el);
      if (overflowX !== 'auto' && overflowX !== 'scroll') continue;
      if (el.scrollWidth > el.clientWidth) {
        const id = el.closest('[data-testid]')?.getAttribute('data-testid') ?? '';
        scrollers.push(
          `${el.tagName.toLowerCase()} in ${id || 'the page'} (${el.scrollWidth} > ${el.clientWidth}${el.getAttribute('aria-label') ? `, "${el.getAttribute('aria-label')}"` : ''})`,
        );
      }
    }
    return { scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth, scrollers };
  });
}

/** The check above finds a box that scrolls sideways (so a pass means there was none). */
async function overflowIsSeen(page: Page): Promise<void> {
  await page.evaluate(() => {
    const box = document.createElement('div');
    box.id = 'fold-probe';
    box.style.cssText = 'overflow-x:auto;width:100px';
    box.innerHTML = '<div style="width:400px;height:4px"></div>';
    document.body.appendChild(box);
  });
  expect((await overflow(page)).scrollers).toEqual([expect.stringContaining('400 > 100')]);
  await page.evaluate(() => document.getElementById('fold-probe')?.remove());
  expect((await overflow(page)).scrollers).toEqual([]);
}

async function noSidewaysScroll(page: Page): Promise<void> {
  const o = await overflow(page);
  expect(o.scrollers).toEqual([]);
  expect(o.scrollWidth).toBeLessThanOrEqual(o.innerWidth);
}

/** The table (by its test id, or the table inside it) is folded into a list of cards, or is a table. */
async function shape(page: Page, testID: string): Promise<{ tables: number; lists: number; cards: number }> {
  return page
    .getByTestId(testID)
    .first()
    .evaluate((el) => {
      const within = (sel: string) => (el.matches(sel) ? 1 : 0) + el.querySelectorAll(sel).length;
      return {
        // The region brief's table is laid out for print (data-brief-table parts become a real table there).
        tables: within('[role="table"], [data-brief-table="table"]'),
        lists: within('[role="list"]'),
        cards: el.querySelectorAll('[role="listitem"]').length,
      };
    });
}

async function expectFolded(page: Page, testID: string, phone: boolean): Promise<void> {
  const s = await shape(page, testID);
  if (phone) {
    expect(s).toMatchObject({ tables: 0 });
    expect(s.cards).toBeGreaterThan(0);
  } else {
    expect(s.tables).toBeGreaterThan(0);
    expect(s.cards).toBe(0);
  }
}

async function shot(page: Page, name: string, at?: string): Promise<void> {
  if (at) await page.getByTestId(at).first().scrollIntoViewIfNeeded();
  await h.shot(page, name);
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.wide],
] as const)('at the %s viewport', (name, viewport) => {
  const phone = name === 'phone';

  it('folds the staff tables into cards on a phone, and nothing scrolls sideways', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, h.baseUrl, DEMO.admin);

      await page.goto(`${h.baseUrl}/runs`);
      await page.getByTestId(`run-row-${runId}`).waitFor();
      await overflowIsSeen(page);
      await expectFolded(page, 'runs-table', phone);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-runs`, 'runs-table');

      await page.goto(`${h.baseUrl}/runs/${runId}`);
      await page.getByTestId('review-row-D13').waitFor();
      await expectFolded(page, 'review-table', phone);
      await noSidewaysScroll(page);
      if (phone) {
        // Each card is a list item named by its visible title, the district's name.
        const card = page.getByTestId('review-row-D13');
        const label = (await card.getAttribute('aria-label'))!;
        expect(label.length).toBeGreaterThan(0);
        expect((await card.innerText()).trim().startsWith(label)).toBe(true);
        // Sorting without headers: by the threshold, highest first, a district without one last
        // (the order the Threshold header gives).
        await page.getByTestId('review-table-sort-by-threshold').click();
        await page.getByTestId('review-table-order-desc').click();
        await expect(page.getByTestId('review-table-order-desc').getAttribute('aria-checked')).resolves.toBe('true');
        const thresholds = await page
          .locator('[data-testid^="review-row-"]')
          .evaluateAll((cards) =>
            cards.map((c) => /\nThreshold[^\n]*\n([^\n]+)/.exec((c as HTMLElement).innerText)?.[1].trim() ?? ''),
          );
        expect(thresholds).toHaveLength(24);
        const levels = thresholds.map((t) => (t === '—' ? null : Number(t.replace(/,/g, ''))));
        expect(levels.every((v) => v === null || Number.isFinite(v))).toBe(true);
        const known = levels.filter((v): v is number => v !== null);
        expect(known.length).toBeGreaterThan(1);
        expect(known).toEqual([...known].sort((a, b) => b - a));
        expect(levels.slice(known.length).every((v) => v === null)).toBe(true);
        await shot(page, `fold-${name}-run-review-sort`, 'review-table-sort');
      }
      await shot(page, `fold-${name}-run-review`, 'review-row-D01');

      // One district of the run: its fits under each variant.
      await page.goto(`${h.baseUrl}/runs/${runId}?district=D13`);
      await page.getByTestId('variants').waitFor();
      // Cards at both sizes: beside the run's table at 1440 px the panel has about 400 px,
      // less than the variants' columns need (440), so there too they fold rather than scroll.
      await expectFolded(page, 'variants', true);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-run-district-variants`, 'variants');

      await page.goto(`${h.baseUrl}/uploads`);
      await page.getByTestId('uploads-screen').waitFor();
      const chooser = page.waitForEvent('filechooser');
      await page.getByTestId('upload-choose').click();
      await (await chooser).setFiles(csv);
      await page.getByTestId('upload-ready').waitFor();
      await noSidewaysScroll(page);
      await page.reload();
      await page.getByTestId('upload-history').waitFor();
      await expectFolded(page, 'upload-history', phone);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-uploads`, 'upload-history');

      const [upload] = await h.t.db('uploads').orderBy('id', 'desc').limit(1).select('id');
      await page.goto(`${h.baseUrl}/uploads/${upload.id}`);
      await page.getByTestId('problems').waitFor();
      await page.getByTestId('preview').waitFor();
      await expectFolded(page, 'problems', phone);
      await expectFolded(page, 'preview', phone);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-upload-detail`, 'problems');
      await shot(page, `fold-${name}-upload-detail-preview`, 'preview-district-D03');

      await page.goto(`${h.baseUrl}/people`);
      await page.getByTestId('people-list').waitFor();
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-people`, 'people-list');

      await page.goto(`${h.baseUrl}/audit`);
      await page.getByTestId('audit-list').waitFor();
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-audit`, 'audit-list');

      await page.goto(`${h.baseUrl}/uploads/boundaries`);
      await page.getByTestId('boundaries-screen').waitFor();
      const bad = page.waitForEvent('filechooser');
      await page.getByTestId('boundary-choose').click();
      await (await bad).setFiles(BAD_BOUNDARIES);
      await page.getByTestId('boundary-problems').waitFor();
      await expectFolded(page, 'boundary-problems', phone);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-boundary-problems`, 'boundary-problems');
      const good = page.waitForEvent('filechooser');
      await page.getByTestId('boundary-choose').click();
      await (await good).setFiles(GOOD_BOUNDARIES);
      await page.getByTestId('boundary-preview-D01').waitFor();
      await expectFolded(page, 'boundary-preview', phone);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-boundary-preview`, 'boundary-preview-D01');
      await page.getByTestId('boundary-commit').click();
      await page.getByTestId('boundary-done-ok').waitFor();
      await page.locator('[data-testid^="boundary-version-status-"]').first().waitFor();
      await expectFolded(page, 'boundary-versions', phone);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-boundary-versions`, 'boundary-versions');
    } finally {
      await context.close();
    }
  });

  it('folds the district’s yearly values and the region brief’s table for an official', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, h.baseUrl, DEMO.official);

      // D09 has no value at all for 2008 (the demo generator's missingYears): a band, folded or not.
      await page.goto(`${h.baseUrl}/district/D09`);
      await page.getByTestId('series-row-2008').waitFor();
      await expectFolded(page, 'series-table', phone);
      expect(await page.getByTestId('series-gap-row-2008').innerText()).toMatch(/no data this year/);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-district-series`, 'series-row-2005');

      await page.goto(`${h.baseUrl}/brief/region`);
      await page.getByTestId('region-brief').first().waitFor();
      await page.getByTestId('brief-table').first().waitFor();
      await expectFolded(page, 'brief-table', phone);
      await noSidewaysScroll(page);
      await shot(page, `fold-${name}-region-brief`, 'brief-table');
    } finally {
      await context.close();
    }
  });
});

it('sends no request beyond 127.0.0.1', () => {
  expect(offLoopback(h.requests)).toEqual([]);
});
