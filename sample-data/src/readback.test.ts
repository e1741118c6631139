import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { fromArrayBuffer, type GeoTIFFImage } from 'geotiff';
import Papa from 'papaparse';
import proj4 from 'proj4';
import { beforeAll, describe, expect, it } from 'vitest';
import { ANOMALY_GRID, SEASON_DAYS, SITE, TERRAIN_GRID } from './config.js';
import {
  bandOf,
  CELL_COLUMNS,
  gdalItems,
  readAnomalyCsv,
  readCellTable,
  readScanInventory,
  readTiff,
  readTruthCells,
} from './readers.js';
import { localMidnightUtcMs, SCAN_MS } from './times.js';

const dir = new URL('../vessary/', import.meta.url);
const path = (p: string) => fileURLToPath(new URL(p, dir));
const text = (p: string) => readFileSync(path(p), 'utf8');
const bytes = (p: string) => new Uint8Array(readFileSync(path(p)));
const scenario = JSON.parse(text('scenario.json'));
const run = JSON.parse(text(`${scenario.radarRun.directory}/run.json`));
const runPath = (f: string) => `${scenario.radarRun.directory}/${f}`;

async function openTiff(p: string): Promise<GeoTIFFImage> {
  const b = readFileSync(path(p));
  const tiff = await fromArrayBuffer(b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength));
  return tiff.getImage();
}

describe('site.json', () => {
  const site = JSON.parse(text('site.json'));
  it('describes the radar with the project defaults', () => {
    expect(site).toMatchObject({
      schemaVersion: 1,
      siteCode: 'VSR',
      location: { lat: SITE.lat, lon: SITE.lon },
      altitudeM: 240,
      rangeKm: 180,
      scanIntervalMin: 6,
      utcOffset: '+06:00',
      identification: {
        thresholdDbz: 35,
        minVolumeKm3: 15,
        minAreaKm2For2d: 5,
        echoTopThresholdDbz: 0,
        connectivity3d: 26,
        connectivity2d: 8,
        zrA: 200,
        zrB: 1.6,
        vilCapDbz: 56,
      },
      tracking: { maxSpeedMS: 30, maxGapFactor: 2.5, maxGapMin: 15, minScans: 2, edgeBandKm: 10 },
      cellTypes: { shallowBelowKm: 4, deepFromKm: 9, heightUsed: 'echoTop' },
    });
    expect(site.levelHeightsKm).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15]);
    expect(site.grid.proj4).toBe(
      `+proj=aeqd +lat_0=${SITE.lat} +lon_0=${SITE.lon} +datum=WGS84 +units=m +no_defs`,
    );
  });
  it('places the radar in the valley, on terrain close to its altitude', async () => {
    const img = await openTiff('terrain.tif');
    const [r] = (await img.readRasters()) as unknown as Int16Array[];
    const i = Math.floor((SITE.lon - TERRAIN_GRID.west) / TERRAIN_GRID.step);
    const j = Math.floor((TERRAIN_GRID.north - SITE.lat) / TERRAIN_GRID.step);
    expect(Math.abs(r[j * img.getWidth() + i] - 240)).toBeLessThan(15);
  });
});

