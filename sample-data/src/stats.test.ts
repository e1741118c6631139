import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { SEASON_DAYS, TERRAIN_GRID } from './config.js';
import { pointInRing } from './province.js';
import { readAnomalyCsv, readCellTable, readScanInventory, readTiff } from './readers.js';
import { coverageMeansFromRecords, regimeSkill, seasonStatistics, summariseTracks } from './stats.js';
import { addDays, SCAN_MS } from './times.js';

const dir = new URL('../vessary/', import.meta.url);
const text = (p: string) => readFileSync(fileURLToPath(new URL(p, dir)), 'utf8');
const cells = readCellTable(text('cells-2025.csv'));
const scans = readScanInventory(text('scans-2025.csv'));
const means = coverageMeansFromRecords(readAnomalyCsv(text('anomalies-2025.csv')));
const terrainTiff = readTiff(new Uint8Array(readFileSync(fileURLToPath(new URL('terrain.tif', dir)))));
const lakeRing = JSON.parse(text('lake.geojson')).features[0].geometry.coordinates[0] as number[][];
const blocks = JSON.parse(text('blocks.geojson')).features as {
  geometry: { type: string; coordinates: number[][][] | number[][][][] };
}[];
const scenario = JSON.parse(text('scenario.json'));
const dates = Array.from({ length: SEASON_DAYS }, (_, d) => addDays('2025-06-01', d));

const stats = seasonStatistics({
  cells,
  scans,
  nominalScans: SEASON_DAYS * 240,
  dates,
  terrain: {
    west: terrainTiff.tiepoint[3],
    north: terrainTiff.tiepoint[4],
    step: terrainTiff.pixelScale[0],
    width: terrainTiff.width,
    height: terrainTiff.height,
    elevation: terrainTiff.data,
  },
  isLake: (lon, lat) => pointInRing(lon, lat, lakeRing),
  dailyMeans: means,
});

