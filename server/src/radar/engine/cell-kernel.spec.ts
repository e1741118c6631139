import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { mulberry32 } from '../../testing/seeded-random.js';
import {
  CellKernel,
  cellKernel,
  cellKernelStatus,
  lowestFloat32AtOrAbove,
  WASM_FILE,
} from './cell-kernel.js';
import type { PlacedGrid } from './grid.js';
import { DEFAULT_IDENTIFY, type IdentifiedCell, identifyCells } from './identify.js';
import { type Connectivity, labelGrid, neighbourRows } from './label.js';

// The kernel is the fast path and the plain-JS code its reference: every check here compares the two.

const SPECIAL = [Number.NaN, -Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, -0, 0, -999];
// +∞ passes any threshold and makes a cell's centroid and VIL non-finite (in both paths): most
// property checks leave it out so that they compare finite numbers.
const FINITE_SPECIAL = SPECIAL.filter((x) => x !== Number.POSITIVE_INFINITY);

/**
 * Storm-like blobs over light echo, with speckle and the special values (NaN, ±∞, ±0, nodata −999)
 * scattered in; widths not a multiple of 8 so that runs cross the kernel's 8-float chunks and row ends.
 */
function testVolume(nx: number, ny: number, nz: number, seed: number, special = SPECIAL): Float32Array {
  const rand = mulberry32(seed);
  const v = new Float32Array(nx * ny * nz);
  for (let i = 0; i < v.length; i++) v[i] = rand() < 0.3 ? 5 + 20 * rand() : -10;
  for (let b = 0; b < 10; b++) {
    const cx = rand() * nx;
    const cy = rand() * ny;
    const r = 2 + rand() * 6;
    const top = 1 + rand() * nz;
    for (let z = 0; z < Math.min(nz, top); z++)
      for (let y = 0; y < ny; y++)
        for (let x = 0; x < nx; x++) {
          const d2 = ((x - cx) ** 2 + (y - cy) ** 2) / (r * r);
          if (d2 < 1) v[(z * ny + y) * nx + x] = 60 - 20 * d2 - (10 * z) / nz;
        }
  }
  for (let i = 0; i < v.length; i++) {
    const u = rand();
    if (u < 0.03) v[i] = 35 + rand() * 25;
    else if (u < 0.04) v[i] = special[Math.floor(rand() * special.length)];
  }
  return v;
}

function grid(nx: number, ny: number, nz: number, data: Float32Array, nodata?: number): PlacedGrid {
  const xKm = new Float64Array(nx * ny);
  const yKm = new Float64Array(nx * ny);
  const areaKm2 = new Float64Array(nx * ny);
  for (let y = 0; y < ny; y++)
    for (let x = 0; x < nx; x++) {
      xKm[y * nx + x] = 0.9 * x - 20;
      yKm[y * nx + x] = 20 - 1.1 * y;
      areaKm2[y * nx + x] = 0.99 + 0.0003 * x;
    }
  return {
    nx,
    ny,
    nz,
    data,
    nodata,
    levelHeightsM: nz > 1 ? Array.from({ length: nz }, (_, k) => 500 + 750 * k + 10 * k * k) : [],
    xKm,
    yKm,
    areaKm2,
    toLonLat: (x, y) => [88 + x / 107, 14 + y / 111],
  };
}

const kernel = cellKernel();
const forcedJs = process.env.CELL_KERNEL === 'js';

describe('the WebAssembly cell kernel', () => {
  it.skipIf(forcedJs)('is built at install and loads here', () => {
    // npm ci runs the root postinstall, which builds server/wasm/build/cells.wasm.
    expect(cellKernelStatus()).toMatch(/^WebAssembly/);
    expect(kernel).not.toBeNull();
  });

  it('finds the smallest float32 at or above a threshold (IEEE 754 binary32 spacing)', () => {
    // 35.3 is not a float32: its neighbours are 35.29999923706055 and 35.30000305175781.
    expect(lowestFloat32AtOrAbove(35.3)).toBe(35.30000305175781);
    expect(lowestFloat32AtOrAbove(-35.3)).toBe(-35.29999923706055);
    expect(lowestFloat32AtOrAbove(35)).toBe(35);
    // The smallest positive float32 (a subnormal) is 2^−149.
    expect(lowestFloat32AtOrAbove(1e-300)).toBe(2 ** -149);
    expect(lowestFloat32AtOrAbove(Number.NEGATIVE_INFINITY)).toBe(Number.NEGATIVE_INFINITY);
    expect(lowestFloat32AtOrAbove(Number.NaN)).toBeNaN();
  });
});

