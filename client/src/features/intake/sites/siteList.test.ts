import { describe, expect, it } from 'vitest';
import { formatLocation } from './siteList';

describe('formatLocation', () => {
  // Common practice: latitude first, hemisphere letters N/S and E/W instead of signs.
  it.each([
    [14.2, 88.1, '14.20° N, 88.10° E'],
    [-33.456, -70.6, '33.46° S, 70.60° W'],
    [0, 0, '0.00° N, 0.00° E'],
  ])('%d, %d → %s', (lat, lon, text) => {
    expect(formatLocation(lat, lon)).toBe(text);
  });
});
