import { describe, expect, it } from 'vitest';
import {
  anomalyDraftFromPreview,
  anomalyMappingProblems,
  guessDateFormat,
  toAnomalyMapping,
  unknownVariableNames,
} from './anomalyCsvMapping';
import { parseCsvPreview } from './csvPreview';

const theirs = parseCsvPreview(
  'Valid Day,Latitude,Longitude,Param,Level,Anomaly\n20250601,14,88,shum,850,1.5\n20250601,14,88,uwnd,850,3\n',
);

describe('the anomaly CSV mapping step', () => {
  it('matches common header spellings and reads the date format off the first rows', () => {
    const draft = anomalyDraftFromPreview(theirs);
    expect(draft.columns).toEqual({
      date: 'Valid Day',
      lat: 'Latitude',
      lon: 'Longitude',
      variable: 'Param',
      level_hpa: 'Level',
      value: 'Anomaly',
    });
    expect(draft.dateFormat).toBe('YYYYMMDD');
  });

  it('asks which of q, u, v the file’s own variable names are, until each is mapped', () => {
    const draft = anomalyDraftFromPreview(theirs);
    expect(unknownVariableNames(draft, theirs)).toEqual(['shum', 'uwnd']);
    expect(anomalyMappingProblems(draft, theirs, null)).toEqual([
      'The file names variables "shum", "uwnd": say which of q, u, v each one is.',
    ]);
    const named = { ...draft, variableNames: { q: 'SHUM', u: 'uwnd', v: '' } };
    expect(anomalyMappingProblems(named, theirs, null)).toEqual([]);
    expect(toAnomalyMapping(named)).toEqual({
      columns: draft.columns,
      variableNames: { q: 'SHUM', u: 'uwnd' },
      dateFormat: 'YYYYMMDD',
    });
  });

  it('takes the variable chosen for the upload and a typed level when the file has neither column', () => {
    const oneField = parseCsvPreview('date,lat,lon,value\n2025-06-01,14,88,1.5\n');
    const draft = anomalyDraftFromPreview(oneField);
    expect(anomalyMappingProblems(draft, oneField, null)).toEqual([
      'Choose the column with the variable, or pick the variable of the whole file above.',
      'Choose the column with the pressure level, or enter the level of the whole file.',
    ]);
    expect(anomalyMappingProblems({ ...draft, levelHpa: '85O' }, oneField, 'q')).toEqual([
      'The level "85O" is not a pressure in hPa between 0 and 1100.',
    ]);
    const ready = { ...draft, levelHpa: '850' };
    expect(anomalyMappingProblems(ready, oneField, 'q')).toEqual([]);
    expect(toAnomalyMapping(ready)).toMatchObject({ levelHpa: 850, dateFormat: 'YYYY-MM-DD' });
  });

  it.each([
    [['2025-06-01'], 'YYYY-MM-DD'],
    [['20250601'], 'YYYYMMDD'],
    // A day above 12 in the second place can only be month/day/year (common practice).
    [['06/01/2025', '06/13/2025'], 'MM/DD/YYYY'],
    [['01/06/2025', '13/06/2025'], 'DD/MM/YYYY'],
  ])('reads dates like %j as %s', (dates, format) => {
    expect(guessDateFormat(dates)).toBe(format);
  });
});
