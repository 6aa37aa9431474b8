/**
 * Browser test of offline reading (scripts/web-offline/service-worker.ts): an official's
 * browser installs the service worker, opens two district cards, loses the network,
 * reloads and still reads both cards with the "offline — figures from <date>" notice; a
 * change tried offline is refused, not queued; after signing out the kept answers are gone
 * and a card no longer opens offline; a 401 clears them too. Also: the worker is served
 * `no-cache`, the CSP allows it, the manifest names the app with its icons, and a new deploy
 * takes over on the next visit with a notice saying so.
 */
import { format } from 'date-fns';
import fs from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { forgetSession } from '../../api/people/session-person';
import { listenOn } from '../../api/http/listen';
import { DEMO } from '../support/auth';
import { startHarness, VIEWPORTS, webDir, type Harness } from '../support/browser';
import { testApp } from '../support/test-app';

jest.setTimeout(300_000);

const API_CACHE_PREFIX = 'crestwatch-api-'; // lib/offline-copies.ts

let h: Harness;
beforeAll(async () => {
  h = await startHarness({ publishRun: true });
});
afterAll(async () => h?.close());

/** Names of the API caches the page's origin holds, with how many answers each keeps. */
async function apiCaches(page: Page): Promise<Record<string, number>> {
  return page.evaluate(async (prefix) => {
    const out: Record<string, number> = {};
    for (const name of await caches.keys())
      if (name.startsWith(prefix)) out[name] = (await (await caches.open(name)).keys()).length;
    return out;
  }, API_CACHE_PREFIX);
}

/** Opens a card from the region list (a navigation inside the app) and returns its name and the answer's Date. */
async function openCard(page: Page, code: string): Promise<{ name: string; sentAt: string }> {
  const answer = page.waitForResponse((r) => r.url().endsWith(`/api/districts/${code}/estimate`) && r.ok());
  await page.getByTestId(`district-row-${code}`).click();
  await page.waitForURL(`${h.baseUrl}/district/${code}`);
  const sentAt = (await answer).headers()['date'];
  await page.getByTestId('district-name').waitFor();
  return { name: await page.getByTestId('district-name').innerText(), sentAt };
}

/** Waits for the card of `code` to show, read from the offline copy, and returns the notice's text. */
async function readOffline(page: Page, name: string): Promise<string> {
  await page.getByTestId('district-name').waitFor();
  expect(await page.getByTestId('district-name').innerText()).toBe(name);
  const notice = page.getByTestId('district-detail-scroll').getByTestId('offline-copy-notice');
  await notice.waitFor();
  return notice.innerText();
}

async function installWorker(page: Page): Promise<void> {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
}

it('serves the worker no-cache, allows it in the CSP and links a manifest with icons', async () => {
  const sw = await fetch(`${h.baseUrl}/sw.js`);
  expect(sw.status).toBe(200);
  expect(sw.headers.get('cache-control')).toBe('no-cache');
  expect(sw.headers.get('content-security-policy')).toMatch(/worker-src 'self'/);
  const html = await (await fetch(`${h.baseUrl}/sign-in`)).text();
  expect(html).toContain('<link rel="manifest" href="/manifest.webmanifest"');
  const manifest = (await (await fetch(`${h.baseUrl}/manifest.webmanifest`)).json()) as {
    name: string;
    theme_color: string;
    background_color: string;
    icons: { src: string; sizes: string }[];
  };
  expect(manifest.name).toBe('Crestwatch');
  // components/theme.ts: colors.headerBackground (slate900) and colors.background (paper).
  expect([manifest.theme_color, manifest.background_color]).toEqual(['#1E2B2F', '#F5F2EA']);
  for (const size of ['192x192', '512x512']) {
    const icon = manifest.icons.find((i) => i.sizes === size);
    expect(icon).toBeDefined();
    const png = Buffer.from(await (await fetch(`${h.baseUrl}${icon!.src}`)).arrayBuffer());
    // PNG signature, then the IHDR width and height (PNG specification, section 11.2.2).
    expect(png.subarray(1, 4).toString('ascii')).toBe('PNG');
    expect(`${png.readUInt32BE(16)}x${png.readUInt32BE(20)}`).toBe(size);
  }
});

