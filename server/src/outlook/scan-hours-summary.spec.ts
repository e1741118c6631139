import { PGlite } from '@electric-sql/pglite';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DatabaseHandle, migrateDatabase, wrap } from '../database/database.js';
import { RadarDataRepository, type ScanSource } from '../radar/radar-data.repository.js';
import { countScanHours } from './engine/scan-hours.js';
import { OutlookRepository } from './outlook.repository.js';

/**
 * The scan_hours summary (kept by triggers on scans) must always equal a recount from the raw scan
 * rows: after any sequence of inserts (through the intake's own repository), deletes, updates, offset
 * changes and rolled-back transactions. The recount is countScanHours over the rows themselves.
 */

const SOURCES: ScanSource[] = ['scan-inventory', 'cell-table', 'volume', 'column-max'];
/** Which stored scans each counted source is judged against (the onset rules; common practice here). */
const MEMBERS = {
  'cell-table': ['scan-inventory', 'cell-table'],
  volume: ['volume'],
  'column-max': ['column-max'],
} as const;
/** Scan instants on a 7.5-minute grid over four days: coarse enough that sources often share a time. */
const BASE = Date.parse('2025-06-01T00:00:00Z');
const STEP = 450_000;
const SLOTS = 4 * 192;
const instant = (slot: number) => BASE + slot * STEP;

let handle: DatabaseHandle;
let radar: RadarDataRepository;
let outlook: OutlookRepository;
const sites: number[] = [];

beforeAll(async () => {
  handle = wrap(await PGlite.create());
  await migrateDatabase(handle);
  radar = new RadarDataRepository(handle);
  outlook = new OutlookRepository(handle);
  for (const [code, offset] of [
    ['EAST', 345],
    ['WEST', -300],
  ] as const) {
    const res = await handle.pg.query<{ id: number }>(
      `insert into radar_sites (code, name, lat, lon, altitude_m, range_km, interval_min, utc_offset_minutes)
       values ($1, $1, 10, 80, 100, 150, 7.5, $2) returning id`,
      [code, offset],
    );
    sites.push(res.rows[0].id);
  }
}, 60_000);

afterAll(async () => {
  await handle?.pg.close();
});

/** Compares the summary of every site and counted source with a recount from the scans table. */
async function expectSummaryEqualsRecount() {
  for (const siteId of sites) {
    const { rows: site } = await handle.pg.query<{ o: number }>(
      'select utc_offset_minutes as o from radar_sites where id = $1',
      [siteId],
    );
    const { rows } = await handle.pg.query<{ source: string; t: number }>(
      `select source, (extract(epoch from time) * 1000)::float8 as t from scans where site_id = $1`,
      [siteId],
    );
    for (const [counted, members] of Object.entries(MEMBERS)) {
      const times = rows.filter((r) => (members as readonly string[]).includes(r.source)).map((r) => r.t);
      const expected = countScanHours(times, site[0].o);
      const stored = await outlook.scanHours(siteId, counted, { from: null, to: null });
      expect({ siteId, counted, ...stored }).toEqual({ siteId, counted, ...expected });
    }
  }
  // No stored day without a scan in it.
  const { rows: empty } = await handle.pg.query(
    'select 1 from scan_hours where not exists (select 1 from unnest(scans) c where c > 0)',
  );
  expect(empty).toHaveLength(0);
}

const site = fc.integer({ min: 0, max: 1 });
const slot = fc.integer({ min: 0, max: SLOTS - 1 });
const operation = fc.oneof(
  fc.record({
    kind: fc.constant('insert' as const),
    site,
    source: fc.constantFrom(...SOURCES),
    slots: fc.array(slot, { minLength: 1, maxLength: 300 }),
  }),
  fc.record({
    kind: fc.constant('delete' as const),
    site,
    from: slot,
    length: fc.integer({ min: 1, max: 200 }),
  }),
  fc.record({
    kind: fc.constant('move' as const),
    site,
    from: slot,
    length: fc.integer({ min: 1, max: 100 }),
    by: fc.integer({ min: -40, max: 40 }),
  }),
  fc.record({ kind: fc.constant('offset' as const), site, offset: fc.constantFrom(-300, 0, 330, 345, 360) }),
  fc.record({
    kind: fc.constant('rolled-back' as const),
    site,
    source: fc.constantFrom(...SOURCES),
    slots: fc.array(slot, { minLength: 1, maxLength: 50 }),
  }),
);
type Operation = typeof operation extends fc.Arbitrary<infer T> ? T : never;

async function apply(op: Operation) {
  const siteId = sites[op.site];
  const range = (from: number, length: number) => [
    new Date(instant(from)).toISOString(),
    new Date(instant(from + length)).toISOString(),
  ];
  switch (op.kind) {
    case 'insert':
      await radar.transaction((tx) => radar.insertScans(siteId, op.source, op.slots.map(instant), null, tx));
      return;
    case 'delete':
      await handle.pg.query('delete from scans where site_id = $1 and time >= $2 and time < $3', [
        siteId,
        ...range(op.from, op.length),
      ]);
      return;
    case 'move':
      // Moved one by one in a random order so the unique (site, source, time) index is never hit twice.
      await handle.pg.query(
        `update scans set time = time + $4 * interval '1 second'
         where site_id = $1 and time >= $2 and time < $3
           and not exists (select 1 from scans o where o.site_id = scans.site_id and o.source = scans.source
                           and o.time = scans.time + $4 * interval '1 second')`,
        [siteId, ...range(op.from, op.length), (op.by * STEP) / 1000 + 1],
      );
      return;
    case 'offset':
      await handle.pg.query('update radar_sites set utc_offset_minutes = $2 where id = $1', [
        siteId,
        op.offset,
      ]);
      return;
    case 'rolled-back':
      await expect(
        radar.transaction(async (tx) => {
          await radar.insertScans(siteId, op.source, op.slots.map(instant), null, tx);
          throw new Error('stopped half-way');
        }),
      ).rejects.toThrow('stopped half-way');
      return;
  }
}

describe('scan_hours, the stored scans per local hour', () => {
  it('equals a recount from the raw scan rows after any inserts, deletes, moves, offset changes and rollbacks', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(operation, { minLength: 1, maxLength: 8 }), async (ops) => {
        await handle.pg.query('delete from scans');
        for (const op of ops) {
          await apply(op);
          await expectSummaryEqualsRecount();
        }
      }),
      { numRuns: 25, seed: 20250601 },
    );
  }, 300_000);

  it('is filled for scans stored before it existed (the migration counts them)', async () => {
    await handle.pg.query('delete from scans');
    await radar.transaction((tx) =>
      radar.insertScans(sites[0], 'scan-inventory', [instant(10), instant(11), instant(500)], null, tx),
    );
    await handle.pg.query('delete from scan_hours');
    await handle.pg.query(
      `select scan_hours_recount(r.id, (select array_agg(distinct scan_local_day(s.time, r.utc_offset_minutes))
         from scans s where s.site_id = r.id)) from radar_sites r`,
    );
    await expectSummaryEqualsRecount();
    const stored = await outlook.scanHours(sites[0], 'cell-table', { from: null, to: null });
    expect(stored.counts.reduce((a, b) => a + b, 0)).toBe(3);
  });
});
