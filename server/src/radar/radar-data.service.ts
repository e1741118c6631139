import { Injectable, NotFoundException } from '@nestjs/common';
import type { TrackDetail } from '@stormhour/shared';
import type { Executor } from '../database/database.js';
import {
  type PreparedCell,
  type PreparedTrack,
  type SiteContext,
  tracksByEngine,
} from '../intake/prepare-cells.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import { BlockLocator } from './engine/block-locator.js';
import { azimuthOf } from './engine/coverage.js';
import { classifyStart } from './engine/starts.js';
import {
  type NewCellRow,
  RadarDataRepository,
  type ScanSource,
  type TrackFilter,
} from './radar-data.repository.js';

export type CellSource = 'volume' | 'column-max' | 'cell-table';

export interface StoreBatch {
  siteId: number;
  source: CellSource;
  uploadId: number | null;
  settingsVersion: number;
  cells: PreparedCell[];
  /** Cell tables bring their tracks; volume cells are tracked afterwards across the site's scans. */
  tracks: PreparedTrack[];
}

/** Stores and reads cells and tracks; keeps onset decisions in step with the site's scan inventory. */
@Injectable()
export class RadarDataService {
  constructor(
    private readonly data: RadarDataRepository,
    private readonly regions: RegionsRepository,
  ) {}

  transaction<T>(work: (tx: Executor) => Promise<T>): Promise<T> {
    return this.data.transaction(work);
  }

  insertScans(siteId: number, source: ScanSource, times: number[], uploadId: number | null, tx: Executor) {
    return this.data.insertScans(siteId, source, times, uploadId, tx);
  }

  async blockLocator(): Promise<BlockLocator> {
    const blocks = await this.regions.listBlocksWithGeometry({});
    return new BlockLocator(blocks.map((b) => ({ id: b.id, bbox: b.bbox, geometry: b.geometry })));
  }

  /** Writes a batch's tracks and cells (inside the caller's transaction); returns the new track ids. */
  async store(batch: StoreBatch, locator: BlockLocator, tx: Executor): Promise<number[]> {
    const blockOf = batch.cells.map((c) => locator.locate(c.lon, c.lat));
    const trackIds = await this.insertTracks(
      batch.siteId,
      batch.source,
      batch.settingsVersion,
      batch.tracks,
      (t) => blockOf[t.cells[0]],
      tx,
    );
    const trackOfCell = new Map<number, number>();
    batch.tracks.forEach((t, k) => {
      for (const i of t.cells) trackOfCell.set(i, trackIds[k]);
    });
    await this.data.insertCells(
      batch.cells.map(
        (c, i): NewCellRow => ({
          siteId: batch.siteId,
          source: batch.source,
          scanTime: new Date(c.time),
          uploadId: batch.uploadId,
          settingsVersion: batch.settingsVersion,
          trackId: trackOfCell.get(i) ?? null,
          externalTrackId: c.externalTrackId,
          parentExternalTrackId: c.parentExternalTrackId,
          lat: c.lat,
          lon: c.lon,
          xKm: c.xKm,
          yKm: c.yKm,
          areaKm2: c.areaKm2,
          volumeKm3: c.volumeKm3,
          maxDbz: c.maxDbz,
          maxDbzHeightKm: c.maxDbzHeightKm ?? null,
          top35Km: c.top35Km,
          echoTopKm: c.echoTopKm,
          coreVolumeKm3: c.coreVolumeKm3,
          vilMaxKgM2: c.vilMaxKgM2,
          vilMassKg: c.vilMassKg ?? null,
          rainRateMaxMmH: c.rainRateMaxMmH ?? null,
          precipFluxM3s: c.precipFluxM3s ?? null,
          semiMajorKm: c.semiMajorKm ?? null,
          semiMinorKm: c.semiMinorKm ?? null,
          orientationDeg: c.orientationDeg ?? null,
          cellType: c.cellType,
          blockId: blockOf[i],
        }),
      ),
      tx,
    );
    return trackIds;
  }

