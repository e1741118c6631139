import { describe, expect, it } from 'vitest';
import { weekWindows } from './weekly.js';

describe('7-day windows', () => {
  it('counts windows and hits as counting by hand does', () => {
    // Ten counted days, storms on days 0 and 8. Windows by hand: days 0–6 (hit), 1–7 (none),
    // 2–8 (hit), 3–9 (hit): 4 windows, 3 hits.
    expect(weekWindows([1, 0, 0, 0, 0, 0, 0, 0, 1, 0])).toEqual({ windows: 4, hits: 3 });
  });

  it('differs from assuming independent days when storms come in spells', () => {
    // Storms on 4 days in a row out of 14, so p = 2/7 a day and 1 − (1 − p)^7 = 0.905 whatever the
    // order. Counted by hand: a spell on days 6–9 falls in all 8 windows (days 0–6 … 7–13); a spell on
    // days 0–3 only in the 4 windows starting on days 0–3.
    const midSpell = [0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 0, 0, 0, 0];
    expect(weekWindows(midSpell)).toEqual({ windows: 8, hits: 8 });
    const spellAtStart = [1, 1, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0];
    expect(weekWindows(spellAtStart)).toEqual({ windows: 8, hits: 4 });
    expect(4 / 8).toBeLessThan(1 - (1 - 4 / 14) ** 7);
  });

  it('has no window in a record shorter than a week', () => {
    expect(weekWindows([1, 1, 1, 1, 1, 1])).toEqual({ windows: 0, hits: 0 });
  });
});