describe('terrain.tif', () => {
  it('reads with geotiff: EPSG:4326, bounds, one Int16 band, no nodata gaps', async () => {
    const img = await openTiff('terrain.tif');
    const keys = img.getGeoKeys();
    expect(keys?.GeographicTypeGeoKey).toBe(4326);
    expect(keys?.GTModelTypeGeoKey).toBe(2);
    expect(keys?.GTRasterTypeGeoKey).toBe(1);
    expect(img.getSamplesPerPixel()).toBe(1);
    const bb = img.getBoundingBox();
    expect(bb.map((v) => Math.round(v * 1e6) / 1e6)).toEqual([
      TERRAIN_GRID.west,
      TERRAIN_GRID.south,
      TERRAIN_GRID.east,
      TERRAIN_GRID.north,
    ]);
    const [r] = (await img.readRasters()) as unknown as Int16Array[];
    expect(r).toBeInstanceOf(Int16Array);
    const own = readTiff(bytes('terrain.tif'));
    expect(Array.from(own.data)).toEqual(Array.from(r));
    expect((await img.getGDALMetadata())?.UNITS).toBe('m');
  });

  it('has the valley, the 600–900 m hill range south of it, and the flat lake', async () => {
    const img = await openTiff('terrain.tif');
    const [r] = (await img.readRasters()) as unknown as Int16Array[];
    const w = img.getWidth();
    const at = (lon: number, lat: number) =>
      r[
        Math.floor((TERRAIN_GRID.north - lat) / TERRAIN_GRID.step) * w +
          Math.floor((lon - TERRAIN_GRID.west) / TERRAIN_GRID.step)
      ];
    // crest of the range along the province, south of the valley
    const crests: number[] = [];
    for (let lon = 86.8; lon <= 89.2; lon += 0.1) {
      let best = 0;
      for (let lat = 13.0; lat <= 14.0; lat += 0.01) best = Math.max(best, at(lon, lat));
      crests.push(best);
      let valley = 9999;
      for (let lat = 14.0; lat <= 14.5; lat += 0.01) valley = Math.min(valley, at(lon, lat));
      expect(valley).toBeLessThan(270);
    }
    expect(Math.min(...crests)).toBeGreaterThanOrEqual(560);
    expect(Math.max(...crests)).toBeLessThanOrEqual(940);
    expect(crests.filter((c) => c >= 600 && c <= 900).length / crests.length).toBeGreaterThan(0.85);
    // the lake: flat water surface in the valley's east
    const lake = JSON.parse(text('lake.geojson')).features[0];
    const [lon0, lat0] = lake.geometry.coordinates[0].reduce(
      (s: number[], p: number[], _: number, a: number[][]) => [
        s[0] + p[0] / a.length,
        s[1] + p[1] / a.length,
      ],
      [0, 0],
    );
    expect(lon0).toBeGreaterThan(88.5);
    expect(at(lon0, lat0)).toBe(228);
  });
});

describe('anomalies', () => {
  const csv = text('anomalies-2025.csv');
  const own = readAnomalyCsv(csv);
  const parsed = Papa.parse<Record<string, unknown>>(csv, {
    header: true,
    dynamicTyping: false,
    skipEmptyLines: true,
  });
  const nx = Math.round((ANOMALY_GRID.east - ANOMALY_GRID.west) / ANOMALY_GRID.step) + 1;
  const ny = Math.round((ANOMALY_GRID.north - ANOMALY_GRID.south) / ANOMALY_GRID.step) + 1;

  it('long-form CSV reads the same with papaparse and our reader', () => {
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual(['date', 'lat', 'lon', 'variable', 'level_hpa', 'value']);
    expect(parsed.data.length).toBe(own.length);
    expect(own.length).toBe(SEASON_DAYS * 3 * nx * ny);
    for (let i = 0; i < own.length; i += 997) {
      expect(Number(parsed.data[i].value)).toBe(own[i].value);
      expect(parsed.data[i].date).toBe(own[i].date);
    }
    expect(own.every((r) => Number.isFinite(r.value) && r.levelHpa === 850)).toBe(true);
    expect(new Set(own.map((r) => r.variable))).toEqual(new Set(['q', 'u', 'v']));
    const dates = [...new Set(own.map((r) => r.date))];
    expect(dates[0]).toBe('2025-06-01');
    expect(dates[dates.length - 1]).toBe('2025-09-30');
    expect(Math.min(...own.map((r) => r.lon))).toBe(ANOMALY_GRID.west);
    expect(Math.max(...own.map((r) => r.lat))).toBe(ANOMALY_GRID.north);
  });

  for (const v of ['q', 'u', 'v'] as const) {
    it(`anomalies-2025-${v}850.tif: one band per day, dates in band metadata, same values as the CSV`, async () => {
      const name = `anomalies-2025-${v}850.tif`;
      const img = await openTiff(name);
      expect(img.getGeoKeys()?.GeographicTypeGeoKey).toBe(4326);
      expect(img.getSamplesPerPixel()).toBe(SEASON_DAYS);
      expect(img.getWidth()).toBe(nx);
      expect(img.getHeight()).toBe(ny);
      const bb = img.getBoundingBox();
      expect(bb[0]).toBeCloseTo(ANOMALY_GRID.west - ANOMALY_GRID.step / 2, 9);
      expect(bb[3]).toBeCloseTo(ANOMALY_GRID.north + ANOMALY_GRID.step / 2, 9);
      const meta = await img.getGDALMetadata();
      expect(meta).toMatchObject({ VARIABLE: v, LEVEL_HPA: '850' });
      expect((await img.getGDALMetadata(0))?.DATE).toBe('2025-06-01');
      expect((await img.getGDALMetadata(SEASON_DAYS - 1))?.DATE).toBe('2025-09-30');
      const rasters = (await img.readRasters()) as unknown as Float32Array[];
      expect(rasters).toHaveLength(SEASON_DAYS);
      for (const band of rasters) expect(band.every(Number.isFinite)).toBe(true);
      const ownTiff = readTiff(bytes(name));
      expect(gdalItems(ownTiff.gdalMetadata ?? '', 40).DATE).toBe((await img.getGDALMetadata(40))?.DATE);
      // spot checks against the CSV
      const lookup = new Map(
        own.filter((r) => r.variable === v).map((r) => [`${r.date}|${r.lat}|${r.lon}`, r.value]),
      );
      for (const d of [0, 17, 60, SEASON_DAYS - 1]) {
        const date = (await img.getGDALMetadata(d))?.DATE as string;
        for (const [i, j] of [
          [0, 0],
          [5, 7],
          [nx - 1, ny - 1],
        ]) {
          const lon = ANOMALY_GRID.west + i * ANOMALY_GRID.step;
          const lat = ANOMALY_GRID.north - j * ANOMALY_GRID.step;
          expect(rasters[d][j * nx + i]).toBeCloseTo(lookup.get(`${date}|${lat}|${lon}`) as number, 5);
          expect(bandOf(ownTiff, d)[j * nx + i]).toBe(rasters[d][j * nx + i]);
        }
      }
    });
  }
});

