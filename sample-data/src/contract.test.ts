/**
 * The committed files against the project's own importers in server/src (read-only use): the block
 * import contract, the cell-table and scan-inventory parsers. Imported by path at run time so that
 * this package does not type-check or build the server; if they move, this test says so.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const dir = new URL('../vessary/', import.meta.url);
const text = (p: string) => readFileSync(fileURLToPath(new URL(p, dir)), 'utf8');
const server = (p: string) => new URL(`../../server/src/${p}`, import.meta.url).href;

interface BlockCheck {
  ok: boolean;
  blocks?: { code: string; districtCode: string }[];
  problems?: unknown[];
  fileProblem?: string;
}
interface CellTableModule {
  guessMapping(headers: string[]): Record<string, string>;
  parseCellTable(
    text: string,
    mapping: { columns: Record<string, string>; areaUnit: 'km2'; timeZone: string; position: 'latlon' },
    opts: { latestTime: number },
  ): { rows: { trackId: string | null; volumeKm3: number | null }[]; problems: unknown[] };
  parseScanInventory(text: string, latestTime: number): { times: number[]; problems: unknown[] };
}

/** The demo season is in 2025: the importers must be told that times up to its end are not "in the future". */
const AFTER_SEASON = Date.UTC(2025, 9, 1);

describe("the project's importers accept the committed files", () => {
  it("site.json carries a body the server's CreateSiteRequest accepts, equal to its own keys", async () => {
    const { CreateSiteRequest } = await import('@stormhour/shared');
    const site = JSON.parse(text('site.json'));
    const req = CreateSiteRequest.parse(site.createSiteRequest);
    expect(req).toMatchObject({
      code: site.siteCode,
      lat: site.location.lat,
      lon: site.location.lon,
      altitudeM: site.altitudeM,
      rangeKm: site.rangeKm,
      intervalMin: site.scanIntervalMin,
      utcOffsetMinutes: 360,
    });
    expect(req.settings).toMatchObject({
      thresholdDbz: site.identification.thresholdDbz,
      minVolumeKm3: site.identification.minVolumeKm3,
      minAreaKm2: site.identification.minAreaKm2For2d,
      maxGapIntervals: site.tracking.maxGapFactor,
      edgeBandKm: site.tracking.edgeBandKm,
      typeEdgesKm: [4, 9],
    });
  });

  it('blocks.geojson passes the block import checks', async () => {
    const { checkBlocksFile } = (await import(server('regions/block-import.ts'))) as {
      checkBlocksFile(text: string): BlockCheck;
    };
    const result = checkBlocksFile(text('blocks.geojson'));
    expect(result.problems ?? []).toEqual([]);
    expect(result.ok).toBe(true);
    expect(new Set(result.blocks?.map((b) => b.districtCode))).toEqual(new Set(['RVB', 'LKS', 'HLF', 'UPL']));
  });

  it('crop-calendars.csv passes the crop calendar import checks for the four districts', async () => {
    const { checkCropCalendarCsv } = (await import(server('advice/crop-calendar-csv.ts'))) as {
      checkCropCalendarCsv(text: string): {
        ok: boolean;
        rows?: { districtCode: string }[];
        problems?: unknown[];
      };
    };
    const result = checkCropCalendarCsv(text('crop-calendars.csv'));
    expect(result.problems ?? []).toEqual([]);
    expect(new Set(result.rows?.map((r) => r.districtCode))).toEqual(new Set(['RVB', 'LKS', 'HLF', 'UPL']));
  });

  it('cells-2025.csv and scans-2025.csv parse without a problem, columns found by their own names', async () => {
    const m = (await import(server('intake/cell-table.ts'))) as CellTableModule;
    const csv = text('cells-2025.csv');
    const columns = m.guessMapping(csv.slice(0, csv.indexOf('\n')).split(','));
    expect(Object.keys(columns).sort()).toEqual(
      [
        'scan_time',
        'track_id',
        'lat',
        'lon',
        'area',
        'volume_km3',
        'max_dbz',
        'top35_km',
        'echo_top_km',
        'core40_km3',
        'vil_max_kg_m2',
        'parent_track_id',
      ].sort(),
    );
    const cells = m.parseCellTable(
      csv,
      { columns, areaUnit: 'km2', timeZone: 'UTC', position: 'latlon' },
      { latestTime: AFTER_SEASON },
    );
    expect(cells.problems).toEqual([]);
    expect(cells.rows.length).toBe(csv.trim().split('\n').length - 1);
    const scans = m.parseScanInventory(text('scans-2025.csv'), AFTER_SEASON);
    expect(scans.problems).toEqual([]);
    expect(scans.times.length).toBe(text('scans-2025.csv').trim().split('\n').length - 1);
  });
});
