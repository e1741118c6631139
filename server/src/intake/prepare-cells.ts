import type { SiteSettings } from '@stormhour/shared';
import { azimuthOf, type Coverage, isCovered } from '../radar/engine/coverage.js';
import { type CellType, cellType } from '../radar/engine/identify.js';
import type { SitePlane } from '../radar/engine/site-plane.js';
import { type Scan, type Track, trackScans } from '../radar/engine/tracking.js';

/** A cell ready to store, from a cell table or found in a scan. */
export interface PreparedCell {
  time: number;
  lon: number;
  lat: number;
  xKm: number;
  yKm: number;
  areaKm2: number;
  volumeKm3: number | null;
  maxDbz: number | null;
  maxDbzHeightKm?: number | null;
  top35Km: number | null;
  echoTopKm: number | null;
  coreVolumeKm3: number | null;
  vilMaxKgM2: number | null;
  vilMassKg?: number | null;
  rainRateMaxMmH?: number | null;
  precipFluxM3s?: number | null;
  semiMajorKm?: number | null;
  semiMinorKm?: number | null;
  orientationDeg?: number | null;
  cellType: CellType | null;
  externalTrackId: string | null;
  parentExternalTrackId: string | null;
}

export interface PreparedTrack {
  externalId: string | null;
  /** Indexes into the prepared cells, in time order. */
  cells: number[];
  parent: number | null;
  mergedInto: number | null;
  firstTime: number;
  lastTime: number;
  scanCount: number;
  durationMin: number;
  speedMs: number | null;
  directionToDeg: number | null;
  isStorm: boolean;
  startLat: number;
  startLon: number;
  startDistanceKm: number;
  startAzimuthDeg: number;
  maxVolumeKm3: number | null;
  maxAreaKm2: number;
  maxEchoTopKm: number | null;
  cellType: CellType | null;
}

export interface SiteContext {
  plane: SitePlane;
  coverage: Coverage;
  settings: SiteSettings;
  intervalMs: number;
}

/** Keeps the cells the radar can see; the others are counted, not stored. */
export function withinCoverage<T extends { xKm: number; yKm: number }>(
  items: T[],
  coverage: Coverage,
): { inside: T[]; outside: number } {
  const inside = items.filter((c) => isCovered(coverage, Math.hypot(c.xKm, c.yKm), azimuthOf(c.xKm, c.yKm)));
  return { inside, outside: items.length - inside.length };
}

export function typeOf(
  c: Pick<PreparedCell, 'echoTopKm' | 'top35Km'>,
  s: Pick<SiteSettings, 'typeHeight' | 'typeEdgesKm'>,
): CellType | null {
  const h = s.typeHeight === 'echoTop' ? c.echoTopKm : c.top35Km;
  return h === null ? null : cellType(h, s.typeEdgesKm);
}

/** Groups cells into tracks by their table's track ids, in time order. */
export function tracksFromIds(cells: PreparedCell[], ctx: SiteContext): PreparedTrack[] {
  const byId = new Map<string, number[]>();
  cells.forEach((c, i) => {
    if (c.externalTrackId === null) return;
    const list = byId.get(c.externalTrackId) ?? [];
    list.push(i);
    byId.set(c.externalTrackId, list);
  });
  const ids = [...byId.keys()];
  const indexOf = new Map(ids.map((id, k) => [id, k]));
  return ids.map((id) => {
    const members = (byId.get(id) as number[]).sort((a, b) => cells[a].time - cells[b].time);
    const parentId = cells[members[0]].parentExternalTrackId;
    const parent = parentId !== null && parentId !== id ? (indexOf.get(parentId) ?? null) : null;
    return describe(id, members, parent, null, cells, ctx);
  });
}

/** Tracks the cells with the engine (DESIGN §3.2), for tables without track ids or for scans. */
export function tracksByEngine(cells: PreparedCell[], ctx: SiteContext): PreparedTrack[] {
  const times = [...new Set(cells.map((c) => c.time))].sort((a, b) => a - b);
  const scanIndex = new Map(times.map((t, i) => [t, i]));
  const members: number[][] = times.map(() => []);
  cells.forEach((c, i) => {
    members[scanIndex.get(c.time) as number].push(i);
  });
  const scans: Scan[] = times.map((time, s) => ({
    time,
    cells: members[s].map((i) => ({
      x: cells[i].xKm,
      y: cells[i].yKm,
      areaKm2: cells[i].areaKm2,
      // Without a volume (2-D input), area stands in for size.
      volumeKm3: cells[i].volumeKm3 ?? cells[i].areaKm2,
    })),
  }));
  const s = ctx.settings;
  const tracks: Track[] = trackScans(scans, {
    maxSpeedMs: s.maxSpeedMs,
    maxGapMs: s.maxGapIntervals * ctx.intervalMs,
    sizeWeight: s.sizeWeight,
  });
  return tracks.map((t) =>
    describe(
      null,
      t.cells.map(([scan, c]) => members[scan][c]),
      t.parent,
      t.mergedInto,
      cells,
      ctx,
    ),
  );
}

function describe(
  externalId: string | null,
  members: number[],
  parent: number | null,
  mergedInto: number | null,
  cells: PreparedCell[],
  ctx: SiteContext,
): PreparedTrack {
  const first = cells[members[0]];
  const last = cells[members[members.length - 1]];
  const seconds = (last.time - first.time) / 1000;
  const dx = last.xKm - first.xKm;
  const dy = last.yKm - first.yKm;
  let maxVolume: number | null = null;
  let maxArea = 0;
  let maxTop: number | null = null;
  let deepest: PreparedCell = first;
  for (const i of members) {
    const c = cells[i];
    if (c.volumeKm3 !== null) maxVolume = Math.max(maxVolume ?? 0, c.volumeKm3);
    maxArea = Math.max(maxArea, c.areaKm2);
    if (c.echoTopKm !== null && (maxTop === null || c.echoTopKm > maxTop)) {
      maxTop = c.echoTopKm;
      deepest = c;
    }
  }
  return {
    externalId,
    cells: members,
    parent,
    mergedInto,
    firstTime: first.time,
    lastTime: last.time,
    scanCount: new Set(members.map((i) => cells[i].time)).size,
    durationMin: (last.time - first.time + ctx.intervalMs) / 60_000,
    speedMs: seconds > 0 ? (Math.hypot(dx, dy) * 1000) / seconds : null,
    directionToDeg: seconds > 0 ? ((Math.atan2(dx, dy) * 180) / Math.PI + 360) % 360 : null,
    isStorm: new Set(members.map((i) => cells[i].time)).size >= ctx.settings.minScans,
    startLat: first.lat,
    startLon: first.lon,
    startDistanceKm: Math.hypot(first.xKm, first.yKm),
    startAzimuthDeg: azimuthOf(first.xKm, first.yKm),
    maxVolumeKm3: maxVolume,
    maxAreaKm2: maxArea,
    maxEchoTopKm: maxTop,
    cellType: typeOf(deepest, ctx.settings),
  };
}
