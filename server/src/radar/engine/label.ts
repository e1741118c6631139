import { cellKernel } from './cell-kernel.js';

/**
 * Connected-component labelling of a thresholded grid, working on runs (horizontal stretches of
 * voxels at or above the threshold) instead of voxels: one pass reads the floats and finds runs, a
 * union–find joins runs that touch in neighbouring rows. No dense label volume is built.
 */

export type Connectivity = 4 | 8 | 6 | 18 | 26;

export interface GridShape {
  nx: number;
  ny: number;
  /** 1 for a 2-D field. */
  nz: number;
}

/** Runs of one labelling, in scan order (z, then y, then x). x1 is exclusive. */
export interface Runs {
  count: number;
  z: Int32Array;
  y: Int32Array;
  x0: Int32Array;
  x1: Int32Array;
  /** Component of each run, 0-based, numbered in order of first appearance. */
  label: Int32Array;
}

export interface Labelling {
  shape: GridShape;
  runs: Runs;
  components: number;
}

class GrowableInt32 {
  data = new Int32Array(1024);
  length = 0;
  push(v: number): void {
    if (this.length === this.data.length) {
      const bigger = new Int32Array(this.data.length * 2);
      bigger.set(this.data);
      this.data = bigger;
    }
    this.data[this.length++] = v;
  }
  view(): Int32Array {
    return this.data.subarray(0, this.length);
  }
}

function find(parent: Int32Array, i: number): number {
  let root = i;
  while (parent[root] !== root) root = parent[root];
  // Path halving keeps later finds short.
  while (parent[i] !== root) {
    const next = parent[i];
    parent[i] = root;
    i = next;
  }
  return root;
}

function union(parent: Int32Array, a: number, b: number): void {
  const ra = find(parent, a);
  const rb = find(parent, b);
  // The smaller index becomes the root, so labels follow scan order.
  if (ra < rb) parent[rb] = ra;
  else if (rb < ra) parent[ra] = rb;
}

/** Which neighbouring rows a row touches, and whether diagonal (x ± 1) contact counts there. */
export function neighbourRows(
  connectivity: Connectivity,
  is3d: boolean,
): { dz: number; dy: number; diagonal: boolean }[] {
  if (!is3d) {
    if (connectivity !== 4 && connectivity !== 8)
      throw new Error(`A 2-D field takes connectivity 4 or 8, not ${connectivity}`);
    return [{ dz: 0, dy: -1, diagonal: connectivity === 8 }];
  }
  switch (connectivity) {
    case 6:
      return [
        { dz: 0, dy: -1, diagonal: false },
        { dz: -1, dy: 0, diagonal: false },
      ];
    case 18:
      return [
        { dz: 0, dy: -1, diagonal: true },
        { dz: -1, dy: -1, diagonal: false },
        { dz: -1, dy: 0, diagonal: true },
        { dz: -1, dy: 1, diagonal: false },
      ];
    case 26:
      return [
        { dz: 0, dy: -1, diagonal: true },
        { dz: -1, dy: -1, diagonal: true },
        { dz: -1, dy: 0, diagonal: true },
        { dz: -1, dy: 1, diagonal: true },
      ];
    default:
      throw new Error(`A 3-D volume takes connectivity 6, 18 or 26, not ${connectivity}`);
  }
}

export interface LabelOptions {
  /** false: the plain-JS path even where the WebAssembly kernel is available (the kernel's reference). */
  useWasm?: boolean;
}

/**
 * Labels voxels with value ≥ threshold. NaN never passes; nor does `nodata` when given (it is compared
 * exactly, as GeoTIFF nodata values are). Data are laid out as index = (z·ny + y)·nx + x.
 * Float32 data go through the WebAssembly kernel when it is available (cell-kernel.ts), with the same result.
 */
