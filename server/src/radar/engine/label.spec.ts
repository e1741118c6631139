import { describe, expect, it } from 'vitest';
import { pythonWithScipy, runPython } from '../../testing/scipy.js';
import { type Connectivity, componentExtents, labelGrid } from './label.js';

/** Blobs plus speckle, in dBZ, with some NaN and nodata voxels. */
function testVolume(nx: number, ny: number, nz: number, seed: number): Float32Array {
  const rand = mulberry32(seed);
  const v = new Float32Array(nx * ny * nz).fill(5);
  for (let b = 0; b < 12; b++) {
    const cx = rand() * nx;
    const cy = rand() * ny;
    const cz = rand() * nz;
    const r = 1 + rand() * 4;
    for (let z = 0; z < nz; z++)
      for (let y = 0; y < ny; y++)
        for (let x = 0; x < nx; x++) {
          const d2 = ((x - cx) ** 2 + (y - cy) ** 2) / r ** 2 + ((z - cz) / (r * 0.7)) ** 2;
          if (d2 < 1) v[(z * ny + y) * nx + x] = 50 - 15 * d2;
        }
  }
  for (let i = 0; i < v.length; i++) {
    const u = rand();
    if (u < 0.04) v[i] = 36 + rand() * 10;
    else if (u < 0.045) v[i] = Number.NaN;
    else if (u < 0.05) v[i] = -999;
  }
  return v;
}

const SCIPY_LABEL = `
import json, sys
import numpy as np
from scipy import ndimage
inp = json.load(sys.stdin)
v = np.array(inp['data'], dtype=np.float32).reshape(inp['shape'])
mask = (v >= inp['threshold']) & (v != inp['nodata'])
rank = {4: 1, 8: 2, 6: 1, 18: 2, 26: 3}[inp['connectivity']]
structure = ndimage.generate_binary_structure(mask.ndim, rank)
labels, n = ndimage.label(mask, structure=structure)
counts = np.bincount(labels.ravel())[1:]
out = []
for i, sl in enumerate(ndimage.find_objects(labels)):
    lo = [s.start for s in sl]; hi = [s.stop - 1 for s in sl]
    out.append({'voxels': int(counts[i]), 'lo': lo, 'hi': hi})
print(json.dumps({'n': int(n), 'components': out}))
`;

import { mulberry32 } from '../../testing/seeded-random.js';

type ScipyResult = { n: number; components: { voxels: number; lo: number[]; hi: number[] }[] };

const python = pythonWithScipy();

if (!python)
  console.warn('label.spec: no python3 with scipy found; the scipy comparison is skipped (CI installs it)');

// Both paths: the WebAssembly kernel (where built, as npm ci does) and the plain-JS reference.
describe.skipIf(!python).each([
  ['WebAssembly kernel', true],
  ['plain JS', false],
])('labelGrid (%s) against scipy.ndimage.label', (_, useWasm) => {
  it.each([
    [26, [3, 5, 20, 24]],
    [18, [4, 6, 18, 22]],
    [6, [5, 4, 25, 21]],
    [8, [6, 1, 40, 30]],
    [4, [7, 1, 33, 37]],
  ] as [Connectivity, number[]][])(
    'finds the same regions with connectivity %d',
    (connectivity, [seed, nz, ny, nx]) => {
      const data = testVolume(nx, ny, nz, seed);
      const ours = labelGrid(data, { nx, ny, nz }, 35, connectivity, -999, { useWasm });
      const theirs = runPython<ScipyResult>(python as string, SCIPY_LABEL, {
        data: Array.from(data, (x) => (Number.isNaN(x) ? -1 : x)),
        shape: nz > 1 ? [nz, ny, nx] : [ny, nx],
        threshold: 35,
        nodata: -999,
        connectivity,
      });
      expect(ours.components).toBe(theirs.n);
      expect(ours.components).toBeGreaterThan(10);
      const key = (voxels: number, lo: number[], hi: number[]) => `${voxels}:${lo.join(',')}:${hi.join(',')}`;
      const oursKeys = componentExtents(ours).map((c) => {
        const [z0, y0, x0, z1, y1, x1] = c.bounds;
        return nz > 1 ? key(c.voxels, [z0, y0, x0], [z1, y1, x1]) : key(c.voxels, [y0, x0], [y1, x1]);
      });
      const theirKeys = theirs.components.map((c) => key(c.voxels, c.lo, c.hi));
      // Both number components in raster order of their first voxel, so the lists agree element by element.
      expect(oursKeys).toEqual(theirKeys);
    },
  );
});

describe('labelGrid on hand-made grids', () => {
  it('tells 4- from 8-connectivity on a diagonal (common practice definition)', () => {
    const g = [1, 0, 0, 1];
    expect(labelGrid(g, { nx: 2, ny: 2, nz: 1 }, 1, 4).components).toBe(2);
    expect(labelGrid(g, { nx: 2, ny: 2, nz: 1 }, 1, 8).components).toBe(1);
  });

  it('joins voxels sharing only a corner across levels with 26 but not 18 or 6', () => {
    // (z0, y0, x0) and (z1, y1, x1): a corner neighbour.
    const g = [1, 0, 0, 0, 0, 0, 0, 1];
    const shape = { nx: 2, ny: 2, nz: 2 };
    expect(labelGrid(g, shape, 1, 26).components).toBe(1);
    expect(labelGrid(g, shape, 1, 18).components).toBe(2);
    expect(labelGrid(g, shape, 1, 6).components).toBe(2);
  });

  it('reads float32 volumes by bit pattern exactly as it compares numbers', () => {
    // IEEE 754: non-negative floats order like their bit patterns; NaN and negatives must never pass.
    const special = [Number.NaN, -Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, -0, -35];
    const f32 = new Float32Array(6 * 40 * 40);
    let seed = 7;
    const random = () => {
      seed = (seed * 1103515245 + 12345) % 2 ** 31;
      return seed / 2 ** 31;
    };
    for (let i = 0; i < f32.length; i++)
      f32[i] = random() < 0.05 ? special[i % special.length] : 25 + 20 * random();
    // 35.3 is not a float32: passing starts at the float32 just above it.
    for (const threshold of [35, 35.3, Math.fround(35.3), 40]) {
      const asFloats = labelGrid(f32, { nx: 40, ny: 40, nz: 6 }, threshold, 26);
      const asNumbers = labelGrid(Array.from(f32), { nx: 40, ny: 40, nz: 6 }, threshold, 26);
      expect(asFloats.runs.count).toBeGreaterThan(100);
      expect(asFloats).toEqual(asNumbers);
    }
  });

  it('refuses a wrong shape and a connectivity that does not fit the dimensions', () => {
    expect(() => labelGrid([1, 2, 3], { nx: 2, ny: 2, nz: 1 }, 1, 8)).toThrow(/holds 3 values/);
    expect(() => labelGrid([1, 2, 3, 4], { nx: 2, ny: 2, nz: 1 }, 1, 26)).toThrow(
      /2-D field takes connectivity 4 or 8/,
    );
  });
});
