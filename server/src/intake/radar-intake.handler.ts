import { Injectable, Logger } from '@nestjs/common';
import type { CellTableMapping, SiteSettings, SiteView } from '@stormhour/shared';
import type { JobContext, JobOutcome } from '../jobs/jobs.service.js';
import { type CellSource, RadarDataService } from '../radar/radar-data.service.js';
import { SitesRepository } from '../radar/sites.repository.js';
import { IntakeWorker } from './intake-worker.js';
import { buildReport } from './quality-report.js';
import { type RadarKind, siteContext } from './radar-parse.js';
import { readEveryFile } from './read-phase.js';
import { UploadStore } from './upload-store.js';
import { UploadsRepository } from './uploads.repository.js';

export const RADAR_INTAKE_JOB = 'radar-intake';

export type { RadarKind };

export interface RadarIntakeParams {
  siteId: number;
  kind: RadarKind;
  onError: 'fail' | 'skip';
  mapping?: CellTableMapping;
  timePattern?: string;
  settingsVersion: number;
  files: { uploadId: number; fileName: string; duplicate: boolean }[];
}

/**
 * The radar intake job: reads every file first (nothing stored), then stores each good file in its
 * own transaction, then re-tracks volume scans and re-decides onsets against the whole inventory.
 */
@Injectable()
export class RadarIntakeHandler {
  private readonly logger = new Logger('RadarIntake');

  constructor(
    private readonly sites: SitesRepository,
    private readonly uploads: UploadsRepository,
    private readonly store: UploadStore,
    private readonly radar: RadarDataService,
  ) {}

  async run(p: RadarIntakeParams, ctx: JobContext): Promise<JobOutcome> {
    const site = (await this.sites.find(p.siteId)) as SiteView;
    const settings = (await this.sites.settingsVersion(p.siteId, p.settingsVersion)) as SiteSettings;
    // The CPU-bound steps (decoding and identifying volumes, parsing and tracking tables, re-tracking
    // the site's scans) run in a worker thread, so polls and other requests are answered meanwhile.
    const worker = await IntakeWorker.start((m) => this.logger.warn(m));
    try {
      return await this.readStoreAndTrack(p, ctx, site, settings, worker);
    } finally {
      await worker.close();
    }
  }

  private async readStoreAndTrack(
    p: RadarIntakeParams,
    ctx: JobContext,
    site: SiteView,
    settings: SiteSettings,
    worker: IntakeWorker,
  ): Promise<JobOutcome> {
    const siteCtx = siteContext(site, settings);
    const read = await readEveryFile(
      p.files,
      p.onError,
      ctx,
      { uploads: this.uploads, store: this.store },
      (content, fileName) =>
        worker.parse({
          kind: p.kind,
          mapping: p.mapping,
          timePattern: p.timePattern,
          site,
          settings,
          fileName,
          content,
        }),
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
          ? await this.radar.retrackScans(
              p.siteId,
              p.kind,
              siteCtx,
              p.settingsVersion,
              locator,
              tx,
              (cells) => worker.track({ cells, site, settings }),
            )
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
}
