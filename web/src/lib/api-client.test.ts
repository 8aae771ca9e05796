import { describe, expect, it, vi } from 'vitest';
import { loginResponseSchema, userSchema } from '@shuntwise/contracts';
import { errorBody, mockApi } from '@/testing/mock-api';
import { mockXhr } from '@/testing/mock-xhr';
import { signInAs } from '@/testing/render';
import { ApiError, apiRequest, describeError, downloadFile, fetchBytes, fileNameFromDisposition, uploadFile } from './api-client';
import { getSession, getSessionEndReason, SESSION_STORAGE_KEY } from './session';

const user = {
  id: 7,
  email: 'lena@demo.test',
  name: 'Lena Quist',
  role: 'engineer',
  active: true,
  createdAt: '2026-11-30T08:00:00.000Z',
  lastLoginAt: null,
};

describe('apiRequest', () => {
  it('calls /api with the bearer token and JSON, and reads the answer with the schema', async () => {
    signInAs('admin');
    const api = mockApi({ 'PATCH /api/users/:id': (call) => ({ body: { ...user, ...(call.body as object) } }) });
    const saved = await apiRequest('/users/7', { method: 'PATCH', body: { role: 'designer' }, schema: userSchema });
    expect(saved.role).toBe('designer');
    expect(api.calls[0].path).toBe('/api/users/7');
    expect(api.calls[0].headers.Authorization).toBe('Bearer test-token-admin');
    expect(api.calls[0].headers['Content-Type']).toBe('application/json');
    expect(api.calls[0].body).toEqual({ role: 'designer' });
  });

  it('sends no token on public calls', async () => {
    signInAs('admin');
    const api = mockApi({
      'POST /api/auth/login': { body: { accessToken: 'x', user: { id: 1, email: 'a@demo.test', name: 'A', role: 'admin' } } },
    });
    await apiRequest('/auth/login', { method: 'POST', body: {}, schema: loginResponseSchema, auth: false });
    expect(api.calls[0].headers.Authorization).toBeUndefined();
  });

  it('turns the error body into an ApiError with status, field errors and correlation id', async () => {
    signInAs('admin');
    mockApi({
      'POST /api/users/invitations': {
        status: 422,
        body: errorBody('Invalid invitation', [{ path: 'email', message: 'Enter a valid e-mail address' }]),
      },
    });
    const error = await apiRequest('/users/invitations', { method: 'POST', body: {} }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    const apiError = error as ApiError;
    expect(apiError.status).toBe(422);
    expect(apiError.message).toBe('Invalid invitation');
    expect(apiError.fieldError('email')).toBe('Enter a valid e-mail address');
    expect(apiError.correlationId).toBe('c0ffee00-test');
    expect(describeError(apiError)).toBe('Invalid invitation (ref. c0ffee00-test)');
  });

  it('still names the status when the error is not in the API shape (e.g. a proxy page)', async () => {
    const fetchMock = async () => new Response('<html>Bad gateway</html>', { status: 502, statusText: 'Bad Gateway' });
    vi.stubGlobal('fetch', fetchMock);
    const error = (await apiRequest('/health', { auth: false }).catch((e: unknown) => e)) as ApiError;
    expect(error.status).toBe(502);
    expect(error.message).toBe('Request failed (502 Bad Gateway).');
  });

  it('reports an unreachable server as such', async () => {
    vi.stubGlobal('fetch', async () => {
      throw new TypeError('Failed to fetch');
    });
    const error = (await apiRequest('/health', { auth: false }).catch((e: unknown) => e)) as ApiError;
    expect(error.status).toBe(0);
    expect(error.message).toMatch(/Cannot reach the Shuntwise server/);
  });

  it('on 401 with a token clears the session, in memory and in localStorage', async () => {
    signInAs('engineer');
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).not.toBeNull();
    mockApi({ 'GET /api/users': { status: 401, body: errorBody('Token no longer valid') } });
    await expect(apiRequest('/users')).rejects.toMatchObject({ status: 401 });
    expect(getSession()).toBeNull();
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull();
    expect(getSessionEndReason()).toBe('expired');
  });

  it('a 401 without a token (wrong password at sign-in) leaves everything as it was', async () => {
    mockApi({ 'POST /api/auth/login': { status: 401, body: errorBody('Invalid credentials') } });
    await expect(apiRequest('/auth/login', { method: 'POST', body: {}, auth: false })).rejects.toMatchObject({
      status: 401,
      message: 'Invalid credentials',
    });
    expect(getSessionEndReason()).toBeNull();
  });

  it('a 403 does not end the session', async () => {
    signInAs('buyer');
    mockApi({ 'GET /api/users': { status: 403, body: errorBody('Forbidden') } });
    await expect(apiRequest('/users')).rejects.toMatchObject({ status: 403 });
    expect(getSession()?.user.role).toBe('buyer');
  });
});

