/**
 * Text at 200% without loss (WCAG 2.2 SC 1.4.4 Resize Text): the browser's default font
 * size is doubled through the DevTools protocol (`Page.setFontSizes`, the setting a reader
 * changes), so every rem-sized text doubles (lib/text-size.web.ts). At a phone (390×844)
 * and a wide (1440×900) viewport, on the region (list and map), a district card with a long
 * name, the method page, alerts, and the staff's runs, a run's review and uploads:
 * (a) nothing scrolls sideways: the document is no wider than the viewport (SC 1.4.10
 *     Reflow's test); tables that scroll inside their own box (components/table) are
 *     left out, as they fold into cards on a phone separately;
 * (b) no text is clipped or drawn over other text: every text box fits its own box and
 *     every box that hides overflow around it, lines of different texts do not overlap,
 *     chart labels stay inside the drawing, placeholders fit their fields, and no scrolling
 *     area is squeezed too small to read; a text cut with an ellipsis counts only when its
 *     full words are there too (a title or an accessible label);
 * (c) the card's key content shows: the district's full name, the standing word, the
 *     threshold with its unit.
 * Screenshots are kept under tests/artifacts/screenshots (text-scale-*).
 */
import type { BrowserContext, Page } from 'playwright-core';
import { seedDemoBoundariesIfEmpty } from '../../api/demo/boundaries';
import { DEMO } from '../support/auth';
import { startHarness, VIEWPORTS, type Harness } from '../support/browser';

jest.setTimeout(600_000);

/** Chromium's default "standard" font size is 16 px (fixed 13 px); a reader's 200% doubles both. */
const STANDARD_PX = 16;
const FIXED_PX = 13;

/** A long, many-word district name (invented): it must wrap, never be cut. */
const LONG_NAME = 'Amberlyn Reach and the Upper Saltings of Marrowby Vale';
const LONG_CODE = 'D01';

let h: Harness;
beforeAll(async () => {
  h = await startHarness({ publishRun: true });
  await seedDemoBoundariesIfEmpty(h.t.db);
  await h.t.db('districts').where({ code: LONG_CODE }).update({ name: LONG_NAME });
});
afterAll(async () => h?.close());