export function labelGrid(
  data: ArrayLike<number>,
  shape: GridShape,
  threshold: number,
  connectivity: Connectivity,
  nodata?: number,
  options: LabelOptions = {},
): Labelling {
  const { nx, ny, nz } = shape;
  if (data.length !== nx * ny * nz) {
    throw new Error(
      `The grid holds ${data.length} values, not nx·ny·nz = ${nx}·${ny}·${nz} = ${nx * ny * nz}`,
    );
  }
  const rows = neighbourRows(connectivity, nz > 1);
  const kernel = options.useWasm === false ? null : cellKernel();
  // The kernel says null when its memory cannot hold the volume: then the JS path below.
  const viaKernel =
    kernel && data instanceof Float32Array ? kernel.label(data, shape, threshold, rows, nodata) : null;
  if (viaKernel) return { shape, ...viaKernel };
  const rz = new GrowableInt32();
  const ry = new GrowableInt32();
  const rx0 = new GrowableInt32();
  const rx1 = new GrowableInt32();
  // rowStart[r]..rowStart[r+1] are the runs of row r = z·ny + y.
  const rowStart = new Int32Array(nz * ny + 1);
  // A nodata value below the threshold (the usual −9999, or NaN) can never pass: ignore it.
  const hasNodata = nodata !== undefined && nodata >= threshold;

  // For float32 data and a positive threshold, x ≥ threshold is an integer comparison of the bit
  // patterns (IEEE 754 orders non-negative floats like their bits; negatives have the sign bit set),
  // with NaN's patterns above +∞ excluded. Reading the bits skips the float-to-double conversion.
  const bits =
    data instanceof Float32Array && threshold > 0 && !hasNodata
      ? new Int32Array(data.buffer, data.byteOffset, data.length)
      : null;
  const thresholdBits = bits ? new Int32Array(new Float32Array([threshold]).buffer)[0] : 0;
  // A threshold between two float32 values: the first float32 at or above it is where passing starts.
  const lowestPassing =
    bits && new Float32Array([threshold])[0] < threshold ? thresholdBits + 1 : thresholdBits;
  const INFINITY_BITS = 0x7f800000;

  for (let z = 0, row = 0; z < nz; z++) {
    for (let y = 0; y < ny; y++, row++) {
      rowStart[row] = rz.length;
      const base = row * nx;
      const end = base + nx;
      let i = base;
      if (bits) {
        while (i < end) {
          while (i < end && !(bits[i] >= lowestPassing && bits[i] <= INFINITY_BITS)) i++;
          if (i === end) break;
          const start = i;
          while (i < end && bits[i] >= lowestPassing && bits[i] <= INFINITY_BITS) i++;
          rz.push(z);
          ry.push(y);
          rx0.push(start - base);
          rx1.push(i - base);
        }
        continue;
      }
      while (i < end) {
        // Skip the (usual) quiet part fast; NaN fails every comparison, so it is quiet too.
        if (hasNodata) while (i < end && !(data[i] >= threshold && data[i] !== nodata)) i++;
        else while (i < end && !(data[i] >= threshold)) i++;
        if (i === end) break;
        const start = i;
        if (hasNodata) while (i < end && data[i] >= threshold && data[i] !== nodata) i++;
        else while (i < end && data[i] >= threshold) i++;
        rz.push(z);
        ry.push(y);
        rx0.push(start - base);
        rx1.push(i - base);
      }
    }
  }
  rowStart[nz * ny] = rz.length;

  const count = rz.length;
  const x0 = rx0.view();
  const x1 = rx1.view();
  const parent = new Int32Array(count);
  for (let i = 0; i < count; i++) parent[i] = i;

  for (let z = 0; z < nz; z++) {
    for (let y = 0; y < ny; y++) {
      const row = z * ny + y;
      const aStart = rowStart[row];
      const aEnd = rowStart[row + 1];
      if (aStart === aEnd) continue;
      for (const { dz, dy, diagonal } of rows) {
        const nzIdx = z + dz;
        const nyIdx = y + dy;
        if (nzIdx < 0 || nyIdx < 0 || nyIdx >= ny) continue;
        const other = nzIdx * ny + nyIdx;
        let b = rowStart[other];
        const bEnd = rowStart[other + 1];
        let a = aStart;
        const slack = diagonal ? 1 : 0;
        // Two sorted run lists: walk both, joining every overlapping pair.
        while (a < aEnd && b < bEnd) {
          if (x0[a] < x1[b] + slack && x0[b] < x1[a] + slack) union(parent, a, b);
          if (x1[a] < x1[b]) a++;
          else b++;
        }
      }
    }
  }

  const label = new Int32Array(count);
  const rootLabel = new Int32Array(count).fill(-1);
  let components = 0;
  for (let i = 0; i < count; i++) {
    const root = find(parent, i);
    if (rootLabel[root] < 0) rootLabel[root] = components++;
    label[i] = rootLabel[root];
  }
  return {
    shape,
    components,
    runs: { count, z: rz.view(), y: ry.view(), x0, x1, label },
  };
}

export interface ComponentExtent {
  voxels: number;
  /** Inclusive bounds: [z0, y0, x0, z1, y1, x1]. */
  bounds: [number, number, number, number, number, number];
}

/** Voxel count and bounding box of each component. */
export function componentExtents(l: Labelling): ComponentExtent[] {
  const out: ComponentExtent[] = Array.from({ length: l.components }, () => ({
    voxels: 0,
    bounds: [Infinity, Infinity, Infinity, -Infinity, -Infinity, -Infinity] as ComponentExtent['bounds'],
  }));
  const { z, y, x0, x1, label, count } = l.runs;
  for (let i = 0; i < count; i++) {
    const c = out[label[i]];
    c.voxels += x1[i] - x0[i];
    const b = c.bounds;
    if (z[i] < b[0]) b[0] = z[i];
    if (y[i] < b[1]) b[1] = y[i];
    if (x0[i] < b[2]) b[2] = x0[i];
    if (z[i] > b[3]) b[3] = z[i];
    if (y[i] > b[4]) b[4] = y[i];
    if (x1[i] - 1 > b[5]) b[5] = x1[i] - 1;
  }
  return out;
}
