/**
 * The WebAssembly kernel of the cell step (server/wasm/cells.ts, built at install into
 * server/wasm/build/cells.wasm): the threshold scan that finds runs eight floats at a time, the run
 * labelling, and the per-column echo top and VIL. The plain-JS code in label.ts and identify.ts stays
 * the reference and the fallback: without the .wasm file or without WebAssembly SIMD, `cellKernel()`
 * is null and the cell step runs in JS with the same results.
 */
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { exactMeanLogOffset, fastMathTables } from './fast-math.js';
import type { GridShape, Runs } from './label.js';

// The same relative path from src/radar/engine (vitest, tsx) and dist/radar/engine (the built server).
export const WASM_FILE = fileURLToPath(new URL('../../../wasm/build/cells.wasm', import.meta.url));

interface KernelExports {
  scanRows(
    dataPtr: number,
    nx: number,
    ny: number,
    rowFrom: number,
    rowTo: number,
    lowest: number,
    useNodata: number,
    nodata: number,
    runsPtr: number,
    count: number,
    rowStartPtr: number,
  ): number;
  joinRuns(
    runsPtr: number,
    count: number,
    rowStartPtr: number,
    nz: number,
    ny: number,
    neighboursPtr: number,
    nNeighbours: number,
    parentPtr: number,
    labelPtr: number,
  ): number;
  columnQuantities(
    dataPtr: number,
    plane: number,
    nz: number,
    columnsPtr: number,
    nCols: number,
    heightsPtr: number,
    echoTopDbz: number,
    capDbz: number,
    useNodata: number,
    nodata: number,
    tablesPtr: number,
    topLevelPtr: number,
    vilPtr: number,
    belowPtr: number,
  ): void;
  runSums(
    dataPtr: number,
    plane: number,
    nx: number,
    runsPtr: number,
    labelPtr: number,
    count: number,
    keptPtr: number,
    components: number,
    thicknessPtr: number,
    areaPtr: number,
    xPtr: number,
    yPtr: number,
    is3d: number,
    coreDbz: number,
    tablesPtr: number,
    volumePtr: number,
    corePtr: number,
    wzPtr: number,
    wxPtr: number,
    wyPtr: number,
    maxPtr: number,
    maxZPtr: number,
    topZPtr: number,
  ): void;
  runSizes(
    runsPtr: number,
    labelPtr: number,
    count: number,
    components: number,
    nx: number,
    rowSumsPtr: number,
    thicknessPtr: number,
    is3d: number,
    sizePtr: number,
  ): void;
}

// Node has WebAssembly, but the type libraries here (no DOM) do not declare it: the little used here.
interface WasmMemory {
  readonly buffer: ArrayBuffer;
  grow(pages: number): number;
}
interface WasmApi {
  Memory: new (d: { initial: number; maximum: number }) => WasmMemory;
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: unknown };
}
const wasm = (globalThis as unknown as { WebAssembly: WasmApi }).WebAssembly;

export interface NeighbourRow {
  dz: number;
  dy: number;
  diagonal: boolean;
}

const PAGE = 65536;
/** The kernel keeps no data of its own; the first kilobyte is left free all the same. */
const TABLES_AT = 1024;
const align = (n: number) => Math.ceil(n / 64) * 64;

/** The smallest float32 at or above t: a float32 x is ≥ t exactly when x ≥ this (NaN stays NaN). */
export function lowestFloat32AtOrAbove(t: number): number {
  const f = Math.fround(t);
  if (!(f < t)) return f;
  const one = new Float32Array([f]);
  const bits = new Int32Array(one.buffer);
  if (f === 0) bits[0] = 1;
  else if (f > 0) bits[0]++;
  else bits[0]--;
  return one[0];
}

/** 4 GiB, all a 32-bit WebAssembly memory can address. */
const MAX_PAGES = 65536;

/**
 * The kernel and its memory. Each step returns null when the memory cannot grow to what the volume
 * needs (then that step runs in JS: the results are the same).
 */
