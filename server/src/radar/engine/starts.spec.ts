import { describe, expect, it } from 'vitest';
import { BlockLocator } from './block-locator.js';
import { classifyStart } from './starts.js';

const MIN = 60_000;
const scans = Float64Array.from([0, 6, 12, 18, 60, 66].map((m) => m * MIN));
const rules = {
  maxGapMs: 15 * MIN,
  edgeBandKm: 10,
  coverage: { lat: 14, lon: 88, rangeKm: 180, blockedSectors: [{ fromDeg: 100, toDeg: 120 }] },
};
const start = (over = {}) => ({
  hasParent: false,
  firstTime: 12 * MIN,
  firstDistanceKm: 80,
  firstAzimuthDeg: 200,
  ...over,
});

// Worked by hand from the definitions of DESIGN §3.2.
describe('classifyStart', () => {
  it.each([
    ['an ordinary start', start(), null],
    ['a split child', start({ hasParent: true }), 'split'],
    ['a start in the first scan', start({ firstTime: 0 }), 'data-start'],
    ['a start after the 42-minute gap', start({ firstTime: 60 * MIN }), 'after-gap'],
    ['a start 175 km out', start({ firstDistanceKm: 175 }), 'edge-band'],
    [
      'a start 5 km beside a blocked sector',
      start({ firstDistanceKm: 80, firstAzimuthDeg: 97 }),
      'edge-band',
    ],
    ['a start 20 km beside a blocked sector', start({ firstDistanceKm: 80, firstAzimuthDeg: 85 }), null],
  ])('%s', (_what, s, reason) => {
    expect(classifyStart(s, scans, rules)).toBe(reason);
  });
});

describe('BlockLocator', () => {
  const square = (x: number, y: number) => ({
    type: 'Polygon' as const,
    coordinates: [
      [
        [x, y],
        [x + 1, y],
        [x + 1, y + 1],
        [x, y + 1],
        [x, y],
      ] as [number, number][],
    ],
  });
  const triangle = {
    type: 'Polygon' as const,
    coordinates: [
      [
        [2, 0],
        [3, 0],
        [2, 1],
        [2, 0],
      ] as [number, number][],
    ],
  };
  const locator = new BlockLocator([
    { id: 1, bbox: [0, 0, 1, 1], geometry: square(0, 0) },
    { id: 2, bbox: [1, 0, 2, 1], geometry: square(1, 0) },
    { id: 3, bbox: [2, 0, 3, 1], geometry: triangle },
  ]);

  it.each([
    [0.5, 0.5, 1],
    [1.5, 0.2, 2],
    [2.2, 0.2, 3],
    // Inside the triangle's box but outside the triangle.
    [2.9, 0.9, null],
    [5, 5, null],
  ])('puts (%d, %d) in block %s', (lon, lat, id) => {
    expect(locator.locate(lon, lat)).toBe(id);
  });
});
