/**
 * Browser test: an analyst loads the demo long CSV through the app — chooses it with the
 * document picker, sees the preview, loads it, sees the new values on the district, reverts
 * it from the history and sees the old values back — at a phone and a wide viewport.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEMO } from '../support/auth';
import { offLoopback, root, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { openSection, signIn } from '../support/staff-steps';

jest.setTimeout(180_000);

const DEMO_LONG = path.join(root, 'assets', 'demo-data', 'demo-long.csv');

/** The file's own value for D03's 2021 emissions, as the district table prints it (two places). */
function fileValueD03_2021(): string {
  const line = fs
    .readFileSync(DEMO_LONG, 'utf8')
    .split(/\r?\n/)
    .find((l) => l.startsWith('D03,emissions_pc,2021,'));
  if (!line) throw new Error('demo-long.csv no longer revises D03 emissions in 2021: pick another value for this test');
  return Number(line.split(',')[3]).toFixed(2);
}

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => h?.close());

/** D03's emissions in 2021 as the district's yearly table (or, on a phone, its card for 2021) shows it. */
async function d03Emissions2021(page: Page): Promise<string> {
  await page.goto(`${h.baseUrl}/district/D03`);
  const row = page.getByTestId('series-row-2021');
  await row.waitFor();
  expect((await row.innerText()).trim()).toMatch(/^2021\b/);
  return (await row.getByTestId('series-value-2021-emissions_pc').innerText()).trim();
}

async function chooseFile(page: Page, file: string): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId('upload-choose').click();
  await (await chooser).setFiles(file);
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.wide],
] as const)('at the %s viewport', (name, viewport) => {
  it('checks, loads and reverts the demo long CSV', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, h.baseUrl, DEMO.analyst);
      const before = await d03Emissions2021(page);
      const revised = fileValueD03_2021();
      expect(before).not.toBe(revised);

      await page.goto(`${h.baseUrl}/`);
      await openSection(page, 'uploads', name === 'phone');
      await page.waitForURL(`${h.baseUrl}/uploads`);
      await page.getByTestId('upload-history').waitFor();

      await chooseFile(page, DEMO_LONG);
      await page.getByTestId('upload-ready').waitFor();
      expect(await page.getByTestId('upload-file').innerText()).toContain('demo-long.csv');
      expect(await page.getByTestId('preview-district-D03').innerText()).toMatch(/Cindervale/);
      expect(parseInt(await page.getByTestId('preview-change').innerText(), 10)).toBeGreaterThan(0);
      await h.shot(page, `staff-${name}-upload-preview`);
      await page.getByTestId('preview').scrollIntoViewIfNeeded();
      await h.shot(page, `staff-${name}-upload-preview-tables`);

      await page.getByTestId('upload-commit').click();
      const done = page.getByTestId('upload-done-ok');
      await done.waitFor();
      const doneText = await done.innerText();
      expect(doneText).toMatch(/Loaded as upload #\d+/);
      const uploadId = Number(/#(\d+)/.exec(doneText)![1]);
      await h.shot(page, `staff-${name}-upload-done`);

      // The district shows the file's value for 2021.
      expect(await d03Emissions2021(page)).toBe(revised);

      await page.goto(`${h.baseUrl}/uploads`);
      await page.getByTestId(`upload-row-${uploadId}`).waitFor();
      expect(await page.getByTestId(`upload-status-${uploadId}`).innerText()).toBe('Loaded');
      await page.getByTestId(`upload-revert-${uploadId}`).click();
      await page.getByTestId(`upload-revert-${uploadId}-confirm`).click();
      await page.getByTestId('upload-revert-ok').waitFor();
      expect(await page.getByTestId('upload-revert-ok').innerText()).toMatch(
        new RegExp(`Upload #${uploadId} reverted`),
      );
      await page.getByText('Reverted', { exact: true }).first().waitFor();
      await h.shot(page, `staff-${name}-upload-reverted`);

      expect(await d03Emissions2021(page)).toBe(before);
    } finally {
      await context.close();
    }
  });
});

