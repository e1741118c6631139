import { Injectable } from '@nestjs/common';
import {
  type CellTableMapping,
  type IntakeKind,
  normaliseHeader,
  type SiteSettings,
  type SiteView,
} from '@stormhour/shared';
import proj4 from 'proj4';
import type { JobContext, JobOutcome } from '../jobs/jobs.service.js';
import { identifyCells } from '../radar/engine/identify.js';
import { sitePlane } from '../radar/engine/site-plane.js';
import { type CellSource, RadarDataService } from '../radar/radar-data.service.js';
import { SitesRepository } from '../radar/sites.repository.js';
import { type CellTableRow, guessMapping, parseCellTable, parseScanInventory } from './cell-table.js';
import { FileProblem, readReflectivityTiff } from './geotiff-reader.js';
import {
  type PreparedCell,
  type PreparedTrack,
  type SiteContext,
  tracksByEngine,
  tracksFromIds,
  typeOf,
  withinCoverage,
} from './prepare-cells.js';
import { buildReport } from './quality-report.js';
import { readEveryFile } from './read-phase.js';
import { UploadStore } from './upload-store.js';
import { UploadsRepository } from './uploads.repository.js';

export const RADAR_INTAKE_JOB = 'radar-intake';

export type RadarKind = Exclude<IntakeKind, 'anomaly-grid'>;

export interface RadarIntakeParams {
  siteId: number;
  kind: RadarKind;
  onError: 'fail' | 'skip';
  mapping?: CellTableMapping;
  timePattern?: string;
  settingsVersion: number;
  files: { uploadId: number; fileName: string; duplicate: boolean }[];
}

/** What reading one file gave, before anything is stored. */
type Parsed =
  | { kind: 'scan-inventory'; times: number[] }
  | { kind: 'cell-table'; cells: PreparedCell[]; tracks: PreparedTrack[]; outside: number; times: number[] }
  | { kind: 'scan'; time: number; cells: PreparedCell[]; rejectedTooSmall: number; outside: number };

/**
 * The radar intake job: reads every file first (nothing stored), then stores each good file in its
 * own transaction, then re-tracks volume scans and re-decides onsets against the whole inventory.
 */
@Injectable()
export class RadarIntakeHandler {
  constructor(
    private readonly sites: SitesRepository,
    private readonly uploads: UploadsRepository,
    private readonly store: UploadStore,
    private readonly radar: RadarDataService,
  ) {}

