import { describe, expect, it } from 'vitest';
import { checkCropCalendarCsv } from './crop-calendar-csv.js';

// Invented rows of the demo province. The file format is the project's own (README, "Advice rules and
// crop calendars"); RFC 4180 CSV as read by papaparse.
const header = 'district_code,crop,stage,from_week,to_week';

describe('checkCropCalendarCsv', () => {
  it('reads a good file, normalising names and keeping the file’s row numbers', () => {
    const check = checkCropCalendarCsv(
      `${header}\r\nRVB,Rice,Grain  Filling,35,38\r\n\r\nHLF,orchards,harvest,50,4\r\n`,
    );
    expect(check).toEqual({
      ok: true,
      rows: [
        {
          row: 2,
          districtCode: 'RVB',
          entry: { crop: 'rice', stage: 'grain filling', fromWeek: 35, toWeek: 38 },
        },
        {
          row: 4,
          districtCode: 'HLF',
          entry: { crop: 'orchards', stage: 'harvest', fromWeek: 50, toWeek: 4 },
        },
      ],
    });
  });

  it('takes the columns in any order and a byte-order mark', () => {
    const check = checkCropCalendarCsv(
      '\uFEFFstage,to_week,crop,from_week,district_code\nsowing,24,pulses,22,LKS\n',
    );
    expect(check.ok && check.rows[0]).toEqual({
      row: 2,
      districtCode: 'LKS',
      entry: { crop: 'pulses', stage: 'sowing', fromWeek: 22, toWeek: 24 },
    });
  });

  it('names every bad row and column', () => {
    const check = checkCropCalendarCsv(
      [
        header,
        'RVB,rice,nursery,24,27', // row 2: fine
        'rvb!,rice,tillering,31,34', // row 3: bad code
        'RVB,,flowering,35,x', // row 4: no crop, week not a number
        'RVB,rice,harvest,54,0', // row 5: weeks out of range
        'RVB,rice,nursery,24,27', // row 6: repeats row 2
        'RVB,rice,,,', // row 7: empty stage and weeks
      ].join('\n'),
    );
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.problems).toEqual([
      { where: 'row 3, column "district_code"', problem: '"rvb!": Use 1–24 capital letters, digits, - or _' },
      {
        where: 'row 4, column "to_week"',
        problem: '"x" is not a week number; give an ISO week from 1 to 53',
      },
      { where: 'row 4, column "crop"', problem: 'is empty' },
      { where: 'row 5, column "from_week"', problem: 'ISO weeks run from 1 to 53' },
      { where: 'row 5, column "to_week"', problem: 'ISO weeks run from 1 to 53' },
      { where: 'row 6', problem: 'repeats row 2' },
      { where: 'row 7, column "from_week"', problem: 'is empty' },
      { where: 'row 7, column "to_week"', problem: 'is empty' },
      { where: 'row 7, column "stage"', problem: 'is empty' },
    ]);
  });

  it('names missing columns, and refuses a file with no rows', () => {
    const noWeeks = checkCropCalendarCsv('district_code,crop,stage\nRVB,rice,nursery\n');
    expect(noWeeks).toMatchObject({
      ok: false,
      fileProblem: expect.stringMatching(/^The file lacks the columns from_week, to_week/),
      problems: [
        { where: 'column "from_week"', problem: 'missing' },
        { where: 'column "to_week"', problem: 'missing' },
      ],
    });
    expect(checkCropCalendarCsv(`${header}\n`)).toEqual({
      ok: false,
      fileProblem: 'The file has a header but no rows.',
      problems: [],
    });
  });
});
