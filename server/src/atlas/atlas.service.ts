import { BadRequestException, Injectable } from '@nestjs/common';
import {
  ATLAS_CELL_TYPES,
  type AtlasDistributionsResponse,
  type AtlasDiurnalResponse,
  type AtlasFilter,
  AtlasMapQuery,
  type AtlasMapResponse,
  type AtlasMotionResponse,
  type AtlasScope,
  type AtlasSource,
  AtlasTimeDistanceQuery,
  type AtlasTimeDistanceResponse,
  type DistributionSummary,
  type DistributionVariable,
  type DiurnalCurve,
  type DiurnalProperty,
  MOTION_SPEED_CLASSES_MS,
  type RegimeDay,
  type RegimesResponse,
  type SiteView,
} from '@stormhour/shared';
import type { z } from 'zod';
import { localDate, localHourOfDay, localMidnightOfDate } from '../radar/engine/local-time.js';
import { sitePlane } from '../radar/engine/site-plane.js';
import { SitesService } from '../radar/sites.service.js';
import { RegimesService } from '../regimes/regimes.service.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import {
  AtlasRepository,
  type CellColumns,
  type OnsetColumns,
  type Period,
  TYPE_CODES,
  TYPE_OF_CODE,
} from './atlas.repository.js';
import { axisLength, projectOntoAxis, timeDistanceCounts } from './engine/axis.js';
import { contourBands, niceThresholds } from './engine/contour-bands.js';
import { countByHour, meanByHour, peakHour } from './engine/diurnal.js';
import { gaussianKde, gridAround, gridIntegral } from './engine/kde.js';
import {
  fitLogNormal,
  ksCriticalValue,
  ksStatistic,
  logHistogram,
  logNormalCdf,
} from './engine/lognormal.js';
import { meanWind, motionRose, SECTOR_NAMES } from './engine/rose.js';

export type MapQuery = z.output<typeof AtlasMapQuery>;
export type TimeDistanceQuery = z.output<typeof AtlasTimeDistanceQuery>;

/** A period's onsets with what every view needs beside them, computed once per load. */
interface LoadedOnsets {
  columns: OnsetColumns;
  localHour: Float64Array;
  localDate: string[];
  xKm: Float64Array;
  yKm: Float64Array;
}

interface Selection {
  site: SiteView;
  scope: AtlasScope;
  onsets: LoadedOnsets;
  /** Indexes of the onsets that pass every filter. */
  kept: Int32Array;
  /** Regime days in the period (all, not only the chosen regime). */
  regimeDays: RegimeDay[];
  /** Decides a cell's local date and block for the same filter. */
  keepsCell: (date: string, blockId: number, typeCode: number) => boolean;
  period: Period;
}

const CACHE_SIZE = 8;

const PROPERTY_UNITS: Record<DiurnalProperty, string> = {
  areaKm2: 'km²',
  volumeKm3: 'km³',
  top35Km: 'km',
  echoTopKm: 'km',
  vilMaxKgM2: 'kg m⁻²',
  precipFluxM3s: 'm³ s⁻¹',
};

const DISTRIBUTIONS: {
  variable: DistributionVariable;
  label: string;
  unit: string;
  column: keyof OnsetColumns;
}[] = [
  { variable: 'areaKm2', label: 'Largest area of the storm', unit: 'km²', column: 'maxAreaKm2' },
  { variable: 'durationMin', label: 'Duration', unit: 'min', column: 'durationMin' },
  { variable: 'top35Km', label: 'Highest 35 dBZ top', unit: 'km', column: 'maxTop35Km' },
];

/** The scientist's explorer (DESIGN §3.5 maps, §3.6): onsets loaded once as columns, views computed here. */
@Injectable()
export class AtlasService {
  private readonly onsetCache = new Map<string, Promise<LoadedOnsets>>();
  private readonly cellCache = new Map<string, Promise<CellColumns>>();
  private readonly regimeCache = new Map<string, Promise<RegimesResponse>>();

  constructor(
    private readonly repo: AtlasRepository,
    private readonly sites: SitesService,
    private readonly regimes: RegimesService,
    private readonly regions: RegionsRepository,
  ) {}