  /**
   * Re-tracks every cell the engine found in the site's scans of one kind in time order, so scans that arrive late or out of
   * order join the right tracks. Returns the new track ids.
   */
  async retrackScans(
    siteId: number,
    source: 'volume' | 'column-max',
    ctx: SiteContext,
    settingsVersion: number,
    locator: BlockLocator,
    tx: Executor,
    /** Tracks the cells; the intake job passes its worker thread's. */
    track: (cells: PreparedCell[]) => Promise<PreparedTrack[]> = async (cells) => tracksByEngine(cells, ctx),
  ) {
    await this.data.deleteTracks(siteId, source, tx);
    const rows = await this.data.cellsOf(siteId, source, tx);
    if (rows.length === 0) return [];
    const cells: PreparedCell[] = rows.map((r) => ({
      time: r.scanTime.getTime(),
      lon: r.lon,
      lat: r.lat,
      xKm: r.xKm,
      yKm: r.yKm,
      areaKm2: r.areaKm2,
      volumeKm3: r.volumeKm3,
      maxDbz: r.maxDbz,
      top35Km: r.top35Km,
      echoTopKm: r.echoTopKm,
      coreVolumeKm3: r.coreVolumeKm3,
      vilMaxKgM2: r.vilMaxKgM2,
      cellType: r.cellType as PreparedCell['cellType'],
      externalTrackId: null,
      parentExternalTrackId: null,
    }));
    const tracks = await track(cells);
    const ids = await this.insertTracks(
      siteId,
      source,
      settingsVersion,
      tracks,
      (t) => locator.locate(t.startLon, t.startLat),
      tx,
    );
    for (const [k, t] of tracks.entries())
      await this.data.setCellTrack(
        t.cells.map((i) => rows[i].id),
        ids[k],
        tx,
      );
    return ids;
  }

  /** Inserts tracks, then links splits and mergers once every track has its id. */
  private async insertTracks(
    siteId: number,
    source: CellSource,
    settingsVersion: number,
    tracks: PreparedTrack[],
    startBlock: (t: PreparedTrack) => number | null,
    tx: Executor,
  ): Promise<number[]> {
    const ids = await this.data.insertTracks(
      tracks.map((t) => ({
        siteId,
        source,
        settingsVersion,
        externalId: t.externalId,
        firstTime: new Date(t.firstTime),
        lastTime: new Date(t.lastTime),
        scanCount: t.scanCount,
        durationMin: t.durationMin,
        speedMs: t.speedMs,
        directionToDeg: t.directionToDeg,
        isStorm: t.isStorm,
        // Decided by recomputeStarts once the batch is in, against the whole inventory.
        onset: false,
        notOnsetReason: null,
        startLat: t.startLat,
        startLon: t.startLon,
        startBlockId: startBlock(t),
        maxVolumeKm3: t.maxVolumeKm3,
        maxAreaKm2: t.maxAreaKm2,
        maxEchoTopKm: t.maxEchoTopKm,
        cellType: t.cellType,
      })),
      tx,
    );
    await this.data.linkTracks(
      tracks.map((t, k) => ({
        id: ids[k],
        parent: t.parent === null ? null : ids[t.parent],
        mergedInto: t.mergedInto === null ? null : ids[t.mergedInto],
      })),
      tx,
    );
    return ids;
  }

  /**
   * Re-decides the onsets of a source's tracks against the scans that source could have seen: a cell
   * table is judged against the inventory and its own scan times, engine tracks against the scans of
   * their own kind that are in (a scan never loaded is a gap in what the engine saw).
   */
  async recomputeStarts(siteId: number, source: CellSource, ctx: SiteContext, tx: Executor): Promise<void> {
    const seen: ScanSource[] = source === 'cell-table' ? ['scan-inventory', 'cell-table'] : [source];
    const times = await this.data.siteScanTimes(siteId, seen, tx);
    const rows = await this.data.tracksForStarts(siteId, source, tx);
    const rules = {
      maxGapMs: ctx.settings.maxGapIntervals * ctx.intervalMs,
      edgeBandKm: ctx.settings.edgeBandKm,
      coverage: ctx.coverage,
    };
    const changes: { id: number; onset: boolean; reason: string | null }[] = [];
    for (const r of rows) {
      const [x, y] = ctx.plane.toKm(r.startLon, r.startLat);
      const reason = classifyStart(
        {
          hasParent: r.parentTrackId !== null,
          firstTime: r.firstTime.getTime(),
          firstDistanceKm: Math.hypot(x, y),
          firstAzimuthDeg: azimuthOf(x, y),
        },
        times,
        rules,
      );
      const onset = r.isStorm && reason === null;
      if (onset !== r.onset || reason !== r.notOnsetReason) changes.push({ id: r.id, onset, reason });
    }
    await this.data.updateStarts(changes, tx);
  }

  siteScanTimes(siteId: number, sources?: ScanSource[]) {
    return this.data.siteScanTimes(siteId, sources);
  }

  trackSummaries(ids: number[]) {
    return this.data.trackSummaries(ids);
  }

  cellsPerScan(siteId: number, source: CellSource, from: number, to: number) {
    return this.data.cellsPerScan(siteId, source, new Date(from), new Date(to));
  }

  listTracks(f: TrackFilter) {
    return this.data.listTracks(f);
  }

  async track(id: number): Promise<TrackDetail> {
    const found = await this.data.findTrack(id);
    if (!found) throw new NotFoundException(`There is no track with id ${id}.`);
    return found;
  }

  cellsAt(siteId: number, scanTime: Date) {
    return this.data.cellsAt(siteId, scanTime);
  }
}
