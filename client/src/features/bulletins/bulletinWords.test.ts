import { describe, expect, it } from 'vitest';
import { nextWeekStart, weekLabel, weekStartOf } from './bulletinWords';

// ISO 8601 weeks: Monday to Sunday, week 1 holds the year's first Thursday. Every expected week below was
// checked with GNU date's ISO week fields (`date -d 2025-07-02 +%G-W%V-%a` → 2025-W27-Wed).
describe('week choice', () => {
  it.each([
    ['2025-07-02', '2025-06-30'],
    ['2025-06-30', '2025-06-30'],
    ['2025-07-06', '2025-06-30'],
    // 2021-01-03 (a Sunday) still belongs to 2020-W53, which began on Monday 2020-12-28.
    ['2021-01-03', '2020-12-28'],
  ])('the week holding %s starts on %s', (day, monday) => {
    expect(weekStartOf(day)).toBe(monday);
  });

  it('refuses text that is not a date', () => {
    expect(weekStartOf('next week')).toBeNull();
  });

  it('names the week by its ISO number and its days', () => {
    expect(weekLabel('2025-06-30')).toBe('ISO week 27 of 2025: Mon 30 Jun – Sun 6 Jul');
    expect(weekLabel('2020-12-28')).toBe('ISO week 53 of 2020: Mon 28 Dec – Sun 3 Jan');
  });

  it('proposes the coming week', () => {
    expect(nextWeekStart('2025-07-02')).toBe('2025-07-07');
  });
});
