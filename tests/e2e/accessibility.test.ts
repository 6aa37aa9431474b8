/**
 * Accessibility, measured on every screen the browser tests visit, at a phone (390×844)
 * and a wide (1440×900) viewport, over a region with a published run:
 *
 * - axe-core (Deque) for the WCAG 2.0, 2.1 and 2.2 A and AA tags: no violation of impact
 *   serious or critical; the moderate and minor ones are printed per screen.
 * - every control (button, link, checkbox, radio, tab, switch) has an accessible name, as
 *   Chromium computes it (W3C Accessible Name and Description Computation 1.2; WCAG 2.2
 *   SC 4.1.2 Name, Role, Value).
 * - focus order follows reading order on the wide region page (WCAG 2.2 SC 2.4.3 Focus Order).
 * - touch targets at the phone viewport: at least 24×24 px (WCAG 2.2 SC 2.5.8 Target Size
 *   (Minimum), with its spacing and inline exceptions); primary actions (a solid Button,
 *   the Menu button, Refresh) at least 44×44 (our own choice, after WCAG 2.2 SC 2.5.5
 *   Target Size (Enhanced)).
 *
 * One browser; one signed-in context per role and viewport, reused across screens. The
 * axe results are also written to tests/artifacts/a11y/axe-results.json.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { seedDemoBoundariesIfEmpty } from '../../api/demo/boundaries';
import {
  countByImpact,
  focusWalk,
  runAxe,
  smallTargets,
  unnamedControls,
  violationTable,
  type AxeViolation,
} from '../support/a11y';
import { DEMO } from '../support/auth';
import { offLoopback, root, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { signIn } from '../support/staff-steps';

jest.setTimeout(240_000);

type Role = 'none' | 'official' | 'analyst' | 'admin';
type ViewportName = 'phone' | 'wide';

interface Screen {
  name: string;
  role: Role;
  /** Path to open (after the fixtures are known). */
  path: () => string;
  /** Waits until the screen shows its content. */
  ready: (page: Page) => Promise<void>;
  only?: ViewportName;
}

let h: Harness;
let headlineTrack = '';
let runId = 0;
let uploadId = 0;

const byTestId = (id: string) => async (page: Page) => {
  await page.getByTestId(id).first().waitFor({ timeout: 30_000 });
};

const SCREENS: Screen[] = [
  {
    name: 'sign-in',
    role: 'none',
    path: () => '/sign-in',
    ready: async (page) => {
      await page.getByRole('button', { name: 'Continue to sign-in' }).waitFor();
    },
  },
  {
    name: 'region list',
    role: 'official',
    path: () => '/',
    only: 'phone',
    ready: async (page) => {
      // The phone remembers Map or List; this screen is the list.
      await page.getByTestId('region-view-list').click();
      await page.getByTestId('district-row-D01').waitFor();
    },
  },
  {
    name: 'region map',
    role: 'official',
    path: () => '/',
    only: 'phone',
    ready: async (page) => {
      // The list's rows come with the data, after the page has hydrated (a click before is lost).
      await page.locator('[data-testid^="district-row-"],[data-testid="region-map-view"]').first().waitFor();
      await page.getByTestId('region-view-map').click();
      await page.getByTestId('region-map-view').waitFor();
      await page.getByTestId('region-map-canvas').waitFor();
    },
  },
  { name: 'region', role: 'official', path: () => '/', ready: byTestId('region-overview'), only: 'wide' },
  {
    name: 'district card (track)',
    role: 'official',
    path: () => `/district/D01?track=${headlineTrack}`,
    ready: async (page) => {
      await page.getByTestId('card-headline').waitFor();
      await page.locator('svg').first().waitFor();
    },
  },
  { name: 'method', role: 'official', path: () => '/method', ready: byTestId('method-standings') },
  { name: 'alerts', role: 'official', path: () => '/alerts', ready: byTestId('alerts-screen') },
  {
    name: 'subscriptions',
    role: 'official',
    path: () => '/subscriptions',
    ready: async (page) => {
      await page.locator('[data-testid="subs-list"],[data-testid="subs-empty"]').first().waitFor();
    },
  },
  { name: 'district brief', role: 'official', path: () => '/brief/D01', ready: byTestId('brief-pdf-link') },
  { name: 'region brief', role: 'official', path: () => '/brief/region', ready: byTestId('brief-pdf-link') },
  { name: 'runs', role: 'analyst', path: () => '/runs', ready: byTestId('runs-table') },
  { name: 'run review', role: 'analyst', path: () => `/runs/${runId}`, ready: byTestId('review-table') },
  { name: 'specs', role: 'analyst', path: () => '/specs', ready: byTestId('specs-list') },
  { name: 'uploads', role: 'analyst', path: () => '/uploads', ready: byTestId('upload-history') },
  {
    name: 'upload detail',
    role: 'analyst',
    path: () => `/uploads/${uploadId}`,
    ready: byTestId('upload-detail-status'),
  },
  {
    name: 'boundaries upload',
    role: 'analyst',
    path: () => '/uploads/boundaries',
    ready: byTestId('boundaries-screen'),
  },
  { name: 'people', role: 'admin', path: () => '/people', ready: byTestId('people-list') },
  { name: 'audit', role: 'admin', path: () => '/audit', ready: byTestId('audit-list') },
  { name: 'settings, tracks', role: 'admin', path: () => '/settings', ready: byTestId('tracks-admin') },
  { name: 'mailbox', role: 'admin', path: () => '/mailbox', ready: byTestId('mailbox-screen') },
];

