import jStat from 'jstat';

/**
 * Log-normal fit by maximum likelihood and the Kolmogorov–Smirnov distance of the sample from it.
 * The MLE of a log-normal is the normal MLE of ln x: μ̂ = mean ln x, σ̂² = mean (ln x − μ̂)² (divisor n).
 */

export interface LogNormalParams {
  mu: number;
  sigma: number;
}

/** Fits μ̂, σ̂ to the positive values; null with fewer than two of them or no spread. */
export function fitLogNormal(values: Float64Array): LogNormalParams | null {
  const n = values.length;
  if (n < 2) return null;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += Math.log(values[i]);
  const mu = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (Math.log(values[i]) - mu) ** 2;
  const sigma = Math.sqrt(ss / n);
  return sigma > 0 ? { mu, sigma } : null;
}

/** F(x) = Φ((ln x − μ) / σ), Φ from jStat's normal distribution. */
export function logNormalCdf(x: number, { mu, sigma }: LogNormalParams): number {
  if (x <= 0) return 0;
  return jStat.normal.cdf(Math.log(x), mu, sigma);
}

/** D = sup |Fₙ(x) − F(x)| over the empirical steps (both sides of every jump). */
export function ksStatistic(values: Float64Array, cdf: (x: number) => number): number {
  const sorted = Float64Array.from(values).sort();
  const n = sorted.length;
  let d = 0;
  for (let i = 0; i < n; i++) {
    const f = cdf(sorted[i]);
    d = Math.max(d, (i + 1) / n - f, f - i / n);
  }
  return d;
}

/**
 * Kolmogorov's limiting distribution K(x) = P(√n Dₙ ≤ x) = 1 − 2 Σₖ (−1)^(k−1) e^(−2k²x²)
 * (Kolmogorov 1933; the distribution scipy calls kstwobign).
 */
export function kolmogorovCdf(x: number): number {
  if (x <= 0) return 0;
  let sum = 0;
  for (let k = 1; k <= 100; k++) {
    const term = Math.exp(-2 * k * k * x * x);
    sum += (k % 2 === 1 ? 1 : -1) * term;
    if (term < 1e-17) break;
  }
  return 1 - 2 * sum;
}

/**
 * P(Dₙ < d) exactly, by the matrix method of Marsaglia, Tsang & Wang (2003, J. Stat. Softw. 8(18)),
 * the method scipy's kstwo uses for moderate n. H is (2k−1)², k = ⌊nd⌋ + 1; its n-th power is taken by
 * squaring with a running power-of-ten exponent so nothing overflows.
 */
export function ksExactCdf(n: number, d: number): number {
  if (d <= 0) return 0;
  if (d >= 1) return 1;
  const k = Math.floor(n * d) + 1;
  const m = 2 * k - 1;
  const h = k - n * d;
  const H = new Float64Array(m * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) H[i * m + j] = i - j + 1 >= 0 ? 1 : 0;
  for (let i = 0; i < m; i++) {
    H[i * m] -= h ** (i + 1);
    H[(m - 1) * m + i] -= h ** (m - i);
  }
  H[(m - 1) * m] += 2 * h - 1 > 0 ? (2 * h - 1) ** m : 0;
  for (let i = 0; i < m; i++)
    for (let j = 0; j < m; j++) if (i - j + 1 > 0) for (let g = 1; g <= i - j + 1; g++) H[i * m + j] /= g;

  const multiply = (a: Float64Array, b: Float64Array) => {
    const c = new Float64Array(m * m);
    for (let i = 0; i < m; i++)
      for (let l = 0; l < m; l++) {
        const a_il = a[i * m + l];
        if (a_il === 0) continue;
        for (let j = 0; j < m; j++) c[i * m + j] += a_il * b[l * m + j];
      }
    return c;
  };
  const power = (a: Float64Array, p: number): { v: Float64Array; e: number } => {
    if (p === 1) return { v: a, e: 0 };
    const half = power(a, Math.floor(p / 2));
    let v = multiply(half.v, half.v);
    let e = 2 * half.e;
    if (p % 2 === 1) v = multiply(a, v);
    if (v[(k - 1) * m + (k - 1)] > 1e140) {
      for (let i = 0; i < v.length; i++) v[i] *= 1e-140;
      e += 140;
    }
    return { v, e };
  };
  const { v, e } = power(H, n);
  let s = v[(k - 1) * m + (k - 1)];
  let exponent = e;
  for (let i = 1; i <= n; i++) {
    s = (s * i) / n;
    if (s < 1e-140) {
      s *= 1e140;
      exponent -= 140;
    }
  }
  return s * 10 ** exponent;
}

function bisect(f: (x: number) => number, target: number, lo: number, hi: number): number {
  for (let it = 0; it < 200 && hi - lo > 1e-12; it++) {
    const mid = (lo + hi) / 2;
    if (f(mid) < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Up to this sample size the critical value is exact; above it the asymptotic c(α)/√n is within 1 %. */
export const EXACT_KS_MAX_N = 100;

/** c(α) with K(c) = 1 − α. */
export function kolmogorovQuantile(alpha: number): number {
  return bisect(kolmogorovCdf, 1 - alpha, 0.1, 5);
}

/** Critical value of Dₙ at level α: exact for n ≤ 100, c(α)/√n above. */
export function ksCriticalValue(n: number, alpha = 0.05): { value: number; method: 'exact' | 'asymptotic' } {
  if (n <= EXACT_KS_MAX_N)
    return { value: bisect((d) => ksExactCdf(n, d), 1 - alpha, 0, 1), method: 'exact' };
  return { value: kolmogorovQuantile(alpha) / Math.sqrt(n), method: 'asymptotic' };
}

export interface LogHistogram {
  edges: number[];
  counts: number[];
  expected: number[];
}

/**
 * Bins equal in ln x between the smallest and largest value (about √n of them, 6 to 30), with the count
 * the fitted distribution expects in each: n · (F(upper) − F(lower)).
 */
export function logHistogram(values: Float64Array, fit: LogNormalParams | null): LogHistogram {
  const n = values.length;
  if (n === 0) return { edges: [], counts: [], expected: [] };
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const v of values) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  // A single value still gets a bin around it.
  const a = Math.log(lo) - (lo === hi ? 0.5 : 0);
  const b = Math.log(hi) + (lo === hi ? 0.5 : 1e-9);
  const bins = Math.min(30, Math.max(6, Math.ceil(Math.sqrt(n))));
  const width = (b - a) / bins;
  const edges = Array.from({ length: bins + 1 }, (_, i) => Math.exp(a + i * width));
  const counts = new Array<number>(bins).fill(0);
  for (const v of values) counts[Math.min(bins - 1, Math.floor((Math.log(v) - a) / width))]++;
  const expected = counts.map((_, i) =>
    fit ? n * (logNormalCdf(edges[i + 1], fit) - logNormalCdf(edges[i], fit)) : 0,
  );
  return { edges, counts, expected };
}
