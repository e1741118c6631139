import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../testing/test-app.js';

describe('people API', () => {
  let t: TestApp;
  let admin: string;
  let districtId: number;
  beforeAll(async () => {
    t = await createTestApp();
    admin = await t.signedIn('admin', { email: 'boss@unit.example' });
    const d = await t.http.post('/api/districts').set(bearer(admin)).send({ code: 'TFA', name: 'Fernwater' });
    districtId = d.body.id;
  });
  afterAll(() => t.close());

  const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
  const newPerson = (over: Record<string, unknown> = {}) => ({
    email: 'new.officer@unit.example',
    name: 'New Officer',
    role: 'officer',
    districtId,
    password: 'a long enough password',
    ...over,
  });

  it('creates a person and lets them sign in with the initial password', async () => {
    const res = await t.http.post('/api/users').set(bearer(admin)).send(newPerson()).expect(201);
    expect(res.body).toMatchObject({
      email: 'new.officer@unit.example',
      role: 'officer',
      districtId,
      active: true,
    });
    expect(res.body.passwordHash).toBeUndefined();
    await t.http
      .post('/api/auth/login')
      .send({ email: 'new.officer@unit.example', password: 'a long enough password' })
      .expect(200);
  });

  it.each([
    [
      'an officer without a district',
      { email: 'x1@unit.example', districtId: null },
      'districtId',
      /assigned to a district/,
    ],
    [
      'an unknown role',
      { email: 'x2@unit.example', role: 'boss' },
      'role',
      /Role must be one of admin, scientist, writer, officer/,
    ],
    ['a bad e-mail', { email: 'nope' }, 'email', /valid e-mail/],
    [
      'a short password',
      { email: 'x3@unit.example', password: 'short' },
      'password',
      /at least 10 characters/,
    ],
  ])('refuses %s, naming the field', async (_what, over, field, problem) => {
    const res = await t.http.post('/api/users').set(bearer(admin)).send(newPerson(over)).expect(400);
    const detail = res.body.details.find((d: { where: string }) => d.where === field);
    expect(detail?.problem).toMatch(problem);
  });

  it('refuses a second person with the same e-mail', async () => {
    const res = await t.http.post('/api/users').set(bearer(admin)).send(newPerson()).expect(409);
    expect(res.body.message).toMatch(/already exists/);
  });

  it('deactivates a person: they cannot sign in and their token stops working at once', async () => {
    const token = await t.signedIn('writer', { email: 'leaving@unit.example' });
    await t.http.get('/api/auth/me').set(bearer(token)).expect(200);
    const list = await t.http.get('/api/users?q=leaving').set(bearer(admin)).expect(200);
    expect(list.body).toHaveLength(1);
    await t.http
      .patch(`/api/users/${list.body[0].id}`)
      .set(bearer(admin))
      .send({ active: false })
      .expect(200);
    await t.http.get('/api/auth/me').set(bearer(token)).expect(401);
    await t.http
      .post('/api/auth/login')
      .send({ email: 'leaving@unit.example', password: 'correct horse battery' })
      .expect(401);
    await t.http.patch(`/api/users/${list.body[0].id}`).set(bearer(admin)).send({ active: true }).expect(200);
    await t.http
      .post('/api/auth/login')
      .send({ email: 'leaving@unit.example', password: 'correct horse battery' })
      .expect(200);
  });

  it('changes a role, clearing the district of a former officer', async () => {
    const [officer] = (await t.http.get('/api/users?role=officer').set(bearer(admin))).body;
    const res = await t.http
      .patch(`/api/users/${officer.id}`)
      .set(bearer(admin))
      .send({ role: 'writer' })
      .expect(200);
    expect(res.body).toMatchObject({ role: 'writer', districtId: null });
  });

  it('does not let an admin deactivate themselves or take an unknown field', async () => {
    const me = (await t.http.get('/api/auth/me').set(bearer(admin))).body;
    const self = await t.http
      .patch(`/api/users/${me.id}`)
      .set(bearer(admin))
      .send({ active: false })
      .expect(400);
    expect(self.body.message).toMatch(/cannot deactivate yourself/);
    const extra = await t.http
      .patch(`/api/users/${me.id}`)
      .set(bearer(admin))
      .send({ passwordHash: 'x' })
      .expect(400);
    expect(extra.body.message).toMatch(/passwordHash/);
  });

  it('records people changes in the audit trail, newest first, paged', async () => {
    const page = await t.http.get('/api/audit?limit=2').set(bearer(admin)).expect(200);
    expect(page.body.items).toHaveLength(2);
    expect(page.body.total).toBeGreaterThan(4);
    const actions = (await t.http.get('/api/audit/actions').set(bearer(admin))).body as string[];
    expect(actions).toEqual(
      expect.arrayContaining(['user.create', 'user.deactivate', 'user.reactivate', 'user.update']),
    );
    const deact = await t.http.get('/api/audit?action=user.deactivate').set(bearer(admin)).expect(200);
    expect(deact.body.items[0]).toMatchObject({ actorEmail: 'boss@unit.example', action: 'user.deactivate' });
  });
});
