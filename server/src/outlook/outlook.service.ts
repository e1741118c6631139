import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import {
  ALL_DAYS,
  OUTLOOK_LEVEL,
  type OutlookBlock,
  type OutlookQuery,
  type OutlookResponse,
  type OutlookSource,
} from '@stormhour/shared';
import { dateOfDay, dayOfDate, localMidnightUtc } from '../radar/engine/local-time.js';
import { sitePlane } from '../radar/engine/site-plane.js';
import { SitesService } from '../radar/sites.service.js';
import { RegimesService } from '../regimes/regimes.service.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import { areaAndPerimeter, bufferedAreaKm2, coverageFraction, toPlane } from './engine/block-coverage.js';
import { blocksWithin, ownBlock } from './engine/neighbourhood.js';
import {
  type AfternoonDaily,
  afternoonRates,
  computeOutlook,
  type OutlookInput,
  type OutlookResult,
} from './engine/outlook.js';
import { type ScanHours, scannedDays } from './engine/scan-hours.js';
import {
  type DataVersion,
  type EventColumns,
  OutlookRepository,
  type SourceOnsets,
  type TimeRange,
} from './outlook.repository.js';
import { outlookCsv } from './outlook-csv.js';

/** A computed outlook, kept serialised so a cached answer costs no work but the version check. */
export interface OutlookAnswer {
  body: OutlookResponse;
  json: Buffer;
  gzip: Buffer;
  etag: string;
  csv(): string;
}

interface Entry {
  version: string;
  answer: Promise<OutlookAnswer>;
}

/** Outlooks kept in memory; each is a few hundred kB. */
const MAX_ANSWERS = 48;
/** Loaded columns (events and scans of a site, source and period) reused across regimes and bins. */
const MAX_LOADS = 6;
/**
 * How often, at most, the database's own write mark is asked as well as this process's write counter:
 * a safety net for a write the counter cannot see (a SELECT calling a function that writes).
 */
const DB_MARK_CHECK_MS = 1000;

const round = (v: number | null) => (v === null ? null : Math.round(v * 1e6) / 1e6);

/**
 * The block outlook (DESIGN §3.5). Answers are cached in memory by their inputs and checked, on every
 * request, against a fingerprint of the data they were made from (OutlookRepository.dataVersion): new
 * tracks, cells, scans, anomaly fields, finished jobs, settings, blocks or site changes give a new
 * fingerprint and the next request computes afresh. The fingerprint itself is read again only after
 * something may have been written (this process's write counter or the database's write mark moved),
 * so a cached answer costs no query; no other module needs to remember to invalidate anything.
 */
@Injectable()
export class OutlookService {
  private readonly answers = new Map<string, Entry>();
  private readonly loads = new Map<string, { version: string; data: Promise<Loaded> }>();
  /** Fingerprints per site, valid while nothing has been written since they were read. */
  private fingerprints = {
    mark: '',
    writes: -1,
    checkedAt: 0,
    bySite: new Map<number, DataVersion | null>(),
  };
  private readonly sourceOnsets = new Map<string, { version: string; onsets: Promise<SourceOnsets[]> }>();
  private readonly regimeDays = new Map<string, { version: string; days: Promise<RegimeList> }>();
  private readonly geometries = new Map<number, { version: string; geometry: Promise<BlockGeometry> }>();

  constructor(
    private readonly repo: OutlookRepository,
    private readonly sites: SitesService,
    private readonly regimes: RegimesService,
    private readonly regions: RegionsRepository,
  ) {}

  async outlook(q: OutlookQuery): Promise<OutlookAnswer> {
    const version = await this.fingerprint(q.siteId);
    if (version === null) throw new NotFoundException(`There is no radar site with id ${q.siteId}.`);
    const key = JSON.stringify(q, Object.keys(q).sort());
    const hit = this.answers.get(key);
    if (hit && hit.version === version.all) {
      // Most recently used last, so the oldest is evicted first.
      this.answers.delete(key);
      this.answers.set(key, hit);
      return hit.answer;
    }
    const answer = this.compute(q, version).then(serialise);
    this.answers.set(key, { version: version.all, answer });
    answer.catch(() => this.answers.delete(key));
    while (this.answers.size > MAX_ANSWERS) this.answers.delete(this.answers.keys().next().value as string);
    return answer;
  }

