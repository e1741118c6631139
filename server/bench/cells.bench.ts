/**
 * npm run bench:cells — Stormhour's cell step (threshold, labelling and every per-cell property of
 * DESIGN §3.1) against scipy.ndimage's fastest equivalent pipeline on the same arrays, in paired,
 * alternating rounds. Prints per volume: ms, Mvox/s and the ratio; the last line is
 * `cells-vs-scipy: R` (median over paired rounds of the largest volume set). Needs python3 with scipy.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import type { PlacedGrid } from '../src/radar/engine/grid.js';
import { DEFAULT_IDENTIFY, identifyCells } from '../src/radar/engine/identify.js';
import { pythonWithScipy } from '../src/testing/scipy.js';
import { syntheticVolume } from './synthetic-volume.js';

const PY = `
import sys, time, json
import numpy as np
from scipy import ndimage
path, nz, ny, nx = sys.argv[1], *map(int, sys.argv[2:5])
v = np.fromfile(path, dtype=np.float32).reshape(nz, ny, nx)
structure = ndimage.generate_binary_structure(3, 3)
def run():
    mask = v >= 35.0
    labels, n = ndimage.label(mask, structure=structure)
    fg = labels[mask]
    counts = np.bincount(fg)
    maxima = np.zeros(n + 1, dtype=np.float32)
    np.maximum.at(maxima, fg, v[mask])
    objects = ndimage.find_objects(labels)
    return n
run()
print("ready", flush=True)
for line in sys.stdin:
    t = time.perf_counter(); n = run(); ms = (time.perf_counter() - t) * 1000
    print(json.dumps({"ms": ms, "n": int(n)}), flush=True)
`;

function placed(v: ReturnType<typeof syntheticVolume>): PlacedGrid {
  const plane = v.nx * v.ny;
  const xKm = new Float64Array(plane);
  const yKm = new Float64Array(plane);
  for (let y = 0; y < v.ny; y++)
    for (let x = 0; x < v.nx; x++) {
      xKm[y * v.nx + x] = x - v.nx / 2;
      yKm[y * v.nx + x] = v.ny / 2 - y;
    }
  return {
    nx: v.nx,
    ny: v.ny,
    nz: v.nz,
    data: v.data,
    levelHeightsM: v.heightsM,
    xKm,
    yKm,
    areaKm2: new Float64Array(plane).fill(1),
    toLonLat: (x, y) => [88 + x / 107, 14 + y / 111],
  };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function main() {
  const python = pythonWithScipy();
  if (!python) {
    console.error('bench:cells needs python3 with scipy (Debian: apt-get install python3-scipy)');
    process.exit(1);
  }
  const dir = mkdtempSync(join(tmpdir(), 'stormhour-bench-'));
  const cases = [
    { name: '20 × 500 × 500', nz: 20, ny: 500, nx: 500, storms: 50, rounds: 15 },
    { name: '40 × 1000 × 1000', nz: 40, ny: 1000, nx: 1000, storms: 170, rounds: 7 },
  ];
  let lastRatio = Number.NaN;
  for (const c of cases) {
    const v = syntheticVolume(c.nx, c.ny, c.nz, c.storms, 7);
    const grid = placed(v);
    const file = join(dir, `${c.nz}x${c.ny}x${c.nx}.f32`);
    writeFileSync(file, Buffer.from(v.data.buffer));
    let above = 0;
    for (const x of v.data) if (x >= 35) above++;
    const proc = spawn(python, ['-c', PY, file, String(c.nz), String(c.ny), String(c.nx)], {
      stdio: ['pipe', 'pipe', 'inherit'],
    });
    const lines = createInterface({ input: proc.stdout })[Symbol.asyncIterator]();
    const next = async () => (await lines.next()).value as string;
    await next(); // ready
    identifyCells(grid, DEFAULT_IDENTIFY); // warm the JIT
    const ours: number[] = [];
    const theirs: number[] = [];
    const ratios: number[] = [];
    let cells = 0;
    for (let r = 0; r < c.rounds; r++) {
      const t = performance.now();
      cells = identifyCells(grid, DEFAULT_IDENTIFY).cells.length;
      const a = performance.now() - t;
      proc.stdin.write('go\n');
      const b = (JSON.parse(await next()) as { ms: number }).ms;
      ours.push(a);
      theirs.push(b);
      ratios.push(a / b);
    }
    proc.stdin.end();
    const mvox = (c.nx * c.ny * c.nz) / 1e6;
    const ms = median(ours);
    lastRatio = median(ratios);
    console.log(
      `${c.name}: ${((100 * above) / v.data.length).toFixed(2)} % of voxels ≥ 35 dBZ, ${cells} cells kept | ` +
        `Stormhour ${ms.toFixed(1)} ms (${(mvox / (ms / 1000)).toFixed(0)} Mvox/s) | ` +
        `scipy ${median(theirs).toFixed(1)} ms | ratio ${lastRatio.toFixed(3)}`,
    );
  }
  rmSync(dir, { recursive: true, force: true });
  console.log(`cells-vs-scipy: ${lastRatio.toFixed(3)}`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
