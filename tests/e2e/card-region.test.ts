/**
 * Browser test of the region view and the district card over a published run, at a phone
 * (390×844) and a wide (1440×900) viewport: sort and filter the region, open a district
 * whose interval is bounded (band drawn) and one whose interval is not (no band), check
 * the chart SVG and its text summary, subscribe and unsubscribe. Screenshots are kept under
 * tests/artifacts/screenshots. No request may leave 127.0.0.1.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEMO } from '../support/auth';
import { artifactsDir, offLoopback, startHarness, VIEWPORTS, type Harness } from '../support/browser';

jest.setTimeout(240_000);

/** The band's fill (chartColors.band in components/theme.ts). */
const BAND_FILL = '#e4daf0';

type Summary = {
  code: string;
  name: string;
  estimate: {
    standing: string;
    intervalBounded: boolean | null;
    threshold: number | null;
    gapPercent: number | null;
  } | null;
};

let h: Harness;
let districts: Summary[];
beforeAll(async () => {
  h = await startHarness({ publishRun: true });
});
afterAll(async () => h?.close());

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(email)}`);
  await page.waitForURL(`${h.baseUrl}/`);
}

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(artifactsDir, `${name}.png`) });
}

/** Codes of the rows the list shows, top to bottom. */
async function rowCodes(page: Page): Promise<string[]> {
  const ids = await page
    .locator('[data-testid^="district-row-"]')
    .evaluateAll((els) => els.map((e) => e.getAttribute('data-testid') ?? ''));
  return ids.map((id) => id.replace('district-row-', ''));
}

/** SVG elements drawn in a chart box, and how many of them carry the band's fill. */
async function chartMarks(page: Page, box: string): Promise<{ svg: number; paths: number; band: number }> {
  return page.locator(`[data-testid="${box}"]`).evaluate((el, fill) => {
    const paths = [...el.querySelectorAll('svg path')];
    const band = paths.filter(
      (p) => (p.getAttribute('fill') ?? '').toLowerCase() === fill || getComputedStyle(p).fill === 'rgb(228, 218, 240)',
    );
    return { svg: el.querySelectorAll('svg').length, paths: paths.length, band: band.length };
  }, BAND_FILL);
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.wide],
] as const)('at the %s viewport', (name, viewport) => {
  it('sorts and filters the region, opens districts with and without a band, subscribes', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, DEMO.official);
      districts = ((await (await page.request.get(`${h.baseUrl}/api/region`)).json()) as { districts: Summary[] })
        .districts;
      expect(districts.filter((d) => d.estimate).length).toBeGreaterThan(20);

      await page.getByTestId('district-row-D01').waitFor();
      await page.getByTestId('standing-counts').waitFor();
      await page.waitForFunction(() => document.fonts.status === 'loaded');
      await shot(page, `card-${name}-region`);

      // Sort by gap: the first row is the district closest to its threshold.
      await page.getByTestId('sort-gap').click();
      const closest = [...districts]
        .filter((d) => d.estimate?.gapPercent !== null && d.estimate?.gapPercent !== undefined)
        .sort(
          (a, b) =>
            Math.abs(a.estimate!.gapPercent!) - Math.abs(b.estimate!.gapPercent!) || a.name.localeCompare(b.name, 'en'),
        )[0];
      await page.waitForFunction(
        (code) =>
          document.querySelector('[data-testid^="district-row-"]')?.getAttribute('data-testid') ===
          `district-row-${code}`,
        closest.code,
      );
      await shot(page, `card-${name}-region-by-gap`);

      // Filter to one standing: every row shown has it, and as many as the API says.
      const pastTurn = districts.filter((d) => d.estimate?.standing === 'past_turn').map((d) => d.code);
      expect(pastTurn.length).toBeGreaterThan(0);
      await page.getByTestId('standing-filter-past_turn').click();
      await page.getByText(`${pastTurn.length} of ${districts.length} districts shown`).waitFor();
      expect((await rowCodes(page)).sort()).toEqual([...pastTurn].sort());
      await shot(page, `card-${name}-region-filtered`);
      await page.getByTestId('standing-filter-past_turn').click();
      await page.getByText(`${districts.length} districts`, { exact: true }).waitFor();

      // Keyboard: Tab from the search field reaches the sort options, each with a visible
      // focus ring; Enter chooses one; further Tabs reach the rows, and Enter opens one.
      if (name === 'wide') {
        await page.getByTestId('sort-name').click();
        await expect(page.getByTestId('sort-gap').getAttribute('aria-checked')).resolves.toBe('false');
        await page.getByTestId('district-search').focus();
        const focusedId = () => page.evaluate(() => document.activeElement?.getAttribute('data-testid') ?? '');
        for (let i = 0; i < 8 && (await focusedId()) !== 'sort-gap'; i++) await page.keyboard.press('Tab');
        expect(await focusedId()).toBe('sort-gap');
        const ring = await page.evaluate(() => {
          const s = getComputedStyle(document.activeElement as Element);
          return { style: s.outlineStyle, width: s.outlineWidth };
        });
        expect(ring).toEqual({ style: 'solid', width: '3px' });
        await shot(page, `card-${name}-region-keyboard-focus`);
        await page.keyboard.press('Enter');
        await expect(page.getByTestId('sort-gap').getAttribute('aria-checked')).resolves.toBe('true');
        for (let i = 0; i < 12 && !(await focusedId()).startsWith('district-row-'); i++)
          await page.keyboard.press('Tab');
        const row = await focusedId();
        expect(row).toMatch(/^district-row-/);
        await page.keyboard.press('Enter');
        await page.waitForURL(new RegExp(`/district/${row.replace('district-row-', '')}$`));
        await page.getByTestId('card-headline').waitFor();
        await page.goto(`${h.baseUrl}/`);
        await page.getByTestId('district-row-D01').waitFor();
      }

      // A district with a bounded interval: chart drawn, band present, summary says so.
      const bounded = districts.find(
        (d) =>
          d.estimate?.intervalBounded === true &&
          (d.estimate.threshold ?? 0) > 0 &&
          d.estimate.standing === 'past_turn',
      )!;
      await page.getByTestId('sort-name').click();
      await page.getByTestId(`district-row-${bounded.code}`).click();
      await page.waitForURL(new RegExp(`/district/${bounded.code}$`));
      await page.getByTestId('card-headline').waitFor();
      await page.locator('[data-testid="curve-chart-box"] svg').first().waitFor();
      await page.locator('[data-testid="path-chart-box"] svg').first().waitFor();
      const withBand = await chartMarks(page, 'curve-chart-box');
      expect(withBand.svg).toBeGreaterThan(0);
      expect(withBand.paths).toBeGreaterThan(3);
      expect(withBand.band).toBeGreaterThan(0);
      expect((await chartMarks(page, 'path-chart-box')).band).toBeGreaterThan(0);
      await expect(page.getByTestId('curve-chart-summary').textContent()).resolves.toMatch(/as a shaded band/);
      await expect(page.getByTestId('curve-chart-box').getAttribute('aria-label')).resolves.toMatch(
        // the indicator names of the demo catalogue (api/demo/catalogue.ts), carried by the run's units
        /^CO2 emissions per person against real income per person/,
      );
      if (name === 'wide') {
        // List and card side by side, and the alerts column at ≥ 1440 px.
        expect(await page.getByTestId('district-row-D02').isVisible()).toBe(true);
        expect(await page.getByTestId('alerts-feed').isVisible()).toBe(true);
      } else {
        expect(await page.getByTestId('district-row-D02').count()).toBe(0);
      }
      await shot(page, `card-${name}-district-bounded`);
      await page.getByTestId('curve-chart').scrollIntoViewIfNeeded();
      await shot(page, `card-${name}-district-bounded-chart`);
      await page.getByTestId('sensitivity-strip').scrollIntoViewIfNeeded();
      await shot(page, `card-${name}-district-sensitivity`);

      // Subscribe from the card, then stop again; the server holds what the switch shows.
      const toggle = page.getByTestId('subscribe-toggle');
      await toggle.scrollIntoViewIfNeeded();
      await expect(toggle.getAttribute('aria-checked')).resolves.toBe('false');
      await toggle.click();
      await page.waitForFunction(
        () => document.querySelector('[data-testid="subscribe-toggle"]')?.getAttribute('aria-checked') === 'true',
      );
      const subs = (await (await page.request.get(`${h.baseUrl}/api/subscriptions`)).json()) as {
        subscriptions: { scope: string; districtCodes: string[] }[];
      };
      expect(subs.subscriptions).toEqual([
        expect.objectContaining({ scope: 'district', districtCodes: [bounded.code] }),
      ]);
      await toggle.click();
      await page.waitForFunction(
        () => document.querySelector('[data-testid="subscribe-toggle"]')?.getAttribute('aria-checked') === 'false',
      );
      expect(
        ((await (await page.request.get(`${h.baseUrl}/api/subscriptions`)).json()) as { subscriptions: unknown[] })
          .subscriptions,
      ).toEqual([]);

      // A district whose interval is not bounded, with its threshold near enough to today's
      // income to be marked on the chart: the chart is drawn with the line and without a band.
      // The current level is on the card, not in the region rows: read the candidates' cards.
      const near = (threshold: number | null, levelNow: number | null) =>
        threshold !== null && levelNow !== null && threshold > levelNow / 2 && threshold < levelNow * 2;
      let unbounded: Summary | undefined;
      for (const d of districts.filter((x) => x.estimate?.intervalBounded === false)) {
        const card = (await (await page.request.get(`${h.baseUrl}/api/districts/${d.code}/estimate`)).json()) as {
          main: { threshold: { level: number | null } | null; range: { levelNow: number } | null } | null;
        };
        if (near(card.main?.threshold?.level ?? null, card.main?.range?.levelNow ?? null)) {
          unbounded = d;
          break;
        }
      }
      expect(unbounded).toBeTruthy();
      await page.goto(`${h.baseUrl}/district/${unbounded!.code}`);
      await page.getByTestId('card-headline').waitFor();
      await page.locator('[data-testid="curve-chart-box"] svg').first().waitFor();
      await page.locator('[data-testid="path-chart-box"] svg').first().waitFor();
      const noBand = await chartMarks(page, 'curve-chart-box');
      expect(noBand.paths).toBeGreaterThan(3);
      expect(noBand.band).toBe(0);
      expect((await chartMarks(page, 'path-chart-box')).band).toBe(0);
      await expect(page.getByTestId('curve-chart-summary').textContent()).resolves.toMatch(
        /without a band: interval not bounded at 95%/,
      );
      await shot(page, `card-${name}-district-unbounded`);
      await page.getByTestId('curve-chart').scrollIntoViewIfNeeded();
      await shot(page, `card-${name}-district-unbounded-chart`);

      // A regional substitute is labelled as such.
      // (The demo region has two districts whose series start too late for a fit of their own.)
      const region = (await (await page.request.get(`${h.baseUrl}/api/region`)).json()) as {
        districts: { code: string; estimate: { status: string } | null }[];
      };
      const substitute = region.districts.find((d) => d.estimate?.status === 'substitute');
      expect(substitute).toBeTruthy();
      await page.goto(`${h.baseUrl}/district/${substitute!.code}`);
      await page.getByTestId('substitute-label').waitFor();
      await shot(page, `card-${name}-district-substitute`);

      // Offline: a card opened before keeps its figures and says they may be out of date.
      await page.goto(`${h.baseUrl}/district/${bounded.code}`);
      await page.getByTestId('card-headline').waitFor();
      await context.setOffline(true);
      const cardNotice = page.getByTestId('district-detail-scroll').getByTestId('stale-notice');
      await cardNotice.waitFor();
      await expect(cardNotice.textContent()).resolves.toMatch(
        /^Offline\. Showing this district’s figures as loaded at .*; they will refresh when the connection returns\.$/,
      );
      expect(await page.getByTestId('card-headline').isVisible()).toBe(true);
      // Beside it on a wide screen, the kept region list says the same of itself.
      if (name === 'wide') await page.getByTestId('district-list-panel').getByTestId('stale-notice').waitFor();
      await cardNotice.scrollIntoViewIfNeeded();
      await shot(page, `card-${name}-district-offline`);
      await context.setOffline(false);
      await cardNotice.waitFor({ state: 'detached' });

      // The method page carries the cautions.
      await page.goto(`${h.baseUrl}/method`);
      await page.getByTestId('method-cautions').waitFor();
      await page.getByText(/trade-adjusted \(consumption-based\) figures/).waitFor();
      await shot(page, `card-${name}-method`);
    } finally {
      await context.close();
    }
  });
});

it('sends no request beyond 127.0.0.1', () => {
  expect(h.requests.length).toBeGreaterThan(20);
  expect(offLoopback(h.requests)).toEqual([]);
});
