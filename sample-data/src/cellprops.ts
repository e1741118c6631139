import { SITE } from './config.js';
import { type CellState, semiMajor } from './storms.js';

/**
 * The reflectivity structure of a model cell, shared by the cell table and the rendered volumes.
 *
 * Core profile P(h) (dBZ on the cell's axis): rises slowly (2 dB/km) up to hmax, falls linearly to
 * 35 dBZ at top35 and on to 0 dBZ at the echo top, and keeps falling above it.
 * Horizontally, with ρ the elliptical radius scaled so that ρ = 1 is the 35 dBZ footprint at hmax:
 *   Z(ρ, h) = P(h) − (Pmax − 35) ρ²                                   for ρ ≤ 1
 *   Z(ρ, h) = P(h) − (Pmax − 35) − max(2 (Pmax − 35), 30) (ρ − 1)      for ρ > 1 (weak halo)
 * so the ≥ 35 dBZ region at level h is the ellipse ρ² ≤ (P(h) − 35)/(Pmax − 35), nested inside the
 * footprint.
 */
export function coreDbz(s: CellState, h: number): number {
  if (h <= s.hmaxKm) return s.peakDbz - 2 * (s.hmaxKm - h);
  if (h <= s.top35Km) return s.peakDbz - ((s.peakDbz - 35) * (h - s.hmaxKm)) / (s.top35Km - s.hmaxKm);
  return 35 - (35 * (h - s.top35Km)) / (s.echoTopKm - s.top35Km);
}

export function fieldDbz(s: CellState, coreAtLevel: number, rho2: number): number {
  const k = s.peakDbz - 35;
  if (rho2 <= 1) return coreAtLevel - k * rho2;
  return coreAtLevel - k - Math.max(2 * k, 30) * (Math.sqrt(rho2) - 1);
}

/** Greene & Clark (1972) VIL of one column from dBZ at the level heights (km), Z capped at capDbz. */
export function vilKgM2(dbz: readonly number[], levelsKm: readonly number[], capDbz: number): number {
  let vil = 0;
  for (let k = 0; k + 1 < dbz.length; k++) {
    const z1 = 10 ** (Math.min(dbz[k], capDbz) / 10);
    const z2 = 10 ** (Math.min(dbz[k + 1], capDbz) / 10);
    vil += 3.44e-6 * ((z1 + z2) / 2) ** (4 / 7) * (levelsKm[k + 1] - levelsKm[k]) * 1000;
  }
  return vil;
}

export interface CellMeasure {
  identified: boolean;
  /** reflectivity-weighted centroid, km east/north of the radar */
  x: number;
  y: number;
  areaKm2: number;
  volumeKm3: number;
  maxDbz: number;
  maxDbzHeightKm: number;
  top35Km: number;
  echoTopKm: number;
  core40Km3: number;
  vilMaxKgM2: number;
  /** whether the footprint reaches past the range ring (measured numerically on the visible part) */
  truncated: boolean;
}

const ID = SITE.identification;

/**
 * What a cell identifier working on the site's CAPPI levels would report for this cell: exact for
 * footprints inside the range ring, numerically (0.2 km sub-grid) for those cut by it.
 */
