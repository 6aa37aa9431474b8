/**
 * Browser test of the walking skeleton: sign in through the stand-in, open the region
 * list, open a district, at a phone and a laptop viewport; screenshots are kept under
 * tests/artifacts/screenshots. No request may leave 127.0.0.1.
 */
import type { Page } from 'playwright-core';
import { DEMO } from '../support/auth';
import { offLoopback, startHarness, VIEWPORTS, type Harness } from '../support/browser';

jest.setTimeout(120_000);

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => h?.close());

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(email)}`);
  await page.waitForURL(`${h.baseUrl}/`);
}

async function fontsFromApp(page: Page): Promise<boolean> {
  return page.evaluate(async () => {
    await document.fonts.ready;
    return [...document.fonts].some((f) => /inter/i.test(f.family) && f.status === 'loaded');
  });
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['laptop', VIEWPORTS.laptop],
] as const)('at the %s viewport', (name, viewport) => {
  it('signs in, lists the districts and opens one', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, DEMO.official);
      const row = page.getByTestId('district-row-D01');
      await row.waitFor();
      await page.getByTestId('district-row-D09').waitFor();
      expect(await fontsFromApp(page)).toBe(true);
      await h.shot(page, `${name}-region`);

      await row.click();
      await page.waitForURL(/\/district\/D01$/);
      await page
        .getByRole('heading', { name: /Amberlyn Reach/ })
        .first()
        .waitFor();
      if (name === 'laptop') {
        // Wide layout: the list stays beside the district.
        expect(await page.getByTestId('district-row-D02').isVisible()).toBe(true);
      } else {
        expect(await page.getByTestId('district-row-D02').count()).toBe(0);
      }
      await h.shot(page, `${name}-district`);

      // A district with a missing year shows the gap.
      await page.goto(`${h.baseUrl}/district/D09`);
      // D09 has no value at all for 2008 (the demo generator's missingYears): its row is one gap band.
      const gap = page.getByTestId('series-gap-row-2008');
      await gap.waitFor();
      expect(await gap.innerText()).toMatch(/no data this year/);
      expect(await page.getByTestId('series-gap-row-2007').count()).toBe(0);
      await h.shot(page, `${name}-district-gap`);
    } finally {
      await context.close();
    }
  });
});

it('sends no request beyond 127.0.0.1', () => {
  expect(h.requests.length).toBeGreaterThan(10);
  expect(offLoopback(h.requests)).toEqual([]);
});
