import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { encodeGeoTiff, type GdalItem, gdalMetadataXml, geographicKeys } from '@stormhour/sample-data';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobsService } from '../jobs/jobs.service.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';

const demo = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
const site = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));

/** A small lon–lat GeoTIFF around the demo radar (or elsewhere): one band per entry of `bands`. */
function gridTiff(opts: {
  variable?: string;
  units?: string;
  bands: { date?: string; month?: number; value: (lon: number, lat: number) => number }[];
  west?: number;
  north?: number;
}): Buffer {
  const nx = 13;
  const ny = 12;
  const step = 0.25;
  const west = opts.west ?? 86.5;
  const north = opts.north ?? 15.5;
  const n = opts.bands.length;
  const data = new Float32Array(nx * ny * n);
  for (let j = 0; j < ny; j++)
    for (let i = 0; i < nx; i++)
      opts.bands.forEach((b, k) => {
        data[(j * nx + i) * n + k] = b.value(west + i * step, north - j * step);
      });
  const items: GdalItem[] = [
    { name: 'VARIABLE', value: opts.variable ?? 'q' },
    { name: 'UNITS', value: opts.units ?? 'g/kg' },
    { name: 'LEVEL_HPA', value: 850 },
  ];
  opts.bands.forEach((b, k) => {
    if (b.date) items.push({ name: 'DATE', sample: k, value: b.date });
    if (b.month) items.push({ name: 'MONTH', sample: k, value: b.month });
  });
  return encodeGeoTiff({
    width: nx,
    height: ny,
    bands: n,
    data,
    pixelScale: [step, step],
    origin: [west - step / 2, north + step / 2],
    geoKeys: geographicKeys(),
    gdalMetadataXml: gdalMetadataXml(items),
  });
}

const days = (first: string, n: number) =>
  Array.from({ length: n }, (_, d) =>
    new Date(Date.parse(first) + d * 86_400_000).toISOString().slice(0, 10),
  );
const flat = (v: number) => () => v;

