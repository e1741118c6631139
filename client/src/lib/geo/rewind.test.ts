import { geoArea, geoContains } from 'd3-geo';
import type { Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { rewindForD3, ringSignedArea } from './rewind';

// An RFC 7946 §3.1.6 square: outer ring anticlockwise, hole clockwise.
const square: Polygon = {
  type: 'Polygon',
  coordinates: [
    [
      [88, 14],
      [89, 14],
      [89, 15],
      [88, 15],
      [88, 14],
    ],
    [
      [88.4, 14.4],
      [88.4, 14.6],
      [88.6, 14.6],
      [88.6, 14.4],
      [88.4, 14.4],
    ],
  ],
};

const rad = Math.PI / 180;

describe('ringSignedArea', () => {
  it.each([
    // Shoelace formula: twice the area of a unit square, sign by direction (common practice).
    [
      'anticlockwise unit square',
      [
        [0, 0],
        [1, 0],
        [1, 1],
        [0, 1],
        [0, 0],
      ],
      2,
    ],
    [
      'clockwise unit square',
      [
        [0, 0],
        [0, 1],
        [1, 1],
        [1, 0],
        [0, 0],
      ],
      -2,
    ],
    [
      'right triangle of legs 2 and 3',
      [
        [0, 0],
        [2, 0],
        [0, 3],
        [0, 0],
      ],
      6,
    ],
  ])('%s', (_name, ring, expected) => {
    expect(ringSignedArea(ring as [number, number][])).toBe(expected);
  });
});

describe('rewindForD3', () => {
  it('turns an RFC 7946 block into the small area d3-geo expects', () => {
    // Reference: d3-geo reads an anticlockwise outer ring as the rest of the globe (d3-geo docs, "Spherical polygons").
    expect(geoArea(square)).toBeGreaterThan(2 * Math.PI);
    const rewound = rewindForD3(square);
    // Area of a 1°×1° cell minus the 0.2°×0.2° hole on the unit sphere, Δλ·(sin φ₂ − sin φ₁) (from memory).
    const cell = (lo: number, hi: number, w: number) => w * rad * (Math.sin(hi * rad) - Math.sin(lo * rad));
    const expected = cell(14, 15, 1) - cell(14.4, 14.6, 0.2);
    // d3 joins corners by great-circle arcs, not parallels, so the two differ by about 2e-5 relative.
    expect(Math.abs(geoArea(rewound) - expected) / expected).toBeLessThan(1e-4);
    expect(geoContains(rewound, [88.2, 14.2])).toBe(true);
    expect(geoContains(rewound, [88.5, 14.5])).toBe(false);
  });

  it('leaves rings already wound for d3 untouched, and rewinds every part of a MultiPolygon', () => {
    const once = rewindForD3(square);
    expect(rewindForD3(once)).toEqual(once);
    const multi = rewindForD3({
      type: 'MultiPolygon',
      coordinates: [square.coordinates, square.coordinates],
    });
    expect(multi.coordinates).toEqual([once.coordinates, once.coordinates]);
  });

  it('does not change the input', () => {
    const before = structuredClone(square);
    rewindForD3(square);
    expect(square).toEqual(before);
  });
});
