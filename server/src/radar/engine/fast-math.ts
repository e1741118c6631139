/**
 * Table look-ups for the two transcendental functions the cell step evaluates millions of times.
 * Linear interpolation on a fine grid; relative error below 1e-7, far inside radar precision.
 */

const P_LO = -8;
const P_HI = 12;
const P_STEP = 1 / 4096;
const POW10 = new Float64Array(Math.round((P_HI - P_LO) / P_STEP) + 2);
for (let i = 0; i < POW10.length; i++) POW10[i] = 10 ** (P_LO + i * P_STEP);

/** 10^y; exact Math.pow outside the table's range. */
export function pow10(y: number): number {
  const t = (y - P_LO) / P_STEP;
  if (!(t >= 0 && t < POW10.length - 1)) return 10 ** y;
  const i = t | 0;
  const f = t - i;
  return POW10[i] + f * (POW10[i + 1] - POW10[i]);
}

// g(d) = log10((1 + 10^(d/10)) / 2): the dB-domain mean of two reflectivities d dB apart.
const G_LIM = 100;
const G_STEP = 1 / 1024;
const G = new Float64Array(Math.round((2 * G_LIM) / G_STEP) + 2);
for (let i = 0; i < G.length; i++) G[i] = Math.log10((1 + 10 ** ((-G_LIM + i * G_STEP) / 10)) / 2);

/** log10 of the mean of 10^(a/10) and 10^(b/10), minus a/10. */
export function meanLogOffset(d: number): number {
  const t = (d + G_LIM) / G_STEP;
  if (t < 0) return -Math.LOG10E * Math.LN2;
  if (t >= G.length - 1) return d / 10 - Math.LOG10E * Math.LN2;
  const i = t | 0;
  const f = t - i;
  return G[i] + f * (G[i + 1] - G[i]);
}