describe('anomaly products, totals and bad input', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let siteId: number;
  beforeAll(async () => {
    t = await createTestApp();
    auth = { Authorization: `Bearer ${await t.signedIn('scientist')}` };
    siteId = (await t.http.post('/api/radar-sites').set(auth).send(site.createSiteRequest).expect(201)).body
      .id;
  });
  afterAll(() => t.close());

  async function upload(files: [name: string, content: Buffer][], fields: Record<string, string> = {}) {
    const req = t.http
      .post('/api/intake')
      .set(auth)
      .field('siteId', String(siteId))
      .field('kind', 'anomaly-grid');
    for (const [k, v] of Object.entries(fields)) req.field(k, v);
    for (const [name, content] of files) req.attach('files[]', content, name);
    const res = await req.expect(202);
    await t.app.get(JobsService).idle();
    return (await t.http.get(`/api/jobs/${res.body.id}`).set(auth).expect(200)).body;
  }
  const sources = async () =>
    (await t.http.get('/api/regimes/sources').set(auth).expect(200)).body as Record<string, unknown>[];

  it('turns totals into anomalies against the monthly climatology uploaded before, and says so', async () => {
    // Monthly climatology of q: 10 + month + a north–south gradient.
    const clim = gridTiff({
      bands: Array.from({ length: 12 }, (_, m) => ({ value: (_lon, lat) => 10 + (m + 1) + 0.1 * lat })),
    });
    const climJob = await upload([['clim-q850.tif', clim]], { fieldKind: 'climatology' });
    expect(climJob.state).toBe('done');
    expect(climJob.summary).toMatch(/monthly climatology of q at 850 hPa, 12 bands 01–12/);
    const anomalies = [1, -1, 0.5];
    const totals = gridTiff({
      bands: days('2024-06-01', 3).map((date, d) => ({
        date,
        value: (_lon, lat) => 16 + 0.1 * lat + anomalies[d],
      })),
    });
    const job = await upload([['totals-q850.tif', totals]], { fieldKind: 'total' });
    expect(job.state).toBe('done');
    expect(job.summary).toMatch(
      /analysis anomalies computed as totals − climatology \(clim-q850\.tif\) of q/,
    );
    const res = await t.http
      .get(`/api/regimes?siteId=${siteId}&from=2024-06-01&to=2024-06-03`)
      .set(auth)
      .expect(200);
    // Total − June's climatology leaves the uniform anomaly (float32 rounding aside).
    expect(res.body.days).toHaveLength(3);
    for (const [d, day] of (res.body.days as { q: number }[]).entries())
      expect(day.q).toBeCloseTo(anomalies[d], 4);
    expect(await sources()).toContainEqual(
      expect.objectContaining({
        product: 'analysis',
        variable: 'q',
        sourceFile: 'totals-q850.tif',
        derivation: 'total-minus-climatology',
        climatologyFile: 'clim-q850.tif',
        days: 3,
      }),
    );
  });

  it('refuses totals with no climatology, naming file and band and the order of uploads', async () => {
    const totals = gridTiff({ variable: 'u', units: 'm/s', bands: [{ date: '2024-06-01', value: flat(3) }] });
    const job = await upload([['totals-u850.tif', totals]], { fieldKind: 'total' });
    expect(job.problems[0]).toMatchObject({
      file: 'totals-u850.tif',
      where: 'band 1',
      problem: expect.stringMatching(/no climatology of u at 850 hPa .*upload the climatology first/),
    });
    expect((await sources()).some((s) => s.variable === 'u')).toBe(false);
  });

  it('refuses totals on another grid than the climatology’s', async () => {
    const totals = gridTiff({ bands: [{ date: '2024-07-01', value: flat(20) }], west: 86.25 });
    const job = await upload([['shifted-q850.tif', totals]], { fieldKind: 'total' });
    expect(job.problems[0]).toMatchObject({
      where: 'band 1',
      problem: expect.stringMatching(/differs from the climatology's .*clim-q850\.tif/),
    });
  });

  it('keeps forecasts apart from analyses and classifies a coming week by the record’s bounds', async () => {
    const analysisQ = [-1.5, -0.5, 0, 0.4, 0.8, 1.6];
    const dates = days('2025-06-01', 6);
    const wind = (u: number, v: number) => [
      gridTiff({ variable: 'u', units: 'm/s', bands: dates.map((date) => ({ date, value: flat(u) })) }),
      gridTiff({ variable: 'v', units: 'm/s', bands: dates.map((date) => ({ date, value: flat(v) })) }),
    ];
    const [u, v] = wind(-2, 0); // from the east: "along-valley" with the default sectors
    const analysis = await upload([
      ['a-q850.tif', gridTiff({ bands: dates.map((date, d) => ({ date, value: flat(analysisQ[d]) })) })],
      ['a-u850.tif', u],
      ['a-v850.tif', v],
    ]);
    expect(analysis.state).toBe('done');
    const before = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth).expect(200)).body;

    // A forecast for 2–4 June (the same dates as analyses): strongly moist, from the south-east (onshore).
    const fDates = dates.slice(1, 4);
    const from = 145 * (Math.PI / 180);
    const forecast = await upload(
      [
        ['f-q850.tif', gridTiff({ bands: fDates.map((date) => ({ date, value: flat(3) })) })],
        [
          'f-u850.tif',
          gridTiff({
            variable: 'u',
            units: 'm/s',
            bands: fDates.map((date) => ({ date, value: flat(-3 * Math.sin(from)) })),
          }),
        ],
        [
          'f-v850.tif',
          gridTiff({
            variable: 'v',
            units: 'm/s',
            bands: fDates.map((date) => ({ date, value: flat(-3 * Math.cos(from)) })),
          }),
        ],
      ],
      { product: 'forecast' },
    );
    expect(forecast.state).toBe('done');
    expect(forecast.summary).toMatch(/f-q850\.tif: forecast anomalies of q/);
    const after = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth).expect(200)).body;
    // The analyses are untouched: same days, same values, same bounds.
    expect(after.days).toEqual(before.days);
    expect(after.moistureBoundsGKg).toEqual(before.moistureBoundsGKg);

    const expected = await t.http
      .get(`/api/regimes/expected?siteId=${siteId}&from=2025-06-01&to=2025-06-07`)
      .set(auth)
      .expect(200);
    expect(expected.body.days.map((d: { date: string }) => d.date)).toEqual(fDates);
    expect(expected.body.moistureBoundsGKg).toEqual(before.moistureBoundsGKg);
    expect(expected.body.regime).toBe('moist / onshore');
    expect(expected.body.days[0].directionFromDeg).toBeCloseTo(145, 4);

    const none = await t.http
      .get(`/api/regimes/expected?siteId=${siteId}&from=2025-08-01&to=2025-08-07`)
      .set(auth)
      .expect(200);
    expect(none.body).toMatchObject({ days: [], regime: null });
    const backwards = await t.http
      .get(`/api/regimes/expected?siteId=${siteId}&from=2025-08-07&to=2025-08-01`)
      .set(auth)
      .expect(400);
    expect(backwards.body.details[0]).toMatchObject({ where: 'to' });
  });

  it('refuses bands without dates unless a file-name pattern gives the first day', async () => {
    const undated = gridTiff({ bands: [{ value: flat(1) }, { value: flat(2) }] });
    const refused = await upload([['q850_20240801.tif', undated]]);
    expect(refused.problems[0]).toMatchObject({
      file: 'q850_20240801.tif',
      where: 'band 1',
      problem: expect.stringMatching(/has no date: give DATE .* or a file-name pattern/),
    });
    const taken = await upload([['q850_20240801.tif', undated]], { timePattern: 'q850_YYYYMMDD.tif' });
    expect(taken.state).toBe('done');
    expect(taken.summary).toMatch(/2 days 2024-08-01–2024-08-02/);
  });

  it('refuses a grid that does not overlap the site’s coverage', async () => {
    const far = gridTiff({ bands: [{ date: '2024-09-01', value: flat(1) }], west: 10, north: 50 });
    const job = await upload([['far-q850.tif', far]]);
    expect(job.problems[0]).toMatchObject({
      file: 'far-q850.tif',
      where: 'grid',
      problem: expect.stringMatching(/does not overlap the coverage of site VSR/),
    });
  });

  it('refuses the same day twice in one upload and, asked to stop, stores nothing of it', async () => {
    const count = (await sources()).reduce((n, s) => n + (s.days as number), 0);
    const a = gridTiff({ bands: days('2024-09-10', 3).map((date) => ({ date, value: flat(1) })) });
    const b = gridTiff({ bands: days('2024-09-12', 2).map((date) => ({ date, value: flat(2) })) });
    const job = await upload(
      [
        ['first-q850.tif', a],
        ['second-q850.tif', b],
      ],
      { onError: 'fail' },
    );
    expect(job.state).toBe('failed');
    expect(job.problems[0]).toMatchObject({
      file: 'second-q850.tif',
      where: 'band 1',
      problem: expect.stringMatching(/2024-09-12 of q at 850 hPa is also in first-q850\.tif of this upload/),
    });
    expect((await sources()).reduce((n, s) => n + (s.days as number), 0)).toBe(count);
  });

  it('refuses an analysis of a day to come but takes it as a forecast', async () => {
    const future = gridTiff({ bands: [{ date: '2099-07-01', value: flat(1) }] });
    const refused = await upload([['future-q850.tif', future]]);
    expect(refused.problems[0]).toMatchObject({
      where: 'band 1',
      problem: expect.stringMatching(/is in the future: .* product "forecast"/),
    });
    const taken = await upload([['future-q850.tif', future]], { product: 'forecast' });
    expect(taken.state).toBe('done');
  });
});
