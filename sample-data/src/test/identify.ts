/**
 * A minimal reference cell identifier for the tests: threshold, connected-component labelling
 * (26-connectivity in 3-D, 8 in 2-D), volume/area rule, Z-weighted centroid. It exists only to show
 * that the rendered files contain the storms of the truth table; it is not the product's engine.
 */
export interface Component {
  voxels: number;
  /** km² of the projection onto the horizontal */
  areaKm2: number;
  volumeKm3: number;
  /** Z-weighted centroid, km east/north of the radar (pixel centres) */
  x: number;
  y: number;
  maxDbz: number;
  topLevel: number;
}

export function labelComponents(
  raw: Uint8Array | ArrayLike<number>,
  nx: number,
  ny: number,
  nz: number,
  opts: {
    thresholdRaw: number;
    nodataRaw: number;
    scale: number;
    offset: number;
    originKm: [number, number];
    dxKm: number;
  },
): Component[] {
  const plane = nx * ny;
  const label = new Int32Array(plane * nz).fill(-1);
  const comps: Component[] = [];
  const stack: number[] = [];
  for (let start = 0; start < plane * nz; start++) {
    const v0 = raw[start];
    if (label[start] !== -1 || v0 === opts.nodataRaw || v0 < opts.thresholdRaw) continue;
    const id = comps.length;
    const c: Component = { voxels: 0, areaKm2: 0, volumeKm3: 0, x: 0, y: 0, maxDbz: -Infinity, topLevel: -1 };
    const footprint = new Set<number>();
    let wsum = 0;
    label[start] = id;
    stack.push(start);
    while (stack.length) {
      const k = stack.pop() as number;
      const z = Math.floor(k / plane);
      const q = k - z * plane;
      const j = Math.floor(q / nx);
      const i = q - j * nx;
      const dbz = raw[k] * opts.scale + opts.offset;
      const w = 10 ** (dbz / 10);
      c.voxels++;
      c.volumeKm3 += opts.dxKm * opts.dxKm;
      footprint.add(q);
      wsum += w;
      c.x += w * (opts.originKm[0] + (i + 0.5) * opts.dxKm);
      c.y += w * (opts.originKm[1] - (j + 0.5) * opts.dxKm);
      c.maxDbz = Math.max(c.maxDbz, dbz);
      c.topLevel = Math.max(c.topLevel, z);
      for (let dz = -1; dz <= 1; dz++) {
        const zz = z + dz;
        if (zz < 0 || zz >= nz) continue;
        for (let dj = -1; dj <= 1; dj++) {
          const jj = j + dj;
          if (jj < 0 || jj >= ny) continue;
          for (let di = -1; di <= 1; di++) {
            const ii = i + di;
            if (ii < 0 || ii >= nx) continue;
            const kk = zz * plane + jj * nx + ii;
            const v = raw[kk];
            if (label[kk] !== -1 || v === opts.nodataRaw || v < opts.thresholdRaw) continue;
            label[kk] = id;
            stack.push(kk);
          }
        }
      }
    }
    c.x /= wsum;
    c.y /= wsum;
    c.areaKm2 = footprint.size * opts.dxKm * opts.dxKm;
    comps.push(c);
  }
  return comps;
}
