/**
 * Browser test of the boundary upload screen, at a phone and a wide viewport: an analyst
 * opens it from the Uploads screen, chooses the demo file with two deliberate problems and
 * sees both by feature, code and reason (nothing loadable); asks for the ST_MakeValid repair
 * and sees the crossing ring repaired while the unknown code still stops the file; then
 * chooses the good demo file, sees its dry run, loads it, sees the version in force in the
 * history and the map drawn on the region view, and reverts it. Screenshots are kept under
 * tests/artifacts/screenshots.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEMO } from '../support/auth';
import { offLoopback, root, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { openSection, signIn } from '../support/staff-steps';

jest.setTimeout(240_000);

const GOOD = path.join(root, 'assets', 'demo-data', 'boundaries.geojson');
const BAD = path.join(root, 'assets', 'demo-data', 'boundaries-with-problems.geojson');

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => h?.close());

async function chooseFile(page: Page, file: string): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('boundary-choose').click();
  await (await chooser).setFiles(file);
}

/** The problem table's column headers, which a card (phones) shows beside each value. */
const FIELD_LABELS = new Set(['Code', 'Kind', 'Problem', 'What is wrong']);

/**
 * The problem rows as lists of texts: feature, code, kind, problem, reason. Wide screens show
 * a table (feature "6"), phones cards ("Feature 6", each value under its label): both read as "6".
 */
async function problemRows(page: Page): Promise<string[][]> {
  const rows = await page.locator('[data-testid^="boundary-problem-"]').allInnerTexts();
  return rows
    .map((r) =>
      r
        .split('\n')
        .map((c) => c.trim())
        .filter((c) => c && !FIELD_LABELS.has(c)),
    )
    .filter((cells) => cells.includes('Error') || cells.includes('Warning'))
    .map(([first, ...rest]) => [first.replace(/^Feature /, ''), ...rest]);
}

async function noHorizontalOverflow(page: Page): Promise<void> {
  const { scroll, inner } = await page.evaluate(() => ({
    scroll: document.documentElement.scrollWidth,
    inner: window.innerWidth,
  }));
  expect(scroll).toBeLessThanOrEqual(inner);
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.wide],
] as const)('the boundary upload screen at the %s viewport', (name, viewport) => {
  it('refuses the demo file with two problems, then checks, loads and reverts the good one', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, h.baseUrl, DEMO.analyst);
      await openSection(page, 'uploads', name === 'phone');
      await page.waitForURL(`${h.baseUrl}/uploads`);
      await page.getByText('Load district boundaries (GeoJSON) and see their versions').click();
      await page.waitForURL(`${h.baseUrl}/uploads/boundaries`);
      await page.getByTestId('boundaries-screen').waitFor();
      expect(await page.getByTestId('boundary-code-property').inputValue()).toBe('code');

      // The refusal path: both deliberate problems, by feature index, code and reason
      // (api/demo/geography.ts: D07 is feature 6 and its ring crosses itself; D31, feature 24, is no district).
      await chooseFile(page, BAD);
      await page.getByTestId('boundary-not-accepted').waitFor();
      expect(await page.getByTestId('boundary-file').innerText()).toContain('boundaries-with-problems.geojson');
      expect(await page.getByTestId('boundary-commit').count()).toBe(0);
      const errors = (await problemRows(page)).filter((c) => c.includes('Error'));
      expect(errors).toHaveLength(2);
      const d07 = errors.find((c) => c.includes('D07'))!;
      expect(d07.slice(0, 2)).toEqual(['6', 'D07']);
      expect(d07).toContain('Crosses itself');
      expect(d07.join(' ')).toMatch(/Self-intersection/);
      const d31 = errors.find((c) => c.includes('D31'))!;
      expect(d31.slice(0, 2)).toEqual(['24', 'D31']);
      expect(d31).toContain('Unknown code');
      expect(d31.join(' ')).toMatch(/not a district of the region/);
      await noHorizontalOverflow(page);
      await h.shot(page, `boundaries-${name}-refused`);
      await page.getByTestId('boundary-problems').scrollIntoViewIfNeeded();
      await h.shot(page, `boundaries-${name}-refused-problems`);

      // Repair only on the analyst's say-so: the crossing ring becomes a warning, the unknown code still stops the file.
      await page.getByTestId('boundary-repair-again').click();
      await page.waitForFunction(() =>
        [...document.querySelectorAll('[data-testid^="boundary-problem-"]')].some((r) =>
          /Repaired/.test((r as HTMLElement).innerText),
        ),
      );
      const repaired = await problemRows(page);
      expect(repaired.find((c) => c.includes('D07'))).toEqual(expect.arrayContaining(['Warning', 'Repaired']));
      expect(repaired.filter((c) => c.includes('Error')).map((c) => c[1])).toEqual(['D31']);
      await page.getByTestId('boundary-not-accepted').waitFor();
      await page.getByTestId('boundary-repair').click();
      await page.getByTestId('boundary-stale').waitFor();

      // The good file: dry run first, then load.
      await chooseFile(page, GOOD);
      await page.getByTestId('boundary-ready').waitFor();
      // 24 demo districts, one feature each (api/demo/generate.ts, geography.ts)
      expect(await page.getByTestId('boundary-count-matched').innerText()).toBe('24');
      expect(await page.getByTestId('boundary-count-missing').innerText()).toBe('0');
      expect(await page.getByTestId('boundary-preview-D01').innerText()).toMatch(/Amberlyn Reach/);
      expect(await page.getByTestId('boundary-preview-D01').innerText()).toMatch(/km²/);
      await h.shot(page, `boundaries-${name}-checked`);
      await page.getByTestId('boundary-commit').click();
      const done = page.getByTestId('boundary-done-ok');
      await done.waitFor();
      const doneText = await done.innerText();
      expect(doneText).toMatch(
        /Loaded as boundary version \d+ \(upload #\d+, data version \d+\): boundaries for 24 districts/,
      );
      const version = Number(/boundary version (\d+)/.exec(doneText)![1]);
      await page.getByTestId(`boundary-version-${version}`).waitFor();
      expect(await page.getByTestId(`boundary-version-status-${version}`).innerText()).toBe('In force');
      await page.getByTestId(`boundary-version-${version}`).scrollIntoViewIfNeeded();
      await noHorizontalOverflow(page);
      await h.shot(page, `boundaries-${name}-loaded`);

      // The region view draws the map from them.
      await page.goto(`${h.baseUrl}/`);
      if (name === 'phone') await page.getByTestId('region-view-map').click();
      await page.getByTestId('region-map-canvas').waitFor();

      // Revert: the version is no longer in force.
      await page.goto(`${h.baseUrl}/uploads/boundaries`);
      await page.getByTestId(`boundary-revert-${version}`).click();
      await page.getByTestId(`boundary-revert-${version}-confirm`).click();
      const reverted = page.getByTestId('boundary-revert-ok');
      await reverted.waitFor();
      expect(await reverted.innerText()).toMatch(new RegExp(`Boundary version ${version} reverted`));
      await page.waitForFunction(
        (id) => document.querySelector(`[data-testid="boundary-version-status-${id}"]`)?.textContent === 'Reverted',
        version,
      );
      await h.shot(page, `boundaries-${name}-reverted`);
    } finally {
      await context.close();
    }
  });
});

it('sends no request beyond 127.0.0.1', () => {
  expect(offLoopback(h.requests)).toEqual([]);
});
