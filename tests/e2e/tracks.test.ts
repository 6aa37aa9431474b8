/**
 * Browser test of tracks on the officials' screens, at a phone (390×844) and a wide
 * (1440×900) viewport. Over the demo region with its published CO₂ run, an analyst adds an
 * invented fine-particle series (µg/m³) for every district, saves a spec of it, an admin
 * makes it a track, and its first run is published. Then an official switches tracks on
 * the region view (the choice goes into the URL and is remembered on the device; the URL
 * wins over the device), opens a district card on the particle track and reads the rows
 * per track at its top. Screenshots are kept under tests/artifacts/screenshots. No request
 * may leave 127.0.0.1. The series and track get codes of their own (pm25_invented,
 * particles), so they stand beside any particle track the demo region brings.
 */
import type { Page } from 'playwright-core';
import { DEMO } from '../support/auth';
import { offLoopback, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { signIn } from '../support/staff-steps';

jest.setTimeout(300_000);

let h: Harness;
let headline = '';

beforeAll(async () => {
  h = await startHarness({ publishRun: true, jobs: true });
  const { context, page } = await h.newPage(VIEWPORTS.wide);
  try {
    await signIn(page, h.baseUrl, DEMO.analyst);
    headline = (await get<{ tracks: { code: string; headline: boolean }[] }>(page, '/api/tracks')).tracks.find(
      (t) => t.headline,
    )!.code;
    await send(page, 'POST', '/api/indicators', {
      code: 'pm25_invented',
      name: 'PM2.5 annual mean',
      unit: 'µg/m³',
      description: 'Invented fine-particle concentrations for the demo region (annual mean).',
      mustBePositive: true,
    });
    await uploadParticles(page);
    const specs = await get<{ specs: Record<string, unknown>[]; headlineSpecId: number }>(page, '/api/specs');
    const base = specs.specs.find((s) => s.id === specs.headlineSpecId)!;
    const { id: _id, archived: _a, createdAt: _c, updatedAt: _u, tracks: _t, ...input } = base;
    const saved = await send<{ spec: { id: number } }>(page, 'POST', '/api/specs', {
      ...input,
      name: 'Fine particles default',
      description: 'The default model for the particle series.',
      emissionsIndicator: 'pm25_invented',
    });
    await signIn(page, h.baseUrl, DEMO.admin);
    await send(page, 'POST', '/api/tracks', { code: 'particles', name: 'Fine particles', specId: saved.spec.id });
    await signIn(page, h.baseUrl, DEMO.analyst);
    const started = await send<{ id: number }>(page, 'POST', '/api/runs', { track: 'particles' });
    for (let i = 0; i < 240; i++) {
      const run = await get<{ state: string; error: string | null }>(page, `/api/runs/${started.id}`);
      if (run.state === 'failed') throw new Error(`the particle run failed: ${run.error}`);
      if (run.state === 'in_review') break;
      await page.waitForTimeout(500);
    }
    await send(page, 'POST', `/api/runs/${started.id}/publish`);
  } finally {
    await context.close();
  }
});
afterAll(async () => h?.close());

async function get<T>(page: Page, path: string): Promise<T> {
  const res = await page.request.get(`${h.baseUrl}${path}`);
  if (!res.ok()) throw new Error(`GET ${path}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

async function send<T = unknown>(page: Page, method: 'POST' | 'PATCH', path: string, body: unknown = {}): Promise<T> {
  const me = await get<{ csrfToken: string }>(page, '/api/me');
  const res = await page.request.fetch(`${h.baseUrl}${path}`, {
    method,
    headers: { 'x-csrf-token': me.csrfToken, 'content-type': 'application/json' },
    data: JSON.stringify(body),
  });
  if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
  return (res.status() === 204 ? undefined : await res.json()) as T;
}

/**
 * An invented particle series per district: a rise-then-fall in income whose peak sits at
 * a different income in each district (some past it, some before it), times a small
 * year-to-year wobble, so the track's standings differ from the CO₂ ones. Loaded through
 * the uploads screen like an analyst's file.
 */
async function uploadParticles(page: Page): Promise<void> {
  const { districts } = await get<{ districts: { code: string }[] }>(page, '/api/districts');
  const lines = ['district_code,indicator,year,value'];
  for (const [k, d] of districts.entries()) {
    const detail = await get<{ series: { year: number; incomePc: number | null }[] }>(page, `/api/districts/${d.code}`);
    const incomes = detail.series.filter((r) => r.incomePc !== null).map((r) => r.incomePc!);
    const mid = incomes.length ? incomes[Math.floor(incomes.length / 2)] : 20000;
    const peak = mid * (k % 2 === 0 ? 0.8 : 1.6);
    for (const r of detail.series) {
      if (r.incomePc === null) continue;
      const u = Math.log(r.incomePc / peak);
      const value = 18 * Math.exp(-1.5 * u * u) * (1 + 0.02 * Math.sin(r.year + k));
      lines.push(`${d.code},pm25_invented,${r.year},${value.toFixed(3)}`);
    }
  }
  await page.goto(`${h.baseUrl}/uploads`);
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('upload-choose').click();
  await (
    await chooser
  ).setFiles({ name: 'pm25-series.csv', mimeType: 'text/csv', buffer: Buffer.from(lines.join('\n') + '\n') });
  await page.getByTestId('upload-commit').click();
  await page.getByTestId('upload-done-ok').waitFor({ timeout: 120_000 });
}

const checked = (page: Page, code: string) =>
  page.getByTestId(`track-option-${code}`).first().getAttribute('aria-checked');

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.wide],
] as const)('at the %s viewport', (name, viewport) => {
  it('switches tracks on the region view and reads every track’s row on a card', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, h.baseUrl, DEMO.official);
      // Neither the URL nor the device names a track: the headline track is on.
      await page.getByTestId('track-switcher').first().waitFor();
      expect(await checked(page, headline)).toBe('true');
      expect(await checked(page, 'particles')).toBe('false');
      await page.waitForFunction(() => document.fonts.status === 'loaded');
      await h.shot(page, `tracks-${name}-region-headline`);

      // Switching puts the track in the URL and on the device; the list follows it.
      const reloaded = page.waitForResponse((r) => r.url().endsWith('/api/region?track=particles'));
      await page.getByTestId('track-option-particles').first().click();
      await reloaded;
      await page.waitForURL(/\?track=particles$/);
      expect(await checked(page, 'particles')).toBe('true');
      expect(await page.evaluate(() => localStorage.getItem('crestwatch.track'))).toBe('particles');
      await page.getByTestId('district-row-D07').waitFor();
      await h.shot(page, `tracks-${name}-region-pm25`);

      // The device remembers it: the bare address opens on it …
      await page.goto(`${h.baseUrl}/`);
      await page.getByTestId('track-switcher').first().waitFor();
      await page.waitForFunction(
        () => document.querySelector('[data-testid="track-option-particles"]')?.getAttribute('aria-checked') === 'true',
      );
      // … and the URL wins over the device.
      await page.goto(`${h.baseUrl}/?track=${headline}`);
      await page.waitForFunction(
        (code) =>
          document.querySelector(`[data-testid="track-option-${code}"]`)?.getAttribute('aria-checked') === 'true',
        headline,
      );
      expect(await checked(page, 'particles')).toBe('false');

      // The card on the particle track: one row per track at the top, the particle card below.
      await page.goto(`${h.baseUrl}/district/D07?track=particles`);
      await page.getByTestId('track-rows').waitFor();
      await page.getByTestId('card-track').waitFor();
      expect(await page.getByTestId('card-track').innerText()).toBe('Fine particles · µg/m³');
      expect(await page.getByTestId(`track-row-${headline}`).count()).toBe(1);
      expect(await page.getByTestId('track-row-particles').count()).toBe(1);
      const pmRow = await page.getByTestId('track-row-particles').innerText();
      expect(pmRow).toMatch(/Fine particles/);
      expect(pmRow).toMatch(/µg\/m³/);
      expect(pmRow).toMatch(/Approaching|At the turn|Past the turn|No turn|Not estimable/);
      expect(await page.getByTestId(`track-row-${headline}`).innerText()).toMatch(/t CO2 per person/);
      // The curve chart is titled by the particle indicator.
      await page.getByTestId('curve-chart').waitFor();
      await page.waitForFunction(() => document.fonts.status === 'loaded');
      await h.shot(page, `tracks-${name}-card-pm25`);
      expect(await page.getByTestId('curve-chart').innerText()).toMatch(/PM2\.5 annual mean and income/);

      // Pressing the headline row shows that track's card, in the URL too.
      await page.getByTestId(`track-row-${headline}`).click();
      await page.waitForURL(new RegExp(`/district/D07\\?track=${headline}$`));
      await page.waitForFunction(() =>
        (document.querySelector('[data-testid="card-track"]') as HTMLElement | null)?.innerText.includes('t CO2'),
      );
      await h.shot(page, `tracks-${name}-card-headline`);
      expect(offLoopback(h.requests)).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
