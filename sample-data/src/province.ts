import { PROVINCE } from './config.js';
import { fromLocalKm, roundTo } from './geo.js';
import { Rng } from './prng.js';

export type Ring = [number, number][];

/**
 * The province outline: a superellipse of about 3° × 2.5° around the centre, with a few seeded
 * harmonics so the border is not a regular shape. Closed ring, counter-clockwise, lon/lat rounded to
 * 6 decimals.
 */
export function provinceOutline(seed: number): Ring {
  const r = new Rng(seed, 'province');
  const harmonics = [2, 3, 5, 7].map((k) => ({
    k,
    amp: r.range(0.015, 0.045) / Math.sqrt(k / 2),
    phase: r.range(0, 2 * Math.PI),
  }));
  const n = PROVINCE.vertices;
  const p = PROVINCE.superellipseExponent;
  const ring: Ring = [];
  for (let i = 0; i < n; i++) {
    const t = (2 * Math.PI * i) / n;
    const c = Math.cos(t);
    const s = Math.sin(t);
    let wobble = 1;
    for (const h of harmonics) wobble += h.amp * Math.sin(h.k * t + h.phase);
    const x = PROVINCE.halfWidthKm * Math.sign(c) * Math.abs(c) ** (2 / p) * wobble;
    const y = PROVINCE.halfHeightKm * Math.sign(s) * Math.abs(s) ** (2 / p) * wobble;
    const [lon, lat] = fromLocalKm(x, y, PROVINCE.centerLon, PROVINCE.centerLat);
    ring.push([roundTo(lon, 6), roundTo(lat, 6)]);
  }
  ring.push([ring[0][0], ring[0][1]]);
  return ring;
}

/** Ray-casting point-in-ring test (lon/lat treated as planar, fine at this size). */
export function pointInRing(lon: number, lat: number, ring: readonly (readonly number[])[]): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > lat !== yj > lat && lon < ((xj - xi) * (lat - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
