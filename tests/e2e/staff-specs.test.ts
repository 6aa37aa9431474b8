/**
 * Browser test of model specs: an analyst saves a new spec from the app, finds it in the
 * list and as a choice for "re-estimate now", then archives it — wide, then the editor on
 * a phone.
 */
import { DEMO } from '../support/auth';
import { offLoopback, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { openSection, signIn } from '../support/staff-steps';

jest.setTimeout(120_000);

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => h?.close());

it('an analyst saves a spec, sees it offered for a run, and archives it (wide)', async () => {
  const { context, page } = await h.newPage(VIEWPORTS.wide);
  try {
    await signIn(page, h.baseUrl, DEMO.analyst);
    await openSection(page, 'specs', false);
    const list = page.getByTestId('specs-list');
    await list.waitFor();
    expect(await list.innerText()).toMatch(
      /Regional default\s+Headline track’s spec[\s\S]*Used by CO2 emissions per person/,
    );
    await h.shot(page, 'staff-wide-specs');

    await page.getByRole('link', { name: 'New spec' }).click();
    await page.waitForURL(`${h.baseUrl}/specs/new`);
    await page.getByTestId('spec-name').fill('Levels without controls');
    await page.getByText('Levels', { exact: true }).click();
    await page.getByTestId('spec-covariance-hc1').click();
    await page.getByTestId('spec-save').click();
    await page.waitForURL(/\/specs\/\d+$/);
    const id = Number(/\/specs\/(\d+)$/.exec(page.url())![1]);
    await page.getByTestId(`spec-row-${id}`).waitFor();
    expect(await page.getByTestId(`spec-row-${id}`).innerText()).toMatch(
      /Level quadratic in income_pc, no controls, HC1 errors/,
    );
    await h.shot(page, 'staff-wide-spec-saved');

    // The track watching the spec's indicator offers it; the track keeps its spec until staff switch it.
    await page.locator(`[data-testid^="track-spec-choice-"][data-testid$="-${id}"]`).first().waitFor();
    expect(await page.getByTestId('track-specs').innerText()).toMatch(/next run uses “Regional default”/);
    await openSection(page, 'runs', false);
    await page.getByTestId('run-start').waitFor();
    expect(await page.getByTestId('runs-screen').innerText()).toMatch(/Track: .+ \(spec “Regional default”\)/);

    await page.goto(`${h.baseUrl}/specs/${id}`);
    await page.getByTestId('spec-archive').click();
    await page.getByTestId('spec-archive-confirm').click();
    await page.waitForURL(/\/specs\?archived=/);
    expect(await page.getByTestId('specs-notice-ok').innerText()).toBe(
      'Archived “Levels without controls”. Runs keep their own copy of it.',
    );
    await page.getByTestId('specs-list').waitFor();
    expect(await page.getByTestId(`spec-row-${id}`).count()).toBe(0);
    await h.shot(page, 'staff-wide-spec-archived');
  } finally {
    await context.close();
  }
});

it('opens the default spec’s editor on its own on a phone', async () => {
  const { context, page } = await h.newPage(VIEWPORTS.phone);
  try {
    await signIn(page, h.baseUrl, DEMO.analyst);
    await openSection(page, 'specs', true);
    await page.getByTestId('specs-list').getByRole('link', { name: 'Regional default' }).click();
    await page.getByTestId('spec-editor').waitFor();
    expect(await page.getByTestId('specs-list').count()).toBe(0);
    expect(await page.getByTestId('spec-name').inputValue()).toBe('Regional default');
    await h.shot(page, 'staff-phone-spec-editor');
  } finally {
    await context.close();
  }
});

it('sends no request beyond 127.0.0.1', () => {
  expect(offLoopback(h.requests)).toEqual([]);
});
