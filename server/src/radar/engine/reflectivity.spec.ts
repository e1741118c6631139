import { describe, expect, it } from 'vitest';
import { dbzForRainRate, dbzToZ, rainRate, vilColumn, zToDbz } from './reflectivity.js';

describe('dBZ and Z', () => {
  it.each([
    // Definition Z = 10^(dBZ/10) (AMS Glossary, "dBZ").
    [35, 3162.2777],
    [40, 10000],
    [50, 100000],
  ])('%d dBZ is Z = %f mm⁶ m⁻³', (dbz, z) => {
    expect(dbzToZ(dbz)).toBeCloseTo(z, 3);
    expect(zToDbz(z)).toBeCloseTo(dbz, 6);
  });
});

describe('Z–R rain rate', () => {
  it.each([
    // Marshall & Palmer 1948, Z = 200 R^1.6; values computed from the formula (REFERENCES §1), tol 1e-4.
    [20, 0.6484],
    [30, 2.7344],
    [35, 5.6151],
    [40, 11.5307],
    [45, 23.6786],
    [50, 48.6246],
    [55, 99.8519],
    [60, 205.048],
  ])('Marshall–Palmer: %d dBZ gives %f mm/h', (dbz, r) => {
    expect(rainRate(dbz)).toBeCloseTo(r, 3);
  });

  it.each([
    [1, 23.0103],
    [10, 39.0103],
    [100, 55.0103],
  ])('Marshall–Palmer inverse: %d mm/h is %f dBZ', (r, dbz) => {
    expect(dbzForRainRate(r)).toBeCloseTo(dbz, 4);
  });

  it.each([
    // Z = 300 R^1.4 (convective relation, from memory: Woodley et al. 1975 / Fulton et al. 1998); computed.
    [{ a: 300, b: 1.4 }, 35, 5.3781],
    [{ a: 300, b: 1.4 }, 50, 63.3952],
    // Z = 250 R^1.2 (tropical, from memory: Rosenfeld, Wolff & Atlas 1993); computed.
    [{ a: 250, b: 1.2 }, 40, 21.6297],
    [{ a: 250, b: 1.2 }, 50, 147.361],
  ])('editable coefficients %o: %d dBZ gives %f mm/h', (zr, dbz, r) => {
    expect(rainRate(dbz, zr)).toBeCloseTo(r, 3);
  });
});

describe('VIL (Greene & Clark 1972)', () => {
  it('is 0.344 kg/m² for a uniform 35 dBZ layer 1 km deep (Z^(4/7) = 100 exactly)', () => {
    expect(vilColumn([35, 35], [1000, 2000])).toBeCloseTo(0.344, 12);
  });

  it.each([
    // Uniform 1 km layers, computed from the formula (REFERENCES §2).
    [40, 0.66416],
    [45, 1.28229],
    [50, 2.47572],
    [55, 4.77986],
    [56, 5.45203],
  ])('is %f for a uniform 1 km layer at %d dBZ', (dbz, vil) => {
    expect(vilColumn([dbz, dbz], [1000, 2000], 99)).toBeCloseTo(vil, 4);
  });

  it('caps reflectivity at 56 dBZ by default (common practice): 60 dBZ counts as 56', () => {
    expect(vilColumn([60, 60], [1000, 2000])).toBeCloseTo(5.45203, 4);
    // Uncapped, 60 dBZ gives 9.22847 (computed, REFERENCES §2).
    expect(vilColumn([60, 60], [1000, 2000], 99)).toBeCloseTo(9.22847, 4);
  });

  it('sums a worked column 50, 50, 45, 40, 30 dBZ at 1–5 km to 5.906581 kg/m²', () => {
    // REFERENCES §2: layer terms 2.475719, 1.949276, 1.009623, 0.471964.
    expect(vilColumn([50, 50, 45, 40, 30], [1000, 2000, 3000, 4000, 5000])).toBeCloseTo(5.906581, 5);
  });

  it('skips layer pairs without echo at both ends', () => {
    expect(vilColumn([Number.NaN, 35, 35, Number.NaN], [0, 1000, 2000, 3000])).toBeCloseTo(0.344, 12);
  });
});

describe('the fast VIL path agrees with the formula evaluated directly', () => {
  it.each([
    [
      [50, 50, 45, 40, 30],
      [1000, 2000, 3000, 4000, 5000],
    ],
    [
      [-10, 12.3, 47.77, 60, 20.5, -31],
      [500, 1250, 2100, 3000, 4500, 7000],
    ],
  ])('column %j', (dbz, heights) => {
    // Greene & Clark (1972) term by term with Math.pow, the 56 dBZ cap applied.
    let direct = 0;
    for (let k = 0; k + 1 < dbz.length; k++) {
      const z = (10 ** (Math.min(dbz[k], 56) / 10) + 10 ** (Math.min(dbz[k + 1], 56) / 10)) / 2;
      direct += 3.44e-6 * z ** (4 / 7) * (heights[k + 1] - heights[k]);
    }
    expect(vilColumn(dbz, heights) / direct).toBeCloseTo(1, 7);
  });
});
