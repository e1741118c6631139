import { describe, expect, it } from 'vitest';
import { countByHour, meanByHour, peakHour } from './diurnal.js';

describe('daily cycle', () => {
  it('counts and averages by local hour and finds the peak', () => {
    const hours = Float64Array.of(0.2, 13.5, 13.9, 14.1, 23.99, 13.0);
    expect(countByHour(hours)).toEqual(Object.assign(new Array(24).fill(0), { 0: 1, 13: 3, 14: 1, 23: 1 }));
    expect(countByHour(hours, (i) => i !== 1)[13]).toBe(2);
    const { means, n } = meanByHour(hours, Float64Array.of(2, 10, 20, 5, Number.NaN, 30));
    expect(n).toBe(5);
    expect(means[13]).toBe(20);
    expect(means[23]).toBeNull();
    expect(peakHour(means)).toBe(13);
    expect(peakHour([null, 3, 3, 1])).toBe(1);
    expect(peakHour([null, null])).toBeNull();
  });
});
