/**
 * Browser test of the web fonts (lib/web-fonts.ts, app/+html.tsx): a district whose name is
 * written in Cyrillic (and one in Greek) renders in Inter, asked through the DevTools
 * protocol (CSS.getPlatformFontsForNode names the font each glyph was drawn with), and a
 * page with Latin text only never downloads the Cyrillic or Greek subset — not even through
 * the service worker, whose requests the context's listener also sees.
 */
import type { BrowserContext, Page } from 'playwright-core';
import { DEMO } from '../support/auth';
import { startHarness, VIEWPORTS, type Harness } from '../support/browser';

jest.setTimeout(240_000);

// Names invented for the test: Cyrillic and Greek letters outside the Latin subset.
const CYRILLIC = { code: 'D03', name: 'Жарово' };
const GREEK = { code: 'D04', name: 'Άνω Πόλη' };

let h: Harness;
beforeAll(async () => {
  h = await startHarness({ publishRun: true });
  for (const d of [CYRILLIC, GREEK]) await h.t.db('districts').where({ code: d.code }).update({ name: d.name });
});
afterAll(async () => h?.close());

/** Every font file the browser fetched in this context (pages and service worker alike). */
function fontRequests(context: BrowserContext): string[] {
  const seen: string[] = [];
  context.on('request', (req) => {
    if (req.url().includes('/fonts/')) seen.push(new URL(req.url()).pathname);
  });
  return seen;
}

/** The platform fonts that drew the text inside the first element matching `selector`. */
async function fontsOf(
  context: BrowserContext,
  page: Page,
  selector: string,
): Promise<{ familyName: string; isCustomFont: boolean; glyphCount: number }[]> {
  const cdp = await context.newCDPSession(page);
  try {
    await cdp.send('DOM.enable');
    await cdp.send('CSS.enable');
    const { root } = await cdp.send('DOM.getDocument', { depth: -1 });
    const { nodeId } = await cdp.send('DOM.querySelector', { nodeId: root.nodeId, selector });
    if (!nodeId) throw new Error(`no element matches ${selector}`);
    return (await cdp.send('CSS.getPlatformFontsForNode', { nodeId })).fonts;
  } finally {
    await cdp.detach();
  }
}

it('downloads only the Latin subset for a page with Latin text only', async () => {
  const { context, page } = await h.newPage(VIEWPORTS.phone);
  try {
    const fonts = fontRequests(context);
    await page.goto(`${h.baseUrl}/sign-in`);
    await page.getByRole('heading', { name: 'Sign in to Crestwatch' }).waitFor();
    await page.waitForFunction(() => document.fonts.status === 'loaded');
    // Inter is in use at all (the Latin file came), so the absence below means something.
    expect(fonts.some((f) => /\/fonts\/inter-latin-\d+-normal\.woff2$/.test(f))).toBe(true);
    expect(fonts.filter((f) => /inter-(cyrillic|greek)-/.test(f))).toEqual([]);
    const heading = await fontsOf(context, page, 'h1, [role="heading"]');
    expect(heading.map((f) => f.familyName)).toEqual(['Inter']);
  } finally {
    await context.close();
  }
});

it.each([
  ['Cyrillic', CYRILLIC, 'cyrillic'],
  ['Greek', GREEK, 'greek'],
] as const)('renders a %s district name in Inter', async (_script, district, subset) => {
  const { context, page } = await h.newPage(VIEWPORTS.phone);
  try {
    const fonts = fontRequests(context);
    await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(DEMO.official)}`);
    await page.waitForURL(`${h.baseUrl}/`);
    await page.goto(`${h.baseUrl}/district/${district.code}`);
    await page.getByTestId('district-name').waitFor();
    expect(await page.getByTestId('district-name').innerText()).toBe(district.name);
    await page.waitForFunction(() => document.fonts.status === 'loaded');
    const used = await fontsOf(context, page, '[data-testid="district-name"]');
    // Every glyph of the name (letters and the space) came from Inter, none from a fallback.
    expect(used.map((f) => f.familyName)).toEqual(['Inter']);
    expect(used[0].isCustomFont).toBe(true);
    expect(used[0].glyphCount).toBe([...district.name].length);
    // The subset was fetched because this page shows it.
    expect(fonts.some((f) => f.includes(`/fonts/inter-${subset}-`))).toBe(true);
    await h.shot(page, `fonts-${subset}-card`);
  } finally {
    await context.close();
  }
});
