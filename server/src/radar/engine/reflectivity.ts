/** Reflectivity conversions and the quantities derived from it (dBZ ↔ Z, Z–R rain rate, VIL). */

import { meanLogOffset, pow10 } from './fast-math.js';

/** Linear reflectivity factor Z in mm⁶ m⁻³ from dBZ. */
export const dbzToZ = (dbz: number): number => pow10(dbz / 10);

export const zToDbz = (z: number): number => 10 * Math.log10(z);

export interface ZR {
  /** Z = a R^b, R in mm h⁻¹. */
  a: number;
  b: number;
}

export const MARSHALL_PALMER: ZR = { a: 200, b: 1.6 };

/** Rain rate in mm h⁻¹ from dBZ through Z = a R^b. */
export const rainRate = (dbz: number, zr: ZR = MARSHALL_PALMER): number => (dbzToZ(dbz) / zr.a) ** (1 / zr.b);

export const dbzForRainRate = (r: number, zr: ZR = MARSHALL_PALMER): number => zToDbz(zr.a * r ** zr.b);

/**
 * Vertically integrated liquid of one column after Greene & Clark (1972):
 * VIL = Σ 3.44e-6 · ((Zᵢ + Zᵢ₊₁)/2)^(4/7) · Δh, Z linear, Δh in m, result in kg m⁻².
 * Reflectivity is capped at `capDbz` first (common practice, to limit hail contamination).
 * Levels below the echo (NaN or nodata) end the layer pair: a pair counts only when both ends have echo.
 */
export function vilColumn(dbz: ArrayLike<number>, heightsM: ArrayLike<number>, capDbz = 56): number {
  let vil = 0;
  for (let k = 0; k + 1 < dbz.length; k++)
    vil += vilLayer(dbz[k], dbz[k + 1], heightsM[k + 1] - heightsM[k], capDbz);
  return vil;
}

/**
 * One layer's term of the sum: 3.44e-6 · ((Zlo + Zhi)/2)^(4/7) · Δh, or 0 unless both ends have echo.
 * The mean is taken in the dB domain with table look-ups (fast-math.ts): log10 of the mean is
 * lo/10 + g(hi − lo), so no power function is evaluated per layer.
 */
export function vilLayer(lo: number, hi: number, dhM: number, capDbz = 56): number {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return 0;
  const a = Math.min(lo, capDbz);
  const b = Math.min(hi, capDbz);
  return 3.44e-6 * pow10((4 / 7) * (a / 10 + meanLogOffset(b - a))) * dhM;
}
