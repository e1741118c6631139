import { coreDbz, fieldDbz } from './cellprops.js';
import { RADAR_GRID, SITE } from './config.js';
import { Rng } from './prng.js';
import type { Scenario } from './scenario.js';
import { semiMajor } from './storms.js';

/** The radar product grid: radar-centred azimuthal equidistant, pixel centres at whole km. */
export interface RadarGridSpec {
  nx: number;
  ny: number;
  spacingKm: number;
  /** model coordinates (m) of the outer corner of the upper-left pixel */
  originM: [number, number];
  levelsKm: readonly number[];
  scale: number;
  offset: number;
  nodataRaw: number;
}

export function radarGrid(): RadarGridSpec {
  const n = Math.round((2 * RADAR_GRID.halfSizeKm) / RADAR_GRID.spacingKm) + 1;
  const half = (n * RADAR_GRID.spacingKm) / 2;
  return {
    nx: n,
    ny: n,
    spacingKm: RADAR_GRID.spacingKm,
    originM: [-half * 1000, half * 1000],
    levelsKm: SITE.levelHeightsKm,
    scale: RADAR_GRID.scale,
    offset: RADAR_GRID.offset,
    nodataRaw: RADAR_GRID.nodataRaw,
  };
}

/** Pixel-centre coordinate (km) of column i and row j. */
export function pixelCentreKm(g: RadarGridSpec, i: number, j: number): [number, number] {
  return [g.originM[0] / 1000 + (i + 0.5) * g.spacingKm, g.originM[1] / 1000 - (j + 0.5) * g.spacingKm];
}

export interface RenderedVolume {
  grid: RadarGridSpec;
  /** band-sequential raw values: ((level × ny) + row) × nx + col; dBZ = raw × scale + offset */
  raw: Uint8Array;
}

export const dbzToRaw = (dbz: number): number =>
  Math.min(254, Math.max(0, Math.round((dbz - RADAR_GRID.offset) / RADAR_GRID.scale)));
export const rawToDbz = (raw: number): number => raw * RADAR_GRID.scale + RADAR_GRID.offset;

interface Clutter {
  i: number;
  j: number;
  dbz: number;
}

const clutterCache = new WeakMap<Scenario, Clutter[]>();

/**
 * Static ground clutter: small clusters (1–3 pixels) on high ground within 120 km of the radar and
 * a few near it, in the lowest level only; too small ever to pass the identification rules.
 */
function clutterOf(sc: Scenario, g: RadarGridSpec): Clutter[] {
  const cached = clutterCache.get(sc);
  if (cached) return cached;
  const r = new Rng(sc.seed, 'clutter');
  const out: Clutter[] = [];
  let tries = 0;
  while (out.length < 150 && tries < 20000) {
    tries++;
    const i = r.int(0, g.nx - 1);
    const j = r.int(0, g.ny - 1);
    const [x, y] = pixelCentreKm(g, i, j);
    const rr = Math.hypot(x, y);
    if (rr > 120) continue;
    const [lon, lat] = sc.projection.toLonLat(x, y);
    const high = sc.terrain.elevation(lon, lat) > 480;
    if (!(high || (rr < 15 && r.chance(0.05)))) continue;
    const base = r.range(24, 50);
    const size = r.int(1, 3);
    const cells: [number, number][] = [
      [i, j],
      [i + 1, j],
      [i, j + 1],
    ];
    for (let c = 0; c < size; c++) out.push({ i: cells[c][0], j: cells[c][1], dbz: base - 4 * c });
  }
  clutterCache.set(sc, out);
  return out;
}

/**
 * Renders the reflectivity volume of one nominal scan from the scenario's model cells: each cell's
 * analytic field (cellprops.ts) sampled at pixel centres and level heights, combined by maximum,
 * plus measurement noise (σ 0.7 dB on echo), sparse weak speckle in the lowest levels and static
 * ground clutter; quantised to Uint8 (0.5 dB steps from −32 dBZ); nodata outside the range ring.
 * Deterministic: the noise is drawn from a stream named by the seed and the scan index.
 */
