/**
 * Realistic reflectivity volumes for benchmarks: convective cells as tilted ellipsoids with a core,
 * anvil-free, plus speckle and light stratiform rain, on a radar-centred 1 km grid. Seeded.
 */
export interface SyntheticVolume {
  nx: number;
  ny: number;
  nz: number;
  data: Float32Array;
  heightsM: number[];
}

function sfc32(seed: number): () => number {
  let a = 0x9e3779b9;
  let b = 0x243f6a88;
  let c = 0xb7e15162;
  let d = seed >>> 0;
  return () => {
    a >>>= 0;
    b >>>= 0;
    c >>>= 0;
    d >>>= 0;
    const t = (a + b + d) >>> 0;
    d = (d + 1) >>> 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) >>> 0;
    c = (c << 21) | (c >>> 11);
    c = (c + t) >>> 0;
    return t / 4294967296;
  };
}

export function syntheticVolume(
  nx: number,
  ny: number,
  nz: number,
  storms: number,
  seed: number,
): SyntheticVolume {
  const rand = sfc32(seed);
  for (let i = 0; i < 10; i++) rand();
  const data = new Float32Array(nx * ny * nz);
  const heightsM = Array.from({ length: nz }, (_, k) => 500 + k * (15_000 / nz));
  // Light rain and noise everywhere below 35 dBZ.
  for (let i = 0; i < data.length; i++) data[i] = rand() < 0.3 ? 5 + 20 * rand() : -10;
  for (let s = 0; s < storms; s++) {
    const cx = rand() * nx;
    const cy = rand() * ny;
    const r = 3 + rand() * 9 * (nx / 500);
    const top = 4 + rand() * 10;
    const peak = 45 + rand() * 15;
    const x0 = Math.max(0, Math.floor(cx - r));
    const x1 = Math.min(nx - 1, Math.ceil(cx + r));
    const y0 = Math.max(0, Math.floor(cy - r));
    const y1 = Math.min(ny - 1, Math.ceil(cy + r));
    for (let z = 0; z < nz; z++) {
      const h = heightsM[z] / 1000;
      if (h > top) break;
      const shrink = 1 - (h / top) ** 2;
      for (let y = y0; y <= y1; y++)
        for (let x = x0; x <= x1; x++) {
          const d2 = ((x - cx) ** 2 + (y - cy) ** 2) / (r * r * shrink + 1e-9);
          if (d2 < 1) {
            const i = (z * ny + y) * nx + x;
            data[i] = Math.max(data[i], peak - 18 * d2 - 6 * (h / top));
          }
        }
    }
  }
  // Speckle: isolated strong voxels (clutter, noise) that the size rules must reject.
  const speckle = Math.floor(data.length * 0.002);
  for (let k = 0; k < speckle; k++) data[Math.floor(rand() * data.length)] = 36 + 20 * rand();
  return { nx, ny, nz, data, heightsM };
}
