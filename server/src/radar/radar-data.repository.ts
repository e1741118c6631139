import { Inject, Injectable } from '@nestjs/common';
import type { CellView, Page, TrackView } from '@stormhour/shared';
import { and, asc, desc, eq, gte, inArray, lte, type SQL, sql } from 'drizzle-orm';
import { DATABASE, type DatabaseHandle, type Executor } from '../database/database.js';
import { blocks, cells, scans, tracks } from '../database/schema.js';

export type ScanSource = (typeof scans.$inferInsert)['source'];
export type NewTrackRow = typeof tracks.$inferInsert;
export type NewCellRow = typeof cells.$inferInsert;
type TrackRow = typeof tracks.$inferSelect;
type CellRow = typeof cells.$inferSelect;

/** PGlite takes one statement's parameters at a time; batches keep each insert well under its limits. */
const BATCH = 500;

export interface TrackFilter {
  siteId: number;
  from?: Date;
  to?: Date;
  blockId?: number;
  onsetOnly?: boolean;
  stormsOnly?: boolean;
  type?: string;
  minDurationMin?: number;
  sort: 'firstTime' | 'durationMin' | 'maxVolumeKm3' | 'maxEchoTopKm' | 'speedMs';
  order: 'asc' | 'desc';
  offset: number;
  limit: number;
}

export function toTrackView(r: TrackRow, startBlockCode: string | null): TrackView {
  return {
    id: r.id,
    siteId: r.siteId,
    source: r.source as TrackView['source'],
    externalId: r.externalId,
    firstTime: r.firstTime.toISOString(),
    lastTime: r.lastTime.toISOString(),
    scanCount: r.scanCount,
    durationMin: r.durationMin,
    speedMs: r.speedMs,
    directionToDeg: r.directionToDeg,
    isStorm: r.isStorm,
    onset: r.onset,
    notOnsetReason: r.notOnsetReason as TrackView['notOnsetReason'],
    parentTrackId: r.parentTrackId,
    mergedIntoTrackId: r.mergedIntoTrackId,
    startLat: r.startLat,
    startLon: r.startLon,
    startBlockId: r.startBlockId,
    startBlockCode,
    maxVolumeKm3: r.maxVolumeKm3,
    maxAreaKm2: r.maxAreaKm2,
    maxEchoTopKm: r.maxEchoTopKm,
    cellType: r.cellType as TrackView['cellType'],
    settingsVersion: r.settingsVersion,
  };
}

export function toCellView(r: CellRow): CellView {
  return {
    id: r.id,
    scanTime: r.scanTime.toISOString(),
    trackId: r.trackId,
    lat: r.lat,
    lon: r.lon,
    areaKm2: r.areaKm2,
    volumeKm3: r.volumeKm3,
    maxDbz: r.maxDbz,
    top35Km: r.top35Km,
    echoTopKm: r.echoTopKm,
    coreVolumeKm3: r.coreVolumeKm3,
    vilMaxKgM2: r.vilMaxKgM2,
    rainRateMaxMmH: r.rainRateMaxMmH,
    precipFluxM3s: r.precipFluxM3s,
    semiMajorKm: r.semiMajorKm,
    semiMinorKm: r.semiMinorKm,
    orientationDeg: r.orientationDeg,
    cellType: r.cellType as CellView['cellType'],
    blockId: r.blockId,
  };
}

