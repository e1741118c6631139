import { Inject, Injectable } from '@nestjs/common';
import type { AtlasCellType, AtlasSource } from '@stormhour/shared';
import { and, asc, count, eq, gte, inArray, lt, max, type SQL, sql } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle } from '../database/database.js';
import { cells, scans, tracks } from '../database/schema.js';

/** Cell types as small codes in typed arrays: 0 = unknown. */
export const TYPE_CODES: Record<AtlasCellType, number> = { shallow: 1, congestus: 2, deep: 3 };
export const TYPE_OF_CODE: (AtlasCellType | null)[] = [null, 'shallow', 'congestus', 'deep'];
const typeCode = (t: string | null) => (t ? (TYPE_CODES[t as AtlasCellType] ?? 0) : 0);

/** A period's onset tracks, column by column; NaN where a value is missing, 0 where a block is. */
export interface OnsetColumns {
  n: number;
  trackId: Int32Array;
  timeMs: Float64Array;
  lat: Float64Array;
  lon: Float64Array;
  blockId: Int32Array;
  durationMin: Float64Array;
  speedMs: Float64Array;
  directionToDeg: Float64Array;
  maxAreaKm2: Float64Array;
  maxVolumeKm3: Float64Array;
  maxEchoTopKm: Float64Array;
  /** Largest 35 dBZ top of the track's cells. */
  maxTop35Km: Float64Array;
  cellType: Uint8Array;
}

export interface CellColumns {
  n: number;
  timeMs: Float64Array;
  blockId: Int32Array;
  cellType: Uint8Array;
  areaKm2: Float64Array;
  volumeKm3: Float64Array;
  top35Km: Float64Array;
  echoTopKm: Float64Array;
  vilMaxKgM2: Float64Array;
  precipFluxM3s: Float64Array;
}

export interface Period {
  fromMs?: number;
  toMs?: number;
}

const orNaN = (v: number | null) => (v === null ? Number.NaN : v);

/** Scans that say where a source could have seen storms: a cell table is judged with the inventory. */
export function scanSourcesOf(source: AtlasSource): ('scan-inventory' | AtlasSource)[] {
  return source === 'cell-table' ? ['scan-inventory', 'cell-table'] : [source];
}

