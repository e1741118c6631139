import type {
  AtlasDistributionsResponse,
  AtlasDiurnalResponse,
  AtlasMapResponse,
  AtlasMotionResponse,
  AtlasTimeDistanceResponse,
} from '@stormhour/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadDemoSeason } from '../testing/demo-season.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';

/** Ring centroid in lon/lat (shoelace), good enough to say which part of the province a band covers. */
function largestRingCentroid(coordinates: number[][][][]): { lon: number; lat: number; area: number } {
  let best = { lon: 0, lat: 0, area: 0 };
  for (const polygon of coordinates) {
    const ring = polygon[0];
    let a = 0;
    let cx = 0;
    let cy = 0;
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const cross = ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
      a += cross;
      cx += (ring[j][0] + ring[i][0]) * cross;
      cy += (ring[j][1] + ring[i][1]) * cross;
    }
    if (Math.abs(a) > best.area) best = { lon: cx / (3 * a), lat: cy / (3 * a), area: Math.abs(a) / 2 };
  }
  return best;
}

describe('Atlas on the demo season', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let siteId: number;
  const q = () => `siteId=${siteId}`;

  beforeAll(async () => {
    t = await createTestApp({ uploadLimitBytes: 20 * 1024 * 1024 });
    ({ siteId, scientist: auth } = await loadDemoSeason(t));
  }, 240_000);
  afterAll(() => t.close());

  it('peaks in the afternoon (local 13–16), the hour the generator built in', async () => {
    const res = await t.http.get(`/api/atlas/diurnal?${q()}`).set(auth).expect(200);
    const body = res.body as AtlasDiurnalResponse;
    expect(body.scope.source).toBe('cell-table');
    expect(body.scope.onsetsBySource).toEqual([{ source: 'cell-table', onsets: body.onsets[0].n }]);
    const all = body.onsets.find((c) => c.group === 'all');
    // sample-data/README.md: 3 546 onsets over the season, peak hour 14:00–15:00 local.
    expect(all?.n).toBe(3546);
    expect(all?.peakHour).toBeGreaterThanOrEqual(13);
    expect(all?.peakHour).toBeLessThanOrEqual(16);
    expect(body.scope.days).toBe(122);
    const area = body.properties.find((p) => p.property === 'areaKm2');
    expect(area?.curves[0].n).toBe(body.cells);
    expect(body.cells).toBeGreaterThan(30_000);
  });

  it('has denser onsets over the hills than over the valley, and bands that integrate to the onsets', async () => {
    const res = await t.http.get(`/api/atlas/map?${q()}&bandwidthKm=15`).set(auth).expect(200);
    const body = res.body as AtlasMapResponse;
    expect(body.density.unit).toBe('onsets per 1000 km² per day');
    expect(body.points).toHaveLength(3546);
    // Onsets near the range ring lose part of their kernel beyond the grid; only a little.
    expect(body.density.integral / 3546).toBeGreaterThan(0.97);
    expect(body.density.integral / 3546).toBeLessThanOrEqual(1.000001);
    const top = body.density.bands.at(-1);
    if (!top) throw new Error('no bands');
    // sample-data/README.md: the hill range's crest is near 13.55° N, south of the valley (radar 14.18° N).
    const where = largestRingCentroid(top.geometry.coordinates);
    expect(where.lat).toBeLessThan(14.0);

    const districts = (await t.http.get('/api/districts').set(auth).expect(200)).body as {
      id: number;
      code: string;
    }[];
    const blocks = (await t.http.get('/api/blocks').set(auth).expect(200)).body as {
      districtId: number;
      areaKm2: number;
    }[];
    const perArea = async (code: string) => {
      const id = districts.find((d) => d.code === code)?.id as number;
      const area = blocks.filter((b) => b.districtId === id).reduce((s, b) => s + b.areaKm2, 0);
      const m = (await t.http.get(`/api/atlas/map?${q()}&districtId=${id}`).set(auth).expect(200))
        .body as AtlasMapResponse;
      return m.points.length / area;
    };
    // Hillfoot (the hill range) against Riverbend (the western valley).
    expect(await perArea('HLF')).toBeGreaterThan(2 * (await perArea('RVB')));
  });

  it('keeps only the chosen bin of local time', async () => {
    const res = await t.http.get(`/api/atlas/map?${q()}&binHours=3&bin=4`).set(auth).expect(200);
    const body = res.body as AtlasMapResponse;
    expect(body.hours).toEqual([12, 15]);
    expect(body.points.length).toBeGreaterThan(0);
    for (const p of body.points) {
      expect(p.localHour).toBeGreaterThanOrEqual(12);
      expect(p.localHour).toBeLessThan(15);
    }
  });

  it('shows storms moving toward the north-west, and the regime’s anomaly wind', async () => {
    const res = await t.http.get(`/api/atlas/motion?${q()}`).set(auth).expect(200);
    const body = res.body as AtlasMotionResponse;
    // sample-data/README.md: motion toward 312° plus noise; storms drift north-west.
    expect(['NW', 'NNW', 'WNW']).toContain(body.modeSector);
    expect(body.sectors.reduce((n, s) => n + s.total, 0)).toBe(body.withMotion);
    expect(body.anomalyWind?.days).toBe(122);
    const regime = body.scope.regimes[0].regime;
    const one = (
      await t.http
        .get(`/api/atlas/motion?${q()}&regime=${encodeURIComponent(regime)}`)
        .set(auth)
        .expect(200)
    ).body as AtlasMotionResponse;
    expect(one.anomalyWind?.days).toBe(body.scope.regimes[0].days);
    expect(one.scope.days).toBe(body.scope.regimes[0].days);
    expect(one.withMotion).toBeLessThan(body.withMotion);
  });

  it('fits log-normals to area, duration and 35 dBZ top', async () => {
    const res = await t.http.get(`/api/atlas/distributions?${q()}&cellType=congestus`).set(auth).expect(200);
    const body = res.body as AtlasDistributionsResponse;
    const area = body.distributions.find((d) => d.variable === 'areaKm2');
    expect(area?.fit?.criticalMethod).toBe('asymptotic');
    expect(area?.histogram.counts.reduce((a, b) => a + b, 0)).toBe(area?.n);
    // sample-data/README.md: storm duration median 42 min; the fitted median should be near it.
    const duration = body.distributions.find((d) => d.variable === 'durationMin');
    expect(duration?.fit?.median).toBeGreaterThan(30);
    expect(duration?.fit?.median).toBeLessThan(60);
  });

  it('draws onsets against local time and distance along the default axis', async () => {
    const res = await t.http.get(`/api/atlas/time-distance?${q()}&halfWidthKm=60`).set(auth).expect(200);
    const body = res.body as AtlasTimeDistanceResponse;
    expect(body.axis.lengthKm).toBeCloseTo(288, -1);
    const total = body.counts.flat().reduce((a, b) => a + b, 0);
    expect(total).toBe(body.inCorridor);
    expect(body.perDay[0][0]).toBeCloseTo(body.counts[0][0] / body.scope.days, 12);
  });

  it('says what is wrong with a bad filter', async () => {
    const bad = await t.http
      .get(`/api/atlas/map?${q()}&binHours=5&cellType=huge&from=2025-07-02&to=2025-07-01`)
      .set(auth)
      .expect(400);
    const where = bad.body.details.map((d: { where: string }) => d.where);
    expect(where).toEqual(expect.arrayContaining(['binHours', 'cellType']));
    const regime = await t.http.get(`/api/atlas/diurnal?${q()}&regime=nowhere`).set(auth).expect(400);
    expect(regime.body.message).toMatch(/No day in the period has the regime "nowhere"/);
    const axis = await t.http
      .get(`/api/atlas/time-distance?${q()}&fromLat=14&fromLon=88&toLat=14&toLon=88`)
      .set(auth)
      .expect(400);
    expect(axis.body.details[0]).toMatchObject({
      where: 'toLat',
      problem: 'The axis needs two different points',
    });
  });
});
