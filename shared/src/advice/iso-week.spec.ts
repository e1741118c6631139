import { format, getISOWeek, getISOWeekYear, parseISO } from 'date-fns';
import { describe, expect, it } from 'vitest';
import type { CropStageEntry } from '../advice.js';
import { addDays, isoWeek, mondayOf, parseDay, rangeHoldsWeek, stagesInWeek } from './iso-week.js';

describe('isoWeek', () => {
  // Worked examples of ISO 8601 week dates (ISO 8601-1:2019 §5.2.3; the year-boundary cases as
  // tabulated in the standard's commentary, from memory), each also confirmed by date-fns below.
  it.each([
    ['2025-12-29', 2026, 1], // a Monday in December that starts week 1 of the next year
    ['2026-01-01', 2026, 1],
    ['2021-01-03', 2020, 53], // a Sunday in January still in the last week of the year before
    ['2020-12-31', 2020, 53],
    ['2008-12-29', 2009, 1],
    ['2010-01-03', 2009, 53],
    ['2005-01-01', 2004, 53],
    ['2007-01-01', 2007, 1], // 1 January on a Monday
    ['2025-08-04', 2025, 32],
  ])('%s is in week %i-W%i', (day, year, week) => {
    expect(isoWeek(day)).toEqual({ year, week });
    // date-fns getISOWeek/getISOWeekYear: a general-purpose date library's reading of the same rule.
    expect(getISOWeek(parseISO(day))).toBe(week);
    expect(getISOWeekYear(parseISO(day))).toBe(year);
  });

  it('agrees with date-fns on every day from 1995 to 2045', () => {
    // date-fns 4 getISOWeek and getISOWeekYear as the reference.
    let day = '1995-01-01';
    let disagreements = 0;
    let days = 0;
    while (day < '2046-01-01') {
      const ours = isoWeek(day);
      const date = parseISO(day);
      if (ours.week !== getISOWeek(date) || ours.year !== getISOWeekYear(date)) disagreements++;
      day = addDays(day, 1);
      days++;
    }
    expect(days).toBe(18628);
    expect(disagreements).toBe(0);
  });

  it('finds the Monday of a week as date-fns formats it (ISO day of week "i" = 1)', () => {
    for (const day of ['2025-08-07', '2025-08-04', '2025-08-10', '2026-01-01']) {
      const monday = mondayOf(day);
      expect(format(parseISO(monday), 'i')).toBe('1');
      expect(getISOWeek(parseISO(monday))).toBe(getISOWeek(parseISO(day)));
    }
  });

  it.each(['2025-02-29', '2025-13-01', '4 Aug 2025', ''])('refuses "%s" as a date', (text) => {
    expect(parseDay(text)).toBeNull();
    expect(() => isoWeek(text)).toThrow(/is not a date/);
  });
});

describe('rangeHoldsWeek', () => {
  it.each([
    [10, 14, 10, true],
    [10, 14, 14, true],
    [10, 14, 15, false],
    [50, 6, 52, true], // wraps over the new year (common practice for a winter crop)
    [50, 6, 1, true],
    [50, 6, 7, false],
    [50, 6, 49, false],
    [20, 20, 20, true],
  ])('%i–%i holds week %i: %s', (from, to, week, holds) => {
    expect(rangeHoldsWeek(from, to, week)).toBe(holds);
  });
});

describe('stagesInWeek', () => {
  const calendar: CropStageEntry[] = [
    { crop: 'rice', stage: 'transplanting', fromWeek: 27, toWeek: 30 },
    { crop: 'rice', stage: 'tillering', fromWeek: 31, toWeek: 34 },
    { crop: 'pulses', stage: 'harvest', fromWeek: 30, toWeek: 31 },
    { crop: 'vegetables', stage: 'nursery', fromWeek: 52, toWeek: 2 },
  ];

  it('lists the stages of a Monday-to-Sunday week, sorted by crop', () => {
    // 2025-07-28 is the Monday of ISO week 31 (date-fns getISOWeek agrees).
    expect(getISOWeek(parseISO('2025-07-28'))).toBe(31);
    expect(stagesInWeek(calendar, '2025-07-28')).toEqual([
      { crop: 'pulses', stage: 'harvest' },
      { crop: 'rice', stage: 'tillering' },
    ]);
  });

  it('counts both ISO weeks of a week that starts mid-week', () => {
    // Thursday 2025-07-24 (week 30) to Wednesday 2025-07-30 (week 31).
    expect(stagesInWeek(calendar, '2025-07-24')).toEqual([
      { crop: 'pulses', stage: 'harvest' },
      { crop: 'rice', stage: 'transplanting' },
      { crop: 'rice', stage: 'tillering' },
    ]);
  });

  it('finds a stage that wraps the new year in week 1 of the next year', () => {
    // 2025-12-29 is in week 1 of 2026 (ISO 8601; date-fns agrees above).
    expect(stagesInWeek(calendar, '2025-12-29')).toEqual([{ crop: 'vegetables', stage: 'nursery' }]);
  });

  it('lists a crop and stage once even when two ranges hold the week', () => {
    const twice: CropStageEntry[] = [
      { crop: 'rice', stage: 'harvest', fromWeek: 30, toWeek: 32 },
      { crop: 'rice', stage: 'harvest', fromWeek: 31, toWeek: 33 },
    ];
    expect(stagesInWeek(twice, '2025-07-28')).toEqual([{ crop: 'rice', stage: 'harvest' }]);
    expect(stagesInWeek([], '2025-07-28')).toEqual([]);
  });
});