  async run(p: RadarIntakeParams, ctx: JobContext): Promise<JobOutcome> {
    const site = (await this.sites.find(p.siteId)) as SiteView;
    const settings = (await this.sites.settingsVersion(p.siteId, p.settingsVersion)) as SiteSettings;
    const siteCtx: SiteContext = {
      plane: sitePlane(site),
      coverage: site,
      settings,
      intervalMs: site.intervalMin * 60_000,
    };
    const read = await readEveryFile(
      p.files,
      p.onError,
      ctx,
      { uploads: this.uploads, store: this.store },
      (content, fileName) => this.parse(p, siteCtx, fileName, content),
    );
    if (read.stopped) return read.stopped;
    const { files, todo, parsed, problems } = read;

    const locator = await this.radar.blockLocator();
    // An inventory changes how cell-table starts are judged; the other kinds judge their own.
    const cellSource: CellSource = p.kind === 'scan-inventory' ? 'cell-table' : p.kind;
    const newTracks: number[] = [];
    let cellsFound = 0;
    let rejected = 0;
    let outside = 0;
    const fileTimes: number[] = [];
    for (const [n, f] of todo.entries()) {
      const result = parsed.get(f.uploadId);
      if (!result) continue;
      await ctx.progress(0.5 + (0.4 * n) / todo.length, `Storing ${f.fileName}`);
      const ids = await this.radar.transaction(async (tx) => {
        await this.uploads.markImported(f.uploadId, tx);
        if (result.kind === 'scan-inventory') {
          await this.radar.insertScans(p.siteId, 'scan-inventory', result.times, f.uploadId, tx);
          return [];
        }
        const times = result.kind === 'scan' ? [result.time] : result.times;
        await this.radar.insertScans(p.siteId, p.kind, times, f.uploadId, tx);
        return this.radar.store(
          {
            siteId: p.siteId,
            source: cellSource,
            uploadId: f.uploadId,
            settingsVersion: p.settingsVersion,
            cells: result.cells,
            tracks: result.kind === 'cell-table' ? result.tracks : [],
          },
          locator,
          tx,
        );
      });
      newTracks.push(...ids);
      if (result.kind !== 'scan-inventory') {
        cellsFound += result.cells.length;
        outside += result.outside;
      }
      if (result.kind === 'scan') rejected += result.rejectedTooSmall;
      fileTimes.push(...(result.kind === 'scan' ? [result.time] : result.times));
      f.state = 'imported';
    }
    await ctx.setFiles(files);

    await ctx.progress(0.92, 'Tracking and deciding onsets');
    const tracked = await this.radar.transaction(async (tx) => {
      const retracked =
        p.kind === 'volume' || p.kind === 'column-max'
          ? await this.radar.retrackScans(p.siteId, p.kind, siteCtx, p.settingsVersion, locator, tx)
          : [];
      await this.radar.recomputeStarts(p.siteId, cellSource, siteCtx, tx);
      return retracked;
    });
    const jobTracks = p.kind === 'volume' || p.kind === 'column-max' ? tracked : newTracks;

    await ctx.progress(0.97, 'Writing the quality report');
    // Seasons hold tens of thousands of times: no spread into Math.min.
    const from = fileTimes.reduce((a, t) => Math.min(a, t), Infinity);
    const to = fileTimes.reduce((a, t) => Math.max(a, t), -Infinity);
    // Availability is a share of whole local days, so the report looks at every day the files touch.
    const dayMs = 86_400_000;
    const offsetMs = site.utcOffsetMinutes * 60_000;
    const dayStart = Math.floor((from + offsetMs) / dayMs) * dayMs - offsetMs;
    const dayEnd = Math.floor((to + offsetMs) / dayMs) * dayMs - offsetMs + dayMs - 1;
    const allScans = await this.radar.siteScanTimes(p.siteId);
    const span = allScans.filter((t) => t >= dayStart && t <= dayEnd);
    const report = buildReport({
      filesRead: [...parsed.keys()].length,
      filesSkipped: files.filter((f) => f.state === 'skipped').length,
      duplicates: files.filter((f) => f.duplicate).length,
      scans: new Set(fileTimes).size,
      cellsFound,
      cellsRejectedTooSmall: rejected,
      cellsOutsideCoverage: outside,
      tracks: await this.radar.trackSummaries(jobTracks),
      siteScans: span,
      cellsPerScan: fileTimes.length ? await this.radar.cellsPerScan(p.siteId, cellSource, from, to) : [],
      intervalMs: siteCtx.intervalMs,
      maxGapMs: settings.maxGapIntervals * siteCtx.intervalMs,
      utcOffsetMinutes: site.utcOffsetMinutes,
    });
    return { result: report as unknown as Record<string, unknown>, problems };
  }

  private async parse(
    p: RadarIntakeParams,
    site: SiteContext,
    fileName: string,
    content: Buffer,
  ): Promise<Parsed> {
    const latestTime = Date.now() + 10 * 60_000;
    if (p.kind === 'scan-inventory') {
      const { times, problems } = parseScanInventory(content.toString('utf8'), latestTime);
      if (problems.length) throw tableProblem(problems);
      return { kind: 'scan-inventory', times };
    }
    if (p.kind === 'cell-table') return this.parseCellTable(p, site, content, latestTime);
    const { time, grid } = await readReflectivityTiff(content, {
      fileName,
      kind: p.kind,
      timePattern: p.timePattern,
      plane: site.plane,
      latestTime,
    });
    let nearestKm = Infinity;
    for (let k = 0; k < grid.xKm.length; k++)
      nearestKm = Math.min(nearestKm, Math.hypot(grid.xKm[k], grid.yKm[k]));
    if (nearestKm > site.coverage.rangeKm) {
      throw new FileProblem(
        null,
        `the grid lies ${nearestKm.toFixed(0)} km from the radar at its nearest, outside its ${site.coverage.rangeKm} km coverage: is it another site's file?`,
      );
    }
    const s = site.settings;
    const found = identifyCells(grid, {
      thresholdDbz: s.thresholdDbz,
      minVolumeKm3: s.minVolumeKm3,
      minAreaKm2: s.minAreaKm2,
      connectivity3d: s.connectivity3d,
      connectivity2d: s.connectivity2d,
      echoTopDbz: s.echoTopDbz,
      coreDbz: s.coreDbz,
      vilCapDbz: s.vilCapDbz,
      zr: { a: s.zrA, b: s.zrB },
      typeEdgesKm: s.typeEdgesKm,
      typeHeight: s.typeHeight,
    });
    const cells: PreparedCell[] = found.cells.map((c) => ({
      time,
      lon: c.lon,
      lat: c.lat,
      xKm: c.xKm,
      yKm: c.yKm,
      areaKm2: c.areaKm2,
      volumeKm3: c.volumeKm3,
      maxDbz: c.maxDbz,
      maxDbzHeightKm: c.maxDbzHeightKm,
      top35Km: c.top35Km,
      echoTopKm: c.echoTopKm,
      coreVolumeKm3: c.coreVolumeKm3,
      vilMaxKgM2: c.vilMaxKgM2,
      vilMassKg: c.vilMassKg,
      rainRateMaxMmH: c.rainRateMaxMmH,
      precipFluxM3s: c.precipFluxM3s,
      semiMajorKm: c.semiMajorKm,
      semiMinorKm: c.semiMinorKm,
      orientationDeg: c.orientationDeg,
      cellType: c.type,
      externalTrackId: null,
      parentExternalTrackId: null,
    }));
    const { inside, outside } = withinCoverage(cells, site.coverage);
    return { kind: 'scan', time, cells: inside, rejectedTooSmall: found.rejectedTooSmall, outside };
  }

