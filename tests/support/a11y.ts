/**
 * Accessibility measurements for the browser tests.
 *
 * - `runAxe`: axe-core (Deque) run in the page for the WCAG 2.0/2.1/2.2 A and AA tags.
 *   The `@axe-core/playwright` wrapper needs Node 22, so the script is injected directly.
 * - `unnamedControls`: controls (button, link, checkbox, radio, tab, switch, menu item)
 *   whose accessible name, as Chromium computes it (W3C Accessible Name and Description
 *   Computation 1.2, read through the DevTools protocol's accessibility tree), is empty.
 * - `smallTargets`: WCAG 2.2 SC 2.5.8 Target Size (Minimum): each pointer target at least
 *   24×24 CSS px, unless a 24 px circle centred on it meets no other target (the spacing
 *   exception) or it is a link inside a sentence (the inline exception).
 * - `focusWalk`: the elements Tab reaches, in order, with their place in the layout.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';

export const AXE_PATH = path.join(path.resolve(__dirname, '..', '..'), 'node_modules', 'axe-core', 'axe.min.js');

/** axe-core's tags for the WCAG 2.0, 2.1 and 2.2 levels A and AA (axe-core rule descriptions, Deque). */
export const WCAG_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'] as const;

export type Impact = 'critical' | 'serious' | 'moderate' | 'minor';
export const IMPACTS: readonly Impact[] = ['critical', 'serious', 'moderate', 'minor'];

export interface AxeViolation {
  id: string;
  impact: Impact;
  help: string;
  /** Each element: its selector, HTML, axe's summary, and (for name checks) its aria-label and text. */
  nodes: { target: string; html: string; summary: string; label?: string; text?: string }[];
}

/**
 * Puts axe-core into the page once. The app's Content-Security-Policy admits only hashed
 * inline scripts, so a `<script>` element carrying axe's text would be refused (and
 * reported as a violation); its text is evaluated through the DevTools protocol instead,
 * which the policy does not govern. `page.addScriptTag({ path })` is used when the page
 * has no such policy (a context opened with `bypassCSP`).
 */
export async function injectAxe(page: Page, opts: { viaScriptTag?: boolean } = {}): Promise<void> {
  if (await page.evaluate(() => typeof (window as unknown as { axe?: unknown }).axe === 'object')) return;
  if (opts.viaScriptTag) {
    await page.addScriptTag({ path: AXE_PATH });
  } else {
    await page.evaluate(fs.readFileSync(AXE_PATH, 'utf8'));
  }
}

export async function runAxe(page: Page, opts: { viaScriptTag?: boolean } = {}): Promise<AxeViolation[]> {
  await injectAxe(page, opts);
  return page.evaluate(
    async (tags) => {
      type AxeResult = {
        violations: {
          id: string;
          impact: string | null;
          help: string;
          nodes: { target: unknown[]; html: string; failureSummary?: string }[];
        }[];
      };
      const axe = (window as unknown as { axe: { run(ctx: Document, o: unknown): Promise<AxeResult> } }).axe;
      const result = await axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
      return result.violations.map((v) => ({
        id: v.id,
        impact: (v.impact ?? 'minor') as 'critical' | 'serious' | 'moderate' | 'minor',
        help: v.help,
        nodes: v.nodes.map((n) => ({
          target: n.target.map(String).join(' '),
          html: n.html.slice(0, 200),
          summary: (n.failureSummary ?? '').replace(/\s+/g, ' ').slice(0, 300),
        })),
      }));
    },
    WCAG_AA_TAGS as unknown as string[],
  );
}

/** Violations counted by impact. */
export function countByImpact(violations: AxeViolation[]): Record<Impact, number> {
  const counts: Record<Impact, number> = { critical: 0, serious: 0, moderate: 0, minor: 0 };
  for (const v of violations) counts[v.impact] += v.nodes.length;
  return counts;
}

