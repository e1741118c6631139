import { Inject, Injectable } from '@nestjs/common';
import { DATABASE, type DatabaseHandle } from '../database/database.js';
import { type ScanHours, scanHoursFromDays } from './engine/scan-hours.js';

export interface TimeRange {
  /** UTC ms, inclusive start and exclusive end; null = unbounded. */
  from: number | null;
  to: number | null;
}

export interface DataVersion {
  /** Changes with anything an outlook depends on. */
  all: string;
  /** Changes with the site or the blocks and districts. */
  geometry: string;
  /** Changes with the site, its regime settings or the anomaly fields. */
  regimes: string;
}

export interface SourceOnsets {
  source: string;
  /** Start times (UTC ms) and start blocks (−1 outside every block), aligned. */
  time: Float64Array;
  blockId: Int32Array;
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

  /** This process's count of writes to the database (see wrap()): unchanged means nothing was written. */
  writeCount(): number {
    return this.handle.writes();
  }

  /**
   * Moves on whenever any transaction that wrote anything has ended (the next transaction id to be
   * assigned: read-only statements get none). One function call, no table read.
   */
  async writeMark(): Promise<string> {
    const res = await this.handle.pg.query<{ m: string }>(
      'select txid_snapshot_xmax(txid_current_snapshot())::text as m',
    );
    return res.rows[0].m;
  }

  /**
   * A cheap fingerprint of everything an outlook depends on: the newest ids of tracks, cells, anomaly
   * fields and settings versions; the site's scans per hour as counted (so removed scans are seen too);
   * the last finished job (onsets are re-decided and anomaly fields replaced in place by jobs); the
   * blocks and districts, and the site's own row. Beside it, two narrower ones for work that new radar
   * data leaves valid: the block geometry as placed on the site, and the days' regimes (the site's
   * row, its regime settings and the anomaly fields: a replaced field takes its new upload's id, so
   * the sum of upload ids moves). Null when the site does not exist.
   */
  async dataVersion(siteId: number): Promise<DataVersion | null> {
    const res = await this.handle.pg.query<{
      site: string | null;
      data: string;
      geometry: string;
      regimes: string;
    }>(
      `select (select md5(r::text) from radar_sites r where r.id = $1) as site,
        (select coalesce(max(id), 0) from tracks) || '|' || (select coalesce(max(id), 0) from cells) || '|' ||
        (select coalesce(md5(string_agg(source || local_day || scans::text, ',' order by source, local_day)), '')
           from scan_hours where site_id = $1) || '|' || (select coalesce(max(id), 0) from anomaly_fields) || '|' ||
        (select coalesce(max(id), 0) from site_settings) || '|' || (select coalesce(max(id), 0) from regime_settings) || '|' ||
        (select coalesce(max(finished_at)::text, '') || count(*) from jobs) as data,
        (select coalesce(max(updated_at)::text, '') || count(*) || coalesce(max(id), 0) from blocks) || '|' ||
        (select coalesce(md5(string_agg(id || code || name, ',' order by id)), '') from districts) as geometry,
        (select coalesce(max(id), 0) || ':' || count(*) || ':' || coalesce(sum(upload_id), 0) from anomaly_fields) || '|' ||
        (select coalesce(max(id), 0) from regime_settings where site_id = $1) as regimes`,
      [siteId],
    );
    const row = res.rows[0];
    if (!row?.site) return null;
    const geometry = `${row.site}|${row.geometry}`;
    const regimes = `${row.site}|${row.regimes}`;
    return { all: `${row.site}|${row.data}|${row.geometry}`, geometry, regimes };
  }

  /**
   * Counted onsets of every stored source in the range, most first: start times and start blocks,
   * one row per source. What a block outlook without a neighbourhood counts, and the count of onsets
   * per source that picks the default source, come from this one read.
   */
  async onsetsBySource(siteId: number, r: TimeRange): Promise<SourceOnsets[]> {
    const t = range(r, 'first_time', 2);
    const res = await this.handle.pg.query<{ source: string; t: string; k: string }>(
      `select source,
              encode(string_agg(float8send(date_part('epoch', first_time) * 1000), ''::bytea), 'base64') as t,
              encode(string_agg(int4send(coalesce(start_block_id, -1)), ''::bytea), 'base64') as k
       from tracks where site_id = $1 and onset${t.sql} group by source`,
      [siteId, ...t.params],
    );
    return res.rows
      .map((row) => ({
        source: row.source,
        time: wholeMs(unpackFloat64(row.t)),
        blockId: unpackInt32(row.k),
      }))
      .sort((x, y) => y.time.length - x.time.length || (x.source < y.source ? -1 : 1));
  }

