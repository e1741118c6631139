/**
 * Table look-ups for the two transcendental functions the cell step evaluates millions of times.
 * Linear interpolation on grids fine enough for a relative error below 1e-7 (far inside radar
 * precision), and tables small enough to stay in the processor's cache: reads from a table of
 * megabytes at random places cost more than the arithmetic they save.
 */

// 10^y = 10^n · 10^f with n = ⌊y⌋ and f in [0, 1): one 32 KB table of 10^f and the powers of ten.
const FRACTION_STEPS = 4096;
const POW10_FRACTION = new Float64Array(FRACTION_STEPS + 1);
for (let i = 0; i <= FRACTION_STEPS; i++) POW10_FRACTION[i] = 10 ** (i / FRACTION_STEPS);
const N_LO = -30;
const N_HI = 30;
const POW10_INTEGER = new Float64Array(N_HI - N_LO + 1);
for (let n = N_LO; n <= N_HI; n++) POW10_INTEGER[n - N_LO] = 10 ** n;

/** 10^y; exact exponentiation outside 10^±30 (and NaN for NaN). */
export function pow10(y: number): number {
  const n = Math.floor(y);
  if (!(n >= N_LO && n <= N_HI)) return 10 ** y;
  const t = (y - n) * FRACTION_STEPS;
  const i = t | 0;
  const f = t - i;
  const lo = POW10_FRACTION[i];
  return POW10_INTEGER[n - N_LO] * (lo + f * (POW10_FRACTION[i + 1] - lo));
}

// g(d) = log10((1 + 10^(d/10)) / 2): the dB-domain mean of two reflectivities d dB apart.
// |d| ≤ 64 dB covers every pair of echoes a layer joins in practice; wider pairs take the formula.
const G_LIMIT_DB = 64;
const G_STEPS_PER_DB = 128;
const G = new Float64Array(2 * G_LIMIT_DB * G_STEPS_PER_DB + 1);
export const exactMeanLogOffset = (d: number): number => Math.log10((1 + 10 ** (d / 10)) / 2);
for (let i = 0; i < G.length; i++) G[i] = exactMeanLogOffset(-G_LIMIT_DB + i / G_STEPS_PER_DB);

/** log10 of the mean of 10^(a/10) and 10^(b/10), minus a/10, for d = b − a. */
export function meanLogOffset(d: number): number {
  const t = (d + G_LIMIT_DB) * G_STEPS_PER_DB;
  if (!(t >= 0 && t < G.length - 1)) return exactMeanLogOffset(d);
  const i = t | 0;
  const f = t - i;
  const lo = G[i];
  return lo + f * (G[i + 1] - lo);
}

/**
 * The three tables one after another (10^f, then 10^n for n = −30…30, then g), for the WebAssembly
 * kernel, which reads the very same values (cell-kernel.ts).
 */
export function fastMathTables(): Float64Array {
  const all = new Float64Array(POW10_FRACTION.length + POW10_INTEGER.length + G.length);
  all.set(POW10_FRACTION, 0);
  all.set(POW10_INTEGER, POW10_FRACTION.length);
  all.set(G, POW10_FRACTION.length + POW10_INTEGER.length);
  return all;
}
