import { describe, expect, it } from 'vitest';
import { chanceText, changeText, hourText, intervalText } from './bulletinFormat';

describe('bulletin figures in words', () => {
  it.each([
    [0.52, '52 %'],
    [0.004, '<1 %'],
    [null, 'no data'],
  ])('chance %s reads %s', (p, text) => {
    expect(chanceText(p)).toBe(text);
  });

  it('writes hours on the 24-hour clock (ISO 8601 hh:mm, common practice)', () => {
    expect(hourText(9)).toBe('09:00');
    expect(hourText(15)).toBe('15:00');
    expect(hourText(null)).toBe('–');
  });

  it('gives the interval and the change from the usual chance in percentage points', () => {
    expect(intervalText({ lower: 0.31, upper: 0.6 })).toBe('31 %–60 %');
    expect(intervalText({ lower: null, upper: null })).toBe('–');
    expect(changeText({ afternoonChance: 0.52, climatologyChance: 0.25 })).toBe('+27 points (usual 25 %)');
    expect(changeText({ afternoonChance: 0.2, climatologyChance: 0.25 })).toBe('−5 points (usual 25 %)');
    expect(changeText({ afternoonChance: 0.25, climatologyChance: 0.25 })).toBe('±0 points (usual 25 %)');
    expect(changeText({ afternoonChance: null, climatologyChance: 0.25 })).toBe('–');
  });
});
