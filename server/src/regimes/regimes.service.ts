import { BadRequestException, Injectable } from '@nestjs/common';
import {
  type ExpectedRegimeResponse,
  type RegimeComposite,
  type RegimeDay,
  RegimeSettings,
  type RegimesResponse,
  type SessionUser,
} from '@stormhour/shared';
import { AuditService } from '../audit/audit.service.js';
import { BlockLocator } from '../radar/engine/block-locator.js';
import { isCovered } from '../radar/engine/coverage.js';
import { distanceAndAzimuth } from '../radar/engine/site-plane.js';
import { SitesService } from '../radar/sites.service.js';
import { RegionsRepository } from '../regions/regions.repository.js';
import { AnomaliesRepository, type AnomalyProduct, type StoredField } from './anomalies.repository.js';
import {
  cellLat,
  cellLon,
  domainMean,
  flowClass,
  type GridGeometry,
  moistureClass,
  mostFrequentRegime,
  terciles,
  windFrom,
} from './engine/regime-math.js';

const LEVEL_HPA = 850;

interface DayFields {
  q?: StoredField;
  u?: StoredField;
  v?: StoredField;
}

/** Daily domain means of the anomalies over a site's coverage, and the regime of every day (DESIGN §3.4). */
@Injectable()
export class RegimesService {
  constructor(
    private readonly anomalies: AnomaliesRepository,
    private readonly sites: SitesService,
    private readonly audit: AuditService,
    private readonly regions: RegionsRepository,
  ) {}

  async settings(siteId: number): Promise<{ version: number; settings: RegimeSettings }> {
    await this.sites.get(siteId);
    return (
      (await this.anomalies.latestSettings(siteId)) ?? { version: 0, settings: RegimeSettings.parse({}) }
    );
  }

  async updateSettings(actor: SessionUser, siteId: number, settings: RegimeSettings) {
    const current = await this.settings(siteId);
    const version = current.version + 1;
    await this.anomalies.addSettings(siteId, version, settings, actor.id);
    await this.audit.record(actor, 'regime-settings.update', `radar-site:${siteId}`, { version });
    return { version, settings };
  }

  async regimes(siteId: number, from?: string, to?: string, districtId?: number): Promise<RegimesResponse> {
    const { settings } = await this.settings(siteId);
    const { days, bounds } = await this.classify(siteId, settings, from, to, districtId);
    const counts = new Map<string, number>();
    for (const d of days) if (d.regime) counts.set(d.regime, (counts.get(d.regime) ?? 0) + 1);
    return {
      siteId,
      settings,
      moistureBoundsGKg: bounds,
      days: days.map(({ fields: _f, ...d }) => d),
      counts: [...counts].map(([regime, n]) => ({ regime, days: n })).sort((a, b) => b.days - a.days),
    };
  }

  /** Mean anomaly fields over the days of one regime, cell by cell. */
  async composite(
    siteId: number,
    regime: string,
    from?: string,
    to?: string,
    districtId?: number,
  ): Promise<RegimeComposite> {
    const { settings } = await this.settings(siteId);
    const { days } = await this.classify(siteId, settings, from, to, districtId);
    const chosen = days.filter((d) => d.regime === regime);
    if (chosen.length === 0) {
      throw new BadRequestException({
        message: `No day in the period has the regime "${regime}".`,
        details: [{ where: 'regime', problem: 'no days' }],
      });
    }
    const g = chosen[0].fields.q as StoredField;
    const mean = (variable: 'q' | 'u' | 'v') => {
      const out: (number | null)[][] = [];
      for (let j = 0; j < g.ny; j++) {
        const row: (number | null)[] = [];
        for (let i = 0; i < g.nx; i++) {
          let sum = 0;
          let n = 0;
          for (const d of chosen) {
            const v = d.fields[variable]?.values[j * g.nx + i];
            if (v !== undefined && !Number.isNaN(v)) {
              sum += v;
              n++;
            }
          }
          row.push(n ? sum / n : null);
        }
        out.push(row);
      }
      return out;
    };
    return {
      regime,
      days: chosen.length,
      lons: Array.from({ length: g.nx }, (_, i) => cellLon(g, i)),
      lats: Array.from({ length: g.ny }, (_, j) => cellLat(g, j)),
      q: mean('q'),
      u: mean('u'),
      v: mean('v'),
    };
  }