export class CellKernel {
  private readonly memory: WasmMemory;
  private readonly k: KernelExports;
  /**
   * Per-column area, x and y of the last grid (3 · plane f64) and its rows' running sums of area
   * (ny · (nx + 1) f64), kept while the same arrays come back (a site's scans share them).
   */
  private readonly geometryAt: number;
  private geometry: { areaKm2: Float64Array; xKm: Float64Array; yKm: Float64Array } | null = null;
  private rowSums: Float64Array | null = null;
  private dataAt = 0;
  /** The volume whose floats and runs are in memory now, set by `label`, read by the other steps. */
  private loaded: {
    data: Float32Array;
    nx: number;
    plane: number;
    runsAt: number;
    labelAt: number;
    count: number;
    components: number;
    end: number;
  } | null = null;

  constructor(module: object, maximumPages = MAX_PAGES) {
    this.memory = new wasm.Memory({ initial: 8, maximum: maximumPages });
    const instance = new wasm.Instance(module, {
      env: { memory: this.memory },
      cells: { pow10Exact: (y: number) => 10 ** y, meanLogOffsetExact: exactMeanLogOffset },
    });
    this.k = instance.exports as unknown as KernelExports;
    const tables = fastMathTables();
    if (!this.reserve(TABLES_AT + tables.byteLength)) throw new Error('no memory for the tables');
    new Float64Array(this.memory.buffer, TABLES_AT, tables.length).set(tables);
    this.geometryAt = align(TABLES_AT + tables.byteLength);
  }

  /**
   * Grows the memory to hold `bytes`; false when it cannot (views made before a growth are detached:
   * make them after).
   */
  private reserve(bytes: number): boolean {
    const have = this.memory.buffer.byteLength;
    if (bytes <= have) return true;
    try {
      this.memory.grow(Math.ceil((bytes - have) / PAGE));
      return true;
    } catch (e) {
      if (e instanceof RangeError) return false;
      throw e;
    }
  }

  /** Whether `data` is the volume just labelled here (so the other steps may run on it). */
  holds(data: Float32Array): boolean {
    return this.loaded?.data === data;
  }

  /**
   * Runs and components of the voxels ≥ threshold (and ≠ nodata), exactly as label.ts finds them.
   * The floats stay in the kernel's memory for `columnQuantities` on the same array.
   */
  label(
    data: Float32Array,
    shape: GridShape,
    threshold: number,
    rows: NeighbourRow[],
    nodata: number | undefined,
  ): { runs: Runs; components: number } | null {
    const { nx, ny, nz } = shape;
    const k = this.k;
    const lowest = lowestFloat32AtOrAbove(threshold);
    // Nodata matters only when it would pass, and only a float32 value can equal a float32 voxel.
    const useNodata = nodata !== undefined && nodata >= threshold && Math.fround(nodata) === nodata ? 1 : 0;
    const plane = nx * ny;
    const dataAt = align(this.geometryAt + (3 * plane + ny * (nx + 1)) * 8);
    if (dataAt !== this.dataAt) {
      this.geometry = null;
      this.rowSums = null;
    }
    this.dataAt = dataAt;
    const rowStartAt = align(dataAt + data.byteLength);
    const neighboursAt = align(rowStartAt + (nz * ny + 1) * 4);
    const runsAt = align(neighboursAt + rows.length * 12);
    // Copy a block of rows (a quarter megabyte or so) and scan it while it is still in the cache.
    const totalRows = nz * ny;
    const rowsPerBlock = Math.min(totalRows, Math.max(1, Math.floor(65536 / nx)));
    const maxRunsPerBlock = Math.ceil(nx / 2) * rowsPerBlock;
    this.loaded = null;
    if (!this.reserve(runsAt + maxRunsPerBlock * 16)) return null;
    const neighbours = new Int32Array(this.memory.buffer, neighboursAt, rows.length * 3);
    for (const [i, r] of rows.entries()) neighbours.set([r.dz, r.dy, r.diagonal ? 1 : 0], i * 3);

    let count = 0;
    for (let from = 0; from < totalRows; from += rowsPerBlock) {
      const to = Math.min(totalRows, from + rowsPerBlock);
      if (!this.reserve(runsAt + (count + maxRunsPerBlock) * 16)) return null;
      new Float32Array(this.memory.buffer, dataAt + from * nx * 4, (to - from) * nx).set(
        data.subarray(from * nx, to * nx),
      );
      count = k.scanRows(dataAt, nx, ny, from, to, lowest, useNodata, nodata ?? 0, runsAt, count, rowStartAt);
    }
    const parentAt = align(runsAt + count * 16);
    const labelAt = align(parentAt + count * 4);
    if (!this.reserve(labelAt + count * 4)) return null;
    new Int32Array(this.memory.buffer, rowStartAt, nz * ny + 1)[nz * ny] = count;
    const components = k.joinRuns(
      runsAt,
      count,
      rowStartAt,
      nz,
      ny,
      neighboursAt,
      rows.length,
      parentAt,
      labelAt,
    );

    const packed = new Int32Array(this.memory.buffer, runsAt, count * 4);
    const z = new Int32Array(count);
    const y = new Int32Array(count);
    const x0 = new Int32Array(count);
    const x1 = new Int32Array(count);
    for (let i = 0, p = 0; i < count; i++, p += 4) {
      z[i] = packed[p];
      y[i] = packed[p + 1];
      x0[i] = packed[p + 2];
      x1[i] = packed[p + 3];
    }
    const label = new Int32Array(this.memory.buffer, labelAt, count).slice();
    this.loaded = { data, nx, plane, runsAt, labelAt, count, components, end: labelAt + count * 4 };
    return { runs: { count, z, y, x0, x1, label }, components };
  }

