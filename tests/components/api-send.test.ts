import { ApiError, apiSend, CSRF_HEADER, rememberCsrfToken } from '@/lib/api-client';

function respond(status: number, body: unknown) {
  // A 204 carries no body at all (the Response constructor refuses one, even empty).
  const text = body === undefined ? null : JSON.stringify(body);
  return Promise.resolve(new Response(text, { status, headers: { 'content-type': 'application/json' } }));
}

const fetchMock = jest.fn<Promise<Response>, [RequestInfo | URL, RequestInit?]>();

beforeEach(() => {
  fetchMock.mockReset();
  global.fetch = fetchMock as unknown as typeof fetch;
  rememberCsrfToken(null);
});

const headersOf = (call: number) => (fetchMock.mock.calls[call][1]?.headers ?? {}) as Record<string, string>;

describe('apiSend', () => {
  it('sends a JSON body with the remembered CSRF token', async () => {
    rememberCsrfToken('tok-1');
    fetchMock.mockReturnValue(respond(201, { spec: { id: 3 } }));
    await expect(apiSend('POST', '/api/specs', { json: { name: 'A' } })).resolves.toEqual({ spec: { id: 3 } });
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/specs');
    expect(init?.method).toBe('POST');
    expect(init?.body).toBe('{"name":"A"}');
    expect(headersOf(0)[CSRF_HEADER]).toBe('tok-1');
    expect(headersOf(0)['Content-Type']).toBe('application/json');
  });

  it('asks /api/me for the token once when none is remembered yet', async () => {
    fetchMock
      .mockReturnValueOnce(respond(200, { email: 'a@crestwatch.example', csrfToken: 'from-me' }))
      .mockReturnValueOnce(respond(204, undefined));
    await expect(apiSend('POST', '/api/auth/sign-out')).resolves.toBeUndefined();
    expect(fetchMock.mock.calls[0][0]).toBe('/api/me');
    expect(headersOf(1)[CSRF_HEADER]).toBe('from-me');
  });

  it('fetches a fresh token and tries once more after csrf_failed', async () => {
    rememberCsrfToken('stale');
    fetchMock
      .mockReturnValueOnce(respond(403, { error: { code: 'csrf_failed', message: 'outdated' } }))
      .mockReturnValueOnce(respond(200, { email: 'a@crestwatch.example', csrfToken: 'fresh' }))
      .mockReturnValueOnce(respond(200, { ok: true }));
    await expect(apiSend('PATCH', '/api/settings', { json: { alpha: 0.1 } })).resolves.toEqual({ ok: true });
    expect(headersOf(0)[CSRF_HEADER]).toBe('stale');
    expect(headersOf(2)[CSRF_HEADER]).toBe('fresh');
  });

  it('does not retry other refusals, and hands back their code, message and details', async () => {
    rememberCsrfToken('tok');
    fetchMock.mockReturnValue(
      respond(403, { error: { code: 'forbidden', message: 'Admins only.', details: { need: 'admin' } } }),
    );
    const error = await apiSend('POST', '/api/people/invitations', { json: {} }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 403,
      code: 'forbidden',
      message: 'Admins only.',
      details: { need: 'admin' },
    });
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });

  it('sends a multipart form as it is, leaving the content type to the platform', async () => {
    rememberCsrfToken('tok');
    fetchMock.mockReturnValue(respond(200, { upload: { id: 1 } }));
    const form = new FormData();
    form.append('note', 'x');
    await apiSend('POST', '/api/uploads', { form });
    expect(fetchMock.mock.calls[0][1]?.body).toBe(form);
    expect(headersOf(0)['Content-Type']).toBeUndefined();
  });
});
