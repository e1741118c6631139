import { describe, expect, it } from 'vitest';
import { countByHour, meanByHour, peakHour } from './diurnal.js';
import { localDate, localHour, localMidnightUtc } from './local-time.js';

describe('local time', () => {
  it('adds the site offset, including offsets that are not whole hours, across midnight', () => {
    const t = Date.parse('2025-07-01T18:40:00Z');
    expect(localHour(t, 360)).toBeCloseTo(0 + 40 / 60, 9);
    expect(localDate(t, 360)).toBe('2025-07-02');
    // UTC+05:45 (a real-world kind of offset, common practice): 18:40 UTC is 00:25 local the next day.
    expect(localHour(t, 345)).toBeCloseTo(25 / 60, 9);
    expect(localDate(t, 345)).toBe('2025-07-02');
    // UTC−03:30: 02:00 UTC is 22:30 local the day before.
    const early = Date.parse('2025-07-02T02:00:00Z');
    expect(localHour(early, -210)).toBeCloseTo(22.5, 9);
    expect(localDate(early, -210)).toBe('2025-07-01');
    expect(localMidnightUtc('2025-07-02', 345)).toBe(Date.parse('2025-07-01T18:15:00Z'));
  });
});

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