it('reads two opened cards offline after a reload, refuses changes offline, and forgets them at sign-out', async () => {
  const { context, page }: { context: BrowserContext; page: Page } = await h.newPage(VIEWPORTS.laptop);
  try {
    await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(DEMO.official)}`);
    await page.waitForURL(`${h.baseUrl}/`);
    await installWorker(page);
    // The first page's answers came before the worker took charge; the next visit goes through it.
    await page.reload();
    await page.getByTestId('district-row-D01').waitFor();

    const first = await openCard(page, 'D01');
    const second = await openCard(page, 'D02');
    const kept = await apiCaches(page);
    expect(kept[`${API_CACHE_PREFIX}card-estimate`]).toBe(2);
    expect(kept[`${API_CACHE_PREFIX}region`]).toBeGreaterThanOrEqual(1);

    // Offline with the card still open: a change is refused at once, in words saying it
    // needs a connection, and nothing is sent (or held back to be sent later).
    await context.setOffline(true);
    const sent: string[] = [];
    page.on('request', (r) => {
      if (r.method() !== 'GET') sent.push(`${r.method()} ${r.url()}`);
    });
    await page.getByTestId('subscribe-toggle').click();
    await page.getByText('This change needs a connection', { exact: false }).waitFor();
    expect(sent).toEqual([]);

    await page.reload();
    const notice = await readOffline(page, second.name);
    // The date the server sent the answer with, as the notice writes it (lib/format-time.ts formatDayTime).
    expect(notice).toContain(`Offline — figures from ${format(new Date(second.sentAt), 'd MMM, HH:mm')}`);
    // The region's list beside it is the offline copy too, and says so.
    const listNotice = page.getByTestId('district-list-panel').getByTestId('offline-copy-notice');
    expect(await listNotice.innerText()).toMatch(/^Offline — figures from \d{1,2} \w{3}, \d{2}:\d{2}\./);
    // The track switcher reads its tracks from the kept copy too, instead of waiting for them.
    await page.getByTestId('track-switcher').waitFor();
    expect(await page.getByTestId('track-switcher-loading').count()).toBe(0);
    await h.shot(page, 'offline-card-second');

    await page.goto(`${h.baseUrl}/district/D01`);
    expect(await readOffline(page, first.name)).toContain(
      `Offline — figures from ${format(new Date(first.sentAt), 'd MMM, HH:mm')}`,
    );
    await h.shot(page, 'offline-card-first');

    await context.setOffline(false);
    expect(sent).toEqual([]); // nothing queued offline went out when the network came back
    await page.getByTestId('sign-out').click();
    await page.waitForURL(`${h.baseUrl}/sign-in`);
    expect(await apiCaches(page)).toEqual({});

    await context.setOffline(true);
    await page.goto(`${h.baseUrl}/district/D01`);
    await page.locator('[data-testid="district-offline"], [data-testid="district-detail-error"]').first().waitFor();
    expect(await page.getByTestId('district-name').count()).toBe(0);
    await h.shot(page, 'offline-card-after-sign-out');
  } finally {
    await context.close();
  }
});

it('forgets the kept answers when the session ends on the server (a 401)', async () => {
  const { context, page } = await h.newPage(VIEWPORTS.laptop);
  try {
    await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(DEMO.official)}`);
    await page.waitForURL(`${h.baseUrl}/`);
    await installWorker(page);
    await page.reload();
    await page.getByTestId('district-row-D03').waitFor();
    await openCard(page, 'D03');
    expect((await apiCaches(page))[`${API_CACHE_PREFIX}card-estimate`]).toBe(1);

    // The session ends on the server (as an idle or lifetime limit ends it); the next
    // answer is a 401, which is not kept and clears what was. (The rows go behind the
    // server's back; its kept copies are forgotten too, as PERSON_CACHE_MS later.)
    const sids = (await h.t.db('session').pluck('sid')) as string[];
    await h.t.db('session').del();
    sids.forEach(forgetSession);
    const refused = page.waitForResponse((r) => r.url().endsWith('/api/districts/D04/estimate'));
    await page.getByTestId('district-row-D04').click();
    expect((await refused).status()).toBe(401);
    await page.waitForFunction(async (prefix) => {
      for (const name of await caches.keys())
        if (name.startsWith(prefix) && (await (await caches.open(name)).keys()).length > 0) return false;
      return true;
    }, API_CACHE_PREFIX);
  } finally {
    await context.close();
  }
});

