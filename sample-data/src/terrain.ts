import { PROVINCE } from './config.js';
import { localKm } from './geo.js';
import { Rng, ValueNoise } from './prng.js';

const smooth = (t: number): number => (t <= 0 ? 0 : t >= 1 ? 1 : t * t * (3 - 2 * t));

interface Spur {
  x0: number;
  lengthKm: number;
  curve: number;
}

/**
 * The invented landscape of Vessary Province, as an analytic function of position (plus seeded
 * value noise): a broad east–west river valley (floor 230–260 m, falling eastwards), a hill range
 * south of it (crest 600–900 m) with spurs running south, a southern piedmont, a gentle rise to an
 * upland plateau in the north, and a lake in the valley's east (surface 228 m).
 *
 * Coordinates inside are local km from the province centre (x east, y north).
 */
export class Terrain {
  private readonly noise: ValueNoise;
  private readonly spurs: Spur[];
  readonly lake = { x: 95, y: 0, semiMajorKm: 26, semiMinorKm: 12, rotationDeg: 12, levelM: 228 };

  constructor(seed: number) {
    this.noise = new ValueNoise(seed, 'terrain');
    const r = new Rng(seed, 'terrain-spurs');
    this.spurs = [-118, -48, 30, 104].map((x0) => ({
      x0: x0 + r.range(-8, 8),
      lengthKm: r.range(55, 75),
      curve: r.range(-0.3, 0.3),
    }));
    this.lake.y = this.riverY(this.lake.x) + 1;
  }

  /** y of the river (valley axis) at x. */
  riverY(x: number): number {
    return 20 + 7 * Math.sin(x / 65 + 0.4);
  }

  /** y of the hill range's crest line at x. */
  crestY(x: number): number {
    return -52 + 7 * Math.sin(x / 55 + 1.3);
  }

  /** Crest height (m) along the range, 600–900 m. */
  crestHeight(x: number): number {
    return 735 + 100 * Math.sin(x / 47 + 0.7) + 30 * Math.sin(x / 23);
  }

  /** Elevation of the plains without the hills (m). */
  private plains(x: number, y: number): number {
    const base = 241 - 0.1 * x;
    const dy = y - this.riverY(x);
    const valleySides = 0.45 * Math.min(Math.abs(dy), 30);
    const north = 235 * smooth((dy - 30) / 70);
    const south = 90 * smooth((this.crestY(x) - y - 10) / 40);
    return base + valleySides + north + south;
  }

  /** Relief of the hills above the plains (m): the range and its spurs. */
  private relief(x: number, y: number): number {
    const yc = this.crestY(x);
    const crestExcess = this.crestHeight(x) - this.plains(x, yc);
    const halfWidth = 20;
    const ridge = crestExcess * Math.exp(-(((y - yc) / halfWidth) ** 2));
    let spur = 0;
    for (const s of this.spurs) {
      const ycs = this.crestY(s.x0);
      const t = (ycs - y) / s.lengthKm;
      if (t < -0.2 || t > 1) continue;
      const xs = s.x0 + s.curve * (ycs - y);
      const top = (this.crestHeight(s.x0) - this.plains(s.x0, ycs)) * (0.78 - 0.42 * Math.max(t, 0));
      const along = t < 0 ? 1 : 1 - smooth((t - 0.7) / 0.3);
      spur = Math.max(spur, top * along * Math.exp(-(((x - xs) / 7) ** 2)));
    }
    return Math.max(ridge, spur);
  }

  /** Elliptical radius of a point from the lake's centre (< 1 inside the lake). */
  lakeRhoXY(x: number, y: number): number {
    const a = (this.lake.rotationDeg * Math.PI) / 180;
    const dx = x - this.lake.x;
    const dy = y - this.lake.y;
    const u = dx * Math.cos(a) + dy * Math.sin(a);
    const v = -dx * Math.sin(a) + dy * Math.cos(a);
    return Math.sqrt((u / this.lake.semiMajorKm) ** 2 + (v / this.lake.semiMinorKm) ** 2);
  }

  elevationXY(x: number, y: number): number {
    const relief = this.relief(x, y);
    const n = this.noise.fractal(x, y, 40, 4);
    let z = this.plains(x, y) + relief + n * (8 + 0.08 * relief);
    const rho = this.lakeRhoXY(x, y);
    if (rho < 1.35) {
      const w = smooth((rho - 1) / 0.35);
      z = this.lake.levelM * (1 - w) + z * w;
    }
    return z;
  }

  /** Elevation (m above sea level) at lon/lat. */
  elevation(lon: number, lat: number): number {
    const [x, y] = localKm(lon, lat, PROVINCE.centerLon, PROVINCE.centerLat);
    return this.elevationXY(x, y);
  }

  isLake(lon: number, lat: number): boolean {
    const [x, y] = localKm(lon, lat, PROVINCE.centerLon, PROVINCE.centerLat);
    return this.lakeRhoXY(x, y) < 1;
  }

  lakeRho(lon: number, lat: number): number {
    const [x, y] = localKm(lon, lat, PROVINCE.centerLon, PROVINCE.centerLat);
    return this.lakeRhoXY(x, y);
  }
}

/** Classes used by the README's statistics and the tests. */
export const TERRAIN_CLASSES = {
  /** "hills": elevation at or above this (m) */
  hillsFromM: 500,
  /** "valley": elevation below this (m), lake excluded */
  valleyBelowM: 290,
} as const;
