import { describe, expect, it } from 'vitest';
import { localDate, localHour, localHourOfDay, localMidnightOfDate } from './local-time.js';

describe('local time', () => {
  it('adds the site offset, including offsets that are not whole hours, across midnight', () => {
    const t = Date.parse('2025-07-01T18:40:00Z');
    expect(localHourOfDay(t, 360)).toBeCloseTo(0 + 40 / 60, 9);
    expect(localDate(t, 360)).toBe('2025-07-02');
    // UTC+05:45 (a real-world kind of offset, common practice): 18:40 UTC is 00:25 local the next day.
    expect(localHourOfDay(t, 345)).toBeCloseTo(25 / 60, 9);
    expect(localDate(t, 345)).toBe('2025-07-02');
    // UTC−03:30: 02:00 UTC is 22:30 local the day before.
    const early = Date.parse('2025-07-02T02:00:00Z');
    expect(localHourOfDay(early, -210)).toBeCloseTo(22.5, 9);
    expect(localDate(early, -210)).toBe('2025-07-01');
    expect(localMidnightOfDate('2025-07-02', 345)).toBe(Date.parse('2025-07-01T18:15:00Z'));
  });
});

describe('local hour bins', () => {
  it('gives the whole local hour, also for offsets that are not whole hours', () => {
    // UTC+05:45: 08:14 UTC is 13:59 local, 08:15 UTC is 14:00 local (common practice).
    expect(localHour(Date.parse('2025-07-01T08:14:00Z'), 345)).toBe(13);
    expect(localHour(Date.parse('2025-07-01T08:15:00Z'), 345)).toBe(14);
  });
});