/** Reads what the Atlas explores, in few queries, as columns. */
@Injectable()
export class AtlasRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  private trackPeriod(siteId: number, period: Period): SQL[] {
    const where: SQL[] = [eq(tracks.siteId, siteId), eq(tracks.onset, true)];
    if (period.fromMs !== undefined) where.push(gte(tracks.firstTime, new Date(period.fromMs)));
    if (period.toMs !== undefined) where.push(lt(tracks.firstTime, new Date(period.toMs)));
    return where;
  }

  /** Onset tracks per source in the period. */
  async onsetsBySource(siteId: number, period: Period): Promise<{ source: AtlasSource; onsets: number }[]> {
    const rows = await this.handle.db
      .select({ source: tracks.source, onsets: count() })
      .from(tracks)
      .where(and(...this.trackPeriod(siteId, period)))
      .groupBy(tracks.source);
    return rows.map((r) => ({ source: r.source as AtlasSource, onsets: Number(r.onsets) }));
  }

  /** Changes whenever a source's tracks are re-made or their onsets re-decided: keys the service's cache. */
  async fingerprint(siteId: number, source: AtlasSource): Promise<string> {
    const [row] = await this.handle.db
      .select({
        n: count(),
        onsets: sql<number>`count(*) filter (where ${tracks.onset})`,
        last: max(tracks.id),
      })
      .from(tracks)
      .where(and(eq(tracks.siteId, siteId), eq(tracks.source, source)));
    return `${row?.n ?? 0}/${row?.onsets ?? 0}/${row?.last ?? 0}`;
  }

  async onsets(siteId: number, source: AtlasSource, period: Period): Promise<OnsetColumns> {
    // Tops come in a query of their own: joining the grouped cells took PGlite a minute on a season.
    const tops = await this.handle.db
      .select({ trackId: cells.trackId, top35: max(cells.top35Km) })
      .from(cells)
      .where(and(eq(cells.siteId, siteId), eq(cells.source, source)))
      .groupBy(cells.trackId);
    const topOf = new Map(tops.map((t) => [t.trackId, t.top35 === null ? null : Number(t.top35)]));
    const rows = await this.handle.db
      .select({
        id: tracks.id,
        firstTime: tracks.firstTime,
        lat: tracks.startLat,
        lon: tracks.startLon,
        blockId: tracks.startBlockId,
        durationMin: tracks.durationMin,
        speedMs: tracks.speedMs,
        directionToDeg: tracks.directionToDeg,
        maxAreaKm2: tracks.maxAreaKm2,
        maxVolumeKm3: tracks.maxVolumeKm3,
        maxEchoTopKm: tracks.maxEchoTopKm,
        cellType: tracks.cellType,
      })
      .from(tracks)
      .where(and(...this.trackPeriod(siteId, period), eq(tracks.source, source)))
      .orderBy(asc(tracks.firstTime), asc(tracks.id));
    const n = rows.length;
    const c: OnsetColumns = {
      n,
      trackId: new Int32Array(n),
      timeMs: new Float64Array(n),
      lat: new Float64Array(n),
      lon: new Float64Array(n),
      blockId: new Int32Array(n),
      durationMin: new Float64Array(n),
      speedMs: new Float64Array(n),
      directionToDeg: new Float64Array(n),
      maxAreaKm2: new Float64Array(n),
      maxVolumeKm3: new Float64Array(n),
      maxEchoTopKm: new Float64Array(n),
      maxTop35Km: new Float64Array(n),
      cellType: new Uint8Array(n),
    };
    rows.forEach((r, i) => {
      c.trackId[i] = r.id;
      c.timeMs[i] = r.firstTime.getTime();
      c.lat[i] = r.lat;
      c.lon[i] = r.lon;
      c.blockId[i] = r.blockId ?? 0;
      c.durationMin[i] = r.durationMin;
      c.speedMs[i] = orNaN(r.speedMs);
      c.directionToDeg[i] = orNaN(r.directionToDeg);
      c.maxAreaKm2[i] = r.maxAreaKm2;
      c.maxVolumeKm3[i] = orNaN(r.maxVolumeKm3);
      c.maxEchoTopKm[i] = orNaN(r.maxEchoTopKm);
      c.maxTop35Km[i] = orNaN(topOf.get(r.id) ?? null);
      c.cellType[i] = typeCode(r.cellType);
    });
    return c;
  }

  /** Every cell of the source in the period (not only those of onset tracks). */
  async cells(siteId: number, source: AtlasSource, period: Period): Promise<CellColumns> {
    const where: SQL[] = [eq(cells.siteId, siteId), eq(cells.source, source)];
    if (period.fromMs !== undefined) where.push(gte(cells.scanTime, new Date(period.fromMs)));
    if (period.toMs !== undefined) where.push(lt(cells.scanTime, new Date(period.toMs)));
    const rows = await this.handle.db
      .select({
        scanTime: cells.scanTime,
        blockId: cells.blockId,
        cellType: cells.cellType,
        areaKm2: cells.areaKm2,
        volumeKm3: cells.volumeKm3,
        top35Km: cells.top35Km,
        echoTopKm: cells.echoTopKm,
        vilMaxKgM2: cells.vilMaxKgM2,
        precipFluxM3s: cells.precipFluxM3s,
      })
      .from(cells)
      .where(and(...where));
    const n = rows.length;
    const c: CellColumns = {
      n,
      timeMs: new Float64Array(n),
      blockId: new Int32Array(n),
      cellType: new Uint8Array(n),
      areaKm2: new Float64Array(n),
      volumeKm3: new Float64Array(n),
      top35Km: new Float64Array(n),
      echoTopKm: new Float64Array(n),
      vilMaxKgM2: new Float64Array(n),
      precipFluxM3s: new Float64Array(n),
    };
    rows.forEach((r, i) => {
      c.timeMs[i] = r.scanTime.getTime();
      c.blockId[i] = r.blockId ?? 0;
      c.cellType[i] = typeCode(r.cellType);
      c.areaKm2[i] = r.areaKm2;
      c.volumeKm3[i] = orNaN(r.volumeKm3);
      c.top35Km[i] = orNaN(r.top35Km);
      c.echoTopKm[i] = orNaN(r.echoTopKm);
      c.vilMaxKgM2[i] = orNaN(r.vilMaxKgM2);
      c.precipFluxM3s[i] = orNaN(r.precipFluxM3s);
    });
    return c;
  }

  /** Local dates (YYYY-MM-DD) with scans that source could have seen in the period: the days on record. */
  async scanDates(
    siteId: number,
    source: AtlasSource,
    period: Period,
    utcOffsetMinutes: number,
  ): Promise<string[]> {
    const where: SQL[] = [eq(scans.siteId, siteId), inArray(scans.source, scanSourcesOf(source))];
    if (period.fromMs !== undefined) where.push(gte(scans.time, new Date(period.fromMs)));
    if (period.toMs !== undefined) where.push(lt(scans.time, new Date(period.toMs)));
    const local = sql<string>`to_char((${scans.time} at time zone 'UTC') + make_interval(mins => ${utcOffsetMinutes}), 'YYYY-MM-DD')`;
    const rows = await this.handle.db
      .selectDistinct({ date: local })
      .from(scans)
      .where(and(...where));
    return rows.map((r) => r.date);
  }
}
