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
   * Scan times from the given sources (UTC ms), sorted, each once. Sorted and deduplicated here rather
   * than by the database: a season of 30 000 scans per source is quicker to sort as a typed array.
   */
  async scanTimes(siteId: number, sources: string[], r: TimeRange): Promise<Float64Array> {
    const t = range(r, 'time', 3);
    const res = await this.handle.pg.query<{ t: Uint8Array | null }>(
      `select string_agg(float8send(date_part('epoch', time) * 1000), ''::bytea) as t from scans
       where site_id = $1 and source = any($2::text[])${t.sql}`,
      [siteId, sources, ...t.params],
    );
    const times = wholeMs(unpackFloat64(res.rows[0]?.t ?? null)).sort();
    let kept = 0;
    for (let i = 0; i < times.length; i++)
      if (i === 0 || times[i] !== times[kept - 1]) times[kept++] = times[i];
    return times.slice(0, kept);
  }

  /**
   * Reads four columns (a time, a block id, two coordinates) as one packed binary value each: the
   * database hands back one row instead of tens of thousands, which it converts far faster. The
   * aggregates of one query see the rows in the same order, so the columns stay aligned.
   */
  private async packedColumns(fromWhere: string, [time, block, a, b]: string[], params: unknown[]) {
    const res = await this.handle.pg.query<Record<'t' | 'k' | 'a' | 'b', Uint8Array | null>>(
      `select string_agg(float8send(date_part('epoch', ${time}) * 1000), ''::bytea) as t,
              string_agg(int4send(coalesce(${block}, -1)), ''::bytea) as k,
              string_agg(float8send(${a}), ''::bytea) as a,
              string_agg(float8send(${b}), ''::bytea) as b
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
function unpackFloat64(bytes: Uint8Array | null): Float64Array {
  if (!bytes) return new Float64Array(0);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const out = new Float64Array(bytes.byteLength / 8);
  for (let i = 0; i < out.length; i++) out[i] = view.getFloat64(i * 8, false);
  return out;
}

function unpackInt32(bytes: Uint8Array | null): Int32Array {
  if (!bytes) return new Int32Array(0);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const out = new Int32Array(bytes.byteLength / 4);
  for (let i = 0; i < out.length; i++) out[i] = view.getInt32(i * 4, false);
  return out;
}