describe('season statistics of the committed scenario (read back from the files)', () => {
  it('match what the generator recorded in scenario.json', () => {
    expect(terrainTiff.tiepoint[3]).toBeCloseTo(TERRAIN_GRID.west, 9);
    expect(stats.onsetsByLocalHour).toEqual(scenario.statistics.onsetsByLocalHour);
    expect(stats.storms).toBe(scenario.statistics.storms);
    expect(stats.onsetsPerDay).toEqual(scenario.statistics.onsetsPerDay);
  });

  it('have the afternoon peak of onsets between 13 and 17 local time, and little at night', () => {
    expect(stats.peakLocalHour).toBeGreaterThanOrEqual(13);
    expect(stats.peakLocalHour).toBeLessThan(17);
    const h = stats.onsetsByLocalHour;
    const afternoon = h.slice(12, 18).reduce((a, b) => a + b, 0);
    const morning = h.slice(6, 10).reduce((a, b) => a + b, 0);
    expect(afternoon).toBeGreaterThan(5 * morning);
  });

  it('have more onsets per km² over the hills than over the valley', () => {
    const d = stats.onsetDensityPer1000Km2;
    expect(d.hillsAreaKm2).toBeGreaterThan(5000);
    expect(d.valleyAreaKm2).toBeGreaterThan(10000);
    expect(d.hills).toBeGreaterThan(2 * d.valley);
  });

  it('have a weak night peak over the lake', () => {
    const n = stats.nightOnsetDensityPer1000Km2;
    expect(n.lake).toBeGreaterThan(5 * n.elsewhere);
    const h = stats.onsetsByLocalHour;
    expect(h.slice(0, 5).reduce((a, b) => a + b, 0)).toBeGreaterThan(
      h.slice(6, 10).reduce((a, b) => a + b, 0),
    );
  });

  it('have more storms on moist days than on dry days, and more with onshore than offshore flow', () => {
    const p = stats.onsetsPerDay;
    expect(p.moistTercile).toBeGreaterThan(1.5 * p.dryTercile);
    expect(p.middleTercile).toBeGreaterThan(p.dryTercile);
    expect(p.byFlowClass.onshore).toBeGreaterThan(p.byFlowClass.offshore);
  });

  it('are plausible for tropical convection (size, life, speed, tops, counts)', () => {
    expect(stats.storms).toBeGreaterThan(2000);
    expect(stats.storms).toBeLessThan(9000);
    expect(stats.cellAreaKm2.mean).toBeGreaterThan(10);
    expect(stats.cellAreaKm2.mean).toBeLessThan(100);
    expect(stats.stormDurationMin.mean).toBeLessThan(60);
    expect(stats.stormDurationMin.mean).toBeGreaterThan(20);
    expect(stats.stormSpeedMS.mean).toBeGreaterThanOrEqual(3);
    expect(stats.stormSpeedMS.mean).toBeLessThanOrEqual(5);
    const toward = stats.stormMotionTowardDeg.circularMean;
    expect(toward).toBeGreaterThan(280);
    expect(toward).toBeLessThan(345);
    expect(stats.top35MaxKm.shareFrom4To9).toBeGreaterThan(0.75);
    expect(stats.splitShare).toBeGreaterThan(0.02);
    expect(stats.mergeShare).toBeGreaterThan(0.01);
    expect(stats.flagged.edgeBand).toBeGreaterThan(50);
  });

  it('log-normal sizes and lifetimes: ln(area) and ln(duration) are roughly symmetric', () => {
    const tracks = summariseTracks(cells, scans).filter((t) => t.isStorm);
    for (const values of [cells.map((c) => c.areaKm2), tracks.map((t) => t.durationMin)]) {
      const l = values.map(Math.log);
      const m = l.reduce((a, b) => a + b, 0) / l.length;
      const sd = Math.sqrt(l.reduce((a, b) => a + (b - m) ** 2, 0) / l.length);
      const skew = l.reduce((a, b) => a + ((b - m) / sd) ** 3, 0) / l.length;
      expect(Math.abs(skew)).toBeLessThan(1);
      const raw = values.reduce((a, b) => a + b, 0) / values.length;
      const rawSd = Math.sqrt(values.reduce((s, v) => s + (v - raw) ** 2, 0) / values.length);
      const rawSkew = values.reduce((a, b) => a + ((b - raw) / rawSd) ** 3, 0) / values.length;
      expect(rawSkew).toBeGreaterThan(skew);
    }
  });

  it('make availability matter: the outage scans are absent and flag the tracks after them', () => {
    const times = new Set(scans.map((s) => s.scanMs));
    for (const o of scenario.outages) {
      for (let t = Date.parse(o.firstMissingUtc); t <= Date.parse(o.lastMissingUtc); t += SCAN_MS)
        expect(times.has(t)).toBe(false);
    }
    expect(stats.scans.missing).toBe(
      scenario.outages.reduce((s: number, o: { missingScans: number }) => s + o.missingScans, 0),
    );
    expect(stats.scans.availability).toBeLessThan(1);
    expect(stats.flagged.afterGap).toBeGreaterThan(0);
  });

  it('make the regime informative: regime-conditioned climatology has skill, shuffled regimes none', () => {
    const onsets = summariseTracks(cells, scans).filter((t) => t.isOnset);
    const polys = blocks.map((b) => ({
      polygons: (b.geometry.type === 'Polygon'
        ? [b.geometry.coordinates]
        : b.geometry.coordinates) as number[][][][],
    }));
    const skill = regimeSkill({ onsets, blocks: polys, dates, dailyMeans: means, scans, shuffleSeed: 1 });
    expect(skill.bss).toBeGreaterThan(0.04);
    expect(skill.bssShuffled).toBeLessThan(0.01);
    for (const seed of [2, 3, 4]) {
      expect(
        regimeSkill({ onsets, blocks: polys, dates, dailyMeans: means, scans, shuffleSeed: seed })
          .bssShuffled,
      ).toBeLessThan(0.01);
    }
  });
});
