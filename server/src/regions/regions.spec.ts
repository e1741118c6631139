import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../testing/test-app.js';

const fixturePath = (name: string) => new URL(`../../../tests/fixtures/${name}`, import.meta.url).pathname;

describe('districts and blocks API', () => {
  let t: TestApp;
  let admin: string;
  let officer: string;
  beforeAll(async () => {
    t = await createTestApp({ uploadLimitBytes: 64 * 1024 });
    admin = await t.signedIn('admin');
  });
  afterAll(() => t.close());

  const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
  const count = async (table: string) =>
    (await t.db.pg.query<{ n: number }>(`select count(*)::int as n from ${table}`)).rows[0].n;

  it('refuses a broken file whole, naming each bad feature, and stores nothing', async () => {
    const res = await t.http
      .post('/api/blocks/import')
      .set(bearer(admin))
      .attach('file', fixturePath('blocks-broken.geojson'))
      .expect(400);
    expect(res.body.message).toBe('blocks-broken.geojson: 6 feature(s) have problems; nothing was imported.');
    const where = res.body.details.map((d: { where: string }) => d.where);
    expect(where).toContain('features[1] (TFA-02)');
    expect(where).toContain('features[4]');
    expect(
      res.body.details.find((d: { where: string }) => d.where === 'features[2] (TFA-03)').problem,
    ).toMatch(/not closed/);
    expect(await count('blocks')).toBe(0);
    expect(await count('districts')).toBe(0);
  });

  it('imports a valid file in one go, creating its districts, with geodesic areas', async () => {
    const res = await t.http
      .post('/api/blocks/import')
      .set(bearer(admin))
      .attach('file', fixturePath('blocks-valid.geojson'))
      .expect(201);
    expect(res.body).toEqual({ districtsCreated: 2, blocksCreated: 4, blocksUpdated: 0 });
    const blocks = await t.http.get('/api/blocks').set(bearer(admin)).expect(200);
    expect(blocks.body.map((b: { code: string }) => b.code)).toEqual([
      'TFA-01',
      'TFA-02',
      'TFB-01',
      'TFB-02',
    ]);
    const first = blocks.body[0];
    // A 0.25° square near 14° N: about 27.7 km × 26.95 km (M·N·cosφ element; common practice).
    expect(first.areaKm2).toBeGreaterThan(740);
    expect(first.areaKm2).toBeLessThan(752);
    expect(first.bbox).toEqual([87.5, 14, 87.75, 14.25]);
    expect(first.centroid[0]).toBeCloseTo(87.625, 9);
    const districts = await t.http.get('/api/districts').set(bearer(admin)).expect(200);
    expect(districts.body.map((d: { code: string; blockCount: number }) => [d.code, d.blockCount])).toEqual([
      ['TFA', 2],
      ['TFB', 2],
    ]);
  });

  it('updates blocks in place when the same file is imported again', async () => {
    const res = await t.http
      .post('/api/blocks/import')
      .set(bearer(admin))
      .attach('file', fixturePath('blocks-valid.geojson'))
      .expect(201);
    expect(res.body).toEqual({ districtsCreated: 0, blocksCreated: 0, blocksUpdated: 4 });
    expect(await count('blocks')).toBe(4);
  });

  it('filters blocks by district and by text, and serves them as GeoJSON', async () => {
    const districts = (await t.http.get('/api/districts').set(bearer(admin))).body as {
      id: number;
      code: string;
    }[];
    const tfb = districts.find((d) => d.code === 'TFB')?.id;
    const inTfb = await t.http.get(`/api/blocks?districtId=${tfb}`).set(bearer(admin)).expect(200);
    expect(inTfb.body.map((b: { code: string }) => b.code)).toEqual(['TFB-01', 'TFB-02']);
    const byName = await t.http.get('/api/blocks?q=reed').set(bearer(admin)).expect(200);
    expect(byName.body.map((b: { code: string }) => b.code)).toEqual(['TFA-02']);
    const geo = await t.http.get('/api/blocks/geojson').set(bearer(admin)).expect(200);
    expect(geo.body.type).toBe('FeatureCollection');
    expect(geo.body.features[3].geometry.type).toBe('MultiPolygon');
    expect(geo.body.features[0].properties).toMatchObject({ code: 'TFA-01', districtName: 'Fernwater' });
  });

  it.each([
    ['a TopoJSON file', 'not-geojson.geojson', /not a GeoJSON FeatureCollection/],
    ['a CSV file named .geojson', 'blocks-as-csv.geojson', /blocks-as-csv.geojson: The file is not JSON/],
  ])('refuses %s with a message naming the file', async (_what, name, message) => {
    const res = await t.http
      .post('/api/blocks/import')
      .set(bearer(admin))
      .attach('file', fixturePath(name))
      .expect(400);
    expect(res.body.message).toMatch(message);
  });

  it('refuses an upload over the size limit and a request without a file', async () => {
    const big = Buffer.alloc(70 * 1024, ' ');
    const tooLarge = await t.http
      .post('/api/blocks/import')
      .set(bearer(admin))
      .attach('file', big, 'huge.geojson')
      .expect(413);
    expect(tooLarge.body.message).toMatch(/larger than the upload limit of 0\.0625 MB/);
    const missing = await t.http.post('/api/blocks/import').set(bearer(admin)).expect(400);
    expect(missing.body.details).toEqual([{ where: 'file', problem: 'missing' }]);
  });

  it('lets the admin add and rename districts and edit blocks, with clear errors', async () => {
    const created = await t.http
      .post('/api/districts')
      .set(bearer(admin))
      .send({ code: 'TFC', name: 'Mossgate' })
      .expect(201);
    const dup = await t.http
      .post('/api/districts')
      .set(bearer(admin))
      .send({ code: 'TFC', name: 'Again' })
      .expect(409);
    expect(dup.body.details).toEqual([{ where: 'code', problem: 'already in use' }]);
    const badCode = await t.http
      .post('/api/districts')
      .set(bearer(admin))
      .send({ code: 'tf c', name: 'x' })
      .expect(400);
    expect(badCode.body.details[0].where).toBe('code');
    await t.http
      .patch(`/api/districts/${created.body.id}`)
      .set(bearer(admin))
      .send({ name: 'Mossgate Vale' })
      .expect(200);
    const blocks = (await t.http.get('/api/blocks').set(bearer(admin))).body as { id: number }[];
    const moved = await t.http
      .patch(`/api/blocks/${blocks[0].id}`)
      .set(bearer(admin))
      .send({ name: 'Oxbow Reach North', districtId: created.body.id })
      .expect(200);
    expect(moved.body).toMatchObject({
      name: 'Oxbow Reach North',
      districtCode: 'TFC',
      districtName: 'Mossgate Vale',
    });
    const nowhere = await t.http
      .patch(`/api/blocks/${blocks[0].id}`)
      .set(bearer(admin))
      .send({ districtId: 9999 })
      .expect(400);
    expect(nowhere.body.details).toEqual([{ where: 'districtId', problem: 'no such district' }]);
  });

  it('keeps officers away from district and block changes', async () => {
    officer = await t.signedIn('officer');
    await t.http.get('/api/blocks').set(bearer(officer)).expect(200);
    const res = await t.http
      .post('/api/blocks/import')
      .set(bearer(officer))
      .attach('file', Buffer.from(readFileSync(fixturePath('blocks-valid.geojson'))), 'b.geojson')
      .expect(403);
    expect(res.body.message).toBe('Your role does not give access to this.');
  });

  it('writes an audit row for each import', async () => {
    const audit = await t.http.get('/api/audit?action=blocks.import').set(bearer(admin)).expect(200);
    expect(audit.body.total).toBe(2);
    expect(audit.body.items[0]).toMatchObject({
      action: 'blocks.import',
      target: 'file:blocks-valid.geojson',
    });
  });
});
