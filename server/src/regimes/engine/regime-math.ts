import type { FlowSector, MoistureClass } from '@stormhour/shared';

/**
 * Wind speed and the direction the wind blows from, degrees clockwise from north in [0, 360):
 * atan2(−u, −v) (the meteorological convention); calm gives 0.
 */
export function windFrom(u: number, v: number): { speed: number; fromDeg: number } {
  const speed = Math.hypot(u, v);
  if (speed === 0) return { speed: 0, fromDeg: 0 };
  const deg = (Math.atan2(-u, -v) * 180) / Math.PI;
  return { speed, fromDeg: ((deg % 360) + 360) % 360 };
}

/**
 * Quantile by linear interpolation between order statistics (Hyndman & Fan 1996 type 7, the default
 * of R's quantile and numpy's percentile).
 */
export function quantile(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** The lower and upper terciles of the values. */
export function terciles(values: number[]): [number, number] {
  const sorted = [...values].sort((a, b) => a - b);
  return [quantile(sorted, 1 / 3), quantile(sorted, 2 / 3)];
}

export function moistureClass(q: number, [dryBelow, moistAbove]: [number, number]): MoistureClass {
  if (q < dryBelow) return 'dry';
  return q > moistAbove ? 'moist' : 'near-normal';
}

/** The sector the direction falls in ("from" inclusive, "to" exclusive; sectors may wrap north). */
export function flowClass(
  speed: number,
  fromDeg: number,
  sectors: FlowSector[],
  weakBelow: number,
): string | null {
  if (speed < weakBelow) return 'weak';
  for (const s of sectors) {
    const inside =
      s.fromDeg <= s.toDeg
        ? fromDeg >= s.fromDeg && fromDeg < s.toDeg
        : fromDeg >= s.fromDeg || fromDeg < s.toDeg;
    if (inside) return s.name;
  }
  return null;
}

export interface GridGeometry {
  nx: number;
  ny: number;
  lon0: number;
  lat0: number;
  dLon: number;
  dLat: number;
}

/** Cell-centre coordinates; row 0 is the northernmost. */
export const cellLon = (g: GridGeometry, i: number) => g.lon0 + i * g.dLon;
export const cellLat = (g: GridGeometry, j: number) => g.lat0 - j * g.dLat;

/**
 * Area-weighted mean over the domain cells: on a regular longitude–latitude grid a cell's area is
 * proportional to cos(latitude). Missing values are left out; `share` is the weighted share present.
 */
export function domainMean(
  values: ArrayLike<number>,
  g: GridGeometry,
  inDomain: Uint8Array,
): { mean: number | null; share: number } {
  let sum = 0;
  let weight = 0;
  let possible = 0;
  for (let j = 0; j < g.ny; j++) {
    const w = Math.cos((cellLat(g, j) * Math.PI) / 180);
    for (let i = 0; i < g.nx; i++) {
      const k = j * g.nx + i;
      if (!inDomain[k]) continue;
      possible += w;
      const v = values[k];
      if (Number.isNaN(v)) continue;
      sum += w * v;
      weight += w;
    }
  }
  return { mean: weight > 0 ? sum / weight : null, share: possible > 0 ? weight / possible : 0 };
}

/**
 * The regime of most days, in date order; a tie goes to the tied regime seen first (the earliest day's).
 * Days without a regime are not counted; null when none has one.
 */
export function mostFrequentRegime(days: { regime: string | null }[]): string | null {
  const counts = new Map<string, number>();
  for (const d of days) if (d.regime) counts.set(d.regime, (counts.get(d.regime) ?? 0) + 1);
  let best: string | null = null;
  // Map keeps first-seen order, so ">" leaves a tie with the earlier regime.
  for (const [regime, n] of counts) if (best === null || n > (counts.get(best) as number)) best = regime;
  return best;
}