it('keeps the last 20 cards opened, dropping the one opened longest ago', async () => {
  const { context, page } = await h.newPage(VIEWPORTS.phone);
  try {
    await page.goto(`${h.baseUrl}/api/auth/google?login_hint=${encodeURIComponent(DEMO.official)}`);
    await page.waitForURL(`${h.baseUrl}/`);
    await installWorker(page);
    // 21 cards' answers, one after the other, through the worker (as opening them does). The
    // expiration orders entries by the millisecond each was kept: a few ms apart, as cards
    // opened by hand always are, so two answers never share a stamp.
    const codes = Array.from({ length: 21 }, (_, i) => `D${String(i + 1).padStart(2, '0')}`);
    await page.evaluate(async (list) => {
      for (const code of list) {
        const res = await fetch(`/api/districts/${code}/estimate`, { headers: { Accept: 'application/json' } });
        if (!res.ok) throw new Error(`${code}: ${res.status}`);
        await new Promise((r) => setTimeout(r, 15));
      }
    }, codes);
    // CARD_LIMIT in lib/offline-copies.ts; the expiration runs just after each answer is kept.
    await page.waitForFunction(
      async (name) => (await (await caches.open(name)).keys()).length === 20,
      `${API_CACHE_PREFIX}card-estimate`,
    );
    const kept = await page.evaluate(async (name) => {
      const keys = await (await caches.open(name)).keys();
      return keys.map((r) => new URL(r.url).pathname.split('/')[3]).sort();
    }, `${API_CACHE_PREFIX}card-estimate`);
    expect(kept).toEqual(codes.slice(1));
  } finally {
    await context.close();
  }
});

/** The build the worker in charge of the page belongs to (it answers over a message channel). */
async function workerVersion(page: Page): Promise<string> {
  return page.evaluate(
    () =>
      new Promise<string>((resolve) => {
        const channel = new MessageChannel();
        channel.port1.onmessage = (e: MessageEvent<{ version: string }>) => resolve(e.data.version);
        navigator.serviceWorker.controller!.postMessage({ type: 'crestwatch:version' }, [channel.port2]);
      }),
  );
}

it('activates a new deploy on the next visit and says so', async () => {
  // A copy of the web build, served by its own app, so the test can "deploy" a new worker.
  const copy = fs.mkdtempSync(path.join(os.tmpdir(), 'crestwatch-deploy-'));
  fs.cpSync(webDir, copy, { recursive: true });
  const app = testApp(h.t.db, { webDir: copy });
  const server: Server = await listenOn(app, 0);
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const { context, page } = await h.newPage(VIEWPORTS.phone);
  try {
    await page.goto(`${base}/sign-in`);
    await installWorker(page);
    const before = await workerVersion(page);
    await page.reload();
    await page.getByRole('heading', { name: 'Sign in to Crestwatch' }).waitFor();
    expect(await page.getByTestId('update-notice').count()).toBe(0);

    // Deploy: a worker that differs (its build id) replaces sw.js.
    const swFile = path.join(copy, 'sw.js');
    const after = 'feedfacefeedface';
    fs.writeFileSync(swFile, fs.readFileSync(swFile, 'utf8').replaceAll(`"${before}"`, `"${after}"`));

    // This visit finds the new worker, which installs and waits while this page is open…
    await page.evaluate(async () => {
      const registration = (await navigator.serviceWorker.getRegistration())!;
      await registration.update();
      await new Promise<void>((resolve) => {
        const check = () => (registration.waiting ? resolve() : setTimeout(check, 100));
        check();
      });
    });
    expect(await workerVersion(page)).toBe(before);

    // …and the next visit is served by it, with a notice saying the app was updated.
    await page.goto(`${base}/sign-in`);
    await page.getByTestId('update-notice').waitFor();
    expect(await page.getByTestId('update-notice').innerText()).toMatch(/updated to a new version/);
    expect(await workerVersion(page)).toBe(after);
    await h.shot(page, 'offline-update-notice');
  } finally {
    await context.close();
    await new Promise<void>((resolve) => {
      server.close(() => resolve());
      server.closeAllConnections();
    });
    await app.locals.close();
    fs.rmSync(copy, { recursive: true, force: true });
  }
});
