import { describe, expect, it } from 'vitest';
import { type IssuedChance, pairChances, type RadarAfternoon, type ReportObservation } from './pairing.js';

const window = { fromHour: 12, toHour: 18 };
const week = ['2025-08-04', '2025-08-05', '2025-08-06'];
const issued: IssuedChance[] = [
  {
    bulletinId: 1,
    bulletinNumber: 'D-2025-32',
    blockCode: 'A',
    blockName: 'Alpha',
    dates: week,
    chance: 0.6,
    climatologyChance: 0.3,
  },
  {
    bulletinId: 1,
    bulletinNumber: 'D-2025-32',
    blockCode: 'B',
    blockName: 'Beta',
    dates: week,
    chance: 0.2,
    climatologyChance: null,
  },
];
// Radar had enough scans on the first two days only, and block B lies outside its coverage.
const radar: RadarAfternoon[] = [
  { blockCode: 'A', date: '2025-08-04', stormStarted: true },
  { blockCode: 'A', date: '2025-08-05', stormStarted: false },
];
const reports: ReportObservation[] = [
  // An afternoon storm on the 5th that radar did not see, and one starting in the morning of the 6th.
  { bulletinId: 1, blockCode: 'A', stormSeen: true, startLocal: '2025-08-05T14:10', filedOn: '2025-08-06' },
  { bulletinId: 1, blockCode: 'A', stormSeen: true, startLocal: '2025-08-06T09:30', filedOn: '2025-08-06' },
  // "No storm" filed on the 5th speaks for the 4th and 5th, not the 6th.
  { bulletinId: 1, blockCode: 'B', stormSeen: false, startLocal: null, filedOn: '2025-08-05' },
];
const outcomes = (pairs: { blockCode: string; date: string; observed: number; source: string }[]) =>
  pairs.map((p) => `${p.blockCode} ${p.date.slice(8)} ${p.observed} ${p.source}`);

describe('pairing issued chances with what happened', () => {
  it('scores from radar only the days and blocks radar had', () => {
    const { pairs } = pairChances(issued, radar, reports, window, 'radar');
    expect(outcomes(pairs)).toEqual(['A 04 1 radar', 'A 05 0 radar']);
    expect(pairs[0]).toMatchObject({ chance: 0.6, climatologyChance: 0.3, bulletinNumber: 'D-2025-32' });
  });

  it('reads field reports: an afternoon storm marks its day, "none" covers the days up to filing', () => {
    const { pairs } = pairChances(issued, radar, reports, window, 'reports');
    // A morning storm alone says nothing of the afternoon, so A on the 6th is not scored.
    expect(outcomes(pairs)).toEqual(['A 05 1 report', 'B 04 0 report', 'B 05 0 report']);
  });

  it('lets radar decide where it has the day and fills the rest from reports', () => {
    const { pairs, agreement } = pairChances(issued, radar, reports, window, 'combined');
    expect(outcomes(pairs)).toEqual(['A 04 1 radar', 'A 05 0 radar', 'B 04 0 report', 'B 05 0 report']);
    // Both sources know A on the 5th: the report saw a storm the radar did not.
    expect(agreement).toEqual({ both: 0, radarOnly: 0, reportOnly: 1, neither: 0 });
  });

  it('ignores a reported storm outside the bulletin’s days and an afternoon window’s end hour', () => {
    const late: ReportObservation[] = [
      {
        bulletinId: 1,
        blockCode: 'A',
        stormSeen: true,
        startLocal: '2025-08-04T18:00',
        filedOn: '2025-08-04',
      },
      {
        bulletinId: 1,
        blockCode: 'A',
        stormSeen: true,
        startLocal: '2025-08-09T13:00',
        filedOn: '2025-08-09',
      },
    ];
    expect(pairChances(issued, [], late, window, 'reports').pairs).toEqual([]);
  });
});