  /**
   * The domain is the site's coverage, or a district's blocks when one is named: the grid cells whose
   * centre lies inside. A district smaller than a grid cell may hold no centre at all; say so.
   */
  private async domain(siteId: number, districtId?: number): Promise<(lat: number, lon: number) => boolean> {
    const site = await this.sites.get(siteId);
    if (districtId === undefined) {
      return (lat, lon) => {
        const { km, azimuthDeg } = distanceAndAzimuth(site, { lat, lon });
        return isCovered(site, km, azimuthDeg);
      };
    }
    const blocks = await this.regions.listBlocksWithGeometry({ districtId });
    if (blocks.length === 0) {
      throw new BadRequestException({
        message: `District ${districtId} has no blocks to average over.`,
        details: [{ where: 'districtId', problem: 'no blocks' }],
      });
    }
    const locator = new BlockLocator(blocks.map((b) => ({ id: b.id, bbox: b.bbox, geometry: b.geometry })));
    return (lat, lon) => locator.locate(lon, lat) !== null;
  }

  /**
   * The regime expected for a coming period: the forecast days in it, each classified with the moisture
   * bounds of the whole analysis record (its terciles, or the fixed bounds) and the site's sectors, and
   * the regime of most of them (a tie goes to the regime of the earliest of the tied days).
   */
  async expected(siteId: number, from: string, to: string): Promise<ExpectedRegimeResponse> {
    const { settings } = await this.settings(siteId);
    const record = await this.classify(siteId, settings);
    const { days } = await this.classify(siteId, settings, from, to, undefined, 'forecast', record.bounds);
    return {
      siteId,
      from,
      to,
      days: days.map(({ fields: _f, ...d }) => d),
      regime: mostFrequentRegime(days),
      moistureBoundsGKg: record.bounds,
    };
  }

  private async classify(
    siteId: number,
    settings: RegimeSettings,
    from?: string,
    to?: string,
    districtId?: number,
    product: AnomalyProduct = 'analysis',
    /** Bounds to use instead of the period's own terciles (forecasts are judged by the record's). */
    givenBounds?: [number, number] | null,
  ) {
    const inDomain = await this.domain(siteId, districtId);
    const byDate = new Map<string, DayFields>();
    for (const f of await this.anomalies.fields(LEVEL_HPA, from, to, product)) {
      const day = byDate.get(f.date) ?? {};
      day[f.variable] = f;
      byDate.set(f.date, day);
    }
    const masks = new Map<string, Uint8Array>();
    // Nearly every field shares the previous one's grid: compare numbers before building a key.
    let last: { g: GridGeometry; mask: Uint8Array } | null = null;
    const maskFor = (g: GridGeometry) => {
      if (last && sameGrid(last.g, g)) return last.mask;
      const key = `${g.nx},${g.ny},${g.lon0},${g.lat0},${g.dLon},${g.dLat}`;
      let mask = masks.get(key);
      if (!mask) {
        mask = new Uint8Array(g.nx * g.ny);
        for (let j = 0; j < g.ny; j++)
          for (let i = 0; i < g.nx; i++) mask[j * g.nx + i] = inDomain(cellLat(g, j), cellLon(g, i)) ? 1 : 0;
        masks.set(key, mask);
      }
      last = { g, mask };
      return mask;
    };

    const days: (RegimeDay & { fields: DayFields })[] = [];
    for (const [date, fields] of [...byDate].sort(([a], [b]) => a.localeCompare(b))) {
      const mean = (f?: StoredField) => (f ? domainMean(f.values, f, maskFor(f)) : { mean: null, share: 0 });
      const q = mean(fields.q);
      const u = mean(fields.u);
      const v = mean(fields.v);
      const wind = u.mean !== null && v.mean !== null ? windFrom(u.mean, v.mean) : null;
      days.push({
        date,
        q: q.mean,
        u: u.mean,
        v: v.mean,
        speedMs: wind?.speed ?? null,
        directionFromDeg: wind?.fromDeg ?? null,
        moisture: null,
        flow: wind ? flowClass(wind.speed, wind.fromDeg, settings.sectors, settings.weakBelowMs) : null,
        regime: null,
        coverage: Math.min(q.share, u.share, v.share),
        fields,
      });
    }
    const qs = days.map((d) => d.q).filter((q): q is number => q !== null);
    const bounds: [number, number] | null =
      givenBounds !== undefined
        ? givenBounds
        : settings.moistureMethod === 'fixed'
          ? settings.fixedBoundsGKg
          : qs.length >= 3
            ? terciles(qs)
            : null;
    for (const d of days) {
      if (d.q !== null && bounds) d.moisture = moistureClass(d.q, bounds);
      d.regime = d.moisture && d.flow ? `${d.moisture} / ${d.flow}` : null;
    }
    return { days, bounds };
  }

  /** Where the stored fields came from: analysis or forecast, anomalies as uploaded or totals − climatology. */
  sources() {
    return this.anomalies.sources(LEVEL_HPA);
  }

  countFields() {
    return this.anomalies.count();
  }
}

const sameGrid = (a: GridGeometry, b: GridGeometry) =>
  a.nx === b.nx &&
  a.ny === b.ny &&
  a.lon0 === b.lon0 &&
  a.lat0 === b.lat0 &&
  a.dLon === b.dLon &&
  a.dLat === b.dLat;
