import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { SiteView } from '@stormhour/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FileProblem } from './geotiff-reader.js';
import { IntakeWorker } from './intake-worker.js';
import { tracksByEngine } from './prepare-cells.js';
import { type ParseRequest, parseRadarFile, siteContext } from './radar-parse.js';

// The worker must give exactly what reading in this thread gives: the in-process parser is the
// reference here (its own numbers are checked against outside sources in identify.spec.ts,
// label.spec.ts and cell-table.spec.ts).
const demo = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
const siteFile = JSON.parse(readFileSync(join(demo, 'site.json'), 'utf8'));
const site: SiteView = { id: 1, settingsVersion: 1, ...siteFile.createSiteRequest };
const runDir = join(demo, readdirSync(demo).find((f) => f.startsWith('run-')) as string);
const volume = readdirSync(runDir).find((f) => f.startsWith('volume-')) as string;
const fixtures = fileURLToPath(new URL('../../../tests/fixtures/', import.meta.url));

function request(kind: ParseRequest['kind'], fileName: string, content: Buffer): ParseRequest {
  return {
    kind,
    mapping:
      kind === 'cell-table'
        ? { columns: {}, areaUnit: 'km2', position: 'latlon', timeZone: 'UTC' }
        : undefined,
    site,
    settings: site.settings,
    fileName,
    content,
  } as ParseRequest;
}

describe('reading intake files in a worker thread', () => {
  let parser: IntakeWorker;
  beforeAll(async () => {
    parser = await IntakeWorker.start();
  });
  afterAll(() => parser.close());

  it('starts a real worker, also from the TypeScript sources', () => {
    expect(parser.inProcessReason).toBeNull();
  });

  it('finds the same cells in a volume as reading in this thread', async () => {
    const bytes = readFileSync(join(runDir, volume));
    const inWorker = await parser.parse(request('volume', volume, Buffer.from(bytes)));
    const here = await parseRadarFile(request('volume', volume, Buffer.from(bytes)));
    expect(inWorker.kind).toBe('scan');
    expect(inWorker).toEqual(here);
  });

  it('parses and tracks a cell table the same way', async () => {
    const bytes = readFileSync(join(fixtures, 'cells-small.csv'));
    const inWorker = await parser.parse(request('cell-table', 'cells-small.csv', bytes));
    const here = await parseRadarFile(request('cell-table', 'cells-small.csv', bytes));
    expect(inWorker.kind).toBe('cell-table');
    expect(inWorker).toEqual(here);
  });

  it("returns a file's problems as the same FileProblem, naming where", async () => {
    const bytes = Buffer.from('scan_time_utc\n2025-08-01T06:00:00Z\nnot a time\n');
    const here = await parseRadarFile(request('scan-inventory', 'scans.csv', bytes)).catch((e) => e);
    const inWorker = await parser.parse(request('scan-inventory', 'scans.csv', bytes)).catch((e) => e);
    expect(here).toBeInstanceOf(FileProblem);
    expect(inWorker).toBeInstanceOf(FileProblem);
    expect(inWorker.where).toBe(here.where);
    expect(inWorker.message).toBe(here.message);
    expect(inWorker.all).toEqual(here.all);
  });

  it('refuses a file that is not a GeoTIFF with the same message, and keeps working after it', async () => {
    const bad = await parser.parse(request('volume', 'notes.tif', Buffer.from('hello'))).catch((e) => e);
    expect(bad).toBeInstanceOf(FileProblem);
    expect(bad.message).toMatch(/not a GeoTIFF/);
    const again = await parser.parse(
      request('scan-inventory', 's.csv', Buffer.from('scan_time_utc\n2025-08-01T06:00:00Z\n')),
    );
    expect(again).toEqual({ kind: 'scan-inventory', times: [Date.UTC(2025, 7, 1, 6)] });
  });

  it('tracks cells the same way as tracking in this thread', async () => {
    const bytes = readFileSync(join(demo, readdirSync(demo).find((f) => f.startsWith('cells-')) as string));
    const table = await parseRadarFile(request('cell-table', 'cells.csv', bytes));
    if (table.kind !== 'cell-table') throw new Error('expected a cell table');
    // A day of the season, without the table's own track ids: the engine links the cells.
    const day = table.cells
      .filter((c) => c.time < table.cells[0].time + 86_400_000)
      .map((c) => ({ ...c, externalTrackId: null, parentExternalTrackId: null }));
    const inWorker = await parser.track({ cells: day, site, settings: site.settings });
    expect(inWorker.length).toBeGreaterThan(0);
    expect(inWorker).toEqual(tracksByEngine(day, siteContext(site, site.settings)));
  });

  it('turns an unexpected error in the worker into an Error with its message, not a file problem', async () => {
    const e = await parser
      .track({ cells: null as never, site, settings: site.settings })
      .catch((err: unknown) => err);
    expect(e).toBeInstanceOf(Error);
    expect(e).not.toBeInstanceOf(FileProblem);
    expect((e as Error).message).toMatch(/null/);
  });
});
