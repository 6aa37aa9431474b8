/**
 * Browser test of a quarterly re-estimation from the app, over a region with a published
 * run: an official subscribes to the whole region; an analyst loads the income revision
 * that moves Mirefield Uplands (D13) across its band, starts a run, waits, reviews the
 * changes (filter, one district's split, checks and residuals, a note) and publishes; the
 * official's feed shows the crossing and opens the district card; an admin sees the
 * scheduled job with its next start in the settings. Wide first, then the same screens on
 * a phone. No request may leave 127.0.0.1.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEMO } from '../support/auth';
import { offLoopback, root, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { openSection, signIn } from '../support/staff-steps';

jest.setTimeout(300_000);

const REVISION = path.join(root, 'assets', 'demo-data', 'income-revision-2025.csv');

let h: Harness;
let runId = 0;
beforeAll(async () => {
  h = await startHarness({ publishRun: true, jobs: true, mailCatcher: true });
});
afterAll(async () => h?.close());

async function loadFile(page: Page, file: string): Promise<void> {
  await page.goto(`${h.baseUrl}/uploads`);
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('upload-choose').click();
  await (await chooser).setFiles(file);
  await page.getByTestId('upload-commit').click();
  await page.getByTestId('upload-done-ok').waitFor();
}

describe('at the wide viewport', () => {
  it('an official subscribes to the whole region', async () => {
    const { context, page } = await h.newPage(VIEWPORTS.wide);
    try {
      await signIn(page, h.baseUrl, DEMO.official);
      await openSection(page, 'alerts', false);
      await page.getByTestId('alerts-screen').waitFor();
      await page.getByRole('link', { name: 'Manage subscriptions' }).click();
      await page.waitForURL(`${h.baseUrl}/subscriptions`);
      await page.getByTestId('sub-scope-region').click();
      await page.getByTestId('sub-save').click();
      await page.getByTestId('sub-ok').waitFor();
      await page.getByTestId('subs-list').getByText('The whole region').waitFor();
      await h.shot(page, 'staff-wide-subscriptions');
    } finally {
      await context.close();
    }
  });

  it('an analyst loads the revision, re-estimates, reviews and publishes', async () => {
    const { context, page } = await h.newPage(VIEWPORTS.wide);
    try {
      await signIn(page, h.baseUrl, DEMO.analyst);
      await loadFile(page, REVISION);

      await openSection(page, 'runs', false);
      await page.getByTestId('runs-table').waitFor();
      expect(await page.getByTestId('runs-schedule').innerText()).toMatch(/Next scheduled run:/);
      await page.getByTestId('run-start').click();
      await page.waitForURL(/\/runs\/\d+$/);
      runId = Number(/\/runs\/(\d+)$/.exec(page.url())![1]);
      await page.getByTestId('run-facts').waitFor();
      await h.shot(page, 'staff-wide-run-working');

      // The run is polled until it reaches review; then the table appears.
      await page.getByTestId('review-table').waitFor({ timeout: 120_000 });
      expect(await page.getByTestId('run-state').innerText()).toBe('In review');
      await page.getByTestId('review-row-D13').waitFor();
      await h.shot(page, 'staff-wide-run-review');

      // Filter to the districts whose standing moved: D13 is among them.
      await page.getByTestId('review-filter-standing').click();
      const count = await page.getByTestId('review-count').innerText();
      expect(count).toMatch(/of 24 districts/);
      expect(await page.getByTestId('review-row-D13').innerText()).toMatch(/Approaching →/);
      // Sorting by the threshold move reorders the rows (largest move first).
      await page.getByTestId('review-filter-all').click();
      await page.getByTestId('review-table-sort-move').click();
      const moves = await page.getByTestId('review-table').evaluate((table) => {
        const headers = [...table.querySelectorAll('[role="columnheader"]')];
        const at = headers.findIndex((h) => /Moved/.test(h.textContent ?? ''));
        return [...table.querySelectorAll('[data-testid^="review-row-"]')].map(
          (row) => row.querySelectorAll('[role="cell"]')[at]?.textContent?.trim() ?? '',
        );
      });
      expect(moves).toHaveLength(24);
      // '+12.3%' / '−4.5%' / '0%' → its size; '—' (no threshold to compare) → null, listed last.
      const sizes = moves.map((m) => (m === '—' ? null : Math.abs(Number(m.replace('−', '-').replace(/[+%]/g, '')))));
      expect(sizes.every((v) => v === null || Number.isFinite(v))).toBe(true);
      const known = sizes.filter((v): v is number => v !== null);
      expect(known.length).toBeGreaterThan(1);
      expect(known).toEqual([...known].sort((a, b) => b - a));
      expect(sizes.slice(known.length).every((v) => v === null)).toBe(true);

      // A district far down the table opens beside it in view: the panel stays put while the table scrolls.
      const last = page.getByTestId('review-row-D24');
      await last.scrollIntoViewIfNeeded();
      await last.getByRole('link').first().click();
      await page.waitForURL(/district=D24/);
      const panel = page.getByTestId('district-review');
      await panel.getByRole('heading', { name: /\(D24\)/ }).waitFor();
      const box = (await panel.getByRole('heading', { name: /\(D24\)/ }).boundingBox())!;
      expect(box.y).toBeGreaterThanOrEqual(0);
      expect(box.y + box.height).toBeLessThanOrEqual(VIEWPORTS.wide.height);
      await h.shot(page, 'staff-wide-run-district-far-down');

      await page.getByTestId('review-row-D13').getByRole('link').first().click();
      await page.waitForURL(/district=D13/);
      await panel.getByRole('heading', { name: /\(D13\)/ }).waitFor();
      await panel.getByTestId('movement').waitFor();
      expect(await panel.getByTestId('movement-data').innerText()).toMatch(/Data revisions/);
      expect(await panel.getByTestId('movement-spec').innerText()).toMatch(/same spec/);
      await panel.getByTestId('diagnostics').waitFor();
      await panel.getByTestId('residual-plot-box').locator('svg').waitFor();
      expect(await panel.getByTestId('residual-plot-summary').innerText()).toMatch(/years/);
      await panel.getByTestId('note-input').fill('Income revised by the statistics office for 2024–2025.');
      await panel.getByTestId('note-save').click();
      await panel.getByTestId('note-ok').waitFor();
      await h.shot(page, 'staff-wide-run-district');

      await page.getByTestId('run-publish').click();
      await page.getByTestId('run-publish-confirm').click();
      const ok = page.getByTestId('run-decision-ok');
      await ok.waitFor();
      expect(await ok.innerText()).toMatch(/Published\. Compared with run #\d+: [1-9]\d* alerts? raised/);
      expect(await page.getByTestId('run-state').innerText()).toBe('Published');
      await h.shot(page, 'staff-wide-run-published');
    } finally {
      await context.close();
    }
  });

  it('the official’s feed shows the crossing, unread, and opens the district card', async () => {
    const { context, page } = await h.newPage(VIEWPORTS.wide);
    try {
      await signIn(page, h.baseUrl, DEMO.official);
      await page.goto(`${h.baseUrl}/alerts`);
      const list = page.getByTestId('alerts-list');
      await list.waitFor();
      const item = list
        .locator('[data-testid^="alert-"]', { hasText: 'Mirefield Uplands' })
        .filter({ hasText: 'Standing moved' })
        .first();
      await item.waitFor();
      expect(await item.innerText()).toMatch(/New/);
      await h.shot(page, 'staff-wide-alerts');
      await item.getByRole('link').first().click();
      // The alert's link opens the card on the alert's own track.
      await page.waitForURL(/\/district\/D13\?track=[a-z][a-z0-9-]*$/);
      await page.goto(`${h.baseUrl}/alerts`);
      await page.getByTestId('alerts-show-unread').click();
      await page.getByTestId('alerts-screen').waitFor();
      expect(
        await page
          .getByTestId('alerts-screen')
          .getByText('Mirefield Uplands')
          .filter({ hasText: 'Standing moved' })
          .count(),
      ).toBe(0);
    } finally {
      await context.close();
    }
  });

  it('an admin sees the scheduled job with its next start', async () => {
    const { context, page } = await h.newPage(VIEWPORTS.wide);
    try {
      await signIn(page, h.baseUrl, DEMO.admin);
      await openSection(page, 'settings', false);
      await page.getByTestId('schedule').waitFor();
      const next = await page.getByTestId('schedule-next').innerText();
      expect(next).toMatch(/^Next start: \d{1,2} (Jan|Apr|Jul|Oct) \d{4}, 06:00 UTC/);
      expect(await page.getByTestId('schedule').innerText()).toMatch(
        /06:00 on the 1st of January, April, July and October/,
      );
      await h.shot(page, 'staff-wide-settings');
    } finally {
      await context.close();
    }
  });
});

describe('at the phone viewport', () => {
  it('shows the published run, one district and the settings', async () => {
    expect(runId).toBeGreaterThan(0);
    const { context, page } = await h.newPage(VIEWPORTS.phone);
    try {
      await signIn(page, h.baseUrl, DEMO.admin);
      await openSection(page, 'runs', true);
      await page.getByTestId(`run-row-${runId}`).waitFor();
      expect(await page.getByTestId(`run-row-state-${runId}`).innerText()).toBe('Published');
      await h.shot(page, 'staff-phone-runs');
      await page.goto(`${h.baseUrl}/runs/${runId}`);
      await page.getByTestId('review-table').waitFor();
      await h.shot(page, 'staff-phone-run-review');
      await page.goto(`${h.baseUrl}/runs/${runId}?district=D13`);
      await page.getByTestId('district-review').waitFor();
      // On a phone the district stands alone, with its way back to the table.
      expect(await page.getByTestId('review-table').count()).toBe(0);
      await page.getByTestId('movement').waitFor();
      await h.shot(page, 'staff-phone-run-district');
      await page.getByTestId('residual-plot').scrollIntoViewIfNeeded();
      await page.getByTestId('residual-plot-box').locator('svg').waitFor();
      await h.shot(page, 'staff-phone-run-residuals');
      await openSection(page, 'settings', true);
      await page.getByTestId('schedule-next').waitFor();
      await h.shot(page, 'staff-phone-settings');
    } finally {
      await context.close();
    }
  });
});

it('sends no request beyond 127.0.0.1', () => {
  expect(offLoopback(h.requests)).toEqual([]);
});
