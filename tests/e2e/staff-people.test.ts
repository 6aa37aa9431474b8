/**
 * Browser test of the admin screens: invite a person with a role from the People screen,
 * read the invitation in the demo mailbox (the local mail catcher), see the invitation in
 * the audit log, then the invitee signs in with that role — at a wide and a phone viewport.
 */
import { DEMO } from '../support/auth';
import { offLoopback, startHarness, VIEWPORTS, type Harness } from '../support/browser';
import { openSection, signIn } from '../support/staff-steps';

jest.setTimeout(180_000);

let h: Harness;
beforeAll(async () => {
  h = await startHarness({ mailCatcher: true });
});
afterAll(async () => h?.close());

describe.each([
  ['wide', VIEWPORTS.wide, 'new.analyst@crestwatch.example', 'analyst', 'Analyst'],
  ['phone', VIEWPORTS.phone, 'new.official@crestwatch.example', 'official', 'Official'],
] as const)('at the %s viewport', (name, viewport, email, role, roleLabel) => {
  it(`an admin invites ${email} as ${role}; the mailbox shows the invitation`, async () => {
    const phone = name === 'phone';
    const { context, page } = await h.newPage(viewport);
    try {
      await signIn(page, h.baseUrl, DEMO.admin);
      await openSection(page, 'people', phone);
      await page.getByTestId('people-list').waitFor();
      await page.getByTestId('invite-email').fill(email);
      await page.getByTestId(`invite-role-${role}`).click();
      await page.getByTestId('invite-send').click();
      const ok = page.getByTestId('invite-ok');
      await ok.waitFor();
      expect(await ok.innerText()).toContain(email);
      // The new person is listed as invited, with the role given.
      const card = page.getByTestId('people-list').locator('[data-testid^="person-"]', { hasText: email }).first();
      await card.waitFor();
      expect(await card.innerText()).toMatch(/Invited, not signed in yet/);
      await h.shot(page, `staff-${name}-people`);

      await openSection(page, 'mailbox', phone);
      const mail = page.getByTestId('mailbox-list').locator('[data-testid^="mail-"]', { hasText: email }).first();
      await mail.waitFor({ timeout: 15_000 });
      expect(await mail.innerText()).toMatch(/You are invited to Crestwatch/);
      await mail.getByRole('button').first().click();
      expect(await mail.innerText()).toMatch(new RegExp(`as an? ${role}`));
      expect(await mail.innerText()).toMatch(/\/sign-in/);
      await h.shot(page, `staff-${name}-mailbox`);

      await openSection(page, 'audit', phone);
      await page.getByTestId('audit-action').fill('person.invite');
      await page.getByTestId('audit-apply').click();
      const entry = page
        .getByTestId('audit-list')
        .locator('[data-testid^="audit-"]', { hasText: 'Invited a person' })
        .first();
      await entry.waitFor();
      await entry.getByRole('button').first().click();
      expect(await entry.innerText()).toContain(email);
      await h.shot(page, `staff-${name}-audit`);
    } finally {
      await context.close();
    }

    // The invitee signs in and has the role.
    const invitee = await h.newPage(viewport);
    try {
      await signIn(invitee.page, h.baseUrl, email);
      expect(await invitee.page.getByTestId('account-role').innerText()).toBe(roleLabel);
    } finally {
      await invitee.context.close();
    }
  });
});

it('refuses an address that already has access, in the server’s words', async () => {
  const { context, page } = await h.newPage(VIEWPORTS.laptop);
  try {
    await signIn(page, h.baseUrl, DEMO.admin);
    await page.goto(`${h.baseUrl}/people`);
    await page.getByTestId('people-list').waitFor();
    await page.getByTestId('invite-email').fill(DEMO.analyst);
    await page.getByTestId('invite-send').click();
    const refusal = page.getByTestId('invite-error');
    await refusal.waitFor();
    expect(await refusal.innerText()).toContain('already has access');
  } finally {
    await context.close();
  }
});

it('shows a lapsed invitation as expired, re-sends it, and resets a pinned Google identity after asking', async () => {
  // The invitation lapsed: its stored expiry is moved into the past (the database clock cannot be moved).
  const [inviter] = await h.t.db('users').where({ email: DEMO.admin }).select('id');
  const [late] = await h.t
    .db('users')
    .insert({
      email: 'late.official@crestwatch.example',
      role: 'official',
      invited_by: inviter.id,
      invited_at: new Date(Date.now() - 20 * 86_400_000),
      invitation_expires_at: new Date(Date.now() - 86_400_000),
    })
    .returning('id');
  const { context, page } = await h.newPage(VIEWPORTS.laptop);
  try {
    // The analyst signs in once, which pins their Google identity.
    const analyst = await h.newPage(VIEWPORTS.laptop);
    await signIn(analyst.page, h.baseUrl, DEMO.analyst);
    await analyst.context.close();
    const [{ id: analystId }] = await h.t.db('users').where({ email: DEMO.analyst }).select('id');

    await signIn(page, h.baseUrl, DEMO.admin);
    await page.goto(`${h.baseUrl}/people`);
    await page.getByTestId('people-list').waitFor();
    expect(await page.getByTestId(`person-status-${late.id}`).innerText()).toBe('Invitation expired');
    await page.getByTestId(`person-resend-${late.id}`).click();
    await page.getByTestId(`person-${late.id}-ok`).waitFor();
    await page.getByText('Invited, not signed in yet').first().waitFor();
    expect(await page.getByTestId(`person-status-${late.id}`).innerText()).toBe('Invited, not signed in yet');
    expect(await page.getByTestId(`person-meta-${late.id}`).innerText()).toMatch(/ · expires /);

    await page.getByTestId(`person-reset-identity-${analystId}`).click();
    await page.getByTestId(`person-reset-identity-${analystId}-confirm`).click();
    await page.getByTestId(`person-${analystId}-ok`).waitFor();
    await h.shot(page, 'staff-laptop-people-lapsed');
    expect((await h.t.db('users').where({ id: analystId }).first()).google_sub).toBeNull();
    expect(
      await h.t
        .db('audit_log')
        .where({ action: 'person.identity_reset', target_id: String(analystId) })
        .first(),
    ).toBeDefined();
  } finally {
    await context.close();
  }
});

it('sends no request beyond 127.0.0.1', () => {
  expect(offLoopback(h.requests)).toEqual([]);
});
