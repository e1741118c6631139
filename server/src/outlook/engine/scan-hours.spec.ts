import { describe, expect, it } from 'vitest';
import { dayOfDate } from '../../radar/engine/local-time.js';
import { countScanHours, NO_SCANS, scanHoursFromDays, scannedDays } from './scan-hours.js';

describe('scans per local hour', () => {
  it('counts by the site’s local clock, so a +05:45 site’s hours start at :15 UTC', () => {
    // Local time = UTC + offset (common practice): 06:14 UTC is 11:59 at +05:45, 06:16 UTC is 12:01,
    // and 18:15 UTC on 1 June is local midnight starting 2 June.
    const s = countScanHours(
      [
        Date.parse('2025-06-01T06:14:00Z'),
        Date.parse('2025-06-01T06:16:00Z'),
        Date.parse('2025-06-01T18:15:00Z'),
      ],
      345,
    );
    expect(s.firstDay).toBe(dayOfDate('2025-06-01'));
    expect(s.dayCount).toBe(2);
    expect(s.counts[11]).toBe(1);
    expect(s.counts[12]).toBe(1);
    expect(s.counts[24]).toBe(1);
    expect(s.counts.reduce((a, b) => a + b, 0)).toBe(3);
  });

  it('counts a time given twice (by two sources) once, and a west-of-UTC site’s evening on the right day', () => {
    const t = Date.parse('2025-06-02T01:30:00Z'); // 20:30 on 1 June at UTC−05:00
    const s = countScanHours([t, t, t + 1], -300);
    expect(s.firstDay).toBe(dayOfDate('2025-06-01'));
    expect(s.counts[20]).toBe(2);
  });

  it('packs stored day rows, days between them holding no scans', () => {
    const d = dayOfDate('2025-06-01');
    const row = (h: number) => Array.from({ length: 24 }, (_, i) => (i === h ? 10 : 0));
    const s = scanHoursFromDays([d, d + 3], [row(5), row(7)]);
    expect(s).toMatchObject({ firstDay: d, dayCount: 4 });
    expect(s.counts[5]).toBe(10);
    expect(s.counts[3 * 24 + 7]).toBe(10);
    expect(s.counts.slice(24, 72).every((c) => c === 0)).toBe(true);
    expect(scannedDays(s)).toEqual({ first: d, last: d + 3 });
    expect(scanHoursFromDays([], [])).toBe(NO_SCANS);
    expect(scannedDays(NO_SCANS)).toBeNull();
  });
});