/** A compact table of violations (rule, impact, how many elements, first target) for the test output. */
export function violationTable(screen: string, violations: AxeViolation[]): string {
  if (!violations.length) return `${screen}: no axe-core violations`;
  const lines = violations.map(
    (v) =>
      `  ${v.impact.padEnd(9)} ${v.id.padEnd(32)} ×${String(v.nodes.length).padEnd(3)} ${v.nodes[0]?.target ?? ''}`,
  );
  return `${screen}:\n${lines.join('\n')}`;
}

const CONTROL_ROLES = new Set(['button', 'link', 'checkbox', 'radio', 'tab', 'switch', 'menuitem', 'combobox']);

/** Controls with no accessible name in Chromium's accessibility tree: role and a piece of their HTML. */
export async function unnamedControls(page: Page): Promise<{ role: string; html: string }[]> {
  const cdp = await page.context().newCDPSession(page);
  try {
    await cdp.send('DOM.getDocument', { depth: -1 });
    const { nodes } = (await cdp.send('Accessibility.getFullAXTree')) as {
      nodes: {
        ignored: boolean;
        role?: { value?: string };
        name?: { value?: string };
        backendDOMNodeId?: number;
      }[];
    };
    const out: { role: string; html: string }[] = [];
    for (const n of nodes) {
      const role = n.role?.value ?? '';
      if (n.ignored || !CONTROL_ROLES.has(role)) continue;
      if ((n.name?.value ?? '').trim() !== '') continue;
      let html = '';
      if (n.backendDOMNodeId) {
        const { outerHTML } = (await cdp.send('DOM.getOuterHTML', { backendNodeId: n.backendDOMNodeId })) as {
          outerHTML: string;
        };
        html = outerHTML.slice(0, 160);
      }
      out.push({ role, html });
    }
    return out;
  } finally {
    await cdp.detach();
  }
}

export interface TargetBox {
  /** data-testid, else the tag and the first words of its name. */
  what: string;
  width: number;
  height: number;
  /** Marked as a primary action (Button kind "solid", the Menu button, Refresh). */
  primary: boolean;
}

/**
 * Pointer targets visible in the page that miss WCAG 2.2 SC 2.5.8 (24×24 CSS px, with the
 * spacing and inline exceptions), and primary actions under `primaryMin` (our own 44 px).
 */
