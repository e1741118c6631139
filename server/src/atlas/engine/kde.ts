/**
 * Gaussian kernel density of points on a regular grid in a plane (km):
 *   f(x, y) = Σᵢ 1/(2πh²) · exp(−((x − xᵢ)² + (y − yᵢ)²) / (2h²)),
 * the bivariate product-Gaussian kernel estimate with one bandwidth h (Silverman 1986, ch. 4). Left
 * unnormalised by n so that it integrates to the number of points: a density of points per km².
 */

export interface PlaneGrid {
  /** Centre of node (0, 0), km; nodes step east (i) and north (j). */
  x0: number;
  y0: number;
  stepKm: number;
  nx: number;
  ny: number;
}

/** Kernels are cut beyond this many bandwidths: the weight lost there is e^(−4.5²/2) ≈ 4e-5 per axis. */
const CUTOFF_BANDWIDTHS = 4.5;

/** A grid of the given step covering a disc of radius r around the plane's origin, with a margin. */
export function gridAround(radiusKm: number, stepKm: number, marginKm: number): PlaneGrid {
  const half = Math.ceil((radiusKm + marginKm) / stepKm);
  return { x0: -half * stepKm, y0: -half * stepKm, stepKm, nx: 2 * half + 1, ny: 2 * half + 1 };
}

/**
 * Density at every node, row-major (index i + j·nx), points per km². The kernel is separable, so each
 * point adds the outer product of two 1-D weight windows: fast enough for thousands of points.
 */
export function gaussianKde(
  xs: Float64Array,
  ys: Float64Array,
  bandwidthKm: number,
  grid: PlaneGrid,
): Float64Array {
  if (xs.length !== ys.length) throw new Error('gaussianKde: xs and ys differ in length');
  if (!(bandwidthKm > 0)) throw new Error('gaussianKde: the bandwidth must be above 0');
  const { x0, y0, stepKm, nx, ny } = grid;
  const out = new Float64Array(nx * ny);
  const norm = 1 / (2 * Math.PI * bandwidthKm * bandwidthKm);
  const twoH2 = 2 * bandwidthKm * bandwidthKm;
  const reach = Math.ceil((CUTOFF_BANDWIDTHS * bandwidthKm) / stepKm);
  const wx = new Float64Array(2 * reach + 1);
  const wy = new Float64Array(2 * reach + 1);
  for (let p = 0; p < xs.length; p++) {
    const ci = Math.round((xs[p] - x0) / stepKm);
    const cj = Math.round((ys[p] - y0) / stepKm);
    const i0 = Math.max(0, ci - reach);
    const i1 = Math.min(nx - 1, ci + reach);
    const j0 = Math.max(0, cj - reach);
    const j1 = Math.min(ny - 1, cj + reach);
    if (i0 > i1 || j0 > j1) continue;
    for (let i = i0; i <= i1; i++) {
      const d = x0 + i * stepKm - xs[p];
      wx[i - i0] = Math.exp(-(d * d) / twoH2);
    }
    for (let j = j0; j <= j1; j++) {
      const d = y0 + j * stepKm - ys[p];
      wy[j - j0] = norm * Math.exp(-(d * d) / twoH2);
    }
    for (let j = j0; j <= j1; j++) {
      const row = j * nx;
      const w = wy[j - j0];
      for (let i = i0; i <= i1; i++) out[row + i] += w * wx[i - i0];
    }
  }
  return out;
}

/** Σ f · cell area: the number of points the density holds on the grid (midpoint rule). */
export function gridIntegral(density: Float64Array, grid: PlaneGrid): number {
  let sum = 0;
  for (let k = 0; k < density.length; k++) sum += density[k];
  return sum * grid.stepKm * grid.stepKm;
}
