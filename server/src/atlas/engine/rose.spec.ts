import { describe, expect, it } from 'vitest';
import { meanWind, motionRose, SECTOR_NAMES, sectorOf, speedClassOf } from './rose.js';

describe('rose sectors', () => {
  it('centres sector k on k × 22.5° and puts each boundary in the sector clockwise of it (common practice)', () => {
    expect(SECTOR_NAMES[sectorOf(0)]).toBe('N');
    expect(SECTOR_NAMES[sectorOf(11.249)]).toBe('N');
    expect(SECTOR_NAMES[sectorOf(11.25)]).toBe('NNE');
    expect(SECTOR_NAMES[sectorOf(33.75)]).toBe('NE');
    expect(SECTOR_NAMES[sectorOf(315)]).toBe('NW');
    expect(SECTOR_NAMES[sectorOf(348.75)]).toBe('N');
    expect(SECTOR_NAMES[sectorOf(348.74)]).toBe('NNW');
  });

  it('wraps at 360° and below 0°', () => {
    expect(sectorOf(360)).toBe(0);
    expect(sectorOf(359.99)).toBe(0);
    expect(sectorOf(-11.25)).toBe(0);
    expect(sectorOf(-11.26)).toBe(15);
    expect(sectorOf(720 + 90)).toBe(4);
  });

  it('classes speeds by their lower edges and skips tracks without motion', () => {
    const edges = [0, 2, 4, 6];
    expect([0, 1.99, 2, 5.9, 6, 40].map((s) => speedClassOf(s, edges))).toEqual([0, 0, 1, 2, 3, 3]);
    const rose = motionRose(Float64Array.of(0, 359, 180, Number.NaN), Float64Array.of(1, 7, 3, 2), edges);
    expect(rose.withMotion).toBe(3);
    expect(rose.counts[0]).toEqual([1, 0, 0, 1]);
    expect(rose.counts[8]).toEqual([0, 1, 0, 0]);
  });
});

describe('mean wind', () => {
  it('gives the direction the wind blows from as NCL wind_direction does (REFERENCES §11)', () => {
    // (u, v) = (10, 0) → from 270; (0, 10) → 180; (−10, 10) → 135 (NCAR NCL documentation, example 1).
    expect(meanWind([10], [0])?.fromDeg).toBeCloseTo(270, 9);
    expect(meanWind([0], [10])?.fromDeg).toBeCloseTo(180, 9);
    const w = meanWind([-10, -10], [10, 10]);
    expect(w?.fromDeg).toBeCloseTo(135, 9);
    expect(w?.towardDeg).toBeCloseTo(315, 9);
    expect(w?.speedMs).toBeCloseTo(Math.hypot(10, 10), 9);
    expect(meanWind([], [])).toBeNull();
  });
});