describe('cell table and scan inventory', () => {
  let cells: ReturnType<typeof readCellTable>;
  let scans: ReturnType<typeof readScanInventory>;
  beforeAll(() => {
    cells = readCellTable(text('cells-2025.csv'));
    scans = readScanInventory(text('scans-2025.csv'));
  });

  it('reads the same with papaparse and our reader, with the agreed columns and no NaN', () => {
    const parsed = Papa.parse<Record<string, number | string | null>>(text('cells-2025.csv'), {
      header: true,
      dynamicTyping: true,
      skipEmptyLines: true,
    });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([...CELL_COLUMNS]);
    expect(parsed.data.length).toBe(cells.length);
    expect(cells.length).toBeGreaterThan(10_000);
    for (let i = 0; i < cells.length; i += 101) {
      const p = parsed.data[i];
      const c = cells[i];
      expect(p.track_id).toBe(c.trackId);
      expect(p.lat).toBe(c.lat);
      expect(p.volume_km3).toBe(c.volumeKm3);
      expect(p.parent_track_id ?? null).toBe(c.parentTrackId);
    }
    const keys = [
      'lat',
      'lon',
      'areaKm2',
      'volumeKm3',
      'maxDbz',
      'top35Km',
      'echoTopKm',
      'core40Km3',
      'vilMaxKgM2',
    ] as const;
    expect(cells.filter((c) => keys.some((k) => !Number.isFinite(c[k])))).toEqual([]);
  });

  it('only has cells that pass the identification rules, inside the coverage', () => {
    const toXY = proj4(
      'EPSG:4326',
      `+proj=aeqd +lat_0=${SITE.lat} +lon_0=${SITE.lon} +datum=WGS84 +units=m +no_defs`,
    );
    const bad = cells.filter((c) => {
      const [x, y] = toXY.forward([c.lon, c.lat]);
      return !(
        c.volumeKm3 >= 14.995 &&
        c.maxDbz >= 35 &&
        c.areaKm2 > 0 &&
        c.top35Km >= 1 &&
        c.echoTopKm >= c.top35Km &&
        c.core40Km3 <= c.volumeKm3 + 0.01 &&
        c.vilMaxKgM2 > 0 &&
        Math.hypot(x, y) / 1000 <= SITE.rangeKm + 0.01
      );
    });
    expect(bad).toEqual([]);
  });

  it('has an inventory of 6-minute scans over the season, ordered, matching the cells', () => {
    const start = localMidnightUtcMs('2025-06-01');
    const end = localMidnightUtcMs('2025-10-01');
    const times = new Set(scans.map((s) => s.scanMs));
    expect(scans[0].scanTimeUtc).toBe('2025-05-31T18:00:00Z');
    const badScans = scans.filter(
      (s, i) =>
        (s.scanMs - start) % SCAN_MS !== 0 || s.scanMs >= end || (i > 0 && s.scanMs <= scans[i - 1].scanMs),
    );
    expect(badScans).toEqual([]);
    const counts = new Map<number, number>();
    for (const c of cells) counts.set(c.scanMs, (counts.get(c.scanMs) ?? 0) + 1);
    expect(cells.filter((c) => !times.has(c.scanMs))).toEqual([]);
    expect(scans.filter((s) => s.cellCount !== (counts.get(s.scanMs) ?? 0))).toEqual([]);
    // one row per track per scan
    expect(new Set(cells.map((c) => `${c.scanMs}|${c.trackId}`)).size).toBe(cells.length);
  });

  it('leaves the outage scans out of the inventory and the table, with one multi-hour gap', () => {
    const times = new Set(scans.map((s) => s.scanMs));
    const cellTimes = new Set(cells.map((c) => c.scanMs));
    let missing = 0;
    for (const o of scenario.outages) {
      for (let t = Date.parse(o.firstMissingUtc); t <= Date.parse(o.lastMissingUtc); t += SCAN_MS) {
        expect(times.has(t)).toBe(false);
        expect(cellTimes.has(t)).toBe(false);
        missing++;
      }
      expect(
        times.has(Date.parse(o.firstMissingUtc) - SCAN_MS) ||
          Date.parse(o.firstMissingUtc) === localMidnightUtcMs('2025-06-01'),
      ).toBe(true);
    }
    expect(scans.length + missing).toBe(SEASON_DAYS * 240);
    const long = scenario.outages.filter((o: { kind: string }) => o.kind === 'multi-hour');
    expect(long).toHaveLength(1);
    expect(long[0].missingScans).toBeGreaterThanOrEqual(30);
    expect(scenario.outages.filter((o: { kind: string }) => o.kind === 'single scan').length).toBeGreaterThan(
      20,
    );
  });

  it('links split children and merges to tracks that exist at that time', () => {
    const byTrack = new Map<number, number[]>();
    for (const c of cells) byTrack.set(c.trackId, [...(byTrack.get(c.trackId) ?? []), c.scanMs]);
    let splits = 0;
    let merges = 0;
    for (const c of cells) {
      if (c.parentTrackId !== null) {
        const parent = byTrack.get(c.parentTrackId);
        expect(parent).toBeDefined();
        const first = Math.min(...(byTrack.get(c.trackId) as number[]));
        expect(parent?.some((t) => t <= first && t >= first - 2 * SCAN_MS)).toBe(true);
        splits++;
      }
      if (c.mergedIntoTrackId !== null) {
        expect(byTrack.get(c.mergedIntoTrackId)).toBeDefined();
        merges++;
      }
    }
    expect(splits).toBeGreaterThan(100);
    expect(merges).toBeGreaterThan(50);
  });
});

