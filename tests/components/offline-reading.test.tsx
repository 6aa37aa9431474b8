// Offline reading on the app's side (lib/offline-copies.ts): answers the service worker
// read from its cache are marked with the date the server sent them and the card says so;
// a 401 and sign-out delete the kept answers by name; a change is refused while offline,
// never queued; the query client keeps a copy and a fresh answer apart.
import { screen, waitFor } from 'expo-router/testing-library';

import { ApiError, apiGet, apiSend, rememberCsrfToken } from '@/lib/api-client';
import { formatDayTime } from '@/lib/format-time';
import {
  API_CACHE_PREFIX,
  API_CACHES,
  clearOfflineCopies,
  markOfflineCopy,
  OFFLINE_COPY_HEADER,
  offlineCopySavedAt,
} from '@/lib/offline-copies';
import { shareUnlessOfflineCopy } from '@/lib/query-client';

import { cardAnswers, estimateRecord } from './support/estimates';
import { gappyDetail } from './support/fixtures';
import { answerWith } from './support/mock-api';
import { renderApp } from './support/render-app';

jest.mock('@/hooks/use-layout-mode', () => ({ useLayoutMode: () => 'phone', useThirdColumn: () => false }));
jest.mock('expo-router/head', () => ({ __esModule: true, default: () => null }));

const fetchMock = jest.fn<Promise<Response>, [RequestInfo | URL, RequestInit?]>();
const realFetch = global.fetch;
const realNavigator = Object.getOwnPropertyDescriptor(global, 'navigator');

/** A stand-in for the browser's CacheStorage: names only, which is all the app touches. */
function fakeCaches(names: string[]) {
  const held = new Set(names);
  const storage = {
    keys: jest.fn(async () => [...held]),
    delete: jest.fn(async (name: string) => held.delete(name)),
  };
  (global as unknown as { caches: unknown }).caches = storage;
  return held;
}

beforeEach(() => {
  fetchMock.mockReset();
  global.fetch = fetchMock as unknown as typeof fetch;
  rememberCsrfToken('tok');
});

afterEach(() => {
  global.fetch = realFetch;
  delete (global as unknown as { caches?: unknown }).caches;
  if (realNavigator) Object.defineProperty(global, 'navigator', realNavigator);
  else delete (global as { navigator?: unknown }).navigator;
});

const json = (status: number, body: unknown, headers: Record<string, string> = {}) =>
  Promise.resolve(
    new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json', ...headers } }),
  );

describe('answers read from the offline copy', () => {
  it('marks an answer the worker took from its cache with the date the server sent it', async () => {
    const sentAt = 'Fri, 04 Dec 2026 19:57:00 GMT';
    fetchMock.mockReturnValueOnce(json(200, { run: { id: 1 }, districts: [] }, { [OFFLINE_COPY_HEADER]: sentAt }));
    const copy = await apiGet<{ run: object; districts: unknown[] }>('/api/districts');
    expect(offlineCopySavedAt(copy)).toBe(Date.parse(sentAt));
    // Its parts too: a query's `select` may hand one of them to the screen.
    expect(offlineCopySavedAt(copy.districts)).toBe(Date.parse(sentAt));
    expect(offlineCopySavedAt(copy.run)).toBe(Date.parse(sentAt));

    fetchMock.mockReturnValueOnce(json(200, { run: { id: 1 }, districts: [] }));
    expect(offlineCopySavedAt(await apiGet('/api/districts'))).toBeNull();
  });

  it('keeps a copy and a fresh answer apart, and shares equal fresh answers as before', () => {
    const older = { a: [1, 2], b: { c: 3 } };
    const equal = { a: [1, 2], b: { c: 3 } };
    expect(shareUnlessOfflineCopy(older, equal)).toBe(older);
    const copy = { a: [1, 2], b: { c: 3 } };
    markOfflineCopy(copy, 0);
    expect(shareUnlessOfflineCopy(older, copy)).toBe(copy);
    expect(shareUnlessOfflineCopy(copy, equal)).toBe(equal);
  });

  it('shows the card with "Offline — figures from <date>" when its answer is a copy', async () => {
    const savedAt = Date.parse('2026-12-04T19:57:00Z');
    const table = answerWith({ ...cardAnswers(estimateRecord({})), '/api/districts/T02': gappyDetail });
    const get = jest.spyOn(jest.requireActual<typeof import('@/lib/api-client')>('@/lib/api-client'), 'apiGet');
    get.mockImplementation(async (path: string) => {
      const body = await table(path);
      if (path.endsWith('/estimate')) markOfflineCopy(body, savedAt);
      return body;
    });
    try {
      renderApp('/district/T02');
      const notice = await screen.findByTestId('offline-copy-notice');
      expect(textOf(notice)).toContain(`Offline — figures from ${formatDayTime(savedAt)}.`);
      expect(screen.getByTestId('card-headline')).toBeTruthy();
    } finally {
      get.mockRestore();
    }
  });
});

describe('forgetting the kept answers', () => {
  it('deletes every API cache by name on a 401, and leaves the app shell', async () => {
    const held = fakeCaches([...Object.values(API_CACHES), 'workbox-precache-v2-http://x/', 'crestwatch-fonts']);
    fetchMock.mockReturnValueOnce(json(401, { error: { code: 'session_expired', message: 'ended' } }));
    await expect(apiGet('/api/districts/T02/estimate')).rejects.toBeInstanceOf(ApiError);
    await waitFor(() => expect([...held].sort()).toEqual(['crestwatch-fonts', 'workbox-precache-v2-http://x/']));
  });

  it('does nothing where the browser has no cache storage', async () => {
    await expect(clearOfflineCopies()).resolves.toBeUndefined();
  });

  it('names every API cache with the prefix the app deletes by', () => {
    for (const name of Object.values(API_CACHES)) expect(name.startsWith(API_CACHE_PREFIX)).toBe(true);
  });
});

describe('changes while offline', () => {
  it('refuses a change at once, sending nothing, with words saying it needs a connection', async () => {
    Object.defineProperty(global, 'navigator', { value: { onLine: false }, configurable: true, writable: true });
    const refused = apiSend('POST', '/api/subscriptions', { json: { scope: 'region' } });
    await expect(refused).rejects.toMatchObject({ status: 0, code: 'offline' });
    await expect(refused).rejects.toThrow(/needs a connection: nothing was sent or saved/);
    expect(fetchMock).not.toHaveBeenCalled();
  });
});

/** The text of a Text element with nested children, as one string. */
function textOf(node: { props: { children?: unknown } }): string {
  const walk = (c: unknown): string =>
    typeof c === 'string' || typeof c === 'number'
      ? String(c)
      : Array.isArray(c)
        ? c.map(walk).join('')
        : c && typeof c === 'object' && 'props' in c
          ? walk((c as { props: { children?: unknown } }).props.children)
          : '';
  return walk(node.props.children);
}
