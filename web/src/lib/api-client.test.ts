import { describe, expect, it, vi } from 'vitest';
import { loginResponseSchema, userSchema } from '@shuntwise/contracts';
import { errorBody, mockApi } from '@/testing/mock-api';
import { signInAs } from '@/testing/render';
import { ApiError, apiRequest, describeError } from './api-client';
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