export async function smallTargets(
  page: Page,
  primaryMin = 44,
): Promise<{
  checked: number;
  under24: TargetBox[];
  primaryUnder: TargetBox[];
  primaries: number;
  /** The smallest target by area, exceptions or not (for the test output). */
  smallest: TargetBox | null;
}> {
  return page.evaluate((primaryMin) => {
    const selector = [
      'a[href]',
      'button',
      'input:not([type="hidden"])',
      'select',
      'textarea',
      '[role="button"]',
      '[role="link"]',
      '[role="checkbox"]',
      '[role="radio"]',
      '[role="tab"]',
      '[role="switch"]',
      '[role="menuitem"]',
      '[tabindex="0"]',
    ].join(',');
    const all = [...document.querySelectorAll<HTMLElement>(selector)];
    // A target inside another counted target (a link's own inner text) is the same target.
    const targets = all.filter((el) => {
      if (all.some((o) => o !== el && o.contains(el))) return false;
      const r = el.getBoundingClientRect();
      const s = getComputedStyle(el);
      if (r.width === 0 || r.height === 0 || s.visibility === 'hidden' || s.display === 'none') return false;
      if (el.closest('[aria-hidden="true"]')) return false;
      return true;
    });
    const describe = (el: HTMLElement): string =>
      el.getAttribute('data-testid') ??
      `${el.tagName.toLowerCase()} "${(el.getAttribute('aria-label') ?? el.textContent ?? '').trim().slice(0, 40)}"`;
    const boxes = targets.map((el) => ({ el, r: el.getBoundingClientRect() }));
    const small = (r: DOMRect) => r.width < 24 - 0.01 || r.height < 24 - 0.01;
    // Inline exception: a link whose box is set by the line of a sentence around it.
    const inSentence = (el: HTMLElement): boolean => {
      const s = getComputedStyle(el);
      if (!s.display.startsWith('inline') || s.display === 'inline-flex' || s.display === 'inline-block') return false;
      const block = el.parentElement;
      if (!block) return false;
      const own = (el.textContent ?? '').trim();
      const around = (block.textContent ?? '').trim();
      return around.length > own.length && /\S/.test(around.replace(own, ''));
    };
    // Spacing exception: a 24 px circle on the target's centre meets no other target and no other small target's circle.
    const circleMeetsBox = (cx: number, cy: number, b: DOMRect) => {
      const dx = Math.max(b.left - cx, 0, cx - b.right);
      const dy = Math.max(b.top - cy, 0, cy - b.bottom);
      return dx * dx + dy * dy < 12 * 12;
    };
    const centre = (r: DOMRect) => [r.left + r.width / 2, r.top + r.height / 2] as const;
    const spaced = (i: number): boolean => {
      const [cx, cy] = centre(boxes[i].r);
      return boxes.every(({ r }, j) => {
        if (j === i) return true;
        if (circleMeetsBox(cx, cy, r)) return false;
        if (small(r)) {
          const [ox, oy] = centre(r);
          if (Math.hypot(ox - cx, oy - cy) < 24) return false;
        }
        return true;
      });
    };
    const under24: { what: string; width: number; height: number; primary: boolean }[] = [];
    const primaryUnder: { what: string; width: number; height: number; primary: boolean }[] = [];
    let primaries = 0;
    let smallest: { what: string; width: number; height: number; primary: boolean } | null = null;
    boxes.forEach(({ el, r }, i) => {
      const primary = el.getAttribute('data-action') === 'primary';
      const box = { what: describe(el), width: Math.round(r.width), height: Math.round(r.height), primary };
      if (!smallest || r.width * r.height < smallest.width * smallest.height) smallest = box;
      if (small(r) && !inSentence(el) && !spaced(i)) under24.push(box);
      if (primary) {
        primaries++;
        if (r.width < primaryMin - 0.01 || r.height < primaryMin - 0.01) primaryUnder.push(box);
      }
    });
    return { checked: boxes.length, under24, primaryUnder, primaries, smallest };
  }, primaryMin);
}

export interface FocusStop {
  what: string;
  /** The landmark the element sits in (banner, navigation "Sections", main, …). */
  landmark: string;
  /** Position in the laid-out page, with every scrolled ancestor's scroll added back. */
  x: number;
  y: number;
  height: number;
}

/** Presses Tab up to `max` times from the top of the page and records each focused element. */
export async function focusWalk(page: Page, max: number): Promise<FocusStop[]> {
  await page.evaluate(() => {
    (document.activeElement as HTMLElement | null)?.blur();
    window.scrollTo(0, 0);
  });
  const stops: FocusStop[] = [];
  for (let i = 0; i < max; i++) {
    await page.keyboard.press('Tab');
    const stop = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      if (!el || el === document.body) return null;
      const r = el.getBoundingClientRect();
      let x = r.left;
      let y = r.top;
      for (let p = el.parentElement; p; p = p.parentElement) {
        x += p.scrollLeft;
        y += p.scrollTop;
      }
      x += window.scrollX;
      y += window.scrollY;
      const mark = el.closest(
        '[role="banner"],[role="navigation"],[role="main"],[role="complementary"],header,nav,main,aside',
      );
      const landmark = mark
        ? `${mark.getAttribute('role') ?? mark.tagName.toLowerCase()}${mark.getAttribute('aria-label') ? ` "${mark.getAttribute('aria-label')}"` : ''}`
        : '(none)';
      const what =
        el.getAttribute('data-testid') ??
        `${el.tagName.toLowerCase()} "${(el.getAttribute('aria-label') ?? el.textContent ?? '').trim().slice(0, 40)}"`;
      return { what, landmark, x: Math.round(x), y: Math.round(y), height: Math.round(r.height) };
    });
    if (!stop) break;
    if (stops.length && stops[0].what === stop.what && stops[0].y === stop.y) break; // wrapped round
    stops.push(stop);
  }
  return stops;
}
