import { afterAll, afterEach, beforeAll, describe, it, vi } from 'vitest';
import { createTestApp, type TestApp } from '../testing/test-app.js';
import { SESSION_USER_TTL_MS } from '../users/users.repository.js';

/**
 * Every authenticated request checks its token against the stored user, reusing a recent read.
 * Changes made through the users module must take effect at the very next request; a change made
 * around it (by hand in SQL) within SESSION_USER_TTL_MS.
 */
describe('the user behind an access token, read at most every few seconds', () => {
  let t: TestApp;
  let admin: string;
  const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
  beforeAll(async () => {
    t = await createTestApp();
    admin = await t.signedIn('admin');
  });
  afterAll(() => t.close());
  afterEach(() => vi.useRealTimers());

  const idOf = async (email: string) =>
    (await t.db.pg.query<{ id: number }>('select id from users where email = $1', [email])).rows[0].id;

  it('refuses a token at the next request after its user’s role changes, though that user was just checked', async () => {
    const token = await t.signedIn('writer', { email: 'moving@unit.example' });
    await t.http.get('/api/auth/me').set(bearer(token)).expect(200);
    await t.http.get('/api/auth/me').set(bearer(token)).expect(200);
    await t.http
      .patch(`/api/users/${await idOf('moving@unit.example')}`)
      .set(bearer(admin))
      .send({ role: 'scientist' })
      .expect(200);
    await t.http.get('/api/auth/me').set(bearer(token)).expect(401);
  });

  it('sees a deactivation made by hand in the database within the reuse time, not before', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const token = await t.signedIn('writer', { email: 'quiet@unit.example' });
    await t.http.get('/api/auth/me').set(bearer(token)).expect(200);
    await t.db.pg.query('update users set active = false where email = $1', ['quiet@unit.example']);
    // Within the reuse time the earlier read still stands (this is the bound, not the usual case) …
    vi.advanceTimersByTime(SESSION_USER_TTL_MS - 1000);
    await t.http.get('/api/auth/me').set(bearer(token)).expect(200);
    // … and once it has passed the user is read again and refused.
    vi.advanceTimersByTime(1001);
    await t.http.get('/api/auth/me').set(bearer(token)).expect(401);
  });

  it('does not keep a row read while a change was being written', async () => {
    const token = await t.signedIn('writer', { email: 'racing@unit.example' });
    const id = await idOf('racing@unit.example');
    // The check and the deactivation are sent together; whichever order they run in, the next check refuses.
    await Promise.all([
      t.http.get('/api/auth/me').set(bearer(token)),
      t.http.patch(`/api/users/${id}`).set(bearer(admin)).send({ active: false }).expect(200),
    ]);
    await t.http.get('/api/auth/me').set(bearer(token)).expect(401);
  });
});