  private parseCellTable(
    p: RadarIntakeParams,
    site: SiteContext,
    content: Buffer,
    latestTime: number,
  ): Parsed {
    const mapping = p.mapping as CellTableMapping;
    const text = content.toString('utf8');
    const given = Object.keys(mapping.columns).length > 0;
    const columns = given ? mapping.columns : guessFromHeader(text);
    // Unmapped files name their own unit: an "area_m2" column is in m².
    const areaUnit =
      !given && columns.area && normaliseHeader(columns.area).endsWith('_m2') ? 'm2' : mapping.areaUnit;
    const xyToLonLat = mapping.position === 'xy' && mapping.crs ? xyConverter(mapping.crs) : undefined;
    const { rows, problems } = parseCellTable(
      text,
      { ...mapping, columns, areaUnit },
      { latestTime, xyToLonLat },
    );
    if (problems.length) throw tableProblem(problems);
    const all = rows.map((r) => toPrepared(r, site));
    const { inside, outside } = withinCoverage(all, site.coverage);
    if (inside.length === 0) {
      const nearest = all.reduce((a, c) => Math.min(a, Math.hypot(c.xKm, c.yKm)), Infinity);
      throw new FileProblem(
        null,
        `none of its ${all.length} cells lie within the site's coverage (the nearest is ${nearest.toFixed(0)} km from the radar)`,
      );
    }
    const withIds = inside.some((c) => c.externalTrackId !== null);
    const tracks = withIds ? tracksFromIds(inside, site) : tracksByEngine(inside, site);
    return {
      kind: 'cell-table',
      cells: inside,
      tracks,
      outside,
      times: [...new Set(inside.map((c) => c.time))],
    };
  }
}

function toPrepared(r: CellTableRow, site: SiteContext): PreparedCell {
  const [xKm, yKm] = site.plane.toKm(r.lon, r.lat);
  const cell: PreparedCell = {
    time: r.time,
    lon: r.lon,
    lat: r.lat,
    xKm,
    yKm,
    areaKm2: r.areaKm2,
    volumeKm3: r.volumeKm3,
    maxDbz: r.maxDbz,
    top35Km: r.top35Km,
    echoTopKm: r.echoTopKm,
    coreVolumeKm3: r.core40Km3,
    vilMaxKgM2: r.vilMaxKgM2,
    cellType: null,
    externalTrackId: r.trackId,
    parentExternalTrackId: r.parentTrackId,
  };
  cell.cellType = typeOf(cell, site.settings);
  return cell;
}

function guessFromHeader(text: string) {
  const header = text.slice(0, text.indexOf('\n') >= 0 ? text.indexOf('\n') : text.length);
  return guessMapping(header.split(',').map((h) => h.trim().replace(/^"|"$/g, '')));
}

function xyConverter(crs: string): (x: number, y: number) => [number, number] {
  try {
    const c = proj4(crs, 'EPSG:4326');
    return (x, y) => c.forward([x, y]) as [number, number];
  } catch {
    throw new FileProblem(
      'mapping.crs',
      `"${crs}" is not a CRS proj4 knows: give a proj4 string or an EPSG code such as EPSG:32645`,
    );
  }
}

function tableProblem(problems: { where: string | null; problem: string }[]): FileProblem {
  return new FileProblem(problems[0].where, problems[0].problem, problems);
}
