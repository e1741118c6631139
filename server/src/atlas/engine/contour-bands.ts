import { contours } from 'd3-contour';
import type { PlaneGrid } from './kde.js';

type Ring = number[][];
export interface BandGeometry {
  type: 'MultiPolygon';
  coordinates: Ring[][];
}

/** Round steps 1, 2, 5 × 10ᵏ: about `count` thresholds from one step up to below the maximum. */
export function niceThresholds(max: number, count = 7): number[] {
  if (!(max > 0)) return [];
  const raw = max / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const out: number[] = [];
  for (let t = step; t < max; t += step) out.push(Number(t.toPrecision(12)));
  return out;
}

/** Twice the signed area of a ring in its own x/y; positive when it runs anticlockwise. */
export function signedArea(ring: Ring): number {
  let sum = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    sum += (ring[j][0] - ring[i][0]) * (ring[j][1] + ring[i][1]);
  }
  return -sum;
}

function oriented(ring: Ring, anticlockwise: boolean): Ring {
  return signedArea(ring) > 0 === anticlockwise ? ring : [...ring].reverse();
}

/**
 * Marching-squares bands (d3-contour) of a grid of values, each the region where the value is at least
 * its threshold, turned into lon/lat with `toLonLat` of the grid's plane. d3-contour places value k at
 * the centre of unit square k, so grid coordinate g maps to node g − ½. Rings are wound as RFC 7946
 * asks (outer anticlockwise, holes clockwise) so any GeoJSON reader draws them the right way.
 */
export function contourBands(
  values: Float64Array,
  grid: PlaneGrid,
  thresholds: number[],
  toLonLat: (xKm: number, yKm: number) => [number, number],
): { threshold: number; geometry: BandGeometry }[] {
  const generator = contours().size([grid.nx, grid.ny]).thresholds(thresholds);
  const place = ([gx, gy]: number[]) =>
    toLonLat(grid.x0 + (gx - 0.5) * grid.stepKm, grid.y0 + (gy - 0.5) * grid.stepKm);
  return generator(Array.from(values)).map((band) => ({
    threshold: band.value,
    geometry: {
      type: 'MultiPolygon',
      coordinates: band.coordinates.map((polygon) =>
        polygon.map((ring, k) =>
          oriented(
            ring.map((p) => place(p)),
            k === 0,
          ),
        ),
      ),
    },
  }));
}
