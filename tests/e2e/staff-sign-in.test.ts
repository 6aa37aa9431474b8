/**
 * Browser test: the sign-in flow end to end through the stand-in page — choose the analyst,
 * land signed in, see the role in the app and only the sections an analyst may use, then
 * sign out — at a phone and a laptop viewport. No request may leave 127.0.0.1.
 */
import { DEMO } from '../support/auth';
import { offLoopback, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { signInThroughStandIn } from '../support/staff-steps';

jest.setTimeout(120_000);

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => h?.close());

describe.each([
  ['phone', VIEWPORTS.phone],
  ['laptop', VIEWPORTS.laptop],
] as const)('at the %s viewport', (name, viewport) => {
  it('signs in as the analyst through the stand-in, shows the role, signs out', async () => {
    const { context, page } = await h.newPage(viewport);
    try {
      await page.goto(`${h.baseUrl}/sign-in`);
      await page.getByRole('heading', { name: 'Sign in to Crestwatch' }).waitFor();
      await h.shot(page, `staff-${name}-sign-in`);

      await signInThroughStandIn(page, h.baseUrl, DEMO.analyst);
      const role = page.getByTestId('account-role');
      await role.waitFor();
      expect(await role.innerText()).toBe('Analyst');

      const phone = name === 'phone';
      if (phone) {
        await page.getByTestId('menu-button').click();
        await page.getByTestId('nav-menu').waitFor();
      }
      const prefix = phone ? 'menu' : 'nav';
      // An analyst's sections, and none of the admin's.
      for (const key of ['region', 'alerts', 'runs', 'uploads', 'specs', 'method']) {
        expect(await page.getByTestId(`${prefix}-${key}`).isVisible()).toBe(true);
      }
      for (const key of ['people', 'settings', 'audit', 'mailbox']) {
        expect(await page.getByTestId(`${prefix}-${key}`).count()).toBe(0);
      }
      expect(await page.getByTestId('account-name').first().innerText()).toMatch(/analyst|Analyst/);
      await h.shot(page, `staff-${name}-signed-in${phone ? '-menu' : ''}`);

      // An admin-only screen reached by its address says why it is closed.
      await page.goto(`${h.baseUrl}/people`);
      await page.getByTestId('role-gate-refused').waitFor();
      expect(await page.getByTestId('role-gate-refused').innerText()).toMatch(/Not available to analysts/);

      if (phone) await page.getByTestId('menu-button').click();
      await page.getByTestId('sign-out').click();
      await page.waitForURL(`${h.baseUrl}/sign-in`);
      await page.getByRole('heading', { name: 'Sign in to Crestwatch' }).waitFor();
      expect(await page.getByTestId('account-role').count()).toBe(0);
      // The session is gone on the server too.
      const me = await page.request.get(`${h.baseUrl}/api/me`);
      expect(me.status()).toBe(401);
      await h.shot(page, `staff-${name}-signed-out`);
    } finally {
      await context.close();
    }
  });
});

it('sends no request beyond 127.0.0.1', () => {
  expect(h.requests.length).toBeGreaterThan(10);
  expect(offLoopback(h.requests)).toEqual([]);
});