async function pageAt(
  viewport: { width: number; height: number },
  scale: number,
): Promise<{ context: BrowserContext; page: Page }> {
  const { context, page } = await h.newPage(viewport);
  const cdp = await context.newCDPSession(page);
  await cdp.send('Page.setFontSizes', {
    fontSizes: { standard: Math.round(STANDARD_PX * scale), fixed: Math.round(FIXED_PX * scale) },
  });
  return { context, page };
}

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(email)}`);
  await page.waitForURL(`${h.baseUrl}/`);
}

async function settle(page: Page): Promise<void> {
  await page.waitForFunction(() => document.fonts.status === 'loaded');
  // Two frames: layout after the text scale is read (hooks/use-text-scale.web.ts).
  await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
}

type Audit = {
  docWidth: number;
  viewport: number;
  rootPx: number;
  texts: number;
  problems: string[];
  /** The outermost boxes that reach past the viewport's right edge (what makes it scroll). */
  tooWide: string[];
};

/**
 * Measures the page as it is: document width against the viewport; each element that holds
 * text (its own text nodes) against its box and every overflow-hiding box around it; the
 * line boxes of different texts against each other; SVG text against its drawing.
 */
async function audit(page: Page): Promise<Audit> {
  return page.evaluate(() => {
    const problems: string[] = [];
    const vw = window.innerWidth;
    const describe = (el: Element, text?: string) => {
      const id = el.closest('[data-testid]')?.getAttribute('data-testid') ?? el.tagName.toLowerCase();
      return `[${id}] “${(text ?? el.textContent ?? '').trim().slice(0, 60)}”`;
    };
    // Tables that scroll sideways inside their own box (components/table/data-table.tsx names
    // its scroller "… (scrolls sideways)"; any table inside a sideways scroller counts too).
    const inSideScroll = (el: Element) => {
      if (el.closest('[aria-label$="(scrolls sideways)"]')) return true;
      if (!el.closest('[role="table"]')) return false;
      for (let a = el.parentElement; a; a = a.parentElement)
        if (/(auto|scroll)/.test(getComputedStyle(a).overflowX) && a.scrollWidth > a.clientWidth + 1) return true;
      return false;
    };
    const visible = (el: Element) => {
      for (let a: Element | null = el; a; a = a.parentElement) {
        const s = getComputedStyle(a);
        if (s.display === 'none' || s.visibility === 'hidden' || s.opacity === '0') return false;
      }
      return el.getClientRects().length > 0;
    };
    const fullTextAvailable = (el: Element, text: string) => {
      for (let a: Element | null = el; a; a = a.parentElement) {
        const label = `${a.getAttribute('title') ?? ''} ${a.getAttribute('aria-label') ?? ''}`;
        if (label.includes(text)) return true;
      }
      return false;
    };
    const lines: { el: Element; text: string; r: DOMRect }[] = [];
    let texts = 0;
    for (const el of document.body.querySelectorAll('*')) {
      if (el instanceof SVGElement) continue;
      const own = [...el.childNodes].filter((n) => n.nodeType === Node.TEXT_NODE && n.textContent!.trim() !== '');
      // Words for screen readers only (components/ui/screen-reader-text.tsx) are hidden on purpose.
      if (own.length === 0 || !visible(el) || inSideScroll(el) || el.closest('[data-screen-reader-only]')) continue;
      texts++;
      const text = own.map((n) => n.textContent!.trim()).join(' ');
      const cs = getComputedStyle(el);
      // (b) its own box: a cut line or a cut end.
      if (cs.display !== 'inline') {
        const cutH = el.scrollHeight > el.clientHeight + 1;
        const cutW = el.scrollWidth > el.clientWidth + 1;
        if (cutH || cutW) {
          const ellipsis = cs.textOverflow === 'ellipsis' || cs.webkitLineClamp !== 'none';
          if (!(ellipsis && fullTextAvailable(el, text)))
            problems.push(
              `clipped ${cutW ? 'width' : 'height'} ${el.scrollWidth}×${el.scrollHeight} in ${el.clientWidth}×${el.clientHeight}: ${describe(el, text)}`,
            );
        }
      }
      // (b) every box around it that hides overflow, up to the nearest scroll container.
      const rects = [...own].flatMap((n) => {
        const range = document.createRange();
        range.selectNodeContents(n);
        return [...range.getClientRects()].filter((r) => r.width > 0 && r.height > 0);
      });
      // What of each line shows: its part inside every box that hides or scrolls overflow.
      for (const r of rects) {
        let shown: DOMRect | null = DOMRect.fromRect(r);
        for (let a: Element | null = el; a && shown; a = a.parentElement) {
          const s = getComputedStyle(a);
          if (s.overflowX === 'visible' && s.overflowY === 'visible') continue;
          const box = a.getBoundingClientRect();
          const left = Math.max(shown.left, box.left);
          const right = Math.min(shown.right, box.right);
          const top = Math.max(shown.top, box.top);
          const bottom = Math.min(shown.bottom, box.bottom);
          shown = right > left && bottom > top ? new DOMRect(left, top, right - left, bottom - top) : null;
        }
        if (shown) lines.push({ el, text, r: shown });
      }
      for (let a = el.parentElement; a && a !== document.body; a = a.parentElement) {
        const s = getComputedStyle(a);
        if (/(auto|scroll)/.test(`${s.overflowX} ${s.overflowY}`)) break;
        if (s.overflowX === 'visible' && s.overflowY === 'visible') continue;
        const box = a.getBoundingClientRect();
        const out = rects.find(
          (r) => r.left < box.left - 1 || r.right > box.right + 1 || r.top < box.top - 1 || r.bottom > box.bottom + 1,
        );
        if (out) {
          problems.push(`cut by a box that hides overflow: ${describe(el, text)}`);
          break;
        }
      }
      // (a) no text beyond the viewport's sides.
      const beyond = rects.find((r) => r.right > vw + 1 || r.left < -1);
      if (beyond)
        problems.push(
          `beyond the viewport (${Math.round(beyond.left)}–${Math.round(beyond.right)}): ${describe(el, text)}`,
        );
    }
    // (b) text drawn over other text (a row too short for its content spills into the next).
    for (let i = 0; i < lines.length; i++) {
      for (let j = i + 1; j < lines.length; j++) {
        const a = lines[i];
        const b = lines[j];
        if (a.el === b.el || a.el.contains(b.el) || b.el.contains(a.el)) continue;
        const w = Math.min(a.r.right, b.r.right) - Math.max(a.r.left, b.r.left);
        const hgt = Math.min(a.r.bottom, b.r.bottom) - Math.max(a.r.top, b.r.top);
        if (w > 2 && hgt > 2) problems.push(`text over text: ${describe(a.el, a.text)} and ${describe(b.el, b.text)}`);
      }
    }
    // (b) a scrolling area squeezed so small that what it holds cannot be read (a list under
    // controls that grew to fill the screen).
    const least = Math.min(200, window.innerHeight / 4);
    for (const el of document.body.querySelectorAll('*')) {
      const s = getComputedStyle(el);
      if (!/(auto|scroll)/.test(s.overflowY) || el.scrollHeight <= el.clientHeight + 1 || !visible(el)) continue;
      if (el.clientHeight < least) problems.push(`scrolling area ${el.clientHeight} px tall: ${describe(el)}`);
    }
    // (b) a placeholder wider than its field (it is cut, and no text node holds it).
    const ctx = document.createElement('canvas').getContext('2d')!;
    for (const el of document.body.querySelectorAll('input, textarea')) {
      const input = el as HTMLInputElement;
      if (!input.placeholder || input.value !== '' || !visible(el) || inSideScroll(el)) continue;
      const s = getComputedStyle(el);
      ctx.font = `${s.fontStyle} ${s.fontWeight} ${s.fontSize} ${s.fontFamily}`;
      const room = el.clientWidth - parseFloat(s.paddingLeft) - parseFloat(s.paddingRight);
      if (ctx.measureText(input.placeholder).width > room + 1)
        problems.push(`placeholder wider than its field (${Math.round(room)} px): ${describe(el, input.placeholder)}`);
    }
    // (b) chart labels inside their drawing.
    for (const t of document.querySelectorAll('svg text')) {
      if (!visible(t) || !(t.textContent ?? '').trim()) continue;
      texts++;
      const svg = (t as SVGElement).ownerSVGElement!;
      const r = t.getBoundingClientRect();
      const box = svg.getBoundingClientRect();
      if (r.left < box.left - 1 || r.right > box.right + 1 || r.top < box.top - 1 || r.bottom > box.bottom + 1)
        problems.push(
          `chart text outside its drawing (${Math.round(r.left - box.left)},${Math.round(r.top - box.top)} ${Math.round(r.width)}×${Math.round(r.height)} in ${Math.round(box.width)}×${Math.round(box.height)}): ${describe(t)}`,
        );
    }
    const tooWide: string[] = [];
    for (const el of document.body.querySelectorAll('*')) {
      if (inSideScroll(el) || el.getBoundingClientRect().right <= vw + 1) continue;
      const parent = el.parentElement;
      if (parent && parent !== document.body && parent.getBoundingClientRect().right > vw + 1) continue;
      tooWide.push(`${describe(el)} right ${Math.round(el.getBoundingClientRect().right)}`);
    }
    return {
      tooWide: tooWide.slice(0, 5),
      docWidth: document.documentElement.scrollWidth,
      viewport: vw,
      rootPx: parseFloat(getComputedStyle(document.documentElement).fontSize),
      texts,
      problems: [...new Set(problems)],
    };
  });
}

/** Audits the page at its top, then a screen at a time down every vertical scrolling area. */
async function checkScreen(page: Page, label: string, shotName: string): Promise<void> {
  await settle(page);
  await h.shot(page, shotName);
  const first = await audit(page);
  // The setting took: rem text is twice the default (not a vacuous pass at 100%).
  expect({ screen: label, rootPx: first.rootPx }).toEqual({ screen: label, rootPx: STANDARD_PX * 2 });
  expect(first.texts).toBeGreaterThan(5);
  const audits = [first];
  // Text outside a scrolling area's visible part is measured when it has been scrolled in.
  for (let step = 1; step <= 30; step++) {
    const moved = await page.evaluate(() => {
      let any = false;
      const scrollers = [...document.querySelectorAll('*')].filter((el) => {
        const s = getComputedStyle(el);
        return /(auto|scroll)/.test(s.overflowY) && el.scrollHeight > el.clientHeight + 1;
      });
      for (const el of [...scrollers, document.scrollingElement!]) {
        const before = el.scrollTop;
        el.scrollTop = before + Math.max(100, el.clientHeight * 0.8);
        if (el.scrollTop !== before) any = true;
      }
      return any;
    });
    if (!moved) break;
    await settle(page);
    audits.push(await audit(page));
  }
  if (audits.length > 1) await h.shot(page, `${shotName}-end`);
  // (a) WCAG 2.2 SC 1.4.10's measure: no horizontal scroll (one pixel for sub-pixel rounding),
  // and nothing reaching past the viewport's edge inside a box that hides it.
  expect({
    screen: label,
    widerBy: Math.max(...audits.map((a) => a.docWidth - a.viewport - 1), 0),
    tooWide: [...new Set(audits.flatMap((a) => a.tooWide))],
  }).toEqual({ screen: label, widerBy: 0, tooWide: [] });
  // (b) no clipped, hidden or overlapping text anywhere along the way.
  expect({ screen: label, problems: [...new Set(audits.flatMap((a) => a.problems))] }).toEqual({
    screen: label,
    problems: [],
  });
}

type Estimate = {
  district: { name: string };
  main: {
    standing: { standing: string };
    threshold: { level: number | null } | null;
  } | null;
  run: { units: { driver: { unit: string } } } | null;
};

const STANDING_WORD: Record<string, string> = {
  approaching: 'Approaching',
  at_turn: 'At the turn',
  past_turn: 'Past the turn',
  no_turn: 'No turn',
  not_estimable: 'Not estimable',
};

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.wide],
] as const)('at 200%% text size, %s viewport', (name, viewport) => {
  it('an official reads the region, a long-named district, the method and alerts without loss', async () => {
    const { context, page } = await pageAt(viewport, 2);
    try {
      await signIn(page, DEMO.official);
      // The region, as a list.
      await page.getByTestId(`district-row-${LONG_CODE}`).waitFor();
      await checkScreen(page, 'region list', `text-scale-${name}-region-list`);
      // The long name is shown whole in its row, and the row can be brought on screen.
      const row = page.getByTestId(`district-row-${LONG_CODE}`);
      expect((await row.innerText()).replace(/\s+/g, ' ')).toContain(LONG_NAME);
      await row.scrollIntoViewIfNeeded();
      const rb = (await row.boundingBox())!;
      expect(rb.y).toBeGreaterThanOrEqual(0);
      expect(rb.y + rb.height).toBeLessThanOrEqual(viewport.height + 1);
      await h.shot(page, `text-scale-${name}-region-long-row`);

      // The region, as a map.
      await page.evaluate(() => window.scrollTo(0, 0));
      if (name === 'phone') await page.getByTestId('region-view-map').click();
      await page.getByTestId('region-map-canvas').waitFor();
      await checkScreen(page, 'region map', `text-scale-${name}-region-map`);

      // The district card with the long name.
      const answer = (await (
        await page.request.get(`${h.baseUrl}/api/districts/${LONG_CODE}/estimate`)
      ).json()) as Estimate;
      expect(answer.district.name).toBe(LONG_NAME);
      expect(answer.main).not.toBeNull();
      const threshold = answer.main!.threshold?.level ?? null;
      expect(threshold).not.toBeNull();
      await page.goto(`${h.baseUrl}/district/${LONG_CODE}`);
      await page.getByTestId('card-headline').waitFor();
      await page.locator('[data-testid="curve-chart-box"] svg').first().waitFor();
      await page.locator('[data-testid="path-chart-box"] svg').first().waitFor();
      await settle(page);
      // (c) the key content, whole and on screen: name, standing word, threshold with unit.
      const nameBox = page.getByTestId('district-name');
      expect((await nameBox.innerText()).replace(/\s+/g, ' ').trim()).toContain(LONG_NAME);
      const nb = (await nameBox.boundingBox())!;
      expect(nb.x).toBeGreaterThanOrEqual(0);
      expect(nb.x + nb.width).toBeLessThanOrEqual(viewport.width + 1);
      const word = STANDING_WORD[answer.main!.standing.standing];
      await expect(page.getByTestId('headline-panel').innerText()).resolves.toContain(word);
      const figure = (await page.getByTestId('figure-threshold').innerText()).replace(/\s+/g, ' ');
      // formatLevel (lib/estimate-words.ts): whole units with thousands separators.
      expect(figure).toContain(Math.round(threshold!).toLocaleString('en-GB'));
      expect(answer.run!.units.driver.unit).not.toBe('');
      expect(figure).toContain(answer.run!.units.driver.unit);
      await checkScreen(page, 'district card', `text-scale-${name}-district`);
      await page.getByTestId('curve-chart').evaluate((el) => el.scrollIntoView({ block: 'center' }));
      await settle(page);
      await h.shot(page, `text-scale-${name}-district-chart`);
      expect((await audit(page)).problems).toEqual([]);

      // The method page and the alerts.
      await page.goto(`${h.baseUrl}/method`);
      await page.getByTestId('method-page').waitFor();
      await checkScreen(page, 'method', `text-scale-${name}-method`);
      await page.goto(`${h.baseUrl}/alerts`);
      await page.getByTestId('alerts-screen').waitFor();
      await checkScreen(page, 'alerts', `text-scale-${name}-alerts`);
    } finally {
      await context.close();
    }
  });

  it('an administrator (a long name in the header) reads the runs, a run’s review and the uploads without loss', async () => {
    const { context, page } = await pageAt(viewport, 2);
    try {
      await signIn(page, DEMO.admin);
      await page.goto(`${h.baseUrl}/runs`);
      await page.getByTestId('runs-table').waitFor();
      await checkScreen(page, 'runs', `text-scale-${name}-runs`);
      // The published run: its facts, the review table, and one district's diagnostics with
      // the residual plot (SVG labels sized by the text scale).
      const runId = (
        (await (await page.request.get(`${h.baseUrl}/api/districts/D13/estimate`)).json()) as { run: { id: number } }
      ).run.id;
      await page.goto(`${h.baseUrl}/runs/${runId}`);
      await page.getByTestId('review-row-D13').waitFor();
      await page.getByTestId('review-row-D13').getByRole('link').first().click();
      await page.locator('[data-testid="residual-plot-box"] svg').first().waitFor();
      await checkScreen(page, 'run review', `text-scale-${name}-run-review`);
      await page.getByTestId('residual-plot').evaluate((el) => el.scrollIntoView({ block: 'center' }));
      await settle(page);
      await h.shot(page, `text-scale-${name}-run-residuals`);
      await page.goto(`${h.baseUrl}/uploads`);
      await page.getByTestId('uploads-screen').waitFor();
      await page.locator('[data-testid="upload-history"], [data-testid="upload-history-empty"]').first().waitFor();
      await checkScreen(page, 'uploads', `text-scale-${name}-uploads`);
    } finally {
      await context.close();
    }
  });
});
