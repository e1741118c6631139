import { describe, expect, it } from 'vitest';
import { contourBands, niceThresholds, signedArea } from './contour-bands.js';
import { gaussianKde, gridAround } from './kde.js';

describe('density bands', () => {
  it('picks round thresholds below the maximum', () => {
    expect(niceThresholds(6.9)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(niceThresholds(7.3)).toEqual([2, 4, 6]);
    expect(niceThresholds(0.034, 4)).toEqual([0.01, 0.02, 0.03]);
    expect(niceThresholds(0)).toEqual([]);
  });

  it('draws a circle around a single kernel at the radius where the Gaussian falls to the threshold', () => {
    const grid = gridAround(40, 0.5, 0);
    const h = 10;
    const f = gaussianKde(Float64Array.of(5), Float64Array.of(-3), h, grid);
    const peak = 1 / (2 * Math.PI * h * h);
    const threshold = peak * Math.exp(-0.5); // reached at r = h (the Gaussian's definition)
    const [band] = contourBands(f, grid, [threshold], (x, y) => [x, y]);
    expect(band.geometry.coordinates).toHaveLength(1);
    const ring = band.geometry.coordinates[0][0];
    // Outer rings anticlockwise (RFC 7946 §3.1.6).
    expect(signedArea(ring)).toBeGreaterThan(0);
    for (const [x, y] of ring) expect(Math.hypot(x - 5, y + 3)).toBeCloseTo(h, 0);
    // The ring's centroid is the point itself: d3-contour's half-cell offset is accounted for.
    let cx = 0;
    let cy = 0;
    for (const [x, y] of ring.slice(1)) {
      cx += x / (ring.length - 1);
      cy += y / (ring.length - 1);
    }
    expect(Math.abs(cx - 5)).toBeLessThan(0.02);
    expect(Math.abs(cy + 3)).toBeLessThan(0.02);
    const area = signedArea(ring) / 2;
    expect(area / (Math.PI * h * h)).toBeCloseTo(1, 2);
  });
});
