import { describe, expect, it } from 'vitest';
import {
  formatSiteClock,
  formatSiteTime,
  formatUtcOffset,
  localDayEndIso,
  localDayStartIso,
  offsetForMapping,
} from './siteTime';

describe('formatUtcOffset', () => {
  // ISO 8601 writes offsets as ±hh:mm; the demo province keeps UTC+06:00 (DESIGN §4).
  it.each([
    [360, 'UTC+06:00'],
    [0, 'UTC+00:00'],
    [-210, 'UTC-03:30'],
    [345, 'UTC+05:45'],
  ])('%i min → %s', (minutes, text) => {
    expect(formatUtcOffset(minutes)).toBe(text);
  });

  it.each([
    [0, 'UTC'],
    [360, '+06:00'],
    [-210, '-03:30'],
  ])('writes %i min for the cell-table mapping as %s', (minutes, text) => {
    expect(offsetForMapping(minutes)).toBe(text);
  });
});

describe('site-local times', () => {
  // 09:42 UTC + 6 h = 15:42 local; 20:30 UTC + 6 h crosses midnight into the next day.
  it.each([
    ['2026-07-14T09:42:00Z', 360, '14 Jul 2026, 15:42'],
    ['2026-07-14T20:30:00Z', 360, '15 Jul 2026, 02:30'],
    ['2026-07-14T01:00:00Z', -180, '13 Jul 2026, 22:00'],
  ])('%s at %i min → %s', (iso, offset, text) => {
    expect(formatSiteTime(iso, offset)).toBe(text);
  });

  it('formats the clock alone', () => {
    expect(formatSiteClock('2026-07-14T09:42:00Z', 360)).toBe('15:42');
  });

  // Local midnight of 14 July at UTC+06:00 is 18:00 UTC on 13 July; it ends 24 h later.
  it.each([
    ['2026-07-14', 360, '2026-07-13T18:00:00.000Z', '2026-07-14T18:00:00.000Z'],
    ['2026-07-14', 0, '2026-07-14T00:00:00.000Z', '2026-07-15T00:00:00.000Z'],
    ['2026-03-01', -300, '2026-03-01T05:00:00.000Z', '2026-03-02T05:00:00.000Z'],
  ])('day %s at %i min runs from %s to %s', (day, offset, start, end) => {
    expect(localDayStartIso(day, offset)).toBe(start);
    expect(localDayEndIso(day, offset)).toBe(end);
  });
});
