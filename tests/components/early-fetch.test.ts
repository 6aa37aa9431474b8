// The head script's early answer is used once when it succeeded, and the ordinary request
// (with its error handling) runs when there is none or it failed.
import { fetchDistrictEstimate } from '@/hooks/use-estimates';
import { apiGet } from '@/lib/api-client';
import { earlyFetchScript } from '@/lib/early-fetch';

import { estimateRecord, estimateResponse } from './support/estimates';

jest.mock('@/lib/api-client', () => ({ ...jest.requireActual('@/lib/api-client'), apiGet: jest.fn() }));
const mockedGet = apiGet as jest.MockedFunction<typeof apiGet>;

type EarlyWindow = { __cwEarly?: Record<string, Promise<unknown>> };
const early = () => window as unknown as EarlyWindow;
const response = (status: number, body: unknown) =>
  Promise.resolve({ ok: status >= 200 && status < 300, status, headers: new Headers(), json: async () => body });

afterEach(() => {
  mockedGet.mockReset();
  delete early().__cwEarly;
});

it('takes the early answer once, then asks the server itself', async () => {
  const body = estimateResponse(estimateRecord({}));
  early().__cwEarly = { '/api/districts/T02/estimate': response(200, body) };
  await expect(fetchDistrictEstimate('T02', null)).resolves.toEqual(body);
  expect(mockedGet).not.toHaveBeenCalled();
  mockedGet.mockResolvedValue(body);
  await fetchDistrictEstimate('T02', null);
  expect(mockedGet).toHaveBeenCalledWith('/api/districts/T02/estimate', expect.anything());
});

it('falls back to the ordinary request when the early one was refused', async () => {
  early().__cwEarly = {
    '/api/districts/T02/estimate': response(401, { error: { code: 'unauthenticated', message: 'Sign in' } }),
  };
  mockedGet.mockResolvedValue(estimateResponse(null));
  await expect(fetchDistrictEstimate('T02', null)).resolves.toEqual(estimateResponse(null));
  expect(mockedGet).toHaveBeenCalledTimes(1);
});

it('builds a script that starts the request only while the page is parsing', () => {
  const script = earlyFetchScript(/^\/district\/([A-Za-z0-9_-]{1,32})\/?$/, (g) => `/api/districts/${g}/estimate`);
  expect(script).toContain('if(document.readyState!=="loading")return;');
  expect(script).toContain('var p="/api/districts/"+encodeURIComponent(m[1])+"/estimate";');
});

describe('the track in the early request', () => {
  const script = earlyFetchScript(/^\/district\/([A-Za-z0-9_-]{1,32})\/?$/, (g) => `/api/districts/${g}/estimate`);
  // Runs the script as the page's head would, with a given address and device memory; returns the paths it fetched.
  function run(search: string, stored: string | null): string[] {
    const fetched: string[] = [];
    const fakeWindow: { __cwEarly?: Record<string, unknown> } = {};
    const fn = new Function('document', 'location', 'localStorage', 'window', 'fetch', script);
    fn(
      { readyState: 'loading' },
      { pathname: '/district/D07', search },
      { getItem: (k: string) => (k === 'crestwatch.track' ? stored : null) },
      fakeWindow,
      (p: string) => {
        fetched.push(p);
        return Promise.resolve();
      },
    );
    expect(Object.keys(fakeWindow.__cwEarly ?? {})).toEqual(fetched);
    return fetched;
  }

  it('passes the URL’s track, which wins over the device’s', () => {
    expect(run('?track=pm25', 'so2')).toEqual(['/api/districts/D07/estimate?track=pm25']);
  });

  it('passes the device’s track when the URL has none', () => {
    expect(run('', 'so2')).toEqual(['/api/districts/D07/estimate?track=so2']);
  });

  it('asks without a track (the headline) when neither has a valid code', () => {
    expect(run('?track=Bad Code', null)).toEqual(['/api/districts/D07/estimate']);
  });

  it('is the same path the card’s query asks for', async () => {
    const body = estimateResponse(estimateRecord({}));
    early().__cwEarly = { '/api/districts/T02/estimate?track=pm25': response(200, body) };
    await expect(fetchDistrictEstimate('T02', 'pm25')).resolves.toEqual(body);
    expect(mockedGet).not.toHaveBeenCalled();
  });
});
