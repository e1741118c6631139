import { describe, expect, it } from 'vitest';
import { equivalentEllipse } from './ellipse.js';

describe('equivalentEllipse (second moments, Hu 1962)', () => {
  it('matches the worked pixels (0,0),(1,0),(2,1),(3,1)', () => {
    // REFERENCES §7 (computed): μ20 = 5, μ02 = 1, μ11 = 2 → θ = 22.5°; semi-axes 1 + √2 and √2 − 1.
    const e = equivalentEllipse([0, 1, 2, 3], [0, 0, 1, 1]);
    expect(e.cx).toBeCloseTo(1.5, 12);
    expect(e.cy).toBeCloseTo(0.5, 12);
    expect(e.angleFromX).toBeCloseTo(22.5, 10);
    expect(e.semiMajor).toBeCloseTo(1 + Math.SQRT2, 10);
    expect(e.semiMinor).toBeCloseTo(Math.SQRT2 - 1, 10);
    expect(e.orientationFromNorth).toBeCloseTo(67.5, 10);
  });

  it.each([
    // REFERENCES §7: a row → 0°, the diagonal → 45°, the anti-diagonal → −45°, a column → 90° (from +x).
    ['a row', [0, 1, 2], [0, 0, 0], 0, 90],
    ['the diagonal', [0, 1, 2], [0, 1, 2], 45, 45],
    ['the anti-diagonal', [0, 1, 2], [2, 1, 0], -45, 135],
    ['a column', [0, 0, 0], [0, 1, 2], 90, 0],
  ])('orients %s', (_what, xs, ys, fromX, fromNorth) => {
    const e = equivalentEllipse(xs, ys);
    expect(e.angleFromX).toBeCloseTo(fromX, 10);
    expect(e.orientationFromNorth).toBeCloseTo(fromNorth, 10);
    expect(e.semiMinor).toBeCloseTo(0, 6);
  });

  it('gives a filled disc of radius r semi-axes close to r (uniform-ellipse identity, common practice)', () => {
    const xs: number[] = [];
    const ys: number[] = [];
    for (let x = -40; x <= 40; x++)
      for (let y = -40; y <= 40; y++)
        if (x * x + y * y <= 1600) {
          xs.push(x);
          ys.push(y);
        }
    const e = equivalentEllipse(xs, ys);
    expect(e.semiMajor / 40).toBeCloseTo(1, 2);
    expect(e.semiMinor / 40).toBeCloseTo(1, 2);
  });
});
