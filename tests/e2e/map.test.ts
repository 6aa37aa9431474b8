/**
 * Browser test of the region map at a phone (390×844) and a wide (1440×900) viewport:
 * the demo boundaries drawn one path per standing with the standing marks, the legend as
 * the standing filter, a tap on a district opening its card (with the locator), the
 * phone's remembered Map | List choice, zoom by buttons and wheel, pan by dragging, reset,
 * no horizontal overflow; on a touch screen, a two-finger pinch (CDP touch events) zooms the
 * map about the point between the fingers (not the page), one finger pans, a tap on the
 * reset button and a tap on a district work. Screenshots are kept under
 * tests/artifacts/screenshots.
 */
import type { CDPSession, Page } from 'playwright-core';
import { seedDemoBoundariesIfEmpty } from '../../api/demo/boundaries';
import { DEMO } from '../support/auth';
import { offLoopback, startHarness, VIEWPORTS, type Harness } from '../support/browser';

jest.setTimeout(240_000);

let h: Harness;
beforeAll(async () => {
  h = await startHarness({ publishRun: true });
  await seedDemoBoundariesIfEmpty(h.t.db);
});
afterAll(async () => h?.close());

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(email)}`);
  await page.waitForURL(`${h.baseUrl}/`);
}

async function noHorizontalOverflow(page: Page): Promise<void> {
  const { scroll, inner } = await page.evaluate(() => ({
    scroll: document.documentElement.scrollWidth,
    inner: window.innerWidth,
  }));
  expect(scroll).toBeLessThanOrEqual(inner);
}

/** Clicks the middle of a district's standing mark (marks let clicks through to the map). */
async function tapDistrict(page: Page, code: string): Promise<void> {
  const box = await page.getByTestId(`map-mark-${code}`).boundingBox();
  expect(box).not.toBeNull();
  await page.mouse.click(box!.x + box!.width / 2, box!.y + box!.height / 2);
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.wide],
] as const)('the region map at the %s viewport', (name, viewport) => {
  it('draws the districts by standing, filters by the legend, opens a card on tap', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, DEMO.official);
      const api = (await (await page.request.get(`${h.baseUrl}/api/region`)).json()) as {
        districts: { code: string; estimate: { standing: string } | null }[];
      };
      const standingOf = new Map(api.districts.map((d) => [d.code, d.estimate?.standing ?? 'not_estimable']));
      if (name === 'phone') {
        await page.getByTestId('region-view-map').click();
      }
      await page.getByTestId('region-map-canvas').waitFor();
      await page.waitForFunction(() => document.fonts.status === 'loaded');
      // One fill path per standing present, never one per district.
      const fills = await page.locator('[data-testid="region-map-canvas"] svg path').count();
      const standings = new Set(standingOf.values());
      expect(fills).toBe(standings.size + 1); // + the borders
      await noHorizontalOverflow(page);
      await h.shot(page, `map-${name}-region`);
      // Zoomed in twice, every one of the 24 demo districts has room for its mark.
      await page.getByTestId('map-zoom-in').click();
      await page.getByTestId('map-zoom-in').click();
      await page.waitForFunction(() => document.querySelectorAll('[data-testid^="map-mark-"]').length === 24);
      await h.shot(page, `map-${name}-zoomed`);
      await page.getByTestId('map-reset').click();
      const transform = () => page.locator('[data-testid="region-map-canvas"] svg g').first().getAttribute('transform');
      await page.waitForFunction(
        () =>
          document.querySelector('[data-testid="region-map-canvas"] svg g')?.getAttribute('transform') ===
          'translate(0 0) scale(1)',
      );
      // The wheel zooms in about the pointer; a drag pans; reset goes back.
      const frame = (await page.getByTestId('region-map-canvas').boundingBox())!;
      const cx = frame.x + frame.width / 2;
      const cy = frame.y + frame.height / 2;
      await page.mouse.move(cx, cy);
      await page.mouse.wheel(0, -200);
      await page.waitForFunction(() =>
        /scale\(1\.25\)/.test(
          document.querySelector('[data-testid="region-map-canvas"] svg g')?.getAttribute('transform') ?? '',
        ),
      );
      const zoomed = await transform();
      await page.mouse.down();
      await page.mouse.move(cx + 40, cy + 30, { steps: 6 });
      await page.mouse.up();
      await page.waitForFunction(
        (before) =>
          document.querySelector('[data-testid="region-map-canvas"] svg g')?.getAttribute('transform') !== before,
        zoomed,
      );
      expect(await transform()).toMatch(/scale\(1\.25\)/);
      await page.getByTestId('map-reset').click();
      await page.waitForFunction(
        () =>
          document.querySelector('[data-testid="region-map-canvas"] svg g')?.getAttribute('transform') ===
          'translate(0 0) scale(1)',
      );

      // The legend filters: past the turn only; its chip is on, and its count is the API's.
      const past = [...standingOf.values()].filter((s) => s === 'past_turn').length;
      const chip = page.getByTestId('map-legend-past_turn');
      await expect(chip.textContent()).resolves.toContain(String(past));
      await chip.click();
      await page.waitForFunction(
        () => document.querySelector('[data-testid="map-legend-past_turn"]')?.getAttribute('aria-checked') === 'true',
      );
      const marks = await page
        .locator('[data-testid^="map-mark-"]')
        .evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!.replace('map-mark-', '')));
      expect(marks.length).toBeGreaterThan(0);
      expect(marks.every((c) => standingOf.get(c) === 'past_turn')).toBe(true);
      await h.shot(page, `map-${name}-filtered`);
      await chip.click();

      // Tap a district: its card opens (the detail pane on wide screens), with the locator.
      const code = (await page.locator('[data-testid^="map-mark-"]').first().getAttribute('data-testid'))!.replace(
        'map-mark-',
        '',
      );
      await tapDistrict(page, code);
      // The map's link keeps the track whose standings it draws (here the headline track).
      await page.waitForURL(new RegExp(`/district/${code}\\?track=[a-z][a-z0-9-]*$`));
      await page.getByTestId('district-name').waitFor();
      await page.getByTestId('locator-map').locator('svg').waitFor();
      await noHorizontalOverflow(page);
      await h.shot(page, `map-${name}-card`);

      if (name === 'phone') {
        // The choice is remembered.
        await page.goto(`${h.baseUrl}/`);
        await page.getByTestId('region-map-canvas').waitFor();
      }
      expect(offLoopback(h.requests)).toEqual([]);
    } finally {
      await context.close();
    }
  });
});

/** The map's view as its transform says: translate(tx ty) scale(k). */
async function mapView(page: Page): Promise<{ tx: number; ty: number; k: number }> {
  const t = await page.locator('[data-testid="region-map-canvas"] svg g').first().getAttribute('transform');
  const m = /translate\((-?[\d.e-]+) (-?[\d.e-]+)\) scale\(([\d.e-]+)\)/.exec(t ?? '');
  if (!m) throw new Error(`unexpected map transform: ${t}`);
  return { tx: Number(m[1]), ty: Number(m[2]), k: Number(m[3]) };
}

type Point = { x: number; y: number };

/** Two fingers from `from` to `to` (pairs of points) in `steps` moves, through Chromium's touch input. */
async function twoFingers(cdp: CDPSession, from: [Point, Point], to: [Point, Point], steps = 8): Promise<void> {
  const at = (i: number) =>
    from.map((p, f) => ({ x: p.x + ((to[f].x - p.x) * i) / steps, y: p.y + ((to[f].y - p.y) * i) / steps, id: f }));
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: at(0) });
  for (let i = 1; i <= steps; i++)
    await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: at(i) });
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
}

async function oneFinger(cdp: CDPSession, from: Point, to: Point, steps = 8): Promise<void> {
  const at = (i: number) => [
    { x: from.x + ((to.x - from.x) * i) / steps, y: from.y + ((to.y - from.y) * i) / steps, id: 0 },
  ];
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: at(0) });
  for (let i = 1; i <= steps; i++)
    await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: at(i) });
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.wide],
] as const)('the region map on a touch screen at the %s viewport', (name, viewport) => {
  it('pinch zooms about the fingers, one finger pans, taps reset and open a card', async () => {
    const { context, page } = await h.newPage(viewport, { touch: true });
    try {
      await signIn(page, DEMO.official);
      if (name === 'phone') await page.getByTestId('region-view-map').tap();
      await page.getByTestId('region-map-canvas').waitFor();
      expect(await mapView(page)).toEqual({ tx: 0, ty: 0, k: 1 });
      const frame = (await page.getByTestId('region-map-canvas').boundingBox())!;
      const cdp = await context.newCDPSession(page);

      // Fingers 40 px apart, spread to 160 px apart about a point left of and above the centre.
      const mid = { x: frame.x + frame.width * 0.4, y: frame.y + frame.height * 0.45 };
      await twoFingers(
        cdp,
        [
          { x: mid.x - 20, y: mid.y },
          { x: mid.x + 20, y: mid.y },
        ],
        [
          { x: mid.x - 80, y: mid.y },
          { x: mid.x + 80, y: mid.y },
        ],
      );
      await page.waitForFunction(() =>
        /scale\(4\)/.test(
          document.querySelector('[data-testid="region-map-canvas"] svg g')?.getAttribute('transform') ?? '',
        ),
      );
      const pinched = await mapView(page);
      // The spread is 160 / 40 = 4 (arithmetic), so the scale is 4; the point between the
      // fingers stays put: tx = m − 4·m = −3·m in frame coordinates (zoom about a point: x' = m + (x − m)·k).
      expect(pinched.k).toBe(4);
      expect(pinched.tx).toBeCloseTo(-3 * (mid.x - frame.x), 0);
      expect(pinched.ty).toBeCloseTo(-3 * (mid.y - frame.y), 0);
      // The map zoomed, not the page.
      expect(await page.evaluate(() => window.visualViewport?.scale ?? 1)).toBe(1);
      await noHorizontalOverflow(page);
      await h.shot(page, `map-${name}-pinched`);

      // One finger drags the zoomed map by the finger's travel.
      await oneFinger(cdp, { x: mid.x, y: mid.y }, { x: mid.x + 50, y: mid.y + 30 });
      await page.waitForFunction(
        (before) =>
          document.querySelector('[data-testid="region-map-canvas"] svg g')?.getAttribute('transform') !== before,
        `translate(${pinched.tx} ${pinched.ty}) scale(4)`,
      );
      const panned = await mapView(page);
      expect(panned.k).toBe(4);
      expect(panned.tx - pinched.tx).toBeCloseTo(50, 0);
      expect(panned.ty - pinched.ty).toBeCloseTo(30, 0);

      // A tap on reset brings the whole region back.
      // A person lifts the finger before tapping: Chromium makes no click of a tap that starts
      // within a few milliseconds of the last touch sequence (seen in this test), so pause first.
      await page.waitForTimeout(400);
      await page.getByTestId('map-reset').tap();
      await page.waitForFunction(
        () =>
          document.querySelector('[data-testid="region-map-canvas"] svg g')?.getAttribute('transform') ===
          'translate(0 0) scale(1)',
      );
      await h.shot(page, `map-${name}-reset`);

      // A tap on a district opens its card.
      const mark = page.locator('[data-testid^="map-mark-"]').first();
      const code = (await mark.getAttribute('data-testid'))!.replace('map-mark-', '');
      const box = (await mark.boundingBox())!;
      await page.waitForTimeout(400);
      await page.touchscreen.tap(box.x + box.width / 2, box.y + box.height / 2);
      await page.waitForURL(new RegExp(`/district/${code}\\?track=`));
      await page.getByTestId('district-name').waitFor();
      expect(offLoopback(h.requests)).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
