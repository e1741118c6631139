import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobsService } from '../jobs/jobs.service.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';

const demo = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
const site = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));
const grids = readdirSync(demo).filter((f) => /^anomalies-.*\.tif$/.test(f));
const cells = readdirSync(demo).find((f) => f.startsWith('cells-')) as string;
const scans = readdirSync(demo).find((f) => f.startsWith('scans-')) as string;

describe('anomaly intake and regimes', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let siteId: number;
  beforeAll(async () => {
    t = await createTestApp({ uploadLimitBytes: 20 * 1024 * 1024 });
    auth = { Authorization: `Bearer ${await t.signedIn('scientist')}` };
    siteId = (await t.http.post('/api/radar-sites').set(auth).send(site.createSiteRequest).expect(201)).body
      .id;
  });
  afterAll(() => t.close());

  async function upload(kind: string, names: string[], fields: Record<string, string> = {}) {
    const req = t.http.post('/api/intake').set(auth).field('siteId', String(siteId)).field('kind', kind);
    for (const [k, v] of Object.entries(fields)) req.field(k, v);
    for (const n of names) req.attach('files[]', readFileSync(join(demo, n)), n);
    const res = await req.expect(202);
    await t.app.get(JobsService).idle();
    return (await t.http.get(`/api/jobs/${res.body.id}`).set(auth).expect(200)).body;
  }

  it('takes the demo anomaly grids in, one field per day', async () => {
    const job = await upload('anomaly-grid', grids);
    expect(job.state).toBe('done');
    expect(job.files.map((f: { state: string }) => f.state)).toEqual(['imported', 'imported', 'imported']);
    expect(job.summary).toMatch(/q at 850 hPa, 122 days 2025-06-01–2025-09-30, already in g\/kg/);
  });

  it('gives every day its domain means and regime, with terciles splitting the days in three', async () => {
    const res = await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth).expect(200);
    expect(res.body.days).toHaveLength(122);
    const day = res.body.days[0];
    expect(day).toMatchObject({ date: '2025-06-01', coverage: 1 });
    expect(day.regime).toBe(`${day.moisture} / ${day.flow}`);
    const byMoisture = (m: string) =>
      res.body.days.filter((d: { moisture: string }) => d.moisture === m).length;
    // Terciles of 122 days: about 41 each (ties aside).
    for (const m of ['dry', 'near-normal', 'moist'])
      expect(Math.abs(byMoisture(m) - 122 / 3)).toBeLessThanOrEqual(2);
    const [lo, hi] = res.body.moistureBoundsGKg;
    expect(lo).toBeLessThan(hi);
    expect(res.body.counts.reduce((n: number, c: { days: number }) => n + c.days, 0)).toBe(122);
  });

  it('finds moist the days the demo generator made moist (agreement at least 90 %)', async () => {
    const res = await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth).expect(200);
    // The generator's own domain-mean q′ per day, classed by its terciles (type 7, as numpy).
    const made: { date: string; qAnomalyGKg: number }[] = JSON.parse(
      readFileSync(join(demo, 'scenario.json'), 'utf8'),
    ).daily;
    const sorted = made.map((d) => d.qAnomalyGKg).sort((a, b) => a - b);
    const upperTercile = sorted[Math.floor((sorted.length - 1) * (2 / 3))];
    const madeMoist = new Set(made.filter((d) => d.qAnomalyGKg > upperTercile).map((d) => d.date));
    const ours = res.body.days as { date: string; moisture: string }[];
    const agree = ours.filter((d) => (d.moisture === 'moist') === madeMoist.has(d.date)).length;
    console.log(`moist-day agreement with the generator: ${agree}/${ours.length}`);
    expect(agree / ours.length).toBeGreaterThanOrEqual(0.9);
  });

  it('classifies the demo forecast week, kept apart from the season, as the moist onshore spell it was made', async () => {
    const forecasts = readdirSync(demo).filter((f) => /^forecast-.*\.tif$/.test(f));
    expect(forecasts).toHaveLength(3);
    const job = await upload('anomaly-grid', forecasts, { product: 'forecast' });
    expect(job.state).toBe('done');
    const season = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth).expect(200)).body;
    expect(season.days).toHaveLength(122);
    const res = await t.http
      .get(`/api/regimes/expected?siteId=${siteId}&from=2025-10-01&to=2025-10-07`)
      .set(auth)
      .expect(200);
    expect(res.body.days).toHaveLength(7);
    expect(res.body.moistureBoundsGKg).toEqual(season.moistureBoundsGKg);
    // The generator made a moist south-easterly spell (sample-data FORECAST_WEEK).
    expect(res.body.regime).toBe('moist / onshore');
  });

  it('shows, on the demo season, more storm onsets on moist days than on dry days', async () => {
    await upload('scan-inventory', [scans]);
    await upload('cell-table', [cells]);
    const regimes = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth)).body.days as {
      date: string;
      moisture: string;
    }[];
    const tracks = (
      await t.http.get(`/api/tracks?siteId=${siteId}&onsetOnly=true&limit=1000&offset=0`).set(auth)
    ).body;
    const all: { firstTime: string }[] = [...tracks.items];
    for (let offset = 1000; offset < tracks.total; offset += 1000)
      all.push(
        ...(
          await t.http
            .get(`/api/tracks?siteId=${siteId}&onsetOnly=true&limit=1000&offset=${offset}`)
            .set(auth)
        ).body.items,
      );
    const localDate = (iso: string) => new Date(Date.parse(iso) + 6 * 3_600_000).toISOString().slice(0, 10);
    const moistureOf = new Map(regimes.map((d) => [d.date, d.moisture]));
    const perDay = (m: string) => {
      const days = regimes.filter((d) => d.moisture === m).length;
      return all.filter((x) => moistureOf.get(localDate(x.firstTime)) === m).length / days;
    };
    console.log(`onsets per day: dry ${perDay('dry').toFixed(1)}, moist ${perDay('moist').toFixed(1)}`);
    expect(perDay('moist')).toBeGreaterThan(2 * perDay('dry'));
    // Loads and tracks the whole season's cell table: give it room on a busy 2-core machine.
  }, 180_000);

  it('composites a regime cell by cell and refuses one with no days', async () => {
    const { counts } = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth)).body;
    const top = counts[0];
    const comp = await t.http
      .get(`/api/regimes/composite?siteId=${siteId}&regime=${encodeURIComponent(top.regime)}`)
      .set(auth)
      .expect(200);
    expect(comp.body.days).toBe(top.days);
    expect(comp.body.q).toHaveLength(comp.body.lats.length);
    expect(comp.body.q[0]).toHaveLength(comp.body.lons.length);
    const none = await t.http
      .get(`/api/regimes/composite?siteId=${siteId}&regime=nowhere`)
      .set(auth)
      .expect(400);
    expect(none.body.message).toMatch(/No day in the period has the regime "nowhere"/);
  });

  it('versions the regime settings and uses fixed bounds when asked', async () => {
    const put = await t.http
      .put(`/api/regimes/settings?siteId=${siteId}`)
      .set(auth)
      .send({ moistureMethod: 'fixed', fixedBoundsGKg: [-0.2, 0.2] })
      .expect(200);
    expect(put.body.version).toBe(1);
    const res = await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth).expect(200);
    expect(res.body.moistureBoundsGKg).toEqual([-0.2, 0.2]);
    const bad = await t.http
      .put(`/api/regimes/settings?siteId=${siteId}`)
      .set(auth)
      .send({ fixedBoundsGKg: [1, 0] })
      .expect(400);
    expect(bad.body.details[0]).toMatchObject({
      where: 'fixedBoundsGKg',
      problem: 'The dry bound must be below the moist bound',
    });
  });

  it('refuses a GeoTIFF that does not say which field it holds', async () => {
    const res = await t.http
      .post('/api/intake')
      .set(auth)
      .field('siteId', String(siteId))
      .field('kind', 'anomaly-grid')
      .attach('files[]', readFileSync(join(demo, 'terrain.tif')), 'terrain.tif')
      .expect(202);
    await t.app.get(JobsService).idle();
    const j = (await t.http.get(`/api/jobs/${res.body.id}`).set(auth)).body;
    expect(j.problems[0]).toMatchObject({ file: 'terrain.tif', where: 'metadata VARIABLE' });
  });

  it('takes the same anomalies as long-form CSV and classifies the days alike', async () => {
    const before = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth)).body.days as {
      regime: string;
    }[];
    const csv = readdirSync(demo).find((f) => /^anomalies-.*\.csv$/.test(f)) as string;
    const job = await upload('anomaly-grid', [csv]);
    expect(job.state).toBe('done');
    expect(job.summary).toMatch(/q at 850 hPa, 122 days/);
    const after = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth)).body.days as {
      regime: string;
    }[];
    // The CSV rounds to 3 decimals: a day on a class boundary may move, hardly any more.
    const same = after.filter((d, i) => d.regime === before[i].regime).length;
    expect(same).toBeGreaterThanOrEqual(118);
  });

  it('takes a CSV with its own column names, variable names and dates through a column mapping', async () => {
    const csv = readdirSync(demo).find((f) => /^anomalies-.*\.csv$/.test(f)) as string;
    const firstDay = readFileSync(join(demo, csv), 'utf8')
      .split('\n')
      .filter((line) => line.startsWith('2025-06-01,') && line.includes(',q,'))
      .map((line) => {
        const [date, lat, lon, , level, value] = line.split(',');
        return [date.replaceAll('-', ''), lat, lon, 'shum', level, value].join(';');
      });
    const text = ['Valid Day;Latitude;Longitude;Param;Level;Anom', ...firstDay].join('\n');
    const mapping = {
      columns: {
        date: 'Valid Day',
        lat: 'Latitude',
        lon: 'Longitude',
        variable: 'Param',
        level_hpa: 'Level',
        value: 'Anom',
      },
      variableNames: { q: 'shum' },
      dateFormat: 'YYYYMMDD',
    };
    const send = (m: unknown) =>
      t.http
        .post('/api/intake')
        .set(auth)
        .field('siteId', String(siteId))
        .field('kind', 'anomaly-grid')
        .field('mapping', JSON.stringify(m))
        .attach('files[]', Buffer.from(text), 'their-q850.csv');
    const refused = await send({ ...mapping, dateFormat: 'DD.MM.YY' }).expect(400);
    expect(refused.body.details[0].where).toBe('mapping.dateFormat');
    const res = await send(mapping).expect(202);
    await t.app.get(JobsService).idle();
    const job = (await t.http.get(`/api/jobs/${res.body.id}`).set(auth)).body;
    expect(job.state).toBe('done');
    expect(job.summary).toMatch(/q at 850 hPa, 1 day/);
  });

  it('averages over a district’s blocks when one is named', async () => {
    const admin = { Authorization: `Bearer ${await t.signedIn('admin')}` };
    await t.http
      .post('/api/blocks/import')
      .set(admin)
      .attach('file', join(demo, 'blocks.geojson'))
      .expect(201);
    const districts = (await t.http.get('/api/districts').set(auth)).body as { id: number; code: string }[];
    const hillfoot = districts.find((d) => d.code === 'HLF') as { id: number };
    const whole = (await t.http.get(`/api/regimes?siteId=${siteId}`).set(auth)).body.days as { q: number }[];
    const part = (
      await t.http.get(`/api/regimes?siteId=${siteId}&districtId=${hillfoot.id}`).set(auth).expect(200)
    ).body.days as { q: number; coverage: number }[];
    expect(part).toHaveLength(122);
    expect(part[0].coverage).toBe(1);
    expect(part.some((d, i) => Math.abs(d.q - whole[i].q) > 1e-6)).toBe(true);
    const empty = await t.http
      .post('/api/districts')
      .set(admin)
      .send({ code: 'EMP', name: 'Empty' })
      .expect(201);
    const res = await t.http
      .get(`/api/regimes?siteId=${siteId}&districtId=${empty.body.id}`)
      .set(auth)
      .expect(400);
    expect(res.body.message).toMatch(/has no blocks to average over/);
  });
});
