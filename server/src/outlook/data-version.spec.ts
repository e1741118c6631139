import { PGlite } from '@electric-sql/pglite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DatabaseHandle, migrateDatabase, wrap } from '../database/database.js';
import { type DataVersion, OutlookRepository } from './outlook.repository.js';

/**
 * The outlook keeps three things between requests, each checked against its own fingerprint: the
 * answers and loaded columns (everything), the blocks as placed on the site (geometry) and the days'
 * regimes. Each fingerprint must move with every change its work depends on, and the two narrower ones
 * must stay put when only radar data arrives (that is what they are for).
 */
describe('OutlookRepository.dataVersion', () => {
  let handle: DatabaseHandle;
  let repo: OutlookRepository;
  let siteId: number;
  let otherSiteId: number;

  const sql = (text: string, params: unknown[] = []) => handle.pg.query(text, params);
  const version = async () => (await repo.dataVersion(siteId)) as DataVersion;
  /** Which of the three fingerprints a change moved. */
  async function moved(change: () => Promise<unknown>) {
    const before = await version();
    await change();
    const after = await version();
    return {
      all: after.all !== before.all,
      geometry: after.geometry !== before.geometry,
      regimes: after.regimes !== before.regimes,
    };
  }
  const field = (date: string, uploadId: number | null) =>
    sql(
      `insert into anomaly_fields (variable, level_hpa, date, nx, ny, lon0, lat0, d_lon, d_lat, values, source_file, upload_id)
       values ('q', 850, $1, 1, 1, 80, 10, 1, 1, '\\x00000000', 'made-in-test.csv', $2)
       on conflict (product, variable, level_hpa, date) do update set values = excluded.values, upload_id = excluded.upload_id`,
      [date, uploadId],
    );
  const upload = async () =>
    (
      await sql(
        `insert into uploads (kind, file_name, sha256, size_bytes) values ('anomaly', 'a.csv', md5(random()::text), 1) returning id`,
      )
    ).rows[0] as { id: number };

  beforeAll(async () => {
    handle = wrap(await PGlite.create());
    await migrateDatabase(handle);
    repo = new OutlookRepository(handle);
    const site = (code: string) =>
      sql(
        `insert into radar_sites (code, name, lat, lon, altitude_m, range_km, interval_min, utc_offset_minutes)
         values ($1, $1, 10, 80, 100, 150, 6, 330) returning id`,
        [code],
      );
    siteId = ((await site('EAST')).rows[0] as { id: number }).id;
    otherSiteId = ((await site('WEST')).rows[0] as { id: number }).id;
    await sql(`insert into districts (code, name) values ('D1', 'First')`);
    await sql(
      `insert into blocks (code, name, district_id, geometry, min_lon, min_lat, max_lon, max_lat, centroid_lon, centroid_lat, area_km2)
       select 'B1', 'One', id, '{"type":"Polygon","coordinates":[[[80,10],[80.1,10],[80.1,10.1],[80,10]]]}', 80, 10, 80.1, 10.1, 80.05, 10.05, 60 from districts`,
    );
    await field('2025-06-01', null);
  }, 60_000);
  afterAll(() => handle?.pg.close());

  it('is null for a site that does not exist', async () => {
    expect(await repo.dataVersion(999_999)).toBeNull();
  });

  it('moves only the full fingerprint when radar data arrives', async () => {
    expect(
      await moved(() =>
        sql(`insert into scans (site_id, source, time) values ($1, 'scan-inventory', now())`, [siteId]),
      ),
    ).toEqual({ all: true, geometry: false, regimes: false });
  });

  it('moves the geometry fingerprint when a block or district changes, or the site moves', async () => {
    expect(
      await moved(() => sql(`update blocks set name = 'Renamed', updated_at = now() + interval '1 s'`)),
    ).toEqual({
      all: true,
      geometry: true,
      regimes: false,
    });
    expect(await moved(() => sql(`update districts set name = 'Renamed'`))).toMatchObject({
      all: true,
      geometry: true,
    });
    expect(await moved(() => sql(`update radar_sites set range_km = 120 where id = $1`, [siteId]))).toEqual({
      all: true,
      geometry: true,
      regimes: true,
    });
  });

  it('moves the regimes fingerprint with a new field, a field replaced in place, or new regime settings', async () => {
    expect(await moved(() => field('2025-06-02', null))).toEqual({
      all: true,
      geometry: false,
      regimes: true,
    });
    // A later upload of the same day replaces the row in place: same id, same count.
    const { id } = await upload();
    expect(await moved(() => field('2025-06-02', id))).toMatchObject({ regimes: true });
    expect(
      await moved(() =>
        sql(`insert into regime_settings (site_id, version, settings) values ($1, 1, '{}')`, [siteId]),
      ),
    ).toEqual({ all: true, geometry: false, regimes: true });
    // Another site's regime settings leave this site's regimes alone.
    expect(
      await moved(() =>
        sql(`insert into regime_settings (site_id, version, settings) values ($1, 1, '{}')`, [otherSiteId]),
      ),
    ).toMatchObject({ regimes: false });
  });
});
