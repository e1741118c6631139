import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEFAULT_SITE_SETTINGS } from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { sitePlane } from '../radar/engine/site-plane.js';
import { classifyStart } from '../radar/engine/starts.js';
import { guessMapping, parseCellTable, parseScanInventory } from './cell-table.js';
import { type PreparedTrack, type SiteContext, tracksByEngine, tracksFromIds } from './prepare-cells.js';

const demo = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
const file = (prefix: string) => join(demo, readdirSync(demo).find((f) => f.startsWith(prefix)) as string);
const site = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));

describe('the demo season re-tracked without its track ids', () => {
  const text = readFileSync(file('cells-'), 'utf8');
  const header = text.slice(0, text.indexOf('\n')).split(',');
  const inventory = Float64Array.from(
    parseScanInventory(readFileSync(file('scans-'), 'utf8'), Date.now()).times.sort((a, b) => a - b),
  );
  const ctx: SiteContext = {
    plane: sitePlane(site.location),
    coverage: { ...site.location, rangeKm: site.rangeKm, blockedSectors: [] },
    settings: DEFAULT_SITE_SETTINGS,
    intervalMs: site.scanIntervalMin * 60_000,
  };
  const onsets = (tracks: PreparedTrack[]) =>
    tracks.filter(
      (t) =>
        t.isStorm &&
        classifyStart(
          {
            hasParent: t.parent !== null,
            firstTime: t.firstTime,
            firstDistanceKm: t.startDistanceKm,
            firstAzimuthDeg: t.startAzimuthDeg,
          },
          inventory,
          { maxGapMs: 2.5 * ctx.intervalMs, edgeBandKm: 10, coverage: ctx.coverage },
        ) === null,
    ).length;
  const prepare = (withIds: boolean) => {
    const columns = guessMapping(header);
    if (!withIds) {
      delete columns.track_id;
      delete columns.parent_track_id;
    }
    const { rows, problems } = parseCellTable(
      text,
      { columns, areaUnit: 'km2', timeZone: 'UTC', position: 'latlon' },
      { latestTime: Date.now() },
    );
    expect(problems).toEqual([]);
    return rows.map((r) => {
      const [xKm, yKm] = ctx.plane.toKm(r.lon, r.lat);
      return {
        ...r,
        xKm,
        yKm,
        coreVolumeKm3: r.core40Km3,
        cellType: null,
        externalTrackId: r.trackId,
        parentExternalTrackId: r.parentTrackId,
      };
    });
  };

  it('counts onsets within 5 % of the count from the table’s own track ids', () => {
    const byIds = onsets(tracksFromIds(prepare(true), ctx));
    const byEngine = onsets(tracksByEngine(prepare(false), ctx));
    const ratio = byEngine / byIds;
    console.log(`season onsets: ${byIds} from track ids, ${byEngine} re-tracked (ratio ${ratio.toFixed(3)})`);
    expect(byIds).toBeGreaterThan(1000);
    expect(Math.abs(ratio - 1)).toBeLessThanOrEqual(0.05);
  });
});