@Injectable()
export class RadarDataRepository {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.handle.db.transaction(work);
  }

  /** Adds scan times learnt from one source; times that source already gave are left as they are. */
  async insertScans(
    siteId: number,
    source: ScanSource,
    times: number[],
    uploadId: number | null,
    tx: Executor,
  ): Promise<number> {
    let added = 0;
    for (let i = 0; i < times.length; i += BATCH) {
      const rows = times.slice(i, i + BATCH).map((t) => ({ siteId, source, time: new Date(t), uploadId }));
      const inserted = await tx.insert(scans).values(rows).onConflictDoNothing().returning({ id: scans.id });
      added += inserted.length;
    }
    return added;
  }

  async insertTracks(rows: NewTrackRow[], tx: Executor): Promise<number[]> {
    const ids: number[] = [];
    for (let i = 0; i < rows.length; i += BATCH) {
      const inserted = await tx
        .insert(tracks)
        .values(rows.slice(i, i + BATCH))
        .returning({ id: tracks.id });
      ids.push(...inserted.map((r) => r.id));
    }
    return ids;
  }

  async insertCells(rows: NewCellRow[], tx: Executor): Promise<void> {
    for (let i = 0; i < rows.length; i += BATCH) await tx.insert(cells).values(rows.slice(i, i + BATCH));
  }

  /** Links parent/merge references once all of a file's tracks have ids. */
  async linkTracks(links: { id: number; parent: number | null; mergedInto: number | null }[], tx: Executor) {
    for (const l of links) {
      if (l.parent === null && l.mergedInto === null) continue;
      await tx
        .update(tracks)
        .set({ parentTrackId: l.parent, mergedIntoTrackId: l.mergedInto })
        .where(eq(tracks.id, l.id));
    }
  }

  /** Distinct scan times of a site, from the given sources (all when none are named), sorted. */
  async siteScanTimes(
    siteId: number,
    sources?: ScanSource[],
    executor: Executor = this.handle.db,
  ): Promise<Float64Array> {
    const where = sources
      ? and(eq(scans.siteId, siteId), inArray(scans.source, sources))
      : eq(scans.siteId, siteId);
    const rows = await executor
      .selectDistinct({ time: scans.time })
      .from(scans)
      .where(where)
      .orderBy(asc(scans.time));
    return Float64Array.from(rows, (r) => r.time.getTime());
  }

  async tracksForStarts(siteId: number, source: string, executor: Executor = this.handle.db) {
    return executor
      .select({
        id: tracks.id,
        parentTrackId: tracks.parentTrackId,
        firstTime: tracks.firstTime,
        startLat: tracks.startLat,
        startLon: tracks.startLon,
        isStorm: tracks.isStorm,
        onset: tracks.onset,
        notOnsetReason: tracks.notOnsetReason,
      })
      .from(tracks)
      .where(and(eq(tracks.siteId, siteId), eq(tracks.source, source)));
  }

  /** Writes changed onset decisions in one statement per batch. */
  async updateStarts(
    changes: { id: number; onset: boolean; reason: string | null }[],
    tx: Executor,
  ): Promise<void> {
    for (let i = 0; i < changes.length; i += BATCH) {
      const values = sql.join(
        changes.slice(i, i + BATCH).map((c) => sql`(${c.id}::int, ${c.onset}::boolean, ${c.reason}::text)`),
        sql`, `,
      );
      await tx.execute(sql`
        update ${tracks} set onset = v.onset, not_onset_reason = v.reason
        from (values ${values}) as v(id, onset, reason) where ${tracks.id} = v.id`);
    }
  }

  async deleteTracks(siteId: number, source: string, tx: Executor): Promise<void> {
    await tx
      .update(cells)
      .set({ trackId: null })
      .where(and(eq(cells.siteId, siteId), eq(cells.source, source)));
    await tx.delete(tracks).where(and(eq(tracks.siteId, siteId), eq(tracks.source, source)));
  }

  async cellsOf(siteId: number, source: string, executor: Executor) {
    return executor
      .select()
      .from(cells)
      .where(and(eq(cells.siteId, siteId), eq(cells.source, source)))
      .orderBy(asc(cells.scanTime), asc(cells.id));
  }

  async setCellTrack(cellIds: number[], trackId: number, tx: Executor): Promise<void> {
    await tx.update(cells).set({ trackId }).where(inArray(cells.id, cellIds));
  }

  async trackSummaries(ids: number[]) {
    if (ids.length === 0) return [];
    const out: { isStorm: boolean; onset: boolean; notOnsetReason: string | null }[] = [];
    for (let i = 0; i < ids.length; i += BATCH) {
      out.push(
        ...(await this.handle.db
          .select({ isStorm: tracks.isStorm, onset: tracks.onset, notOnsetReason: tracks.notOnsetReason })
          .from(tracks)
          .where(inArray(tracks.id, ids.slice(i, i + BATCH)))),
      );
    }
    return out;
  }

  async cellsPerScan(siteId: number, source: string, from: Date, to: Date) {
    const rows = await this.handle.db.execute<{ time: string; cells: number }>(sql`
      select s.time as time, count(c.id)::int as cells
      from (select distinct time from ${scans} where site_id = ${siteId}
            and time between ${from.toISOString()} and ${to.toISOString()}) s
      left join ${cells} c on c.site_id = ${siteId} and c.scan_time = s.time and c.source = ${source}
      group by s.time order by s.time`);
    return rows.rows.map((r) => ({ time: new Date(r.time).getTime(), cells: Number(r.cells) }));
  }

  async listTracks(f: TrackFilter): Promise<Page<TrackView>> {
    const where: SQL[] = [eq(tracks.siteId, f.siteId)];
    if (f.from) where.push(gte(tracks.firstTime, f.from));
    if (f.to) where.push(lte(tracks.firstTime, f.to));
    if (f.blockId) where.push(eq(tracks.startBlockId, f.blockId));
    if (f.onsetOnly) where.push(eq(tracks.onset, true));
    if (f.stormsOnly) where.push(eq(tracks.isStorm, true));
    if (f.type) where.push(eq(tracks.cellType, f.type));
    if (f.minDurationMin !== undefined) where.push(gte(tracks.durationMin, f.minDurationMin));
    const column = tracks[f.sort];
    const ordering = f.order === 'desc' ? sql`${column} desc nulls last` : sql`${column} asc nulls last`;
    const [rows, [{ total }]] = await Promise.all([
      this.handle.db
        .select({ track: tracks, blockCode: blocks.code })
        .from(tracks)
        .leftJoin(blocks, eq(blocks.id, tracks.startBlockId))
        .where(and(...where))
        .orderBy(ordering, asc(tracks.id))
        .offset(f.offset)
        .limit(f.limit),
      this.handle.db
        .select({ total: sql<number>`count(*)::int` })
        .from(tracks)
        .where(and(...where)),
    ]);
    return {
      items: rows.map((r) => toTrackView(r.track, r.blockCode)),
      total,
      offset: f.offset,
      limit: f.limit,
    };
  }

  async findTrack(id: number) {
    const [row] = await this.handle.db
      .select({ track: tracks, blockCode: blocks.code })
      .from(tracks)
      .leftJoin(blocks, eq(blocks.id, tracks.startBlockId))
      .where(eq(tracks.id, id));
    if (!row) return undefined;
    const trackCells = await this.handle.db
      .select()
      .from(cells)
      .where(eq(cells.trackId, id))
      .orderBy(asc(cells.scanTime));
    return { track: toTrackView(row.track, row.blockCode), cells: trackCells.map(toCellView) };
  }

  async cellsAt(siteId: number, scanTime: Date): Promise<CellView[]> {
    const rows = await this.handle.db
      .select()
      .from(cells)
      .where(and(eq(cells.siteId, siteId), eq(cells.scanTime, scanTime)))
      .orderBy(desc(cells.areaKm2));
    return rows.map(toCellView);
  }
}