  /**
   * A short hash of everything the site's outlooks depend on: a bulletin records it at drafting and at
   * approval, so anyone can tell whether the data changed since. Null when the site does not exist.
   */
  async dataFingerprint(siteId: number): Promise<string | null> {
    const version = await this.fingerprint(siteId);
    return version === null ? null : createHash('sha1').update(version.all).digest('hex');
  }

  /**
   * The site's data fingerprint. It is read again only after something may have been written: this
   * process's write counter moved, or (checked at most every DB_MARK_CHECK_MS, for writes the counter
   * cannot see) the database's write mark moved. A cached answer thus usually costs no query at all.
   */
  private async fingerprint(siteId: number): Promise<DataVersion | null> {
    // Read before awaiting anything: a write landing meanwhile moves the counter past this value,
    // so whatever is read now is read again at the next request.
    const writes = this.repo.writeCount();
    const now = Date.now();
    if (writes !== this.fingerprints.writes || now - this.fingerprints.checkedAt >= DB_MARK_CHECK_MS) {
      const mark = await this.repo.writeMark();
      if (mark !== this.fingerprints.mark || writes !== this.fingerprints.writes)
        this.fingerprints = { mark, writes, checkedAt: now, bySite: new Map() };
      else this.fingerprints.checkedAt = now;
    }
    const { bySite } = this.fingerprints;
    const known = bySite.get(siteId);
    if (known !== undefined) return known;
    const version = await this.repo.dataVersion(siteId);
    bySite.set(siteId, version);
    return version;
  }

  /**
   * For the scorecard: on each day of q.from–q.to, whether each block (covered enough) saw a storm start
   * in the afternoon window, on the days whose afternoon had enough radar availability. Counted exactly
   * as the outlook counts, from the same stored source.
   */
  async afternoonDaily(q: OutlookQuery & { from: string; to: string }): Promise<AfternoonDailyAnswer> {
    const version = (await this.fingerprint(q.siteId)) ?? { all: 'none', geometry: 'none', regimes: 'none' };
    const site = await this.sites.get(q.siteId);
    const offset = site.utcOffsetMinutes;
    const range: TimeRange = {
      from: localMidnightUtc(dayOfDate(q.from), offset),
      to: localMidnightUtc(dayOfDate(q.to) + 1, offset),
    };
    const sources = await this.onsetsBySource(q.siteId, range, version.all);
    const source = (q.source ?? sources[0]?.source ?? 'cell-table') as OutlookSource;
    const data = await this.load(q, source, range, version, sources);
    const days: number[] = [];
    for (let d = dayOfDate(q.from); d <= dayOfDate(q.to); d++) days.push(d);
    const result = computeOutlook({
      ...engineInput(site, q, data),
      days: Int32Array.from(days),
      withIntervals: false,
      withDaily: true,
    });
    return {
      source,
      dates: days.map(dateOfDay),
      blocks: data.blocks.map((b) => ({ id: b.id, code: b.code, name: b.name, districtId: b.districtId })),
      daily: result.afternoonDaily as AfternoonDaily,
    };
  }

