import type { GeoPolygonal } from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { destination, sitePlane } from '../../radar/engine/site-plane.js';
import {
  areaAndPerimeter,
  bufferedAreaKm2,
  coverageFraction,
  toPlane,
  withinBuffer,
} from './block-coverage.js';
import { blocksWithin } from './neighbourhood.js';

const site = { lat: 14.18, lon: 87.95 };
const plane = sitePlane(site);

/** A square block of side s km centred on (x, y) km in the site plane. */
function squareAt(xKm: number, yKm: number, sideKm: number): GeoPolygonal {
  const h = sideKm / 2;
  const ring = [
    [xKm - h, yKm - h],
    [xKm + h, yKm - h],
    [xKm + h, yKm + h],
    [xKm - h, yKm + h],
    [xKm - h, yKm - h],
  ].map(([x, y]) => plane.toLonLat(x, y));
  return { type: 'Polygon', coordinates: [ring] };
}

describe('block coverage fraction', () => {
  const coverage = { ...site, rangeKm: 100, blockedSectors: [] };

  it('is 1 for a block well inside the range ring', () => {
    expect(coverageFraction(squareAt(20, 30, 10), coverage, plane)).toBe(1);
  });

  it('is about one half for a block centred on the range ring', () => {
    // The ring's curvature over a 10 km block is small (sagitta 0.125 km): half the area, within 2 %.
    const half = coverageFraction(squareAt(100, 0, 10), coverage, plane);
    expect(half).toBeGreaterThan(0.48);
    expect(half).toBeLessThan(0.52);
  });

  it('is about one half for a block split by the edge of a blocked sector', () => {
    // A sector from due north (0°) to 90°: the block centred on the northward line at 50 km is cut in two.
    const blocked = { ...site, rangeKm: 100, blockedSectors: [{ fromDeg: 0, toDeg: 90 }] };
    const f = coverageFraction(squareAt(0, 50, 10), blocked, plane);
    expect(f).toBeGreaterThan(0.47);
    expect(f).toBeLessThan(0.53);
  });

  it('is 0 beyond the range', () => {
    expect(coverageFraction(squareAt(130, 0, 10), coverage, plane)).toBe(0);
  });

  it('places the edge where the geodesic range ends (Karney 2013 direct problem)', () => {
    const edge = destination(site, 90, 100);
    const [x] = plane.toKm(edge.lon, edge.lat);
    expect(x).toBeCloseTo(100, 2);
  });
});

describe('neighbourhood of a block', () => {
  const square = toPlane(squareAt(0, 0, 10), plane);

  it('measures the block in the plane: a 10 km square is 100 km² with a 40 km perimeter', () => {
    const { areaKm2, perimeterKm } = areaAndPerimeter(square);
    expect(areaKm2).toBeCloseTo(100, 2);
    expect(perimeterKm).toBeCloseTo(40, 2);
  });

  it('buffers a convex block by Steiner’s formula A + P r + π r² (exact for convex sets)', () => {
    expect(bufferedAreaKm2(100, 40, 2)).toBeCloseTo(100 + 80 + 4 * Math.PI, 12);
  });

  it('counts a point inside, or within r km of the boundary', () => {
    expect(withinBuffer(square, 0, 0, 0)).toBe(true);
    expect(withinBuffer(square, 6, 0, 0)).toBe(false);
    expect(withinBuffer(square, 6, 0, 1.5)).toBe(true);
    // Off the corner (5, 5): distance √2 ≈ 1.414.
    expect(withinBuffer(square, 6, 6, 1.4)).toBe(false);
    expect(withinBuffer(square, 6, 6, 1.42)).toBe(true);
  });

  it('lists every block an event is near, and none for an event far away', () => {
    const east = toPlane(squareAt(10, 0, 10), plane);
    const found = blocksWithin(
      Float64Array.from([4.9, 0, 30]),
      Float64Array.from([0, 0, 30]),
      [square, east],
      0.5,
    );
    expect(Array.from(found.offsets)).toEqual([0, 2, 3, 3]);
    expect(Array.from(found.blockIndex)).toEqual([0, 1, 0]);
  });
});
