/**
 * A reflectivity grid placed on the radar site's plane. Whatever the file's projection, the reader
 * turns it into this: for every column its position (km east and north of the radar) and area.
 */
export interface PlacedGrid {
  nx: number;
  ny: number;
  /** 1 for a 2-D field (column maximum). */
  nz: number;
  /** dBZ, index (z·ny + y)·nx + x. NaN or `nodata` where there is no data. */
  data: Float32Array;
  nodata?: number;
  /** Height of each level's centre, m; empty for a 2-D field. */
  levelHeightsM: number[];
  /** Per column (y·nx + x): position on the site plane, km. */
  xKm: Float64Array;
  yKm: Float64Array;
  /** Per column: horizontal area, km². */
  areaKm2: Float64Array;
  /** From the site plane back to longitude and latitude. */
  toLonLat(xKm: number, yKm: number): [number, number];
}

/**
 * Layer thickness of each level, m: from half-way to the level below to half-way to the level above;
 * the lowest and highest layers extend as far beyond their centre as to their neighbour's half-way
 * point, and the lowest never below 0.
 */
export function layerThicknessesM(heights: number[]): number[] {
  const n = heights.length;
  if (n === 0) return [];
  if (n === 1) throw new Error('A volume with one level has no layer thickness: give it as a 2-D field');
  for (let k = 1; k < n; k++) {
    if (!(heights[k] > heights[k - 1]))
      throw new Error(`Level heights must increase: level ${k} is ${heights[k]} m after ${heights[k - 1]} m`);
  }
  const bounds = new Array<number>(n + 1);
  bounds[0] = Math.max(0, heights[0] - (heights[1] - heights[0]) / 2);
  for (let k = 1; k < n; k++) bounds[k] = (heights[k - 1] + heights[k]) / 2;
  bounds[n] = heights[n - 1] + (heights[n - 1] - heights[n - 2]) / 2;
  return heights.map((_, k) => bounds[k + 1] - bounds[k]);
}
