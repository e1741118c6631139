import type { GeoPolygonal, Position } from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { boundingBox, centroid, geodesicAreaKm2 } from './block-geometry.js';

// WGS84 defining parameters (NIMA TR8350.2).
const a = 6378137;
const f = 1 / 298.257223563;
const e2 = f * (2 - f);
const e = Math.sqrt(e2);

/** Surface area of an ellipsoid of revolution, closed form: 2πa²[1 + (1 − e²)/e · atanh(e)]. */
const ellipsoidAreaKm2 = (2 * Math.PI * a * a * (1 + ((1 - e2) / e) * Math.atanh(e))) / 1e6;

const square = (lon0: number, lat0: number, d: number): { type: 'Polygon'; coordinates: Position[][] } => ({
  type: 'Polygon',
  coordinates: [
    [
      [lon0, lat0],
      [lon0 + d, lat0],
      [lon0 + d, lat0 + d],
      [lon0, lat0 + d],
      [lon0, lat0],
    ],
  ],
});

describe('geodesicAreaKm2', () => {
  it('gives an octant of the ellipsoid one eighth of its closed-form surface area', () => {
    // The triangle (0,0), (0,90E), pole is bounded by geodesics (equator, two meridians); by symmetry it
    // is exactly 1/8 of the surface. The GeographicLib Planimeter documentation shows the same polygon.
    const octant: GeoPolygonal = {
      type: 'Polygon',
      coordinates: [
        [
          [0, 0],
          [90, 0],
          [0, 90],
          [0, 0],
        ],
      ],
    };
    expect(geodesicAreaKm2(octant)).toBeCloseTo(ellipsoidAreaKm2 / 8, 3);
    // WGS84 total surface, 510 065 621.7 km² (computed from the closed form above; from memory also in TR8350.2).
    expect(ellipsoidAreaKm2).toBeCloseTo(510_065_621.7, 0);
  });

  it('matches M·N·cosφ·Δφ·Δλ for a small square at the demo latitude', () => {
    // Area element of the ellipsoid with the meridian (M) and prime-vertical (N) radii of curvature
    // (standard geodesy, e.g. Snyder 1987, USGS PP 1395, eqs 4-18 and 4-20). At 0.05° the second-order
    // error is far below 1e-5.
    const lat = 14.025;
    const d = 0.05;
    const s2 = Math.sin((lat * Math.PI) / 180) ** 2;
    const M = (a * (1 - e2)) / (1 - e2 * s2) ** 1.5;
    const N = a / Math.sqrt(1 - e2 * s2);
    const rad = (d * Math.PI) / 180;
    const expected = (M * N * Math.cos((lat * Math.PI) / 180) * rad * rad) / 1e6;
    expect(geodesicAreaKm2(square(88, 14, d)) / expected).toBeCloseTo(1, 5);
  });

  it('subtracts holes and sums the parts of a multipolygon, whatever the ring orientation', () => {
    const outer = square(88, 14, 0.2).coordinates[0] as [number, number][];
    const hole = (square(88.05, 14.05, 0.1).coordinates[0] as [number, number][]).slice().reverse();
    const withHole: GeoPolygonal = { type: 'Polygon', coordinates: [outer, hole] };
    const big = geodesicAreaKm2(square(88, 14, 0.2));
    const small = geodesicAreaKm2(square(88.05, 14.05, 0.1));
    expect(geodesicAreaKm2(withHole)).toBeCloseTo(big - small, 6);
    const reversed: GeoPolygonal = { type: 'Polygon', coordinates: [outer.slice().reverse()] };
    expect(geodesicAreaKm2(reversed)).toBeCloseTo(big, 6);
    const multi: GeoPolygonal = {
      type: 'MultiPolygon',
      coordinates: [square(88, 14, 0.2).coordinates, square(89, 14, 0.2).coordinates],
    };
    expect(geodesicAreaKm2(multi)).toBeCloseTo(2 * big, 3);
  });
});

describe('centroid and bounding box', () => {
  it.each([
    // Plane-geometry centroids worked by hand (common practice: shoelace formula).
    ['unit square', square(0, 0, 1), [0.5, 0.5]],
    ['square at the demo site', square(88, 14, 0.2), [88.1, 14.1]],
  ] as const)('%s', (_name, g, expected) => {
    const [x, y] = centroid(g);
    expect(x).toBeCloseTo(expected[0], 10);
    expect(y).toBeCloseTo(expected[1], 10);
  });

  it('moves the centroid away from a hole', () => {
    // Square 0..2 minus the hole 0..1 × 0..1: an L of area 3 whose centroid is (7/6, 7/6) by the
    // composite-area rule (2·2·1 − 1·0.5)/3.
    const g: GeoPolygonal = {
      type: 'Polygon',
      coordinates: [square(0, 0, 2).coordinates[0], square(0, 0, 1).coordinates[0].slice().reverse()],
    };
    const [x, y] = centroid(g);
    expect(x).toBeCloseTo(7 / 6, 10);
    expect(y).toBeCloseTo(7 / 6, 10);
  });

  it('takes the bounding box over all parts', () => {
    const multi: GeoPolygonal = {
      type: 'MultiPolygon',
      coordinates: [square(88, 14, 0.2).coordinates, square(89, 13, 0.5).coordinates],
    };
    expect(boundingBox(multi)).toEqual([88, 13, 89.5, 14.2]);
  });
});