  /** Counted onsets of one source: start time, start block and start lon/lat. */
  async onsets(siteId: number, source: string, r: TimeRange): Promise<EventColumns> {
    const t = range(r, 'first_time', 3);
    return this.packedColumns(
      `from tracks where site_id = $1 and source = $2 and onset${t.sql}`,
      ['first_time', 'start_block_id', 'start_lon', 'start_lat'],
      [siteId, source, ...t.params],
    );
  }

  /** Cells of storm tracks of one source: scan time, block and position in the site plane (km). */
  async stormCells(siteId: number, source: string, r: TimeRange): Promise<EventColumns> {
    const t = range(r, 'c.scan_time', 3);
    return this.packedColumns(
      `from cells c join tracks k on k.id = c.track_id where c.site_id = $1 and c.source = $2 and k.is_storm${t.sql}`,
      ['c.scan_time', 'c.block_id', 'c.x_km', 'c.y_km'],
      [siteId, source, ...t.params],
    );
  }

  /**
   * Scans per local hour of each local day (the site's offset) that the counted source could have seen,
   * from the summary the database keeps as scans are stored (table scan_hours): a row per day, not per scan.
   */
  async scanHours(
    siteId: number,
    source: string,
    days: { from: number | null; to: number | null },
  ): Promise<ScanHours> {
    const params: unknown[] = [siteId, source];
    let where = '';
    if (days.from !== null) where += ` and local_day >= $${params.push(days.from)}`;
    if (days.to !== null) where += ` and local_day <= $${params.push(days.to)}`;
    const res = await this.handle.pg.query<{ local_day: number; scans: number[] }>(
      `select local_day, scans from scan_hours where site_id = $1 and source = $2${where} order by local_day`,
      params,
    );
    return scanHoursFromDays(
      res.rows.map((r) => r.local_day),
      res.rows.map((r) => r.scans),
    );
  }

  /**
   * Reads four columns (a time, a block id, two coordinates) as one packed binary value each: the
   * database hands back one row instead of tens of thousands, which it converts far faster. The
   * aggregates of one query see the rows in the same order, so the columns stay aligned. They travel
   * as base64 text: PGlite hands bytea results to JavaScript through a hex form several times slower.
   */
  private async packedColumns(fromWhere: string, [time, block, a, b]: string[], params: unknown[]) {
    const res = await this.handle.pg.query<Record<'t' | 'k' | 'a' | 'b', string | null>>(
      `select encode(string_agg(float8send(date_part('epoch', ${time}) * 1000), ''::bytea), 'base64') as t,
              encode(string_agg(int4send(coalesce(${block}, -1)), ''::bytea), 'base64') as k,
              encode(string_agg(float8send(${a}), ''::bytea), 'base64') as a,
              encode(string_agg(float8send(${b}), ''::bytea), 'base64') as b
       ${fromWhere}`,
      params,
    );
    const row = res.rows[0];
    return {
      time: wholeMs(unpackFloat64(row?.t ?? null)),
      blockId: unpackInt32(row?.k ?? null),
      a: unpackFloat64(row?.a ?? null),
      b: unpackFloat64(row?.b ?? null),
    };
  }
}

/** date_part gives seconds as a double; round the milliseconds so equal instants compare equal. */
function wholeMs(times: Float64Array): Float64Array {
  for (let i = 0; i < times.length; i++) times[i] = Math.round(times[i]);
  return times;
}

/** PostgreSQL's binary send format is big-endian. */
function unpackFloat64(base64: string | null): Float64Array {
  if (!base64) return new Float64Array(0);
  const bytes = Buffer.from(base64, 'base64');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const out = new Float64Array(bytes.byteLength / 8);
  for (let i = 0; i < out.length; i++) out[i] = view.getFloat64(i * 8, false);
  return out;
}

function unpackInt32(base64: string | null): Int32Array {
  if (!base64) return new Int32Array(0);
  const bytes = Buffer.from(base64, 'base64');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const out = new Int32Array(bytes.byteLength / 4);
  for (let i = 0; i < out.length; i++) out[i] = view.getInt32(i * 4, false);
  return out;
}