describe('radar run', () => {
  it('lists its scans; every file exists, and the cells of those scans are the truth rows', () => {
    expect(run.scans).toHaveLength(30);
    const volumes = run.scans.filter((s: { volumeFile: string | null }) => s.volumeFile);
    expect(volumes.length).toBeGreaterThanOrEqual(3);
    const truth = readTruthCells(text(runPath('truth-cells.csv'))).filter((t) => t.inCellTable);
    const times = new Set(run.scans.map((s: { scanTimeUtc: string }) => Date.parse(s.scanTimeUtc)));
    const table = readCellTable(text('cells-2025.csv')).filter((c) => times.has(c.scanMs));
    expect(truth.length).toBe(table.length);
    const key = (c: { scanMs: number; trackId: number | null }) => `${c.scanMs}|${c.trackId}`;
    const tableMap = new Map(table.map((c) => [key(c), c]));
    for (const t of truth) {
      const c = tableMap.get(key(t));
      expect(c).toBeDefined();
      expect(Math.abs((c?.lat ?? 0) - t.lat)).toBeLessThan(1e-5);
      expect(Math.abs((c?.volumeKm3 ?? 0) - t.volumeKm3)).toBeLessThan(0.01);
      expect(c?.top35Km).toBe(t.top35Km);
      expect(c?.parentTrackId).toBe(t.parentTrackId);
    }
  });

  it('volume GeoTIFFs read with geotiff: aeqd GeoKeys, 15 bands, levels, scan time, scale/offset, nodata', async () => {
    const scan = run.scans.find((s: { volumeFile: string | null }) => s.volumeFile);
    const img = await openTiff(runPath(scan.volumeFile));
    const keys = img.getGeoKeys();
    expect(keys).toMatchObject({
      GTModelTypeGeoKey: 1,
      GTRasterTypeGeoKey: 1,
      ProjectedCSTypeGeoKey: 32767,
      ProjectionGeoKey: 32767,
      ProjCoordTransGeoKey: 12,
      ProjLinearUnitsGeoKey: 9001,
      GeographicTypeGeoKey: 4326,
      ProjCenterLongGeoKey: SITE.lon,
      ProjCenterLatGeoKey: SITE.lat,
      ProjFalseEastingGeoKey: 0,
      ProjFalseNorthingGeoKey: 0,
    });
    expect(img.getSamplesPerPixel()).toBe(15);
    expect(img.getWidth()).toBe(361);
    expect(img.getHeight()).toBe(361);
    expect(img.getBoundingBox()).toEqual([-180500, -180500, 180500, 180500]);
    expect(img.getResolution().slice(0, 2)).toEqual([1000, -1000]);
    expect(img.getGDALNoData()).toBe(255);
    const meta = await img.getGDALMetadata();
    expect(meta?.SCAN_TIME_UTC).toBe(scan.scanTimeUtc);
    expect(meta?.LEVEL_HEIGHTS_KM).toBe('1,2,3,4,5,6,7,8,9,10,11,12,13,14,15');
    expect(meta?.PROJ4).toBe(run.grid.proj4);
    for (let b = 0; b < 15; b++) {
      expect(await img.getGDALMetadata(b)).toMatchObject({
        HEIGHT_KM: String(b + 1),
        SCALE: '0.5',
        OFFSET: '-32',
      });
    }
    const rasters = (await img.readRasters()) as unknown as Uint8Array[];
    expect(rasters).toHaveLength(15);
    // nodata exactly outside the range ring (pixel centres), data inside
    const own = readTiff(bytes(runPath(scan.volumeFile)));
    for (let j = 0; j < 361; j += 3) {
      for (let i = 0; i < 361; i += 3) {
        const r = Math.hypot(-180 + i, 180 - j);
        const v = rasters[0][j * 361 + i];
        expect(v === 255, `${i},${j}`).toBe(r > 180);
        expect(own.data[(j * 361 + i) * 15 + 7]).toBe(rasters[7][j * 361 + i]);
      }
    }
    // the upper-left corner pixel centre maps to the right place
    const conv = proj4('EPSG:4326', run.grid.proj4);
    const [lon, lat] = conv.inverse([-180000, 180000]);
    expect(conv.forward([lon, lat])[0]).toBeCloseTo(-180000, 3);
  });

  it('column-maximum GeoTIFFs cover every scan of the run and equal the maximum over the levels', async () => {
    for (const s of run.scans) {
      const img = await openTiff(runPath(s.columnMaxFile));
      expect(img.getSamplesPerPixel()).toBe(1);
      expect((await img.getGDALMetadata())?.SCAN_TIME_UTC).toBe(s.scanTimeUtc);
      expect(img.getGDALNoData()).toBe(255);
      if (!s.volumeFile) continue;
      const [cmax] = (await (
        await openTiff(runPath(s.columnMaxFile))
      ).readRasters()) as unknown as Uint8Array[];
      const vol = readTiff(bytes(runPath(s.volumeFile)));
      for (let q = 0; q < 361 * 361; q += 7) {
        let m = 0;
        for (let b = 0; b < 15; b++) m = Math.max(m, vol.data[q * 15 + b]);
        expect(cmax[q]).toBe(m);
      }
    }
  });
});
