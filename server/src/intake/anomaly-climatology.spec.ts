import { describe, expect, it } from 'vitest';
import {
  type ClimatologyField,
  climatologyKeys,
  dayOfYearKey,
  subtractClimatology,
} from './anomaly-climatology.js';

const grid = { nx: 2, ny: 1, lon0: 88, lat0: 14, dLon: 0.25, dLat: 0.25 };
const clim = (key: string, values: number[], g = grid): ClimatologyField => ({
  variable: 'q',
  levelHpa: 850,
  key,
  grid: g,
  values: Float32Array.from(values),
  sourceFile: 'clim.tif',
});
const field = { variable: 'q' as const, levelHpa: 850, grid };
const day = (date: string, values: number[]) => ({ date, values: Float32Array.from(values) });

describe('climatology keys', () => {
  it.each([
    // Gregorian calendar (common practice): day 60 is 1 March in a common year, 29 February in a leap year.
    [60, 365, '03-01'],
    [60, 366, '02-29'],
    [1, 365, '01-01'],
    [365, 365, '12-31'],
    [366, 366, '12-31'],
    [166, 365, '06-15'],
  ] as const)('day %d of a %d-day year is %s', (d, n, key) => {
    expect(dayOfYearKey(d, n)).toBe(key);
  });

  it('reads months or days from band metadata, else from the band count', () => {
    expect(climatologyKeys(2, [{ MONTH: '6' }, { MONTH: '7' }])).toEqual({
      keys: ['06', '07'],
      period: 'monthly',
    });
    expect(climatologyKeys(1, [{ DAY_OF_YEAR: '166' }]).keys).toEqual(['06-15']);
    expect(climatologyKeys(12, Array(12).fill({})).keys[11]).toBe('12');
    expect(climatologyKeys(365, Array(365).fill({})).keys[59]).toBe('03-01');
  });

  it('refuses a band count that is neither months nor days, saying what it needs', () => {
    expect(() => climatologyKeys(5, Array(5).fill({}))).toThrow(/12 bands .* or 365\/366 .* has 5 band/);
  });
});

describe('subtractClimatology', () => {
  it('subtracts the day of the year, else the month, cell by cell', () => {
    const stored = [clim('06', [1, 2]), clim('06-15', [0.5, 0.5])];
    expect([...subtractClimatology(day('2025-06-15', [3, 4]), 'band 1', field, stored).values]).toEqual([
      2.5, 3.5,
    ]);
    expect([...subtractClimatology(day('2025-06-16', [3, 4]), 'band 2', field, stored).values]).toEqual([
      2, 2,
    ]);
  });

  it('uses 28 February for a leap day when the climatology has none', () => {
    const out = subtractClimatology(day('2024-02-29', [3, 3]), 'band 1', field, [clim('02-28', [1, 1])]);
    expect([...out.values]).toEqual([2, 2]);
  });

  it('names the band and asks for the climatology first when none matches', () => {
    expect(() => subtractClimatology(day('2025-06-01', [1, 1]), 'band 3', field, [])).toThrow(
      /no climatology of q at 850 hPa .* upload the climatology first/,
    );
    try {
      subtractClimatology(day('2025-07-01', [1, 1]), 'band 3', field, [clim('06', [1, 1])]);
      expect.unreachable();
    } catch (e) {
      expect(e).toMatchObject({ where: 'band 3', message: expect.stringMatching(/neither 07-01 nor July/) });
    }
  });

  it('refuses totals on another grid, naming the climatology file', () => {
    const other = clim('06', [1, 1], { ...grid, lon0: 90 });
    expect(() => subtractClimatology(day('2025-06-01', [1, 1]), 'band 1', field, [other])).toThrow(
      /differs from the climatology's .*clim\.tif/,
    );
  });
});
