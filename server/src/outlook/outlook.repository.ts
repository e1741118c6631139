import { Inject, Injectable } from '@nestjs/common';
import { DATABASE, type DatabaseHandle } from '../database/database.js';

export interface TimeRange {
  /** UTC ms, inclusive start and exclusive end; null = unbounded. */
  from: number | null;
  to: number | null;
}

export interface EventColumns {
  time: Float64Array;
  blockId: Int32Array;
  /** Where the event was, in the site plane (km) or as lon/lat when the plane is not stored. */
  a: Float64Array;
  b: Float64Array;
}

const range = (r: TimeRange, column: string, first: number) => {
  const where: string[] = [];
  const params: string[] = [];
  if (r.from !== null) {
    params.push(new Date(r.from).toISOString());
    where.push(`${column} >= $${first + params.length - 1}`);
  }
  if (r.to !== null) {
    params.push(new Date(r.to).toISOString());
    where.push(`${column} < $${first + params.length - 1}`);
  }
  return { sql: where.length ? ` and ${where.join(' and ')}` : '', params };
};

/**
 * Reads for the outlook: whole columns at once (rows as arrays, times as epoch ms), so the counting
 * happens in the process over typed arrays rather than in GROUP BY queries per request.
 */
@Injectable()
export class OutlookRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  /**
   * A cheap fingerprint of everything an outlook depends on: the newest ids of tracks, cells, scans,
   * anomaly fields and settings versions, the last finished job (onsets are re-decided and anomaly
   * fields replaced in place by jobs), the blocks and districts, and the site's own row.
   * Null when the site does not exist.
   */
  async dataVersion(siteId: number): Promise<string | null> {
    const res = await this.handle.pg.query<{ v: string | null }>(
      `select (select md5(r::text) from radar_sites r where r.id = $1) || '|' ||
        (select coalesce(max(id), 0) from tracks) || '|' || (select coalesce(max(id), 0) from cells) || '|' ||
        (select coalesce(max(id), 0) from scans) || '|' || (select coalesce(max(id), 0) from anomaly_fields) || '|' ||
        (select coalesce(max(id), 0) from site_settings) || '|' || (select coalesce(max(id), 0) from regime_settings) || '|' ||
        (select coalesce(max(finished_at)::text, '') || count(*) from jobs) || '|' ||
        (select coalesce(max(updated_at)::text, '') || count(*) || coalesce(max(id), 0) from blocks) || '|' ||
        (select coalesce(md5(string_agg(id || code || name, ',' order by id)), '') from districts) as v`,
      [siteId],
    );
    return res.rows[0]?.v ?? null;
  }

  /** Counted onsets per stored source in the range, most first. */
  async onsetsBySource(siteId: number, r: TimeRange): Promise<{ source: string; onsets: number }[]> {
    const t = range(r, 'first_time', 2);
    const res = await this.handle.pg.query<{ source: string; onsets: number }>(
      `select source, count(*)::int as onsets from tracks where site_id = $1 and onset${t.sql}
       group by source order by onsets desc, source`,
      [siteId, ...t.params],
    );
    return res.rows;
  }

  /** Counted onsets of one source: start time, start block and start lon/lat. */
  async onsets(siteId: number, source: string, r: TimeRange): Promise<EventColumns> {
    const t = range(r, 'first_time', 3);
    const res = await this.handle.pg.query<[number, number | null, number, number]>(
      `select (extract(epoch from first_time) * 1000)::float8, start_block_id, start_lon, start_lat
       from tracks where site_id = $1 and source = $2 and onset${t.sql}`,
      [siteId, source, ...t.params],
      { rowMode: 'array' },
    );
    return columns(res.rows);
  }

  /** Cells of storm tracks of one source: scan time, block and position in the site plane (km). */
  async stormCells(siteId: number, source: string, r: TimeRange): Promise<EventColumns> {
    const t = range(r, 'c.scan_time', 3);
    const res = await this.handle.pg.query<[number, number | null, number, number]>(
      `select (extract(epoch from c.scan_time) * 1000)::float8, c.block_id, c.x_km, c.y_km
       from cells c join tracks k on k.id = c.track_id
       where c.site_id = $1 and c.source = $2 and k.is_storm${t.sql}`,
      [siteId, source, ...t.params],
      { rowMode: 'array' },
    );
    return columns(res.rows);
  }

  /** Distinct scan times from the given sources, sorted (UTC ms). */
  async scanTimes(siteId: number, sources: string[], r: TimeRange): Promise<Float64Array> {
    const t = range(r, 'time', 3);
    const res = await this.handle.pg.query<[number]>(
      `select distinct (extract(epoch from time) * 1000)::float8 as t from scans
       where site_id = $1 and source = any($2::text[])${t.sql} order by t`,
      [siteId, sources, ...t.params],
      { rowMode: 'array' },
    );
    return Float64Array.from(res.rows, (row) => row[0]);
  }
}

function columns(rows: [number, number | null, number, number][]): EventColumns {
  const out: EventColumns = {
    time: new Float64Array(rows.length),
    blockId: new Int32Array(rows.length),
    a: new Float64Array(rows.length),
    b: new Float64Array(rows.length),
  };
  rows.forEach((row, i) => {
    out.time[i] = row[0];
    out.blockId[i] = row[1] ?? -1;
    out.a[i] = row[2];
    out.b[i] = row[3];
  });
  return out;
}