const contexts = new Map<string, { context: BrowserContext; page: Page }>();

async function pageFor(viewport: ViewportName, role: Role): Promise<Page> {
  const key = `${viewport}/${role}`;
  let open = contexts.get(key);
  if (!open) {
    open = await h.newPage(VIEWPORTS[viewport]);
    if (role !== 'none') await signIn(open.page, h.baseUrl, DEMO[role]);
    contexts.set(key, open);
  }
  return open.page;
}

async function openScreen(viewport: ViewportName, screen: Screen): Promise<Page> {
  const page = await pageFor(viewport, screen.role);
  await page.goto(`${h.baseUrl}${screen.path()}`);
  try {
    await screen.ready(page);
  } catch (err) {
    await h.shot(page, `a11y-${viewport}-${screen.name.replace(/[^a-z]+/g, '-')}-not-ready`);
    throw err;
  }
  await page.waitForFunction(() => document.fonts.status === 'loaded');
  return page;
}

const results: Record<string, { viewport: ViewportName; screen: string; violations: AxeViolation[] }> = {};

beforeAll(async () => {
  h = await startHarness({ publishRun: true, mailCatcher: true });
  // The demo boundaries, so the map views draw the districts.
  await seedDemoBoundariesIfEmpty(h.t.db);
  runId = Number((await h.t.db('runs').where({ state: 'published' }).first('id'))!.id);
  const upload = await h.t.db('uploads').orderBy('id', 'desc').first('id');
  if (!upload) throw new Error('the demo region has no upload to open');
  uploadId = Number(upload.id);
  const page = await pageFor('wide', 'official');
  const res = await page.request.get(`${h.baseUrl}/api/tracks`);
  headlineTrack = ((await res.json()) as { tracks: { code: string; headline: boolean }[] }).tracks.find(
    (t) => t.headline,
  )!.code;
});

afterAll(async () => {
  for (const { context } of contexts.values()) await context.close();
  const dir = path.join(root, 'tests', 'artifacts', 'a11y');
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(path.join(dir, 'axe-results.json'), JSON.stringify(results, null, 2));
  await h?.close();
});

describe.each(['phone', 'wide'] as const)('at the %s viewport', (viewport) => {
  const screens = SCREENS.filter((s) => !s.only || s.only === viewport);

  it.each(screens.map((s) => [s.name, s] as const))(
    '%s: no serious or critical axe-core violation of the WCAG 2.2 A/AA rules, every control named',
    async (name, screen) => {
      const page = await openScreen(viewport, screen);
      const violations = await runAxe(page);
      results[`${viewport}/${name}`] = { viewport, screen: name, violations };
      const counts = countByImpact(violations);
      console.log(
        `[axe] ${viewport} · ${violationTable(name, violations)}\n  counts: critical ${counts.critical}, serious ${counts.serious}, moderate ${counts.moderate}, minor ${counts.minor}`,
      );
      await h.shot(page, `a11y-${viewport}-${name.replace(/[^a-z]+/g, '-')}`);
      // axe-core rules (Deque), WCAG 2.2 A/AA tags: impact serious or critical fails.
      const blocking = violations
        .filter((v) => v.impact === 'serious' || v.impact === 'critical')
        .map((v) => ({ id: v.id, impact: v.impact, nodes: v.nodes.slice(0, 3) }));
      expect(blocking).toEqual([]);
      // WCAG 2.2 SC 4.1.2 Name, Role, Value: every control has a name (Chromium's accessibility tree).
      expect(await unnamedControls(page)).toEqual([]);
    },
  );
});