  private async compute(q: OutlookQuery, version: DataVersion): Promise<OutlookResponse> {
    const site = await this.sites.get(q.siteId);
    const offset = site.utcOffsetMinutes;
    const range: TimeRange = {
      from: q.from ? localMidnightUtc(dayOfDate(q.from), offset) : null,
      to: q.to ? localMidnightUtc(dayOfDate(q.to) + 1, offset) : null,
    };
    const sources = await this.onsetsBySource(q.siteId, range, version.all);
    const source = (q.source ?? sources[0]?.source ?? 'cell-table') as OutlookSource;
    const data = await this.load(q, source, range, version, sources);

    // The period: as asked, or from the first to the last day with a scan the source could have seen.
    const scanned = scannedDays(data.scanHours);
    const firstDay = q.from ? dayOfDate(q.from) : (scanned?.first ?? null);
    const lastDay = q.to ? dayOfDate(q.to) : (scanned?.last ?? null);
    const allDays: number[] = [];
    if (firstDay !== null && lastDay !== null) for (let d = firstDay; d <= lastDay; d++) allDays.push(d);
    const from = firstDay === null ? null : dateOfDay(firstDay);
    const to = lastDay === null ? null : dateOfDay(lastDay);

    const regimes =
      from && to ? await this.regimesOf(q.siteId, from, to, version.regimes) : { days: [], counts: [] };
    let selected = allDays;
    if (q.regime !== ALL_DAYS) {
      const dates = new Set(regimes.days.filter((d) => d.regime === q.regime).map((d) => d.date));
      selected = allDays.filter((d) => dates.has(dateOfDay(d)));
      if (selected.length === 0) {
        throw new BadRequestException({
          message: `No day of the period ${from ?? '…'} to ${to ?? '…'} has the regime "${q.regime}": pick one of those listed, or all days.`,
          details: [{ where: 'regime', problem: 'no days of this regime in the period' }],
        });
      }
    }

    const settings = site.settings;
    const common = engineInput(site, q, data);
    const result = computeOutlook({ ...common, days: Int32Array.from(selected) });
    // The regime's ratio needs only the all-days afternoon rates.
    const climatology =
      q.regime === ALL_DAYS
        ? result.blocks.map((r) => r.afternoon.rate)
        : afternoonRates({ ...common, days: Int32Array.from(allDays) });

    const bins = Array.from({ length: 24 / q.binHours }, (_, index) => {
      const fromHour = index * q.binHours;
      const toHour = fromHour + q.binHours;
      return { index, fromHour, toHour, label: `${pad(fromHour)}–${pad(toHour)}` };
    });
    const blocks: OutlookBlock[] = data.blocks.map((b, i) => {
      const r = result.blocks[i];
      const climate = climatology[i];
      const rate = r.afternoon.rate;
      return {
        blockId: b.id,
        code: b.code,
        name: b.name,
        districtId: b.districtId,
        districtCode: b.districtCode,
        districtName: b.districtName,
        areaKm2: round(b.areaKm2) as number,
        coverage: round(b.coverage) as number,
        hasData: r.hasData,
        bins: r.bins.map(roundFigure),
        afternoon: roundFigure(r.afternoon),
        climatologyRate: round(climate),
        ratioToClimatology: rate !== null && climate ? round(rate / climate) : null,
        week: { ...r.week, rate: round(r.week.rate), lower: round(r.week.lower), upper: round(r.week.upper) },
        peakBin: r.peakBin,
      };
    });
    const prior = (p: OutlookResult['priors']['afternoon']) => ({
      mean: round(p.mean),
      strength: round(p.strength),
      alpha: round(p.alpha),
      beta: round(p.beta),
    });
    return {
      siteId: site.id,
      siteCode: site.code,
      utcOffsetMinutes: offset,
      source,
      sources: sources.map((o) => ({ source: o.source, onsets: o.time.length })),
      measure: q.measure,
      regime: q.regime,
      from,
      to,
      binHours: q.binHours,
      bins,
      afternoon: { fromHour: q.afternoonFrom, toHour: q.afternoonTo },
      radiusKm: q.radiusKm,
      interval: q.interval,
      level: OUTLOOK_LEVEL,
      minAvailability: settings.minAvailability,
      minBlockCoverage: settings.minBlockCoverage,
      daysInPeriod: allDays.length,
      regimeDays: selected.length,
      regimes: regimes.counts,
      priors: {
        bins: result.priors.bins.map(prior),
        afternoon: prior(result.priors.afternoon),
        method: 'moments',
      },
      blocks,
    };
  }

  /** Onset times and blocks of every source in the period, read once per data version. */
  private onsetsBySource(siteId: number, range: TimeRange, version: string): Promise<SourceOnsets[]> {
    const key = `${siteId}|${range.from}|${range.to}`;
    const hit = this.sourceOnsets.get(key);
    if (hit && hit.version === version) return hit.onsets;
    const onsets = this.repo.onsetsBySource(siteId, range);
    this.sourceOnsets.set(key, { version, onsets });
    onsets.catch(() => this.sourceOnsets.delete(key));
    while (this.sourceOnsets.size > MAX_LOADS)
      this.sourceOnsets.delete(this.sourceOnsets.keys().next().value as string);
    return onsets;
  }

