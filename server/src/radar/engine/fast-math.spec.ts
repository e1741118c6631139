import { describe, expect, it } from 'vitest';
import { meanLogOffset, pow10 } from './fast-math.js';

/** Largest relative difference from the reference over a dense sweep of arguments. */
function worstRelative(f: (x: number) => number, exact: (x: number) => number, from: number, to: number) {
  let worst = 0;
  // An irrational step, so the sweep falls between table nodes as well as on them.
  for (let x = from; x <= to; x += Math.SQRT2 / 997) {
    const e = exact(x);
    worst = Math.max(worst, Math.abs(f(x) - e) / Math.abs(e));
  }
  return worst;
}

describe('fast-math tables', () => {
  it('gives 10^y within 1e-7 of the exact power over the whole range of dBZ/10 and VIL exponents', () => {
    // Reference: ECMAScript's exponentiation operator (IEEE 754 double precision).
    expect(worstRelative(pow10, (y) => 10 ** y, -12, 12)).toBeLessThan(1e-7);
    expect(pow10(2)).toBeCloseTo(100, 10);
    // Outside the tables: exact, and NaN stays NaN.
    expect(pow10(40)).toBe(1e40);
    expect(pow10(Number.NaN)).toBeNaN();
  });

  it('gives the dB-domain mean offset within 1e-7 (relative, after raising to 4/7 as VIL does)', () => {
    const exact = (d: number) => Math.log10((1 + 10 ** (d / 10)) / 2);
    // VIL raises 10 to (4/7)·offset: an absolute error e in the offset is a relative error of
    // (4/7)·ln10·e in the layer's term.
    const vilRelative = (d: number) => (4 / 7) * Math.LN10 * Math.abs(meanLogOffset(d) - exact(d));
    let worst = 0;
    for (let d = -90; d <= 90; d += Math.SQRT2 / 97) worst = Math.max(worst, vilRelative(d));
    expect(worst).toBeLessThan(1e-7);
    // Two equal reflectivities average to themselves (offset 0); a far weaker partner halves Z.
    expect(meanLogOffset(0)).toBeCloseTo(0, 12);
    expect(meanLogOffset(-200)).toBeCloseTo(-Math.log10(2), 12);
  });
});