describe.skipIf(!kernel)('the kernel against the plain-JS path', () => {
  const cases: [string, number, number, number, Connectivity, number, number | undefined][] = [
    // name, nx, ny, nz, connectivity, threshold, nodata
    ['26-connected volume', 61, 47, 9, 26, 35, -999],
    ['18-connected volume, threshold not a float32', 45, 53, 7, 18, 35.3, -999],
    ['6-connected volume, no nodata', 39, 41, 6, 6, 40, undefined],
    ['8-connected field', 203, 97, 1, 8, 35, -999],
    ['4-connected field, nodata that would pass', 77, 64, 1, 4, 35, 45],
    ['26-connected, threshold 0 (−0 and +0 pass)', 33, 29, 5, 26, 0, undefined],
    ['26-connected, negative threshold, NaN nodata', 35, 31, 4, 26, -5.5, Number.NaN],
  ];

  it.each(cases)('labels exactly as JS: %s', (_, nx, ny, nz, connectivity, threshold, nodata) => {
    const data = testVolume(nx, ny, nz, nx * ny + nz);
    const viaKernel = labelGrid(data, { nx, ny, nz }, threshold, connectivity, nodata, { useWasm: true });
    const viaJs = labelGrid(data, { nx, ny, nz }, threshold, connectivity, nodata, { useWasm: false });
    expect(viaJs.runs.count).toBeGreaterThan(50);
    expect(viaJs.components).toBeGreaterThan(0);
    expect(viaKernel).toEqual(viaJs);
  });

  it('labels exactly as JS on rows of every width from 1 to 40 (chunk edges, row ends)', () => {
    for (let nx = 1; nx <= 40; nx++) {
      // Quiet rows with echo only near the end, and rows with runs everywhere, touching the row ends.
      const data = new Float32Array(nx * 9 * 3).fill(10);
      for (let row = 0; row < 27; row++) {
        if (row % 3 === 0) for (let x = 0; x < nx; x += 3) data[row * nx + x] = 50;
        else if (row % 3 === 1) data[row * nx + nx - 1 - (row % Math.min(nx, 5))] = 50;
      }
      const viaKernel = labelGrid(data, { nx, ny: 9, nz: 3 }, 35, 26, -999, { useWasm: true });
      const viaJs = labelGrid(data, { nx, ny: 9, nz: 3 }, 35, 26, -999, { useWasm: false });
      expect(viaJs.runs.count).toBeGreaterThan(8);
      expect(viaKernel).toEqual(viaJs);
    }
  });

  const relativelyEqual = (a: number | null, b: number | null) =>
    Object.is(a, b) ||
    (a !== null && b !== null && Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b)));

  function expectSameCells(ours: IdentifiedCell[], reference: IdentifiedCell[]) {
    expect(ours.length).toBe(reference.length);
    for (let i = 0; i < reference.length; i++) {
      const { columns: a, type: ta, ...numbersA } = ours[i];
      const { columns: b, type: tb, ...numbersB } = reference[i];
      expect(a).toEqual(b);
      expect(ta).toBe(tb);
      for (const key of Object.keys(numbersB) as (keyof typeof numbersB)[]) {
        if (!relativelyEqual(numbersA[key], numbersB[key]))
          throw new Error(`cell ${i}, ${key}: kernel ${numbersA[key]}, JS ${numbersB[key]}`);
      }
    }
  }

  it.each([
    ['a volume with nodata −999', 90, 70, 16, -999, FINITE_SPECIAL],
    ['a volume without nodata', 64, 80, 12, undefined, FINITE_SPECIAL],
    ['a 2-D field', 150, 120, 1, -999, FINITE_SPECIAL],
    ['a volume with +∞ voxels', 70, 60, 10, -999, SPECIAL],
  ] as [string, number, number, number, number | undefined, number[]][])(
    'describes every cell as JS does (sums to 1e-12 relative): %s',
    (_, nx, ny, nz, nodata, special) => {
      const g = grid(nx, ny, nz, testVolume(nx, ny, nz, nx + ny, special), nodata);
      const settings = { ...DEFAULT_IDENTIFY, minVolumeKm3: 4, minAreaKm2: 4 };
      const viaKernel = identifyCells(g, settings, { useWasm: true });
      const viaJs = identifyCells(g, settings, { useWasm: false });
      expect(viaJs.cells.length).toBeGreaterThan(3);
      if (special === FINITE_SPECIAL) expect(viaJs.cells.every((c) => Number.isFinite(c.xKm))).toBe(true);
      expect(viaKernel.rejectedTooSmall).toBe(viaJs.rejectedTooSmall);
      expectSameCells(viaKernel.cells, viaJs.cells);
    },
  );

  it('gives the same cells whether the kernel last saw this volume or another one', () => {
    const a = grid(50, 40, 8, testVolume(50, 40, 8, 1, FINITE_SPECIAL), -999);
    const b = grid(50, 40, 8, testVolume(50, 40, 8, 2, FINITE_SPECIAL), -999);
    const settings = { ...DEFAULT_IDENTIFY, minVolumeKm3: 4 };
    const first = identifyCells(a, settings);
    identifyCells(b, settings);
    expectSameCells(identifyCells(a, settings).cells, first.cells);
    expectSameCells(first.cells, identifyCells(a, settings, { useWasm: false }).cells);
  });
});

describe.skipIf(!existsSync(WASM_FILE))('a kernel whose memory cannot hold the volume', () => {
  it('says null instead of failing, and grows where it can', () => {
    // 16 pages of 64 KiB (1 MiB): the tables fit, a 60 × 60 × 80 float volume (1.15 MB) does not.
    const module = new (
      globalThis as unknown as { WebAssembly: { Module: new (b: Uint8Array) => object } }
    ).WebAssembly.Module(readFileSync(WASM_FILE));
    const small = new CellKernel(module, 16);
    const rows = neighbourRows(26, true);
    const big = testVolume(60, 60, 80, 5, FINITE_SPECIAL);
    expect(small.label(big, { nx: 60, ny: 60, nz: 80 }, 35, rows, -999)).toBeNull();
    expect(small.holds(big)).toBe(false);
    const fits = testVolume(20, 20, 6, 5, FINITE_SPECIAL);
    const viaKernel = small.label(fits, { nx: 20, ny: 20, nz: 6 }, 35, rows, -999);
    const viaJs = labelGrid(fits, { nx: 20, ny: 20, nz: 6 }, 35, 26, -999, { useWasm: false });
    expect(viaKernel).toEqual({ runs: viaJs.runs, components: viaJs.components });
    expect(small.holds(fits)).toBe(true);
  });
});
