import { describe, expect, it } from 'vitest';
import {
  baseRateInWords,
  CHANCE_LADDER,
  chanceBand,
  chanceInWords,
  chanceWithClimatology,
  formatPercent,
} from './chance-words.js';

// "1 in N" natural frequencies for lay readers: Gigerenzer & Hoffrage 1995, Psychological Review 102,
// 684–704 (from memory). The thresholds and ladder are this product's documented mapping; the
// expected words below are worked by hand from it (k/n is the fraction nearest the chance).
describe('chanceInWords', () => {
  it.each([
    [0.5, 'about 1 afternoon in 2'],
    [0.25, 'about 1 afternoon in 4'],
    [0.33, 'about 1 afternoon in 3'],
    [0.4, 'about 2 afternoons in 5'],
    [0.45, 'about 2 afternoons in 5'], // halfway between 2/5 and 1/2: the smaller wins
    [0.52, 'about 1 afternoon in 2'],
    [0.55, 'about 1 afternoon in 2'], // halfway between 1/2 and 3/5 in floating point too
    [0.35, 'about 1 afternoon in 3'], // 1/3 is 0.017 away, 2/5 is 0.05
    [0.66, 'about 2 afternoons in 3'],
    [0.75, 'about 3 afternoons in 4'],
    [0.79, 'about 3 afternoons in 4'],
    [0.8, 'most afternoons'],
    [1, 'most afternoons'],
    [0.1, 'about 1 afternoon in 10'],
    [0.05, 'about 1 afternoon in 20'],
    [0.049, 'rarely'],
    [0, 'rarely'],
  ])('%f → %s', (p, words) => {
    expect(chanceInWords(p)).toBe(words);
  });

  it.each([
    [0.25, 'about 1 in 4'],
    [0.6, 'about 3 in 5'],
    [0.02, 'rarely'],
    [0.9, 'most afternoons'],
  ])('short form: %f → %s', (p, words) => {
    expect(chanceInWords(p, 'short')).toBe(words);
  });

  it('always names the ladder fraction nearest the chance', () => {
    for (let pct = 5; pct < 80; pct++) {
      const band = chanceBand(pct / 100);
      if (band.kind !== 'fraction') throw new Error(`${pct} % should be a fraction`);
      const distance = Math.abs(band.k / band.n - pct / 100);
      // 1e-9: exact ties are decided for the smaller fraction whatever the rounding noise.
      for (const [k, n] of CHANCE_LADDER)
        expect(distance).toBeLessThanOrEqual(Math.abs(k / n - pct / 100) + 1e-9);
    }
  });

  it.each([-0.1, 1.2, Number.NaN])('refuses %f', (p) => {
    expect(() => chanceInWords(p)).toThrow(/between 0 and 1/);
  });
});

describe('the change from climatology', () => {
  it.each([
    [0.5, 0.25, 'about 1 afternoon in 2, usually 1 in 4'],
    [0.26, 0.24, 'about 1 afternoon in 4, as usual'],
    [0.3, 0.02, 'about 1 afternoon in 3, usually rare'],
    [0.1, 0.85, 'about 1 afternoon in 10, usually most afternoons'],
    [0.5, null, 'about 1 afternoon in 2'],
  ])('%f against %s → %s', (p, base, words) => {
    expect(chanceWithClimatology(p, base)).toBe(words);
  });

  it('says the base rate alone', () => {
    expect(baseRateInWords(0.25)).toBe('usually 1 in 4');
  });
});

describe('formatPercent', () => {
  it.each([
    [0.523, '52 %'],
    [0.525, '53 %'], // Math.round rounds half up
    [0.004, '<1 %'],
    [0, '0 %'],
    [1, '100 %'],
  ])('%f → %s', (p, text) => {
    expect(formatPercent(p)).toBe(text);
  });
});