  private static remember<T>(
    cache: Map<string, Promise<T>>,
    key: string,
    load: () => Promise<T>,
  ): Promise<T> {
    const found = cache.get(key);
    if (found) return found;
    const loading = load();
    loading.catch(() => cache.delete(key));
    cache.set(key, loading);
    if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value as string);
    return loading;
  }

  /** The regime of every day; reclassified only when fields or regime settings change. */
  private async regimesOf(siteId: number, from?: string, to?: string) {
    const [{ version }, fields] = await Promise.all([
      this.regimes.settings(siteId),
      this.regimes.countFields(),
    ]);
    const key = `${siteId}|${from}|${to}|${version}|${JSON.stringify(fields)}`;
    return AtlasService.remember(this.regimeCache, key, () => this.regimes.regimes(siteId, from, to));
  }

  private async loadOnsets(site: SiteView, source: AtlasSource, period: Period): Promise<LoadedOnsets> {
    const key = `${site.id}|${source}|${period.fromMs}|${period.toMs}|${site.utcOffsetMinutes}|${site.lat},${site.lon}|${await this.repo.fingerprint(site.id, source)}`;
    return AtlasService.remember(this.onsetCache, key, async () => {
      const columns = await this.repo.onsets(site.id, source, period);
      const plane = sitePlane(site);
      const xKm = new Float64Array(columns.n);
      const yKm = new Float64Array(columns.n);
      const hours = new Float64Array(columns.n);
      const dates: string[] = [];
      for (let i = 0; i < columns.n; i++) {
        [xKm[i], yKm[i]] = plane.toKm(columns.lon[i], columns.lat[i]);
        hours[i] = localHourOfDay(columns.timeMs[i], site.utcOffsetMinutes);
        dates.push(localDate(columns.timeMs[i], site.utcOffsetMinutes));
      }
      return { columns, localHour: hours, localDate: dates, xKm, yKm };
    });
  }

  private async loadCells(site: SiteView, source: AtlasSource, period: Period): Promise<CellColumns> {
    const key = `${site.id}|${source}|${period.fromMs}|${period.toMs}|${await this.repo.fingerprint(site.id, source)}`;
    return AtlasService.remember(this.cellCache, key, () => this.repo.cells(site.id, source, period));
  }

  /** Resolves the shared filter: source, period, regime days, district blocks, and the onsets kept. */
  private async select(q: AtlasFilter): Promise<Selection> {
    const site = await this.sites.get(q.siteId);
    const offset = site.utcOffsetMinutes;
    const period: Period = {
      fromMs: q.from ? localMidnightOfDate(q.from, offset) : undefined,
      toMs: q.to ? localMidnightOfDate(q.to, offset) + 86_400_000 : undefined,
    };
    const onsetsBySource = await this.repo.onsetsBySource(site.id, period);
    const source =
      q.source ?? [...onsetsBySource].sort((a, b) => b.onsets - a.onsets)[0]?.source ?? 'cell-table';

    const regimes = await this.regimesOf(site.id, q.from, q.to);
    const regimeOf = new Map(regimes.days.map((d) => [d.date, d.regime]));
    if (q.regime && !regimes.counts.some((c) => c.regime === q.regime)) {
      throw new BadRequestException({
        message: `No day in the period has the regime "${q.regime}".`,
        details: [{ where: 'regime', problem: 'no days in the period' }],
      });
    }

    let blocksOfDistrict: Set<number> | null = null;
    if (q.districtId !== undefined) {
      if (!(await this.regions.findDistrict(q.districtId))) {
        throw new BadRequestException({
          message: `There is no district ${q.districtId}.`,
          details: [{ where: 'districtId', problem: 'no such district' }],
        });
      }
      blocksOfDistrict = new Set(
        (await this.regions.listBlocks({ districtId: q.districtId })).map((b) => b.id),
      );
    }
    const wantType = q.cellType ? TYPE_CODES[q.cellType] : 0;
    const keepsDate = (date: string) => !q.regime || regimeOf.get(date) === q.regime;
    const keepsCell = (date: string, blockId: number, typeCode: number) =>
      keepsDate(date) &&
      (blocksOfDistrict === null || blocksOfDistrict.has(blockId)) &&
      (wantType === 0 || typeCode === wantType);

    const onsets = await this.loadOnsets(site, source, period);
    const c = onsets.columns;
    const kept: number[] = [];
    for (let i = 0; i < c.n; i++)
      if (keepsCell(onsets.localDate[i], c.blockId[i], c.cellType[i])) kept.push(i);

    // Days on record: local dates with scans that source could see, of the chosen regime.
    const dates = await this.repo.scanDates(site.id, source, period, offset);
    let days = 0;
    for (const d of dates) if (keepsDate(d)) days++;

    return {
      site,
      period,
      onsets,
      kept: Int32Array.from(kept),
      regimeDays: regimes.days,
      keepsCell,
      scope: {
        siteId: site.id,
        source,
        onsetsBySource,
        from: q.from ?? null,
        to: q.to ?? null,
        regime: q.regime ?? null,
        districtId: q.districtId ?? null,
        cellType: q.cellType ?? null,
        days,
        onsets: kept.length,
        utcOffsetMinutes: offset,
        regimes: regimes.counts,
      },
    };
  }

  async map(q: MapQuery): Promise<AtlasMapResponse> {
    const s = await this.select(q);
    const { columns: c, localHour: hours, xKm, yKm } = s.onsets;
    const hoursOfBin: [number, number] =
      q.bin === undefined ? [0, 24] : [q.bin * q.binHours, (q.bin + 1) * q.binHours];
    const inBin = [...s.kept].filter((i) => hours[i] >= hoursOfBin[0] && hours[i] < hoursOfBin[1]);

    const gridKm = Math.min(10, Math.max(2, q.bandwidthKm / 4));
    const grid = gridAround(s.site.rangeKm, gridKm, 3 * q.bandwidthKm);
    const perKm2 = gaussianKde(
      Float64Array.from(inBin, (i) => xKm[i]),
      Float64Array.from(inBin, (i) => yKm[i]),
      q.bandwidthKm,
      grid,
    );
    const integral = gridIntegral(perKm2, grid);
    // Points per km² over the period → onsets per 1000 km² per day.
    const scale = s.scope.days > 0 ? 1000 / s.scope.days : 0;
    const density = perKm2.map((v) => v * scale);
    const max = density.reduce((a, b) => Math.max(a, b), 0);
    const plane = sitePlane(s.site);
    const bands = contourBands(density, grid, niceThresholds(max), (x, y) => plane.toLonLat(x, y));

    return {
      scope: { ...s.scope, onsets: inBin.length },
      binHours: q.binHours,
      bin: q.bin ?? null,
      hours: hoursOfBin,
      bandwidthKm: q.bandwidthKm,
      points: inBin.map((i) => ({
        trackId: c.trackId[i],
        time: new Date(c.timeMs[i]).toISOString(),
        localHour: Math.round(hours[i] * 1000) / 1000,
        lat: c.lat[i],
        lon: c.lon[i],
        blockId: c.blockId[i] || null,
        cellType: TYPE_OF_CODE[c.cellType[i]],
      })),
      density: { unit: 'onsets per 1000 km² per day', gridKm, max, integral, bands },
    };
  }

  async diurnal(q: AtlasFilter): Promise<AtlasDiurnalResponse> {
    const s = await this.select(q);
    const hours = s.onsets.localHour;
    const types = s.onsets.columns.cellType;
    const keptHours = Float64Array.from(s.kept, (i) => hours[i]);
    const keptTypes = Uint8Array.from(s.kept, (i) => types[i]);
    const groups = ['all', ...ATLAS_CELL_TYPES] as const;
    const curve = (group: DiurnalCurve['group'], values: (number | null)[], n: number): DiurnalCurve => ({
      group,
      values,
      peakHour: n > 0 ? peakHour(values) : null,
      n,
    });
    const onsets = groups.map((g) => {
      const code = g === 'all' ? 0 : TYPE_CODES[g];
      const counts = countByHour(keptHours, code === 0 ? undefined : (i) => keptTypes[i] === code);
      return curve(
        g,
        counts,
        counts.reduce((a, b) => a + b, 0),
      );
    });

    const cells = await this.loadCells(s.site, s.scope.source, s.period);
    const offset = s.site.utcOffsetMinutes;
    const keptCells: number[] = [];
    for (let i = 0; i < cells.n; i++) {
      if (s.keepsCell(localDate(cells.timeMs[i], offset), cells.blockId[i], cells.cellType[i]))
        keptCells.push(i);
    }
    const cellHours = Float64Array.from(keptCells, (i) => localHourOfDay(cells.timeMs[i], offset));
    const cellTypes = Uint8Array.from(keptCells, (i) => cells.cellType[i]);
    const properties = (Object.keys(PROPERTY_UNITS) as DiurnalProperty[]).map((property) => {
      const values = Float64Array.from(keptCells, (i) => cells[property][i]);
      return {
        property,
        unit: PROPERTY_UNITS[property],
        curves: groups.map((g) => {
          const code = g === 'all' ? 0 : TYPE_CODES[g];
          const { means, n } = meanByHour(
            cellHours,
            values,
            code === 0 ? undefined : (i) => cellTypes[i] === code,
          );
          return curve(g, means, n);
        }),
      };
    });
    return { scope: s.scope, onsets, properties, cells: keptCells.length };
  }

  async distributions(q: AtlasFilter): Promise<AtlasDistributionsResponse> {
    const s = await this.select(q);
    const distributions = DISTRIBUTIONS.map(({ variable, label, unit, column }): DistributionSummary => {
      const all = s.onsets.columns[column] as Float64Array;
      const values = Float64Array.from([...s.kept].map((i) => all[i]).filter((v) => v > 0));
      const fit = fitLogNormal(values);
      let summary: DistributionSummary['fit'] = null;
      if (fit) {
        const ksD = ksStatistic(values, (x) => logNormalCdf(x, fit));
        const critical = ksCriticalValue(values.length, 0.05);
        summary = {
          ...fit,
          median: Math.exp(fit.mu),
          mean: Math.exp(fit.mu + (fit.sigma * fit.sigma) / 2),
          ksD,
          critical05: critical.value,
          criticalMethod: critical.method,
          consistent: ksD < critical.value,
        };
      }
      return {
        variable,
        label,
        unit,
        n: values.length,
        skipped: s.kept.length - values.length,
        fit: summary,
        histogram: logHistogram(values, fit),
      };
    });
    return { scope: s.scope, distributions };
  }

  async timeDistance(q: TimeDistanceQuery): Promise<AtlasTimeDistanceResponse> {
    const s = await this.select(q);
    const plane = sitePlane(s.site);
    const [ax, ay] = plane.toKm(q.fromLon, q.fromLat);
    const [bx, by] = plane.toKm(q.toLon, q.toLat);
    const axis = { ax, ay, bx, by };
    const lengthKm = axisLength(axis);
    const { along, across } = projectOntoAxis(
      Float64Array.from(s.kept, (i) => s.onsets.xKm[i]),
      Float64Array.from(s.kept, (i) => s.onsets.yKm[i]),
      axis,
    );
    const { counts, inCorridor } = timeDistanceCounts(
      along,
      across,
      Float64Array.from(s.kept, (i) => s.onsets.localHour[i]),
      lengthKm,
      q.halfWidthKm,
      q.stepKm,
    );
    const days = s.scope.days;
    return {
      scope: s.scope,
      axis: { fromLat: q.fromLat, fromLon: q.fromLon, toLat: q.toLat, toLon: q.toLon, lengthKm },
      halfWidthKm: q.halfWidthKm,
      stepKm: q.stepKm,
      distancesKm: counts.map((_, r) => r * q.stepKm),
      counts,
      perDay: counts.map((row) => row.map((n) => (days > 0 ? n / days : 0))),
      inCorridor,
    };
  }

  async motion(q: AtlasFilter): Promise<AtlasMotionResponse> {
    const s = await this.select(q);
    const c = s.onsets.columns;
    const { counts, withMotion } = motionRose(
      Float64Array.from(s.kept, (i) => c.directionToDeg[i]),
      Float64Array.from(s.kept, (i) => c.speedMs[i]),
      MOTION_SPEED_CLASSES_MS,
    );
    const sectors = counts.map((row, k) => ({
      centreDeg: k * 22.5,
      name: SECTOR_NAMES[k],
      counts: row,
      total: row.reduce((a, b) => a + b, 0),
    }));
    const top = sectors.reduce((best, x) => (x.total > best.total ? x : best), sectors[0]);
    const windDays = s.regimeDays.filter(
      (d) => d.u !== null && d.v !== null && (!q.regime || d.regime === q.regime),
    );
    const wind = meanWind(
      windDays.map((d) => d.u as number),
      windDays.map((d) => d.v as number),
    );
    return {
      scope: s.scope,
      sectors,
      speedClassesMs: [...MOTION_SPEED_CLASSES_MS],
      withMotion,
      modeSector: withMotion > 0 ? top.name : null,
      anomalyWind: wind ? { ...wind, days: windDays.length } : null,
    };
  }
}
