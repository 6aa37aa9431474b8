import { DistrictListResponseSchema } from '@/contracts/districts';
import { ApiError, apiGet } from '@/lib/api-client';
import { shouldRetry } from '@/lib/query-client';

function respond(status: number, body: string, statusText = '') {
  return Promise.resolve(new Response(body, { status, statusText, headers: { 'content-type': 'application/json' } }));
}

const fetchMock = jest.fn<Promise<Response>, [RequestInfo | URL, RequestInit?]>();

beforeEach(() => {
  fetchMock.mockReset();
  global.fetch = fetchMock as unknown as typeof fetch;
});

describe('apiGet', () => {
  it('resolves with the decoded body on 2xx, asking for JSON on a relative path', async () => {
    fetchMock.mockReturnValue(respond(200, JSON.stringify({ districts: [] })));
    await expect(apiGet('/api/districts')).resolves.toEqual({ districts: [] });
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/districts');
    expect(init?.method).toBe('GET');
    expect((init?.headers as Record<string, string>).Accept).toBe('application/json');
  });

  it('turns the error shape into an ApiError with status, code, message and details', async () => {
    fetchMock.mockReturnValue(
      respond(
        404,
        JSON.stringify({ error: { code: 'not_found', message: 'No district ZZ9', details: { code: 'ZZ9' } } }),
      ),
    );
    const error = await apiGet('/api/districts/ZZ9').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 404,
      code: 'not_found',
      message: 'No district ZZ9',
      details: { code: 'ZZ9' },
    });
    expect((error as ApiError).isClientError).toBe(true);
  });

  it('gives an http_error when a failure has no error body', async () => {
    fetchMock.mockReturnValue(respond(502, '<html>Bad gateway</html>', 'Bad Gateway'));
    await expect(apiGet('/api/districts')).rejects.toMatchObject({ status: 502, code: 'http_error' });
  });

  it('gives a network_error with status 0 when no response arrives', async () => {
    fetchMock.mockRejectedValue(new TypeError('Failed to fetch'));
    await expect(apiGet('/api/districts')).rejects.toMatchObject({ status: 0, code: 'network_error' });
  });

  it('rejects a 2xx body that does not match its contract as bad_response, naming the field', async () => {
    fetchMock.mockReturnValue(respond(200, JSON.stringify({ rows: [] })));
    await expect(apiGet('/api/districts', { schema: DistrictListResponseSchema })).rejects.toMatchObject({
      code: 'bad_response',
      details: { fields: [expect.objectContaining({ path: 'districts' })] },
    });
  });

  it('returns the body read through its contract: typed, and without fields the contract does not name', async () => {
    const row = { code: 'D01', name: 'Alder Vale', extra: 'dropped' };
    fetchMock.mockReturnValue(respond(200, JSON.stringify({ districts: [row] })));
    const answer = await apiGet('/api/districts', { schema: DistrictListResponseSchema });
    expect(answer.districts[0].name).toBe('Alder Vale');
    expect(answer.districts[0]).not.toHaveProperty('extra');
  });

  it('passes an abort through untouched (react-query cancels on unmount)', async () => {
    const controller = new AbortController();
    controller.abort();
    const abort = new DOMException('Aborted', 'AbortError');
    fetchMock.mockRejectedValue(abort);
    await expect(apiGet('/api/districts', { signal: controller.signal })).rejects.toBe(abort);
  });
});

describe('retry policy', () => {
  it('never retries a 4xx', () => {
    expect(shouldRetry(0, new ApiError(404, 'not_found', 'x'))).toBe(false);
    expect(shouldRetry(0, new ApiError(400, 'invalid_request', 'x'))).toBe(false);
  });

  it('retries server and network faults twice, then stops', () => {
    const fault = new ApiError(503, 'database_unavailable', 'x');
    expect(shouldRetry(0, fault)).toBe(true);
    expect(shouldRetry(1, fault)).toBe(true);
    expect(shouldRetry(2, fault)).toBe(false);
    expect(shouldRetry(0, new ApiError(0, 'network_error', 'x'))).toBe(true);
  });
});
