import { CSRF_HEADER } from '@stormhour/shared';
import jwt from 'jsonwebtoken';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, TEST_PASSWORD, type TestApp, testConfig } from '../testing/test-app.js';
import { SIGN_IN_FAILED } from './auth.service.js';

const refreshCookie = (res: { headers: Record<string, unknown> }) =>
  ((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('stormhour_refresh='));

describe('sign-in, sessions and tokens', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ loginAttemptsPerMinute: 5 });
    await t.signedIn('scientist', { email: 'sci@unit.example' });
  });
  afterAll(() => t.close());

  const login = (email: string, password: string) => t.http.post('/api/auth/login').send({ email, password });

  it('signs in with the right password, returning a token, the user and an httpOnly cookie', async () => {
    const res = await login('SCI@unit.example ', TEST_PASSWORD).expect(200);
    expect(res.body.user).toMatchObject({ email: 'sci@unit.example', role: 'scientist', districtId: null });
    expect(res.body.expiresIn).toBe(15 * 60);
    const cookie = refreshCookie(res);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Strict/);
    expect(cookie).toMatch(/Path=\/api\/auth/);
    const me = await t.http
      .get('/api/auth/me')
      .set('Authorization', `Bearer ${res.body.accessToken}`)
      .expect(200);
    expect(me.body.email).toBe('sci@unit.example');
  });

  it('answers an unknown e-mail and a wrong password with the same message', async () => {
    const unknown = await login('nobody@unit.example', TEST_PASSWORD).expect(401);
    const wrong = await login('sci@unit.example', 'not the password').expect(401);
    expect(unknown.body.message).toBe(SIGN_IN_FAILED);
    expect(wrong.body.message).toBe(SIGN_IN_FAILED);
  });

  it('lists each field wrong in a malformed sign-in', async () => {
    const res = await t.http.post('/api/auth/login').send({ email: 'not-an-email' }).expect(400);
    expect(res.body.details.map((d: { where: string }) => d.where).sort()).toEqual(['email', 'password']);
  });

  it('refuses malformed JSON with a message saying so', async () => {
    const res = await t.http
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send('{"email": "sci@unit.example",')
      .expect(400);
    expect(res.body.message).toMatch(/not valid JSON/);
  });

  it.each([
    ['no token', undefined],
    ['a malformed token', 'Bearer not.a.token'],
    [
      'a token signed with another secret',
      `Bearer ${jwt.sign({ sub: 1, role: 'admin', ver: 0 }, 'x'.repeat(40))}`,
    ],
    [
      'an expired token',
      `Bearer ${jwt.sign({ sub: 1, role: 'scientist', ver: 0, exp: Math.floor(Date.now() / 1000) - 60 }, testConfig().jwtSecret)}`,
    ],
    [
      'a token with the "none" algorithm',
      `Bearer ${jwt.sign({ sub: 1, role: 'admin', ver: 0 }, '', { algorithm: 'none' })}`,
    ],
  ])('refuses %s with 401', async (_what, header) => {
    const req = t.http.get('/api/auth/me');
    if (header) req.set('Authorization', header);
    const res = await req.expect(401);
    expect(res.body.message).toMatch(/sign in/i);
  });

  it('restores a session from the refresh cookie once, rotating it, and only with the CSRF header', async () => {
    const first = await login('sci@unit.example', TEST_PASSWORD).expect(200);
    const cookie = (refreshCookie(first) as string).split(';')[0];
    await t.http.post('/api/auth/refresh').set('Cookie', cookie).expect(401);
    const refreshed = await t.http
      .post('/api/auth/refresh')
      .set('Cookie', cookie)
      .set(CSRF_HEADER, '1')
      .expect(200);
    expect(refreshed.body.user.email).toBe('sci@unit.example');
    expect(refreshCookie(refreshed)).toBeDefined();
    // The spent cookie cannot be replayed.
    await t.http.post('/api/auth/refresh').set('Cookie', cookie).set(CSRF_HEADER, '1').expect(401);
  });

  it('ends the refresh session on sign-out', async () => {
    const res = await login('sci@unit.example', TEST_PASSWORD).expect(200);
    const cookie = (refreshCookie(res) as string).split(';')[0];
    await t.http
      .post('/api/auth/logout')
      .set('Authorization', `Bearer ${res.body.accessToken}`)
      .set('Cookie', cookie)
      .expect(204);
    await t.http.post('/api/auth/refresh').set('Cookie', cookie).set(CSRF_HEADER, '1').expect(401);
  });

  it('changes the own password, checking the current one', async () => {
    const token = await t.signedIn('writer', { email: 'pw@unit.example' });
    const auth = { Authorization: `Bearer ${token}` };
    const wrong = await t.http
      .post('/api/auth/password')
      .set(auth)
      .send({ currentPassword: 'nope', newPassword: 'a new long password' })
      .expect(400);
    expect(wrong.body.details).toEqual([{ where: 'currentPassword', problem: 'does not match' }]);
    const short = await t.http
      .post('/api/auth/password')
      .set(auth)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'short' })
      .expect(400);
    expect(short.body.details[0]).toMatchObject({
      where: 'newPassword',
      problem: 'Use at least 10 characters',
    });
    await t.http
      .post('/api/auth/password')
      .set(auth)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a new long password' })
      .expect(204);
    await login('pw@unit.example', TEST_PASSWORD).expect(401);
    await login('pw@unit.example', 'a new long password').expect(200);
  });

  it('limits repeated sign-in attempts for one account', async () => {
    await t.signedIn('writer', { email: 'target@unit.example' });
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) statuses.push((await login('target@unit.example', `guess-${i}`)).status);
    expect(statuses.slice(0, 4)).toEqual([401, 401, 401, 401]);
    expect(statuses.at(-1)).toBe(429);
    const limited = await login('target@unit.example', TEST_PASSWORD).expect(429);
    expect(limited.body.message).toMatch(/Too many sign-in attempts/);
  });

  it('records sign-ins and failed sign-ins in the audit trail', async () => {
    const rows = await t.db.pg.query<{ action: string; target: string }>(
      "select action, target from audit_log where target like 'email:nobody%' or action = 'auth.sign-in'",
    );
    expect(
      rows.rows.some((r) => r.action === 'auth.sign-in-failed' && r.target === 'email:nobody@unit.example'),
    ).toBe(true);
    expect(rows.rows.some((r) => r.action === 'auth.sign-in')).toBe(true);
  });
});
