import { describe, expect, it } from 'vitest';
import { gaussianKde, gridAround, gridIntegral } from './kde.js';

describe('Gaussian kernel density on a grid', () => {
  it('peaks at 1/(2πh²) on a single point (the bivariate Gaussian kernel; Silverman 1986 ch. 4, from memory)', () => {
    const grid = gridAround(50, 1, 0);
    const h = 8;
    const f = gaussianKde(Float64Array.of(0), Float64Array.of(0), h, grid);
    const centre = Math.floor(grid.nx / 2) + Math.floor(grid.ny / 2) * grid.nx;
    expect(f[centre]).toBeCloseTo(1 / (2 * Math.PI * h * h), 12);
    expect(Math.max(...f)).toBe(f[centre]);
    // One bandwidth away east the kernel has fallen by e^(−1/2).
    expect(f[centre + h] / f[centre]).toBeCloseTo(Math.exp(-0.5), 12);
  });

  it('integrates to the number of points, within the grid’s truncation', () => {
    const xs = Float64Array.of(-20, 0, 13.3, 25, -7.5);
    const ys = Float64Array.of(10, 0, -21.7, 3, 30);
    const grid = gridAround(40, 2, 60);
    const f = gaussianKde(xs, ys, 10, grid);
    expect(gridIntegral(f, grid)).toBeCloseTo(5, 3);
  });

  it('loses the mass beyond the grid edge: a point on the edge keeps about a half', () => {
    const grid = gridAround(30, 1, 0);
    const f = gaussianKde(Float64Array.of(30), Float64Array.of(0), 5, grid);
    // Half the kernel lies east of x = 30 km, the grid's last column (plus the half cell it stands for).
    expect(gridIntegral(f, grid)).toBeGreaterThan(0.5);
    expect(gridIntegral(f, grid)).toBeLessThan(0.6);
  });

  it('agrees with a direct sum of the kernel at every node (a plain reference without the cut-off)', () => {
    const xs = Float64Array.of(3, -4.2, 11);
    const ys = Float64Array.of(-1, 6.6, 2);
    const grid = gridAround(20, 2.5, 0);
    const h = 4;
    const f = gaussianKde(xs, ys, h, grid);
    let worst = 0;
    for (let j = 0; j < grid.ny; j++)
      for (let i = 0; i < grid.nx; i++) {
        const x = grid.x0 + i * grid.stepKm;
        const y = grid.y0 + j * grid.stepKm;
        let direct = 0;
        for (let p = 0; p < xs.length; p++)
          direct += Math.exp(-((x - xs[p]) ** 2 + (y - ys[p]) ** 2) / (2 * h * h)) / (2 * Math.PI * h * h);
        worst = Math.max(worst, Math.abs(direct - f[i + j * grid.nx]));
      }
    // The cut-off at 4.5 h drops at most e^(−10) of the peak.
    expect(worst).toBeLessThan(1e-4 / (2 * Math.PI * h * h));
  });

  it('refuses a bandwidth of zero', () => {
    expect(() => gaussianKde(Float64Array.of(0), Float64Array.of(0), 0, gridAround(5, 1, 0))).toThrow(
      /bandwidth/,
    );
  });
});
