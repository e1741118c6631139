import type { OutlookBlock, OutlookResponse } from '@stormhour/shared';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { dayOfDate, HOUR_MS, localMidnightUtc } from '../radar/engine/local-time.js';
import { loadDemoSeason } from '../testing/demo-season.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;

describe('GET /api/outlook on the demo season', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let writer: { Authorization: string };
  let siteId: number;
  let all: OutlookResponse;

  beforeAll(async () => {
    t = await createTestApp({ uploadLimitBytes: 20 * 1024 * 1024 });
    ({ siteId, scientist: auth } = await loadDemoSeason(t));
    writer = { Authorization: `Bearer ${await t.signedIn('writer')}` };
    all = (await t.http.get(`/api/outlook?siteId=${siteId}`).set(writer).expect(200)).body;
  }, 240_000);
  afterAll(() => t.close());

  const district = (o: OutlookResponse, code: string) => o.blocks.filter((b) => b.districtCode === code);
  const afternoon = (bs: OutlookBlock[]) => mean(bs.map((b) => b.afternoon.rate as number));

  it('counts the cell table over the season, every demo block inside coverage, with n beside every rate', () => {
    expect(all).toMatchObject({ source: 'cell-table', measure: 'onsets', regime: 'all', binHours: 3 });
    expect(all.from).toBe('2025-06-01');
    expect(all.to).toBe('2025-09-30');
    expect(all.daysInPeriod).toBe(122);
    expect(all.blocks).toHaveLength(31);
    expect(all.bins.map((b) => b.label)).toEqual([
      '00–03',
      '03–06',
      '06–09',
      '09–12',
      '12–15',
      '15–18',
      '18–21',
      '21–24',
    ]);
    for (const b of all.blocks) {
      expect(b.hasData).toBe(true);
      for (const f of b.bins) {
        // The season's outages (a 5–8 h gap and short ones) take days out of some bins: n ≤ 122.
        expect(f.n).toBeGreaterThan(100);
        expect(f.n).toBeLessThanOrEqual(122);
        expect(f.rate).toBeCloseTo((f.x as number) / (f.n as number), 5);
        expect(f.lower as number).toBeLessThanOrEqual(f.rate as number);
        expect(f.upper as number).toBeGreaterThanOrEqual(f.rate as number);
      }
    }
    // The long outage starts 10:30–12:30 local: some bin around midday has fewer days than the night bins.
    expect(Math.min(...all.blocks[0].bins.map((f) => f.n as number))).toBeLessThan(
      all.blocks[0].bins[0].n as number,
    );
  });

  it('gives hill blocks a higher afternoon chance than valley blocks (the generator triggers storms over the hills)', () => {
    const hills = afternoon([...district(all, 'HLF'), ...district(all, 'UPL')]);
    const valley = afternoon([...district(all, 'RVB'), ...district(all, 'LKS')]);
    expect(hills).toBeGreaterThan(valley);
    expect(afternoon(district(all, 'HLF'))).toBeGreaterThan(afternoon(district(all, 'RVB')));
  });

  it('peaks in the afternoon', () => {
    const pooled = all.priors.bins.map((p) => p.mean as number);
    const peak = pooled.indexOf(Math.max(...pooled));
    expect(all.bins[peak].fromHour).toBeGreaterThanOrEqual(12);
    expect(all.bins[peak].toHour).toBeLessThanOrEqual(18);
    for (const b of district(all, 'HLF')) expect([4, 5]).toContain(b.peakBin);
  });

  it('gives moist regimes a higher afternoon chance than dry ones, beside the all-days climatology', async () => {
    const byMoisture: Record<string, { rate: number; days: number }[]> = { moist: [], dry: [] };
    for (const { regime, days } of all.regimes) {
      const moisture = regime.split(' / ')[0];
      if (!(moisture in byMoisture)) continue;
      const res = await t.http.get('/api/outlook').query({ siteId, regime }).set(auth).expect(200);
      const o = res.body as OutlookResponse;
      expect(o.regimeDays).toBe(days);
      expect(o.blocks[0].climatologyRate).toBe(all.blocks[0].afternoon.rate);
      byMoisture[moisture].push({ rate: afternoon(o.blocks), days });
    }
    const weighted = (xs: { rate: number; days: number }[]) =>
      xs.reduce((s, x) => s + x.rate * x.days, 0) / xs.reduce((s, x) => s + x.days, 0);
    expect(weighted(byMoisture.moist)).toBeGreaterThan(weighted(byMoisture.dry));
  }, 60_000);

  it('gives the weekly chance from the record’s windows, at least the daily chance', () => {
    for (const b of all.blocks) {
      expect(b.week.windows).toBe((b.afternoon.n as number) - 6);
      expect(b.week.rate as number).toBeGreaterThanOrEqual(b.afternoon.rate as number);
    }
  });

  it('lists the onsets of every stored source, most first, as a plain count in the database gives them', async () => {
    const counted = await t.db.pg.query<{ source: string; onsets: number }>(
      `select source, count(*)::int as onsets from tracks where site_id = $1 and onset
       group by source order by onsets desc, source`,
      [siteId],
    );
    expect(counted.rows.length).toBeGreaterThan(0);
    expect(all.sources).toEqual(counted.rows);
    // A source with nothing stored counts nothing (not the cell table's onsets).
    const volume: OutlookResponse = (
      await t.http.get('/api/outlook').query({ siteId, source: 'volume' }).set(auth).expect(200)
    ).body;
    expect(volume.source).toBe('volume');
    expect(volume.blocks.every((b) => b.afternoon.x === 0)).toBe(true);
    expect(all.blocks.some((b) => (b.afternoon.x ?? 0) > 0)).toBe(true);
  });

  it('counts more with presence than with onsets, and more with a neighbourhood radius', async () => {
    const presence: OutlookResponse = (
      await t.http.get('/api/outlook').query({ siteId, measure: 'presence' }).set(auth).expect(200)
    ).body;
    const wide: OutlookResponse = (
      await t.http.get('/api/outlook').query({ siteId, radiusKm: 10 }).set(auth).expect(200)
    ).body;
    all.blocks.forEach((b, i) => {
      expect(presence.blocks[i].afternoon.x as number).toBeGreaterThanOrEqual(b.afternoon.x as number);
      expect(wide.blocks[i].afternoon.x as number).toBeGreaterThanOrEqual(b.afternoon.x as number);
    });
    expect(afternoon(wide.blocks)).toBeGreaterThan(afternoon(all.blocks));
  }, 60_000);

  it('sends an unchanged outlook as 304 to a client holding it, and compressed to one that accepts gzip', async () => {
    const plain = await t.http
      .get('/api/outlook')
      .query({ siteId })
      .set(auth)
      .set('Accept-Encoding', 'identity');
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body).toEqual(all);
    const etag = plain.headers.etag;
    expect(etag).toMatch(/^"/);
    // RFC 9110 §13.1.2: a matching If-None-Match on a GET gets 304 Not Modified, no body.
    const again = await t.http.get('/api/outlook').query({ siteId }).set(auth).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    expect(again.text ?? '').toBe('');
    const stale = await t.http
      .get('/api/outlook')
      .query({ siteId })
      .set(auth)
      .set('If-None-Match', '"other"');
    expect(stale.status).toBe(200);
    const zipped = await t.http
      .get('/api/outlook')
      .query({ siteId })
      .set(auth)
      .set('Accept-Encoding', 'gzip');
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(Number(zipped.headers['content-length'])).toBeLessThan(Number(plain.headers['content-length']));
    expect(zipped.body).toEqual(all);
  });

  it('answers the same from its cache as when computed, and computes afresh after a settings change', async () => {
    const first = await t.http.get('/api/outlook').query({ siteId, binHours: 1 }).set(auth).expect(200);
    const cached = await t.http.get('/api/outlook').query({ siteId, binHours: 1 }).set(auth).expect(200);
    expect(cached.body).toEqual(first.body);
    expect(cached.headers.etag).toBe(first.headers.etag);
    expect(first.body.bins).toHaveLength(24);
    await t.http
      .patch(`/api/radar-sites/${siteId}`)
      .set(auth)
      .send({ settings: { minAvailability: 1 } })
      .expect(200);
    const after = await t.http.get('/api/outlook').query({ siteId, binHours: 1 }).set(auth).expect(200);
    expect(after.body.minAvailability).toBe(1);
    const n = (o: OutlookResponse) => o.blocks[0].bins.reduce((s, f) => s + (f.n as number), 0);
    expect(n(after.body)).toBeLessThan(n(first.body));
    await t.http
      .patch(`/api/radar-sites/${siteId}`)
      .set(auth)
      .send({ settings: { minAvailability: 0.8 } })
      .expect(200);
  });

  it('gives new numbers at the next request after scans are removed, and the old ones once they are back', async () => {
    const get = async () => (await t.http.get('/api/outlook').query({ siteId }).set(auth).expect(200)).body;
    const before: OutlookResponse = await get();
    // Every scan of 10 June 12:00–15:00 local (bin 4) goes: that day no longer counts in that bin.
    const from = localMidnightUtc(dayOfDate('2025-06-10'), before.utcOffsetMinutes) + 12 * HOUR_MS;
    const window = [siteId, new Date(from).toISOString(), new Date(from + 3 * HOUR_MS).toISOString()];
    const { rows: site } = await t.db.pg.query<{ interval_min: number }>(
      'select interval_min from radar_sites where id = $1',
      [siteId],
    );
    const removed = await t.db.pg.query<{ source: string; time: Date; upload_id: number | null }>(
      'delete from scans where site_id = $1 and time >= $2 and time < $3 returning source, time, upload_id',
      window,
    );
    // The day counted in that bin before (at least 80 % of the expected scans: DESIGN §3.5).
    const distinct = new Set(removed.rows.map((r) => r.time.getTime())).size;
    expect(distinct).toBeGreaterThanOrEqual((0.8 * 3 * 60) / site[0].interval_min);
    const after: OutlookResponse = await get();
    expect(after.blocks[0].bins[4].n).toBe((before.blocks[0].bins[4].n as number) - 1);
    expect(after.blocks[0].bins[0].n).toBe(before.blocks[0].bins[0].n);

    const restore = () =>
      t.db.pg.query(
        `insert into scans (site_id, source, time, upload_id)
         select $1, u.source, u.time, u.upload_id from unnest($2::text[], $3::timestamptz[], $4::int[]) as u(source, time, upload_id)`,
        [
          siteId,
          removed.rows.map((r) => r.source),
          removed.rows.map((r) => r.time.toISOString()),
          removed.rows.map((r) => r.upload_id),
        ],
      );
    await restore();
    expect(await get()).toEqual(before);

    // A write this process's counter cannot see (a SELECT calling a function that deletes) is seen once
    // the database's own write mark is checked again, at most a second later.
    vi.useFakeTimers({ toFake: ['Date'] });
    try {
      await get();
      await t.db.pg.query(
        `create function outlook_spec_remove(p_site int, p_from timestamptz, p_to timestamptz) returns void
         language sql as 'delete from scans where site_id = p_site and time >= p_from and time < p_to'`,
      );
      await get();
      await t.db.pg.query('select outlook_spec_remove($1, $2, $3)', window);
      vi.advanceTimersByTime(1001);
      expect((await get()).blocks[0].bins[4].n).toBe((before.blocks[0].bins[4].n as number) - 1);
    } finally {
      vi.useRealTimers();
    }
    await restore();
    expect(await get()).toEqual(before);
  });

  it('exports the table as CSV, one row per block and bin', async () => {
    const res = await t.http.get('/api/outlook.csv').query({ siteId }).set(writer).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/outlook-VSR-all-days\.csv/);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    expect(parsed.data).toHaveLength(31 * 8);
    const row = parsed.data.find((r) => r.block_code === all.blocks[0].code && r.bin_local === '12–15');
    expect(Number(row?.n)).toBe(all.blocks[0].bins[4].n);
    expect(Number(row?.x)).toBe(all.blocks[0].bins[4].x);
  });

  it('names the field that is wrong, and answers 404 for an unknown site', async () => {
    const bad = await t.http
      .get('/api/outlook')
      .query({ siteId, binHours: 5, measure: 'rain' })
      .set(auth)
      .expect(400);
    expect(bad.body.details.map((d: { where: string }) => d.where).sort()).toEqual(['binHours', 'measure']);
    const window = await t.http
      .get('/api/outlook')
      .query({ siteId, afternoonFrom: 18, afternoonTo: 12 })
      .set(auth)
      .expect(400);
    expect(window.body.details[0].where).toBe('afternoonTo');
    const regime = await t.http
      .get('/api/outlook')
      .query({ siteId, regime: 'soggy / sideways' })
      .set(auth)
      .expect(400);
    expect(regime.body.details[0].where).toBe('regime');
    await t.http.get('/api/outlook').query({ siteId: 99999 }).set(auth).expect(404);
  });
});