describe('conflicts', () => {
  it('reads a 409 as the usual error body and keeps the fields a conflict adds (code, current)', async () => {
    signInAs('engineer');
    const body = { ...errorBody('Saved meanwhile by someone else'), code: 'stale', current: { version: 4, vzNom: 5.1 } };
    mockApi({ 'PUT /api/vendor-parts/:id/rating-card': { status: 409, body } });
    const error = (await apiRequest('/vendor-parts/3/rating-card', { method: 'PUT', body: {} }).catch((e: unknown) => e)) as ApiError;
    expect(error.status).toBe(409);
    expect(error.message).toBe('Saved meanwhile by someone else');
    expect(error.correlationId).toBe('c0ffee00-test');
    expect(error.code).toBe('stale');
    expect(error.current).toEqual({ version: 4, vzNom: 5.1 });
  });
});

describe('fileNameFromDisposition (the content-disposition package, RFC 6266)', () => {
  it('prefers the UTF-8 filename* over the ASCII fallback', async () => {
    // The header the datasheet route sends (api/test/datasheets.e2e-spec.ts).
    const header = `inline; filename="BRZ05 Datenblatt _.pdf"; filename*=UTF-8''BRZ05%20Datenblatt%20%C2%B5.pdf`;
    await expect(fileNameFromDisposition(header)).resolves.toBe('BRZ05 Datenblatt \u00b5.pdf');
  });

  it('reads a plain quoted name and gives nothing for a missing or malformed header', async () => {
    await expect(fileNameFromDisposition('attachment; filename="sources-2026-12-04.csv"')).resolves.toBe('sources-2026-12-04.csv');
    await expect(fileNameFromDisposition('attachment')).resolves.toBeUndefined();
    await expect(fileNameFromDisposition(null)).resolves.toBeUndefined();
    await expect(fileNameFromDisposition('attachment; filename=')).resolves.toBeUndefined();
  });
});

describe('downloads and uploads share the token, the 401 rule and the error body', () => {
  it("a download sends the token and uses the server's file name", async () => {
    signInAs('engineer');
    const fetchMock = vi.fn(
      async () => new Response('a,b\n', { status: 200, headers: { 'Content-Disposition': 'attachment; filename="rating-cards-2026.csv"' } }),
    );
    vi.stubGlobal('fetch', fetchMock);
    const created: string[] = [];
    vi.stubGlobal('URL', Object.assign(Object.create(URL), { createObjectURL: () => (created.push('blob:x'), 'blob:x'), revokeObjectURL: () => undefined }));
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    await expect(downloadFile('/exports/rating-cards', 'fallback.csv')).resolves.toBe('rating-cards-2026.csv');
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/exports/rating-cards');
    expect((init.headers as Record<string, string>).Authorization).toBe('Bearer test-token-engineer');
    expect(click).toHaveBeenCalledOnce();
    expect(created).toHaveLength(1);
    click.mockRestore();
  });

  it("a download that gets 401 ends the session and throws the server's message", async () => {
    signInAs('engineer');
    mockApi({ 'GET /api/qualifications/9/record': { status: 401, body: errorBody('Token no longer valid') } });
    await expect(downloadFile('/qualifications/9/record', 'r.pdf')).rejects.toMatchObject({ status: 401, message: 'Token no longer valid' });
    expect(getSessionEndReason()).toBe('expired');
  });

  it('reading bytes reports the error body like any call', async () => {
    signInAs('designer');
    mockApi({ 'GET /api/datasheets/4/file': { status: 404, body: errorBody('Datasheet 4 not found') } });
    await expect(fetchBytes('/datasheets/4/file')).rejects.toMatchObject({ status: 404, correlationId: 'c0ffee00-test' });
    expect(getSession()?.user.role).toBe('designer');
  });

  it('an upload reports progress, sends the token and reads a 401 the same way', async () => {
    signInAs('engineer');
    const xhr = mockXhr(() => ({ status: 401, body: errorBody('Token no longer valid'), progress: [0.5] }));
    const progress: number[] = [];
    const schema = { parse: (x: unknown) => x };
    const file = new File(['x'], 'a.csv');
    const error = (await uploadFile('/measurement-sets', file, { schema, onProgress: (f) => progress.push(f) }).catch((e: unknown) => e)) as ApiError;
    expect(xhr.calls[0].headers.Authorization).toBe('Bearer test-token-engineer');
    expect(progress).toEqual([0.5]);
    expect(error).toBeInstanceOf(ApiError);
    expect(error.message).toBe('Token no longer valid');
    expect(getSessionEndReason()).toBe('expired');
  });
});
