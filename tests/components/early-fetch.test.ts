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
  await expect(fetchDistrictEstimate('T02')).resolves.toEqual(body);
  expect(mockedGet).not.toHaveBeenCalled();
  mockedGet.mockResolvedValue(body);
  await fetchDistrictEstimate('T02');
  expect(mockedGet).toHaveBeenCalledWith('/api/districts/T02/estimate', expect.anything());
});

it('falls back to the ordinary request when the early one was refused', async () => {
  early().__cwEarly = {
    '/api/districts/T02/estimate': response(401, { error: { code: 'unauthenticated', message: 'Sign in' } }),
  };
  mockedGet.mockResolvedValue(estimateResponse(null));
  await expect(fetchDistrictEstimate('T02')).resolves.toEqual(estimateResponse(null));
  expect(mockedGet).toHaveBeenCalledTimes(1);
});

it('builds a script that starts the request only while the page is parsing', () => {
  const script = earlyFetchScript(/^\/district\/([A-Za-z0-9_-]{1,32})\/?$/, (g) => `/api/districts/${g}/estimate`);
  expect(script).toContain('if(document.readyState!=="loading")return;');
  expect(script).toContain('var p="/api/districts/"+encodeURIComponent(m[1])+"/estimate";');
});