  /** Size of every component of the volume just labelled, from its runs (identify.ts's first pass). */
  runSizes(
    data: Float32Array,
    rowSums: Float64Array,
    thicknessKm: number[],
    is3d: boolean,
  ): Float64Array | null {
    const loaded = this.loaded;
    if (loaded?.data !== data) throw new Error('runSizes: label this volume first');
    const rowSumsAt = this.geometryAt + 3 * loaded.plane * 8;
    if (rowSums.length !== loaded.plane + loaded.plane / loaded.nx)
      throw new Error('runSizes: the running sums do not fit the grid');
    if (this.rowSums !== rowSums) {
      new Float64Array(this.memory.buffer, rowSumsAt, rowSums.length).set(rowSums);
      this.rowSums = rowSums;
    }
    const thicknessAt = align(loaded.end);
    const sizeAt = align(thicknessAt + thicknessKm.length * 8);
    if (!this.reserve(sizeAt + loaded.components * 8)) return null;
    new Float64Array(this.memory.buffer, thicknessAt, thicknessKm.length).set(thicknessKm);
    this.k.runSizes(
      loaded.runsAt,
      loaded.labelAt,
      loaded.count,
      loaded.components,
      loaded.nx,
      rowSumsAt,
      thicknessAt,
      is3d ? 1 : 0,
      sizeAt,
    );
    return new Float64Array(this.memory.buffer, sizeAt, loaded.components).slice();
  }

  /**
   * identify.ts's per-run sums for the kept components of the volume just labelled: volume, core
   * volume, Z-weighted sums for the centroid, maximum dBZ with its level, and the top level.
   */
  runSums(
    data: Float32Array,
    nx: number,
    kept: Uint8Array,
    thicknessKm: number[],
    areaKm2: Float64Array,
    xKm: Float64Array,
    yKm: Float64Array,
    is3d: boolean,
    coreDbz: number,
  ) {
    const loaded = this.loaded;
    if (loaded?.data !== data) throw new Error('runSums: label this volume first');
    const { plane, components } = loaded;
    const g = this.geometry;
    if (!g || g.areaKm2 !== areaKm2 || g.xKm !== xKm || g.yKm !== yKm) {
      const at = this.geometryAt;
      new Float64Array(this.memory.buffer, at, plane).set(areaKm2);
      new Float64Array(this.memory.buffer, at + plane * 8, plane).set(xKm);
      new Float64Array(this.memory.buffer, at + plane * 16, plane).set(yKm);
      this.geometry = { areaKm2, xKm, yKm };
    }
    const keptAt = align(loaded.end);
    const thicknessAt = align(keptAt + components);
    const f64At = align(thicknessAt + thicknessKm.length * 8);
    const each = align(components * 8);
    const maxZAt = f64At + 6 * each;
    const topZAt = maxZAt + align(components * 4);
    if (!this.reserve(topZAt + components * 4)) return null;
    const buffer = this.memory.buffer;
    new Uint8Array(buffer, keptAt, components).set(kept);
    new Float64Array(buffer, thicknessAt, thicknessKm.length).set(thicknessKm);
    this.k.runSums(
      this.dataAt,
      plane,
      nx,
      loaded.runsAt,
      loaded.labelAt,
      loaded.count,
      keptAt,
      components,
      thicknessAt,
      this.geometryAt,
      this.geometryAt + plane * 8,
      this.geometryAt + plane * 16,
      is3d ? 1 : 0,
      coreDbz,
      TABLES_AT,
      f64At,
      f64At + each,
      f64At + 2 * each,
      f64At + 3 * each,
      f64At + 4 * each,
      f64At + 5 * each,
      maxZAt,
      topZAt,
    );
    const out = (i: number) => new Float64Array(buffer, f64At + i * each, components).slice();
    return {
      volume: out(0),
      core: out(1),
      wz: out(2),
      wx: out(3),
      wy: out(4),
      maxDbz: out(5),
      maxZ: new Int32Array(buffer, maxZAt, components).slice(),
      topZ: new Int32Array(buffer, topZAt, components).slice(),
    };
  }

