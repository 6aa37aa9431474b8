/**
 * Steps the staff browser tests share: signing in (through the stand-in page, or straight
 * to the flow with login_hint), moving between sections with the app's own navigation
 * (tabs when wide, the menu on a phone), and waiting for text.
 */
import type { Page } from 'playwright-core';

/** The whole sign-in flow as a person does it: sign-in page → stand-in page → chosen account. */
export async function signInThroughStandIn(page: Page, baseUrl: string, email: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole('button', { name: 'Continue to sign-in' }).click();
  await page.waitForURL(`${baseUrl}/api/auth/stand-in`);
  await page.locator(`a.acct[href*="${encodeURIComponent(email)}"]`).click();
  await page.waitForURL(`${baseUrl}/`);
}

/** Straight into the OAuth flow with login_hint (what scripts do); lands on the region. */
export async function signIn(page: Page, baseUrl: string, email: string): Promise<void> {
  await page.goto(`${baseUrl}/api/auth/google?login_hint=${encodeURIComponent(email)}`);
  await page.waitForURL(`${baseUrl}/`);
  await page.getByTestId('account-role').waitFor();
}

/** Opens a section through the navigation the viewport shows. */
export async function openSection(page: Page, key: string, phone: boolean): Promise<void> {
  if (phone) {
    await page.getByTestId('menu-button').click();
    await page.getByTestId(`menu-${key}`).click();
  } else {
    await page.getByTestId(`nav-${key}`).click();
  }
}