  /**
   * The regime of each day of the period, all regimes at once, classified again only when the site,
   * its regime settings or the anomaly fields change (not with every radar intake).
   */
  private regimesOf(siteId: number, from: string, to: string, version: string): Promise<RegimeList> {
    const key = `${siteId}|${from}|${to}`;
    const hit = this.regimeDays.get(key);
    if (hit && hit.version === version) return hit.days;
    const days = this.regimes.regimes(siteId, from, to).then(({ days, counts }) => ({
      days: days.map((d) => ({ date: d.date, regime: d.regime })),
      counts,
    }));
    this.regimeDays.set(key, { version, days });
    days.catch(() => this.regimeDays.delete(key));
    while (this.regimeDays.size > MAX_LOADS)
      this.regimeDays.delete(this.regimeDays.keys().next().value as string);
    return days;
  }

  /**
   * The blocks as placed on the site: outlines in the site plane, perimeters and the share of each in
   * coverage. Worked out again only when the site or the blocks change, not with every radar intake.
   */
  private blockGeometry(siteId: number, version: string): Promise<BlockGeometry> {
    const hit = this.geometries.get(siteId);
    if (hit && hit.version === version) return hit.geometry;
    const geometry = (async () => {
      const [site, stored] = await Promise.all([
        this.sites.get(siteId),
        this.regions.listBlocksWithGeometry({}),
      ]);
      const plane = sitePlane(site);
      const inPlane = stored.map((b) => toPlane(b.geometry, plane));
      return {
        plane,
        inPlane,
        indexOf: new Map(stored.map((b, i) => [b.id, i])),
        perimeterKm: inPlane.map((rings) => areaAndPerimeter(rings).perimeterKm),
        blocks: stored.map((b) => ({ ...b, coverage: coverageFraction(b.geometry, site, plane) })),
      };
    })();
    this.geometries.set(siteId, { version, geometry });
    geometry.catch(() => this.geometries.delete(siteId));
    return geometry;
  }

  /** Events, scans and block geometry for a site, source, measure, radius and period, loaded once. */
  private load(
    q: OutlookQuery,
    source: OutlookSource,
    range: TimeRange,
    version: DataVersion,
    sources: SourceOnsets[],
  ): Promise<Loaded> {
    const key = JSON.stringify([q.siteId, source, q.measure, q.radiusKm, range.from, range.to]);
    const hit = this.loads.get(key);
    if (hit && hit.version === version.all) return hit.data;
    const data = this.loadFresh(q, source, range, sources, version.geometry);
    this.loads.set(key, { version: version.all, data });
    data.catch(() => this.loads.delete(key));
    while (this.loads.size > MAX_LOADS) this.loads.delete(this.loads.keys().next().value as string);
    return data;
  }

  private async loadFresh(
    q: OutlookQuery,
    source: OutlookSource,
    range: TimeRange,
    sources: SourceOnsets[],
    geometryVersion: string,
  ): Promise<Loaded> {
    // Availability is judged against the scans a source could have seen (as the onset rules do): a
    // cell table with the scan inventory, a volume or column-maximum run with its own scans only. The
    // database keeps those counts per local hour as scans are stored.
    const days = { from: q.from ? dayOfDate(q.from) : null, to: q.to ? dayOfDate(q.to) : null };
    const [scanHours, events, geometry] = await Promise.all([
      this.repo.scanHours(q.siteId, source, days),
      // Onsets counted in their own block need only their times and blocks, already read per source;
      // a neighbourhood also needs where each started.
      q.measure === 'onsets'
        ? q.radiusKm === 0
          ? (sources.find((o) => o.source === source) ?? NO_ONSETS)
          : this.repo.onsets(q.siteId, source, range)
        : this.repo.stormCells(q.siteId, source, range),
      this.blockGeometry(q.siteId, geometryVersion),
    ]);
    const { plane, inPlane, indexOf, perimeterKm } = geometry;
    const blocks = geometry.blocks.map((b, i) => ({
      ...b,
      countingAreaKm2: q.radiusKm > 0 ? bufferedAreaKm2(b.areaKm2, perimeterKm[i], q.radiusKm) : b.areaKm2,
    }));
    let eventBlocks: Loaded['eventBlocks'];
    if (q.radiusKm === 0) {
      eventBlocks = ownBlock(Int32Array.from(events.blockId, (id) => indexOf.get(id) ?? -1));
    } else {
      const columns = events as EventColumns;
      const [x, y] = q.measure === 'onsets' ? project(columns, plane) : [columns.a, columns.b];
      eventBlocks = blocksWithin(x, y, inPlane, q.radiusKm);
    }
    return { scanHours, events, eventBlocks, blocks };
  }
}

