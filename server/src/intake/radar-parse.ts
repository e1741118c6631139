import {
  type CellTableMapping,
  type IntakeKind,
  normaliseHeader,
  type SiteSettings,
  type SiteView,
} from '@stormhour/shared';
import proj4 from 'proj4';
import { identifyCells } from '../radar/engine/identify.js';
import { sitePlane } from '../radar/engine/site-plane.js';
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

/**
 * Reading one radar intake file into what will be stored, with nothing stored yet: the CPU-bound
 * half of the intake job (GeoTIFF decoding and cell identification, cell-table parsing and tracking).
 * Plain data in and out, so it can run in a worker thread (intake-worker.entry.ts).
 */

export type RadarKind = Exclude<IntakeKind, 'anomaly-grid'>;

export interface ParseRequest {
  kind: RadarKind;
  mapping?: CellTableMapping;
  timePattern?: string;
  site: SiteView;
  settings: SiteSettings;
  fileName: string;
  content: Uint8Array;
}

/** What reading one file gave, before anything is stored. */
export type Parsed =
  | { kind: 'scan-inventory'; times: number[] }
  | { kind: 'cell-table'; cells: PreparedCell[]; tracks: PreparedTrack[]; outside: number; times: number[] }
  | { kind: 'scan'; time: number; cells: PreparedCell[]; rejectedTooSmall: number; outside: number };

export function siteContext(site: SiteView, settings: SiteSettings): SiteContext {
  return { plane: sitePlane(site), coverage: site, settings, intervalMs: site.intervalMin * 60_000 };
}

export async function parseRadarFile(p: ParseRequest): Promise<Parsed> {
  const site = siteContext(p.site, p.settings);
  const { fileName } = p;
  const content = Buffer.from(p.content.buffer, p.content.byteOffset, p.content.byteLength);
  const latestTime = Date.now() + 10 * 60_000;
  if (p.kind === 'scan-inventory') {
    const { times, problems } = parseScanInventory(content.toString('utf8'), latestTime);
    if (problems.length) throw tableProblem(problems);
    return { kind: 'scan-inventory', times };
  }
  if (p.kind === 'cell-table') return parseCellTableFile(p, site, content, latestTime);
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

function parseCellTableFile(
  p: Pick<ParseRequest, 'mapping'>,
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