describe('loading states', () => {
  it.each([
    ['district brief', '/brief/D01', /\/api\/briefs\/district\/D01(\?|$)/, 'brief-loading'],
    ['alerts', '/alerts', /\/api\/alerts(\?|$)/, 'alerts-screen'],
  ] as const)(
    '%s while its answer is held back: no serious or critical axe-core violation',
    async (_name, path, api, shown) => {
      // Its own context with service workers blocked: requests a worker answers never reach page.route.
      const context = await h.browser.newContext({ viewport: VIEWPORTS.phone, serviceWorkers: 'block' });
      const page = await context.newPage();
      await signIn(page, h.baseUrl, DEMO.official);
      const held: (() => Promise<void>)[] = [];
      const hold = (route: import('playwright-core').Route) => {
        if (!api.test(new URL(route.request().url()).pathname + new URL(route.request().url()).search)) {
          return route.continue();
        }
        held.push(() => route.continue());
      };
      await page.route('**/api/**', hold);
      try {
        await page.goto(`${h.baseUrl}${path}`);
        await page.getByTestId(shown).first().waitFor();
        await page.waitForFunction(() => document.fonts.status === 'loaded');
        expect(held.length).toBeGreaterThan(0);
        const violations = await runAxe(page);
        console.log(`[axe] phone · loading · ${violationTable(path, violations)}`);
        expect(violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual(
          [],
        );
      } finally {
        await page.unroute('**/api/**', hold);
        for (const go of held) await go().catch(() => undefined);
        await context.close();
      }
    },
  );
});

describe('focus order on the wide region page (WCAG 2.2 SC 2.4.3 Focus Order)', () => {
  it('Tab moves through the header, the sections, the list, then the overview, each top to bottom', async () => {
    const page = await openScreen(
      'wide',
      SCREENS.find((s) => s.name === 'region')!,
    );
    const stops = await focusWalk(page, 70);
    console.log(
      `[focus] ${stops.length} stops:\n${stops.map((s) => `  ${s.landmark.padEnd(28)} ${String(s.x).padStart(5)},${String(s.y).padStart(5)} ${s.what}`).join('\n')}`,
    );
    expect(stops.length).toBeGreaterThan(20);
    // Landmarks are visited in reading order, each once: the banner, the sections, the
    // district list (left column), the page's own content (right of it).
    const order: string[] = [];
    for (const s of stops) if (order[order.length - 1] !== s.landmark) order.push(s.landmark);
    expect(new Set(order).size).toBe(order.length);
    expect(order.slice(0, 4)).toEqual(['banner', 'navigation "Sections"', 'navigation "Districts"', 'main']);
    // Within a landmark: each stop is below the one before, or on the same line and to its right.
    const backwards: string[] = [];
    for (let i = 1; i < stops.length; i++) {
      const [a, b] = [stops[i - 1], stops[i]];
      if (a.landmark !== b.landmark) continue;
      // Same line: their vertical middles lie within half the taller one's height.
      const sameLine = Math.abs(b.y + b.height / 2 - (a.y + a.height / 2)) < Math.max(a.height, b.height) / 2;
      const ok = sameLine ? b.x > a.x : b.y > a.y;
      if (!ok) backwards.push(`${a.what} (${a.x},${a.y}) → ${b.what} (${b.x},${b.y})`);
    }
    expect(backwards).toEqual([]);
  });
});

describe('touch targets at the phone viewport', () => {
  it.each(SCREENS.filter((s) => s.only !== 'wide').map((s) => [s.name, s] as const))(
    '%s: every target ≥ 24×24 (WCAG 2.2 SC 2.5.8), primary actions ≥ 44×44 (our choice)',
    async (_name, screen) => {
      const page = await openScreen('phone', screen);
      const found = await smallTargets(page);
      const min = found.smallest;
      console.log(
        `[targets] phone · ${_name}: ${found.checked} targets, ${found.primaries} primary; smallest ${min ? `${min.width}×${min.height} ${min.what}` : '—'}`,
      );
      expect(found.checked).toBeGreaterThan(0);
      expect(found.under24).toEqual([]);
      expect(found.primaryUnder).toEqual([]);
    },
  );

  it('the measure finds a small target, and spares a link inside a sentence (WCAG 2.2 SC 2.5.8 exceptions)', async () => {
    const page = await openScreen(
      'phone',
      SCREENS.find((s) => s.name === 'method')!,
    );
    const added = await page.evaluate(() => {
      const box = document.createElement('div');
      box.id = 'target-check';
      box.style.cssText = 'position:fixed;left:100px;top:300px;width:200px;background:#fff';
      // 16×16 and 10 px from another button: too small, and too close for the spacing exception.
      box.innerHTML =
        '<button data-testid="tiny-a" style="width:16px;height:16px;padding:0;margin:0;position:absolute;left:0;top:0"></button>' +
        '<button data-testid="tiny-b" aria-label="b" style="width:40px;height:40px;padding:0;position:absolute;left:26px;top:0"></button>' +
        '<p style="position:absolute;top:60px;font-size:12px;line-height:14px;margin:0">Read the <a href="#x">notes</a> first.</p>';
      document.body.appendChild(box);
      return true;
    });
    expect(added).toBe(true);
    try {
      const found = await smallTargets(page);
      expect(found.under24.map((t) => t.what)).toEqual(['tiny-a']);
    } finally {
      await page.evaluate(() => document.getElementById('target-check')?.remove());
    }
  });

  it('the open Menu panel: every target ≥ 24×24, the Menu button ≥ 44×44', async () => {
    const page = await openScreen(
      'phone',
      SCREENS.find((s) => s.name === 'region list')!,
    );
    await page.getByTestId('menu-button').click();
    await page.getByTestId('nav-menu').waitFor();
    const found = await smallTargets(page);
    expect(found.primaries).toBeGreaterThan(0);
    expect(found.under24).toEqual([]);
    expect(found.primaryUnder).toEqual([]);
    await page.getByTestId('menu-button').click();
  });
});

describe('phone details', () => {
  it('the Menu panel closes on Escape and gives the focus back to the Menu button (WAI-ARIA APG, Disclosure)', async () => {
    const page = await openScreen(
      'phone',
      SCREENS.find((s) => s.name === 'alerts')!,
    );
    await page.getByTestId('menu-button').click();
    await page.getByTestId('nav-menu').waitFor();
    await page.getByTestId('menu-method').focus();
    await h.shot(page, 'a11y-phone-menu-open');
    await page.keyboard.press('Escape');
    await page.getByTestId('nav-menu').waitFor({ state: 'detached' });
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).toBe('menu-button');
    expect(await page.getByTestId('menu-button').getAttribute('aria-expanded')).toBe('false');
    // Choosing a section closes it too.
    await page.getByTestId('menu-button').click();
    await page.getByTestId('menu-method').click();
    await page.waitForURL(/\/method$/);
    expect(await page.getByTestId('nav-menu').count()).toBe(0);
  });

  it.each(['phone', 'wide'] as const)(
    'at the %s viewport, Refresh on the region and the card fetches again and says when',
    async (viewport) => {
      const checks: [string, string][] = [
        [viewport === 'phone' ? 'region list' : 'region', 'region-refresh'],
        ['district card (track)', 'card-refresh'],
      ];
      for (const [name, id] of checks) {
        const page = await openScreen(
          viewport,
          SCREENS.find((s) => s.name === name && (!s.only || s.only === viewport))!,
        );
        const button = page.getByTestId(id);
        await button.waitFor();
        expect(await button.isVisible()).toBe(true);
        const status = page.getByTestId(`${id}-status`);
        const updated = () =>
          page.waitForFunction(
            (tid) =>
              /^Updated \d\d:\d\d$/.test(document.querySelector(`[data-testid="${tid}-status"]`)?.textContent ?? ''),
            id,
            { timeout: 15_000 },
          );
        await updated();
        const asked: string[] = [];
        const onRequest = (r: { url(): string }) => {
          if (r.url().includes('/api/')) asked.push(new URL(r.url()).pathname);
        };
        page.on('request', onRequest);
        await button.click();
        await updated();
        expect(await status.innerText()).toMatch(/^Updated \d\d:\d\d$/);
        page.off('request', onRequest);
        // The screen's own answers were asked for again.
        if (id === 'region-refresh') expect(asked).toContain('/api/region');
        else expect(asked.some((p) => /^\/api\/districts\/D01\/estimate$/.test(p))).toBe(true);
        const box = (await button.boundingBox())!;
        expect(box.width).toBeGreaterThanOrEqual(44);
        expect(box.height).toBeGreaterThanOrEqual(44);
        await h.shot(page, `a11y-${viewport}-${id}`);
      }
    },
  );
});

it('sends no request beyond 127.0.0.1', () => {
  expect(offLoopback(h.requests)).toEqual([]);
});
