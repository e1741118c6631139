import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEFAULT_SITE_SETTINGS } from '@stormhour/shared';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { identifyCells } from '../radar/engine/identify.js';
import { sitePlane } from '../radar/engine/site-plane.js';
import { readReflectivityTiff } from './geotiff-reader.js';
import { type PreparedCell, tracksByEngine } from './prepare-cells.js';

// The demo scenario's own radar run and the generator's record of the storms it drew ("truth").
// This checks the engine against the scenario's generator, which knows where every storm is.
const demo = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
const site = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));
const runDir = join(demo, readdirSync(demo).find((f) => f.startsWith('run-')) as string);
const volumes = readdirSync(runDir)
  .filter((f) => f.startsWith('volume-'))
  .sort();
const plane = sitePlane(site.location);

interface Truth {
  scan_time_utc: string;
  track_id: string;
  x_km: number;
  y_km: number;
  volume_km3: number;
  truncated_by_range: number;
}

describe('the cell engine on the demo radar run', async () => {
  const scans = await Promise.all(
    volumes.map((f) =>
      readReflectivityTiff(readFileSync(join(runDir, f)), {
        fileName: f,
        kind: 'volume',
        plane,
        latestTime: Date.now(),
      }),
    ),
  );
  const found = scans.map((s) => ({ time: s.time, cells: identifyCells(s.grid).cells }));
  const truthRows = Papa.parse<Truth>(readFileSync(join(runDir, 'truth-cells.csv'), 'utf8'), {
    header: true,
    dynamicTyping: true,
    skipEmptyLines: true,
  }).data;
  const times = new Set(found.map((f) => f.time));
  const truth = truthRows.filter(
    (t) => times.has(Date.parse(String(t.scan_time_utc))) && t.volume_km3 >= 15 && t.truncated_by_range === 0,
  );

  it('reads five volumes with 15 levels on the radar-centred grid', () => {
    expect(scans).toHaveLength(5);
    expect(scans[0].grid.nz).toBe(15);
    expect(scans[0].grid.levelHeightsM[0]).toBe(1000);
  });

  it('finds at least 90 % of the storms of ≥ 15 km³, within 2 km and 15 % of volume', () => {
    const matched = truth.filter((t) => {
      const scan = found.find((f) => f.time === Date.parse(String(t.scan_time_utc)));
      return scan?.cells.some(
        (c) =>
          Math.hypot(c.xKm - t.x_km, c.yKm - t.y_km) <= 2 &&
          Math.abs((c.volumeKm3 as number) - t.volume_km3) / t.volume_km3 <= 0.15,
      );
    });
    const share = matched.length / truth.length;
    console.log(
      `engine vs scenario: ${matched.length} of ${truth.length} storms found (${(share * 100).toFixed(1)} %)`,
    );
    expect(truth.length).toBeGreaterThan(50);
    expect(share).toBeGreaterThanOrEqual(0.9);
  });

  it('links at least 90 % of the scenario’s scan-to-scan steps into the same track', () => {
    const cells: PreparedCell[] = found.flatMap((f) =>
      f.cells.map((c) => ({
        time: f.time,
        lon: c.lon,
        lat: c.lat,
        xKm: c.xKm,
        yKm: c.yKm,
        areaKm2: c.areaKm2,
        volumeKm3: c.volumeKm3,
        maxDbz: c.maxDbz,
        top35Km: c.top35Km,
        echoTopKm: c.echoTopKm,
        coreVolumeKm3: c.coreVolumeKm3,
        vilMaxKgM2: c.vilMaxKgM2,
        cellType: c.type,
        externalTrackId: null,
        parentExternalTrackId: null,
      })),
    );
    const tracks = tracksByEngine(cells, {
      plane,
      coverage: { ...site.location, rangeKm: site.rangeKm, blockedSectors: [] },
      settings: DEFAULT_SITE_SETTINGS,
      intervalMs: 6 * 60_000,
    });
    const trackOf = new Map<number, number>();
    tracks.forEach((t, k) => {
      for (const i of t.cells) trackOf.set(i, k);
    });
    const nearest = (t: Truth) => {
      const time = Date.parse(String(t.scan_time_utc));
      let best = -1;
      let bestD = 2;
      cells.forEach((c, i) => {
        const d = Math.hypot(c.xKm - t.x_km, c.yKm - t.y_km);
        if (c.time === time && d <= bestD) {
          best = i;
          bestD = d;
        }
      });
      return best;
    };
    const byTrack = new Map<string, Truth[]>();
    for (const t of truth) byTrack.set(String(t.track_id), [...(byTrack.get(String(t.track_id)) ?? []), t]);
    let links = 0;
    let kept = 0;
    for (const rows of byTrack.values()) {
      rows.sort((a, b) => Date.parse(String(a.scan_time_utc)) - Date.parse(String(b.scan_time_utc)));
      for (let k = 1; k < rows.length; k++) {
        const a = nearest(rows[k - 1]);
        const b = nearest(rows[k]);
        if (a < 0 || b < 0) continue;
        links++;
        if (trackOf.get(a) === trackOf.get(b)) kept++;
      }
    }
    console.log(
      `engine vs scenario: ${kept} of ${links} scan-to-scan links kept (${((kept / links) * 100).toFixed(1)} %)`,
    );
    expect(links).toBeGreaterThan(40);
    expect(kept / links).toBeGreaterThanOrEqual(0.9);
  });
});
