import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobsService } from '../jobs/jobs.service.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';

const SITE = {
  code: 'TST',
  name: 'Test valley radar',
  lat: 14.18,
  lon: 87.95,
  altitudeM: 240,
  rangeKm: 180,
  intervalMin: 6,
  utcOffsetMinutes: 360,
};

const t0 = Date.UTC(2025, 6, 14, 6, 0);
const iso = (minutes: number) => new Date(t0 + minutes * 60_000).toISOString().replace('.000', '');
const inventory = (minutes: number[]) => ['scan_time_utc', ...minutes.map(iso)].join('\n');
const HEADER =
  'scan_time_utc,track_id,lat,lon,area_km2,volume_km3,max_dbz,top35_km,echo_top_km,core40_km3,vil_max_kg_m2,parent_track_id';
// Track A starts at 06:12 and lives three scans; B is seen at the first scan of the data; C starts
// right after the 06:24–07:00 gap; D starts near the edge of coverage (≈ 175 km east).
const table = [
  HEADER,
  `${iso(0)},B,14.40,88.10,20,30,45,7,10,4,5,`,
  `${iso(6)},B,14.41,88.09,22,32,46,7,10,4,5,`,
  `${iso(12)},A,14.30,88.00,18,25,44,6,9,3,4,`,
  `${iso(18)},A,14.31,87.99,20,28,45,6,9.5,3,4,`,
  `${iso(24)},A,14.32,87.98,21,30,45,6,9.5,3,4,`,
  `${iso(60)},C,14.10,87.90,15,20,42,5,8,2,3,`,
  `${iso(66)},C,14.11,87.89,16,21,42,5,8,2,3,`,
  `${iso(66)},D,14.18,89.57,15,20,42,5,8,2,3,`,
  `${iso(72)},D,14.19,89.56,16,21,42,5,8,2,3,`,
].join('\n');

