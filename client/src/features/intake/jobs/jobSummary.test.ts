import { describe, expect, it } from 'vitest';
import {
  formatBytes,
  formatShare,
  jobSiteId,
  summariseAvailability,
  summariseCellsPerScan,
} from './jobSummary';

describe('jobSiteId', () => {
  it.each([
    [{ siteId: 3 }, 3],
    [{ siteId: '4' }, 4],
    [{}, null],
    [{ siteId: 'VSR' }, null],
  ])('%o → %s', (params, id) => {
    expect(jobSiteId({ params })).toBe(id);
  });
});

describe('formatBytes', () => {
  // SI prefixes (1 kB = 1000 B), as in IEC 80000-13's decimal units.
  it.each([
    [812, '812 B'],
    [14_200, '14.2 kB'],
    [3_100_000, '3.1 MB'],
    [999_999, '1,000 kB'],
  ])('%i → %s', (bytes, text) => {
    expect(formatBytes(bytes)).toBe(text);
  });
});

describe('summaries for screen readers', () => {
  const hhmm = (iso: string) => iso.slice(11, 16);

  it('says how many scans, the mean and the busiest scan', () => {
    const text = summariseCellsPerScan(
      [
        { time: '2026-07-14T09:00:00Z', cells: 2 },
        { time: '2026-07-14T09:06:00Z', cells: 7 },
        { time: '2026-07-14T09:12:00Z', cells: 3 },
      ],
      hhmm,
    );
    // Mean of 2, 7 and 3 is 4.
    expect(text).toBe(
      '3 scans from 09:00 to 09:12; 4 cells per scan on average; most in one scan: 7 at 09:06.',
    );
  });

  it('counts the days at or above the threshold and names the lowest', () => {
    const text = summariseAvailability(
      [
        { date: '2026-07-01', share: 1 },
        { date: '2026-07-02', share: 0.8 },
        { date: '2026-07-03', share: 0.42 },
      ],
      0.8,
    );
    expect(text).toBe(
      '2 of 3 days have at least 80 % of the expected scans; the lowest is 42 % on 2026-07-03.',
    );
  });

  it('rounds shares to whole per cent', () => {
    expect(formatShare(0.125)).toBe('13 %');
  });
});