export function renderVolume(sc: Scenario, step: number): RenderedVolume {
  const g = radarGrid();
  const { nx, ny } = g;
  const levels = g.levelsKm;
  const nz = levels.length;
  const plane = nx * ny;
  const dbz = new Float32Array(plane * nz).fill(-32);
  for (const s of sc.statesAt(step)) {
    if (s.areaKm2 <= 0) continue;
    const a = semiMajor(s.areaKm2, s.axisRatio);
    const b = a * s.axisRatio;
    const th = (s.orientationDeg * Math.PI) / 180;
    const ax = Math.sin(th);
    const ay = Math.cos(th);
    const k35 = s.peakDbz - 35;
    const outer = Math.max(2 * k35, 30);
    levels.forEach((h, lev) => {
      const p = coreDbz(s, h);
      if (p <= -32) return;
      // extent where the halo falls to the background
      const rhoMax = p - k35 > -32 ? 1 + (p - k35 + 32) / outer : Math.sqrt(Math.max(0, (p + 32) / k35));
      const ext = a * rhoMax + 1;
      const [i0, i1] = [
        Math.floor((s.x - ext - g.originM[0] / 1000) / g.spacingKm),
        Math.ceil((s.x + ext - g.originM[0] / 1000) / g.spacingKm),
      ];
      const [j0, j1] = [
        Math.floor((g.originM[1] / 1000 - (s.y + ext)) / g.spacingKm),
        Math.ceil((g.originM[1] / 1000 - (s.y - ext)) / g.spacingKm),
      ];
      for (let j = Math.max(0, j0); j <= Math.min(ny - 1, j1); j++) {
        const py = g.originM[1] / 1000 - (j + 0.5) * g.spacingKm - s.y;
        for (let i = Math.max(0, i0); i <= Math.min(nx - 1, i1); i++) {
          const px = g.originM[0] / 1000 + (i + 0.5) * g.spacingKm - s.x;
          const u = px * ax + py * ay;
          const v = -px * ay + py * ax;
          const z = fieldDbz(s, p, (u / a) ** 2 + (v / b) ** 2);
          const k = lev * plane + j * nx + i;
          if (z > dbz[k]) dbz[k] = z;
        }
      }
    });
  }
  const r = new Rng(sc.seed, 'render', step);
  for (let lev = 0; lev < nz; lev++) {
    const speckle = lev < 3 ? 0.0015 : 0;
    for (let q = 0; q < plane; q++) {
      const k = lev * plane + q;
      if (dbz[k] > -10) dbz[k] += 0.7 * r.normal();
      if (speckle && r.uniform() < speckle) dbz[k] = Math.max(dbz[k], r.range(0, 22));
    }
  }
  for (const c of clutterOf(sc, g)) {
    if (c.i >= nx || c.j >= ny) continue;
    const k = c.j * nx + c.i;
    dbz[k] = Math.max(dbz[k], c.dbz + 2.5 * r.normal());
  }
  const raw = new Uint8Array(plane * nz);
  const half = RADAR_GRID.halfSizeKm;
  const inRange = new Uint8Array(plane);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const [x, y] = pixelCentreKm(g, i, j);
      inRange[j * nx + i] = Math.hypot(x, y) <= Math.min(half, SITE.rangeKm) ? 1 : 0;
    }
  }
  for (let k = 0; k < raw.length; k++) raw[k] = inRange[k % plane] ? dbzToRaw(dbz[k]) : g.nodataRaw;
  return { grid: g, raw };
}

/** Column maximum (2-D) of a rendered volume; nodata stays nodata. */
export function columnMax(v: RenderedVolume): Uint8Array {
  const { nx, ny, levelsKm, nodataRaw } = v.grid;
  const plane = nx * ny;
  const out = new Uint8Array(plane);
  for (let q = 0; q < plane; q++) {
    let m = 0;
    if (v.raw[q] === nodataRaw) {
      out[q] = nodataRaw;
      continue;
    }
    for (let lev = 0; lev < levelsKm.length; lev++) m = Math.max(m, v.raw[lev * plane + q]);
    out[q] = m;
  }
  return out;
}

/** Band-sequential → pixel-interleaved, as the GeoTIFF strip wants it. */
export function interleave(raw: Uint8Array, plane: number, bands: number): Uint8Array {
  const out = new Uint8Array(raw.length);
  for (let b = 0; b < bands; b++) for (let q = 0; q < plane; q++) out[q * bands + b] = raw[b * plane + q];
  return out;
}
