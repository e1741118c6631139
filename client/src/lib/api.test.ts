import { CSRF_HEADER } from '@stormhour/shared';
import { beforeEach, describe, expect, it } from 'vitest';
import { aLogin, aSessionUser } from '../test/builders';
import { fakeApi } from '../test/fakeApi';
import { refreshSession, request, setAccessToken, setSessionHandlers } from './api';
import { ApiError } from './apiError';

let lost = 0;
beforeEach(() => {
  lost = 0;
  setAccessToken(null);
  setSessionHandlers({ onRefreshed: () => {}, onLost: () => lost++ });
});

describe('request', () => {
  it('renews an expired token once through the refresh cookie and repeats the call', async () => {
    let userCalls = 0;
    const server = fakeApi({
      'GET /api/auth/me': (req) =>
        ++userCalls === 1
          ? { status: 401, body: { statusCode: 401, message: 'Token expired' } }
          : { body: { seenToken: req.headers.authorization } },
      'POST /api/auth/refresh': { body: aLogin(aSessionUser({ id: 4 })) },
    });
    setAccessToken('stale');
    await expect(request('/api/auth/me')).resolves.toEqual({ seenToken: 'Bearer token-for-4' });
    const refresh = server.calls.find((c) => c.path === '/api/auth/refresh');
    expect(refresh?.headers[CSRF_HEADER]).toBe('1');
    expect(lost).toBe(0);
  });

  it('gives up and reports the session lost when the refresh is refused', async () => {
    fakeApi({
      'GET /api/users': { status: 401, body: { statusCode: 401, message: 'Token expired' } },
      'POST /api/auth/refresh': { status: 401, body: { statusCode: 401, message: 'No session' } },
    });
    await expect(request('/api/users')).rejects.toBeInstanceOf(ApiError);
    expect(lost).toBe(1);
  });

  it('shares one refresh between calls that fail together', async () => {
    const server = fakeApi({ 'POST /api/auth/refresh': { body: aLogin() } });
    await Promise.all([refreshSession(), refreshSession(), refreshSession()]);
    expect(server.calls).toHaveLength(1);
  });

  it('keeps the token out of web storage', async () => {
    fakeApi({ 'POST /api/auth/refresh': { body: aLogin() } });
    await refreshSession();
    expect(localStorage.length).toBe(0);
    expect(sessionStorage.length).toBe(0);
  });

  it('says plainly when the server cannot be reached', async () => {
    const { vi } = await import('vitest');
    vi.stubGlobal('fetch', () => Promise.reject(new TypeError('Failed to fetch')));
    await expect(request('/api/health')).rejects.toMatchObject({
      status: 0,
      message: 'The server could not be reached. Check the connection and try again.',
    });
  });
});