export function measureCell(
  s: CellState,
  levelsKm: readonly number[],
  thicknessKm: readonly number[],
  rangeKm: number,
): CellMeasure {
  const a = semiMajor(s.areaKm2, s.axisRatio);
  const core = levelsKm.map((h) => coreDbz(s, h));
  const k35 = s.peakDbz - 35;
  const none: CellMeasure = {
    identified: false,
    x: s.x,
    y: s.y,
    areaKm2: 0,
    volumeKm3: 0,
    maxDbz: 0,
    maxDbzHeightKm: 0,
    top35Km: 0,
    echoTopKm: 0,
    core40Km3: 0,
    vilMaxKgM2: 0,
    truncated: false,
  };
  if (s.areaKm2 <= 0 || k35 <= 0) return none;
  const rc = Math.hypot(s.x, s.y);
  if (rc - a > rangeKm) return none;
  const ellipse = s.areaKm2;
  if (rc + a <= rangeKm) {
    let maxF = 0;
    let volume = 0;
    let core40 = 0;
    let top35 = 0;
    let echoTop = 0;
    let maxDbz = Number.NEGATIVE_INFINITY;
    let maxH = 0;
    core.forEach((p, k) => {
      const f = (p - ID.thresholdDbz) / k35;
      if (f > 0) {
        maxF = Math.max(maxF, f);
        volume += ellipse * f * thicknessKm[k];
        top35 = levelsKm[k];
      }
      const f40 = (p - ID.coreThresholdDbz) / k35;
      if (f40 > 0) core40 += ellipse * f40 * thicknessKm[k];
      if (p >= ID.echoTopThresholdDbz) echoTop = levelsKm[k];
      if (p > maxDbz) {
        maxDbz = p;
        maxH = levelsKm[k];
      }
    });
    if (maxF <= 0) return none;
    return {
      identified: volume >= ID.minVolumeKm3,
      x: s.x,
      y: s.y,
      areaKm2: ellipse * maxF,
      volumeKm3: volume,
      maxDbz,
      maxDbzHeightKm: maxH,
      top35Km: top35,
      echoTopKm: echoTop,
      core40Km3: core40,
      vilMaxKgM2: vilKgM2(core, levelsKm, ID.vilCapDbz),
      truncated: false,
    };
  }

  // Cut by the range ring: integrate over the visible part on a fine sub-grid.
  const b = a * s.axisRatio;
  const th = (s.orientationDeg * Math.PI) / 180;
  const ax = Math.sin(th);
  const ay = Math.cos(th);
  const d = 0.2;
  const cellArea = d * d;
  let area = 0;
  let volume = 0;
  let core40 = 0;
  let top35 = 0;
  let echoTop = 0;
  let maxDbz = Number.NEGATIVE_INFINITY;
  let maxH = 0;
  let minRho2 = Number.POSITIVE_INFINITY;
  let wsum = 0;
  let wx = 0;
  let wy = 0;
  for (let px = -a; px <= a; px += d) {
    for (let py = -a; py <= a; py += d) {
      const x = s.x + px;
      const y = s.y + py;
      if (Math.hypot(x, y) > rangeKm) continue;
      const u = px * ax + py * ay;
      const v = -px * ay + py * ax;
      const rho2 = (u / a) ** 2 + (v / b) ** 2;
      if (rho2 > 1) continue;
      let inCell = false;
      core.forEach((p, k) => {
        const z = p - k35 * rho2;
        if (z >= ID.thresholdDbz) {
          inCell = true;
          volume += cellArea * thicknessKm[k];
          top35 = Math.max(top35, levelsKm[k]);
          const lin = 10 ** (z / 10);
          wsum += lin;
          wx += lin * x;
          wy += lin * y;
          if (z >= ID.coreThresholdDbz) core40 += cellArea * thicknessKm[k];
          if (z > maxDbz) {
            maxDbz = z;
            maxH = levelsKm[k];
          }
        }
      });
      if (inCell) {
        area += cellArea;
        minRho2 = Math.min(minRho2, rho2);
      }
    }
  }
  if (area <= 0) return none;
  const column = core.map((p) => p - k35 * minRho2);
  column.forEach((z, k) => {
    if (z >= ID.echoTopThresholdDbz) echoTop = levelsKm[k];
  });
  return {
    identified: volume >= ID.minVolumeKm3,
    x: wx / wsum,
    y: wy / wsum,
    areaKm2: area,
    volumeKm3: volume,
    maxDbz,
    maxDbzHeightKm: maxH,
    top35Km: top35,
    echoTopKm: echoTop,
    core40Km3: core40,
    vilMaxKgM2: vilKgM2(column, levelsKm, ID.vilCapDbz),
    truncated: true,
  };
}