  /**
   * Per listed column (y·nx + x, ascending): the highest level ≥ echoTopDbz (−1 if none) and the
   * column's VIL, as identify.ts's JS loop works them out. `data` must be the array just labelled.
   */
  columnQuantities(
    data: Float32Array,
    plane: number,
    nz: number,
    columns: Int32Array,
    heightsM: number[],
    echoTopDbz: number,
    capDbz: number,
    nodata: number | undefined,
  ): { topLevel: Int32Array<ArrayBuffer>; vil: Float64Array<ArrayBuffer> } | null {
    if (this.loaded?.data !== data) throw new Error('columnQuantities: label this volume first');
    const n = columns.length;
    const columnsAt = align(this.loaded.end);
    const heightsAt = align(columnsAt + n * 4);
    const topAt = align(heightsAt + nz * 8);
    const vilAt = align(topAt + n * 4);
    const belowAt = align(vilAt + n * 8);
    if (!this.reserve(belowAt + n * 8)) return null;
    const buffer = this.memory.buffer;
    new Int32Array(buffer, columnsAt, n).set(columns);
    new Float64Array(buffer, heightsAt, nz).set(heightsM);
    const useNodata = nodata !== undefined && !Number.isNaN(nodata) ? 1 : 0;
    this.k.columnQuantities(
      this.dataAt,
      plane,
      nz,
      columnsAt,
      n,
      heightsAt,
      echoTopDbz,
      capDbz,
      useNodata,
      nodata ?? 0,
      TABLES_AT,
      topAt,
      vilAt,
      belowAt,
    );
    return {
      topLevel: new Int32Array(buffer, topAt, n).slice(),
      vil: new Float64Array(buffer, vilAt, n).slice(),
    };
  }
}

let kernel: CellKernel | null | undefined;
let unavailableBecause = '';

/** The kernel, or null (and why, in `cellKernelStatus()`) when the .wasm is missing or cannot run here. */
export function cellKernel(): CellKernel | null {
  if (kernel !== undefined) return kernel;
  kernel = null;
  if (process.env.CELL_KERNEL === 'js') unavailableBecause = 'CELL_KERNEL=js';
  else if (!existsSync(WASM_FILE))
    unavailableBecause = `${WASM_FILE} is missing (npm run build:wasm -w server builds it)`;
  else {
    try {
      kernel = new CellKernel(new wasm.Module(readFileSync(WASM_FILE)));
    } catch (e) {
      // Most likely a runtime without WebAssembly SIMD.
      unavailableBecause = `the kernel does not load here: ${(e as Error).message}`;
    }
  }
  // Said once per thread: the results are the same, only slower.
  if (!kernel && process.env.CELL_KERNEL !== 'js')
    console.warn(`Cell step in plain JS: ${unavailableBecause}`);
  return kernel;
}

export function cellKernelStatus(): string {
  return cellKernel() ? `WebAssembly (${WASM_FILE})` : `plain JS: ${unavailableBecause}`;
}