it('refuses a file with errors and lists them by line and column', async () => {
  const { context, page } = await h.newPage(VIEWPORTS.laptop);
  try {
    await signIn(page, h.baseUrl, DEMO.analyst);
    await page.goto(`${h.baseUrl}/uploads`);
    await page.getByTestId('upload-history').waitFor();
    await chooseFile(page, path.join(root, 'tests', 'fixtures', 'bad-csv', 'not-a-number.csv'));
    await page.getByTestId('upload-refused').waitFor();
    // Where the problem is comes from the corpus's own expectations (tests/fixtures/bad-csv/expected.json).
    const expected = JSON.parse(
      fs.readFileSync(path.join(root, 'tests', 'fixtures', 'bad-csv', 'expected.json'), 'utf8'),
    )['not-a-number.csv'];
    const rows = await page.locator('[data-testid^="problem-"]').allInnerTexts();
    const errors = rows
      .map((r) =>
        r
          .split('\n')
          .map((c) => c.trim())
          .filter(Boolean),
      )
      .filter((cells) => cells.includes('Error'));
    expect(errors).toHaveLength(1);
    expect(errors[0][0]).toBe(String(expected.line));
    expect(errors[0][1]).toMatch(new RegExp(`^${expected.column}\\b`));
    // Where it stopped: every row was read, the checks refused it at the first bad line.
    expect(await page.getByTestId('upload-stopped-at').innerText()).toBe(
      `Stopped while checking against stored data, at line ${expected.line}.`,
    );
    await h.shot(page, 'staff-laptop-upload-refused');
  } finally {
    await context.close();
  }
});

it('shows the bytes sent while a large file goes up, then its preview', async () => {
  // 600 new districts × 4 indicators × 30 years: 72,000 rows, about 3 MB (invented values).
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'crestwatch-e2e-')), 'large.csv');
  const lines = ['district_code,district_name,indicator,year,value'];
  for (let d = 1; d <= 600; d++)
    for (const ind of ['emissions_pc', 'income_pc', 'population', 'pop_density'])
      for (let y = 1996; y < 2026; y++)
        lines.push(`N${String(d).padStart(4, '0')},Newfield ${d},${ind},${y},${d + y / 1000}`);
  fs.writeFileSync(file, lines.join('\n') + '\n');
  const rows = lines.length - 1;
  const { context, page } = await h.newPage(VIEWPORTS.laptop);
  try {
    await signIn(page, h.baseUrl, DEMO.analyst);
    await page.goto(`${h.baseUrl}/uploads`);
    await page.getByTestId('upload-history').waitFor();
    await page.getByTestId('upload-allow-new').click();
    // Uploads slowed to 600 KB/s (Chromium's network emulation), so the bytes sent can be watched.
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 0,
      downloadThroughput: -1,
      uploadThroughput: 600 * 1024,
    });
    await chooseFile(page, file);
    const bar = page.getByTestId('upload-bytes');
    // Part of the file sent: the bar's value is between its ends (WAI-ARIA 1.2 progressbar), in words too.
    await page.waitForFunction(
      () => {
        const el = document.querySelector('[data-testid="upload-bytes"]');
        const now = Number(el?.getAttribute('aria-valuenow'));
        return now > 0 && now < Number(el?.getAttribute('aria-valuemax'));
      },
      undefined,
      { timeout: 30_000 },
    );
    expect(await bar.getAttribute('role')).toBe('progressbar');
    const size = fs.statSync(file).size;
    // The body is the file and a few hundred bytes of multipart headers.
    const max = Number(await bar.getAttribute('aria-valuemax'));
    expect(max - size).toBeGreaterThan(0);
    expect(max - size).toBeLessThan(1000);
    // formatBytes: kB and MB are 10^3 and 10^6 bytes.
    expect(await bar.getAttribute('aria-valuetext')).toMatch(
      new RegExp(`^\\d+(\\.\\d)? (bytes|kB|MB) of ${(max / 1e6).toFixed(1).replace('.', '\\.')} MB$`),
    );
    await h.shot(page, 'staff-laptop-upload-progress');
    // Once sent, the server's phases follow with their counts (polled); then the preview replaces them.
    await page.getByTestId('upload-ready').waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('preview-insert').innerText()).toContain(String(rows));
    expect(await page.getByTestId('upload-progress').count()).toBe(0);
  } finally {
    await context.close();
  }
});

it('sends no request beyond 127.0.0.1', () => {
  expect(offLoopback(h.requests)).toEqual([]);
});