describe('radar intake of cell tables and inventories', () => {
  let t: TestApp;
  let sci: string;
  let siteId: number;
  beforeAll(async () => {
    t = await createTestApp();
    sci = await t.signedIn('scientist');
    const site = await t.http.post('/api/radar-sites').set(bearer()).send(SITE).expect(201);
    siteId = site.body.id;
  });
  afterAll(() => t.close());

  function bearer() {
    return { Authorization: `Bearer ${sci}` };
  }
  async function upload(kind: string, files: [string, string][], fields: Record<string, string> = {}) {
    const req = t.http.post('/api/intake').set(bearer()).field('siteId', String(siteId)).field('kind', kind);
    for (const [k, v] of Object.entries(fields)) req.field(k, v);
    for (const [name, content] of files) req.attach('files[]', Buffer.from(content), name);
    const res = await req;
    if (res.status === 202) await t.app.get(JobsService).idle();
    return res;
  }
  const job = async (id: number) => (await t.http.get(`/api/jobs/${id}`).set(bearer()).expect(200)).body;

  it('creates a site with the default settings as version 1', async () => {
    const site = await t.http.get(`/api/radar-sites/${siteId}`).set(bearer()).expect(200);
    expect(site.body).toMatchObject({
      settingsVersion: 1,
      settings: { thresholdDbz: 35, minVolumeKm3: 15, maxSpeedMs: 30 },
    });
  });

  it('takes a scan inventory and then a cell table, deciding every onset against the inventory', async () => {
    const inv = await upload('scan-inventory', [['scans.csv', inventory([0, 6, 12, 18, 24, 60, 66, 72])]]);
    expect(inv.status).toBe(202);
    expect((await job(inv.body.id)).state).toBe('done');

    const res = await upload('cell-table', [['cells.csv', table]]);
    const done = await job(res.body.id);
    expect(done.state).toBe('done');
    expect(done.files[0].state).toBe('imported');
    expect(done.report).toMatchObject({ cellsFound: 9, tracks: 4, storms: 4, onsets: 1 });
    expect(done.report.flaggedStarts).toEqual({ split: 0, 'data-start': 1, 'after-gap': 1, 'edge-band': 1 });
    expect(done.report.gaps).toEqual([
      { from: new Date(iso(24)).toISOString(), to: new Date(iso(60)).toISOString(), minutes: 36 },
    ]);

    const tracks = await t.http.get(`/api/tracks?siteId=${siteId}&sort=firstTime`).set(bearer()).expect(200);
    expect(tracks.body.total).toBe(4);
    const byId = Object.fromEntries(tracks.body.items.map((x: { externalId: string }) => [x.externalId, x]));
    expect(byId.A).toMatchObject({ onset: true, scanCount: 3, durationMin: 18, notOnsetReason: null });
    expect(byId.B.notOnsetReason).toBe('data-start');
    expect(byId.C.notOnsetReason).toBe('after-gap');
    expect(byId.D.notOnsetReason).toBe('edge-band');
    const onsets = await t.http.get(`/api/tracks?siteId=${siteId}&onsetOnly=true`).set(bearer()).expect(200);
    expect(onsets.body.items.map((x: { externalId: string }) => x.externalId)).toEqual(['A']);

    const detail = await t.http.get(`/api/tracks/${byId.A.id}`).set(bearer()).expect(200);
    expect(detail.body.cells).toHaveLength(3);
    expect(detail.body.cells[0]).toMatchObject({ areaKm2: 18, echoTopKm: 9, cellType: 'deep' });
  });

  it('recognises the same file uploaded again and does not count it twice', async () => {
    const res = await upload('cell-table', [['cells-again.csv', table]]);
    const again = await job(res.body.id);
    expect(again.files[0]).toMatchObject({ duplicate: true, state: 'duplicate' });
    const tracks = await t.http.get(`/api/tracks?siteId=${siteId}`).set(bearer()).expect(200);
    expect(tracks.body.total).toBe(4);
  });

  it('names the file, row and column of bad values, skips that file, and stores nothing of it', async () => {
    const bad = `${HEADER}\n${iso(90)},E,14.3,88.0,-4,20,42,5,8,2,3,\n${iso(96)},E,200,88.0,15,20,42,5,8,2,3,\n`;
    const good = `${HEADER}\n${iso(90)},F,14.3,88.0,15,20,42,5,8,2,3,\n${iso(96)},F,14.31,88.0,15,20,42,5,8,2,3,\n`;
    const res = await upload(
      'cell-table',
      [
        ['bad.csv', bad],
        ['good.csv', good],
      ],
      { onError: 'skip' },
    );
    const j = await job(res.body.id);
    expect(j.state).toBe('done');
    expect(j.files.map((f: { state: string }) => f.state)).toEqual(['skipped', 'imported']);
    expect(j.problems).toEqual([
      {
        file: 'bad.csv',
        where: 'row 2, column "area_km2"',
        problem: '-4 is impossible: expected an area above 0 and below 100 000 km²',
      },
      {
        file: 'bad.csv',
        where: 'row 3, column "lat"',
        problem: '200 is impossible: expected a latitude between −90 and 90',
      },
    ]);
    const e = await t.http.get(`/api/tracks?siteId=${siteId}`).set(bearer()).expect(200);
    expect(e.body.items.map((x: { externalId: string }) => x.externalId)).not.toContain('E');
    expect(e.body.items.map((x: { externalId: string }) => x.externalId)).toContain('F');
  });

  it('stops the whole job and stores nothing when asked to fail on a bad file', async () => {
    const good = `${HEADER}\n${iso(120)},G,14.3,88.0,15,20,42,5,8,2,3,\n`;
    const bad = `${HEADER}\n${iso(120)},H,14.3,88.0,15,20,42,5,8,2,3,\nnot a time,H,14.3,88.0,15,20,42,5,8,2,3,\n`;
    const res = await upload(
      'cell-table',
      [
        ['good2.csv', good],
        ['bad2.csv', bad],
      ],
      { onError: 'fail' },
    );
    const j = await job(res.body.id);
    expect(j.state).toBe('failed');
    expect(j.error).toMatch(/bad2\.csv has problems/);
    expect(j.problems[0]).toMatchObject({ file: 'bad2.csv', where: 'row 3, column "scan_time_utc"' });
    const all = await t.http.get(`/api/tracks?siteId=${siteId}&limit=100`).set(bearer()).expect(200);
    expect(all.body.items.map((x: { externalId: string }) => x.externalId)).not.toContain('G');
  });

  it('refuses a table whose cells all lie far outside the coverage', async () => {
    const far = `${HEADER}\n${iso(150)},K,20.0,95.0,15,20,42,5,8,2,3,\n`;
    const j = await job((await upload('cell-table', [['far.csv', far]])).body.id);
    expect(j.problems[0].problem).toMatch(
      /none of its 1 cells lie within the site's coverage \(the nearest is \d+ km/,
    );
  });

  it('answers bad intake fields with 400s naming them', async () => {
    const noFiles = await t.http
      .post('/api/intake')
      .set(bearer())
      .field('siteId', String(siteId))
      .field('kind', 'cell-table');
    expect(noFiles.status).toBe(400);
    expect(noFiles.body.details).toEqual([{ where: 'files', problem: 'missing' }]);
    const badKind = await upload('radar-soup', [['x.csv', 'a']]);
    expect(badKind.status).toBe(400);
    expect(badKind.body.details[0]).toMatchObject({
      where: 'kind',
      problem: 'kind must be one of volume, column-max, cell-table, scan-inventory, anomaly-grid',
    });
    const badMapping = await upload('cell-table', [['y.csv', table]], { mapping: '{"columns":{"area":""}}' });
    expect(badMapping.status).toBe(400);
    expect(badMapping.body.details[0].where).toBe('mapping.columns.area');
  });

  it('versions settings: a change makes version 2 and the history keeps both', async () => {
    const res = await t.http
      .patch(`/api/radar-sites/${siteId}`)
      .set(bearer())
      .send({ settings: { thresholdDbz: 40 } })
      .expect(200);
    expect(res.body).toMatchObject({ settingsVersion: 2, settings: { thresholdDbz: 40, minVolumeKm3: 15 } });
    // A second change keeps the first: only the keys sent change.
    const again = await t.http
      .patch(`/api/radar-sites/${siteId}`)
      .set(bearer())
      .send({ settings: { minVolumeKm3: 20 } })
      .expect(200);
    expect(again.body).toMatchObject({
      settingsVersion: 3,
      settings: { thresholdDbz: 40, minVolumeKm3: 20 },
    });
    // Sending the same value again is no change and makes no version.
    const same = await t.http
      .patch(`/api/radar-sites/${siteId}`)
      .set(bearer())
      .send({ settings: { minVolumeKm3: 20 } });
    expect(same.body.settingsVersion).toBe(3);
    const history = await t.http.get(`/api/radar-sites/${siteId}/settings`).set(bearer()).expect(200);
    expect(history.body.map((h: { version: number }) => h.version)).toEqual([3, 2, 1]);
    const bad = await t.http
      .patch(`/api/radar-sites/${siteId}`)
      .set(bearer())
      .send({ settings: { zrA: 2 } })
      .expect(400);
    expect(bad.body.details[0]).toMatchObject({
      where: 'settings.zrA',
      problem: 'Z–R a below 10 is outside published relations',
    });
  });
});
