/**
 * Seeded pseudo-random numbers.
 *
 * Generator: sfc32 ("Small Fast Counting", 32-bit variant) by Chris Doty-Humphrey, from the PractRand
 * suite; four 32-bit words of state, period ≥ 2^32. The state is filled from the user's seed and a
 * stream label with FNV-1a (32-bit) followed by splitmix32 steps, and warmed up by 15 draws.
 *
 * Every part of the scenario draws from its own named stream (`rng(seed, 'blocks')`,
 * `rng(seed, 'storms', day)` …), so that a change in one part (or a shorter season) leaves the
 * others, and the first days of a season, unchanged.
 */

/** FNV-1a, 32-bit, over the UTF-16 code units of a string. */
export function fnv1a(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/** splitmix32 finaliser (Steele, Lea & Flood's splitmix, 32-bit constants by Hoshi/Vigna-style mixing). */
function splitmix32(state: { s: number }): number {
  state.s = (state.s + 0x9e3779b9) | 0;
  let z = state.s;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

export class Rng {
  private a: number;
  private b: number;
  private c: number;
  private d: number;
  private spare: number | null = null;

  constructor(seed: number, ...stream: (string | number)[]) {
    const st = { s: fnv1a(`${seed}|${stream.join('|')}`) };
    this.a = splitmix32(st);
    this.b = splitmix32(st);
    this.c = splitmix32(st);
    this.d = splitmix32(st);
    for (let i = 0; i < 15; i++) this.nextUint32();
  }

  /** sfc32 step: a uniformly distributed unsigned 32-bit integer. */
  nextUint32(): number {
    const t = (((this.a + this.b) | 0) + this.d) | 0;
    this.d = (this.d + 1) | 0;
    this.a = this.b ^ (this.b >>> 9);
    this.b = (this.c + (this.c << 3)) | 0;
    this.c = (this.c << 21) | (this.c >>> 11);
    this.c = (this.c + t) | 0;
    return t >>> 0;
  }

  /** Uniform on [0, 1) with 53 random bits. */
  uniform(): number {
    const hi = this.nextUint32() >>> 5; // 27 bits
    const lo = this.nextUint32() >>> 6; // 26 bits
    return (hi * 67108864 + lo) / 9007199254740992;
  }

  range(lo: number, hi: number): number {
    return lo + (hi - lo) * this.uniform();
  }

  /** Integer uniform on [lo, hi] (inclusive). */
  int(lo: number, hi: number): number {
    return lo + Math.floor(this.uniform() * (hi - lo + 1));
  }

  /** Standard normal deviate (Box–Muller, polar form of Marsaglia). */
  normal(): number {
    if (this.spare !== null) {
      const s = this.spare;
      this.spare = null;
      return s;
    }
    let u = 0;
    let v = 0;
    let s = 0;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const m = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = v * m;
    return u * m;
  }

  /** Log-normal deviate with the given median and σ of ln x. */
  lognormal(median: number, sigma: number): number {
    return median * Math.exp(sigma * this.normal());
  }

  /** Poisson deviate (Knuth's product method for small means, normal approximation above 40). */
  poisson(mean: number): number {
    if (mean <= 0) return 0;
    if (mean > 40) return Math.max(0, Math.round(mean + Math.sqrt(mean) * this.normal()));
    const limit = Math.exp(-mean);
    let k = 0;
    let p = this.uniform();
    while (p > limit) {
      k++;
      p *= this.uniform();
    }
    return k;
  }

  chance(p: number): boolean {
    return this.uniform() < p;
  }

  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.uniform() * items.length)];
  }

  /** Fisher–Yates shuffle of a copy. */
  shuffle<T>(items: readonly T[]): T[] {
    const out = items.slice();
    for (let i = out.length - 1; i > 0; i--) {
      const j = Math.floor(this.uniform() * (i + 1));
      [out[i], out[j]] = [out[j], out[i]];
    }
    return out;
  }
}

/** A value-noise field on the plane (seeded lattice, smooth interpolation), summed over octaves. */
export class ValueNoise {
  private readonly table: Float64Array;
  private readonly perm: Uint16Array;

  constructor(seed: number, label: string) {
    const r = new Rng(seed, 'noise', label);
    this.table = new Float64Array(512);
    this.perm = new Uint16Array(1024);
    for (let i = 0; i < 512; i++) this.table[i] = r.uniform() * 2 - 1;
    const p = r.shuffle(Array.from({ length: 512 }, (_, i) => i));
    for (let i = 0; i < 1024; i++) this.perm[i] = p[i & 511];
  }

  private lattice(ix: number, iy: number): number {
    const i = ((ix % 512) + 512) % 512;
    const j = ((iy % 512) + 512) % 512;
    return this.table[this.perm[this.perm[i] + j]];
  }

  /** Single octave at lattice spacing 1, values in about [-1, 1]. */
  sample(x: number, y: number): number {
    const x0 = Math.floor(x);
    const y0 = Math.floor(y);
    const fx = x - x0;
    const fy = y - y0;
    const sx = fx * fx * (3 - 2 * fx);
    const sy = fy * fy * (3 - 2 * fy);
    const a = this.lattice(x0, y0);
    const b = this.lattice(x0 + 1, y0);
    const c = this.lattice(x0, y0 + 1);
    const d = this.lattice(x0 + 1, y0 + 1);
    return a + (b - a) * sx + (c - a) * sy + (a - b - c + d) * sx * sy;
  }

  /** Fractal sum: `octaves` octaves, the first at wavelength `scale`, each half as long and as strong. */
  fractal(x: number, y: number, scale: number, octaves: number): number {
    let sum = 0;
    let amp = 1;
    let norm = 0;
    let f = 1 / scale;
    for (let o = 0; o < octaves; o++) {
      sum += amp * this.sample(x * f + o * 17.31, y * f - o * 9.77);
      norm += amp;
      amp *= 0.5;
      f *= 2;
    }
    return sum / norm;
  }
}