export interface AfternoonDailyAnswer {
  source: OutlookSource;
  /** Local dates, in the order of the daily arrays. */
  dates: string[];
  blocks: { id: number; code: string; name: string; districtId: number | null }[];
  daily: AfternoonDaily;
}

interface RegimeList {
  days: { date: string; regime: string | null }[];
  counts: { regime: string; days: number }[];
}

const NO_ONSETS = { time: new Float64Array(0), blockId: new Int32Array(0) };

interface BlockGeometry {
  plane: ReturnType<typeof sitePlane>;
  inPlane: ReturnType<typeof toPlane>[];
  indexOf: Map<number, number>;
  perimeterKm: number[];
  blocks: (Awaited<ReturnType<RegionsRepository['listBlocksWithGeometry']>>[number] & { coverage: number })[];
}

interface Loaded {
  scanHours: ScanHours;
  /** Where each event was is read only when a neighbourhood needs it. */
  events: Pick<EventColumns, 'time' | 'blockId'> | EventColumns;
  eventBlocks: ReturnType<typeof ownBlock>;
  blocks: (Awaited<ReturnType<RegionsRepository['listBlocksWithGeometry']>>[number] & {
    coverage: number;
    countingAreaKm2: number;
  })[];
}

/** What the outlook engine counts with, for any set of days: the loaded columns and the site's settings. */
function engineInput(
  site: Awaited<ReturnType<SitesService['get']>>,
  q: OutlookQuery,
  data: Loaded,
): Omit<OutlookInput, 'days'> {
  return {
    blocks: data.blocks.map((b) => ({ coverage: b.coverage, countingAreaKm2: b.countingAreaKm2 })),
    eventTimes: data.events.time,
    eventBlocks: data.eventBlocks,
    scanHours: data.scanHours,
    utcOffsetMinutes: site.utcOffsetMinutes,
    intervalMin: site.intervalMin,
    binHours: q.binHours,
    afternoon: { fromHour: q.afternoonFrom, toHour: q.afternoonTo },
    minAvailability: site.settings.minAvailability,
    minBlockCoverage: site.settings.minBlockCoverage,
    interval: q.interval,
    level: OUTLOOK_LEVEL,
  };
}

/** Onset starts are stored as lon/lat; the neighbourhood is measured in the site plane. */
function project(events: EventColumns, plane: ReturnType<typeof sitePlane>): [Float64Array, Float64Array] {
  const x = new Float64Array(events.a.length);
  const y = new Float64Array(events.a.length);
  for (let i = 0; i < x.length; i++) [x[i], y[i]] = plane.toKm(events.a[i], events.b[i]);
  return [x, y];
}

const pad = (h: number) => String(h).padStart(2, '0');

function roundFigure(f: OutlookResult['blocks'][number]['afternoon']) {
  return {
    n: f.n,
    x: f.x,
    rate: round(f.rate),
    lower: round(f.lower),
    upper: round(f.upper),
    shrunk: round(f.shrunk),
    per100Km2: round(f.per100Km2),
  };
}

function serialise(body: OutlookResponse): OutlookAnswer {
  const json = Buffer.from(JSON.stringify(body));
  let csv: string | undefined;
  return {
    body,
    json,
    gzip: gzipSync(json, { level: 6 }),
    etag: `"${createHash('sha1').update(json).digest('base64url')}"`,
    csv: () => {
      csv ??= outlookCsv(body);
      return csv;
    },
  };
}
