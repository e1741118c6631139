import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { guessMapping, parseCellTable, parseScanInventory } from './cell-table.js';
import { parseTime, timeFromFileName } from './times.js';

const NOW = Date.UTC(2032, 0, 1);
const HEADER =
  'scan_time_utc,track_id,lat,lon,area_km2,volume_km3,max_dbz,top35_km,echo_top_km,core40_km3,vil_max_kg_m2,parent_track_id';
const mapping = (over = {}) => ({
  columns: guessMapping(HEADER.split(',')),
  areaUnit: 'km2' as const,
  timeZone: 'UTC',
  position: 'latlon' as const,
  ...over,
});

describe('times', () => {
  it.each([
    // ISO 8601 / RFC 3339 forms (the standards' own examples, adapted to the demo years).
    ['2031-07-14T09:30:00Z', 'UTC', Date.UTC(2031, 6, 14, 9, 30)],
    ['2031-07-14T15:30:00+06:00', 'UTC', Date.UTC(2031, 6, 14, 9, 30)],
    ['2031-07-14 15:30', '+06:00', Date.UTC(2031, 6, 14, 9, 30)],
    ['2031-07-14T09:30:15.5', 'UTC', Date.UTC(2031, 6, 14, 9, 30, 15, 500)],
  ])('reads %s (zone %s)', (text, zone, expected) => {
    expect(parseTime(text, zone)).toBe(expected);
  });

  it.each(['2031-02-30T10:00', '14/07/2031 09:30', 'yesterday', '2031-07-14T25:00'])('refuses %s', (text) => {
    expect(parseTime(text)).toBeNull();
  });

  it('reads a scan time from a file name by pattern', () => {
    expect(timeFromFileName('VSR_20310714_0930.tif', 'VSR_YYYYMMDD_hhmm.tif')).toBe(
      Date.UTC(2031, 6, 14, 9, 30),
    );
    expect(timeFromFileName('other.tif', 'VSR_YYYYMMDD_hhmm.tif')).toBeNull();
  });
});

describe('parseCellTable', () => {
  const good = [
    HEADER,
    '2031-07-14T09:30:00Z,T1,14.2,88.1,25.5,40.2,48,7.5,11,3.2,6.1,',
    '2031-07-14T09:36:00Z,T1,14.21,88.09,27,44,50,8,11.5,4,6.5,',
    '2031-07-14T09:36:00Z,T2,14.4,88.3,12,,41,,,,,T1',
  ].join('\n');

  it('reads rows, leaving empty optional fields null, and agrees with papaparse on the row count', () => {
    const { rows, problems } = parseCellTable(good, mapping(), { latestTime: NOW });
    expect(problems).toEqual([]);
    // papaparse (npm) as the independent reader of the same CSV.
    expect(rows).toHaveLength(Papa.parse(good, { header: true, skipEmptyLines: true }).data.length);
    expect(rows[2]).toMatchObject({
      line: 4,
      trackId: 'T2',
      parentTrackId: 'T1',
      volumeKm3: null,
      areaKm2: 12,
    });
  });

  it('converts m² to km²', () => {
    const text = 'time,lat,lon,area\n2031-07-14T09:30:00Z,14,88,25000000\n';
    const { rows } = parseCellTable(
      text,
      { ...mapping({ areaUnit: 'm2' }), columns: guessMapping(['time', 'lat', 'lon', 'area']) },
      { latestTime: NOW },
    );
    expect(rows[0].areaKm2).toBe(25);
  });

  it.each([
    [
      'a negative area',
      '2031-07-14T09:30:00Z,T1,14.2,88.1,-5,40,48,7,11,3,6,',
      'row 2, column "area_km2"',
      /-5 is impossible/,
    ],
    [
      'latitude 200',
      '2031-07-14T09:30:00Z,T1,200,88.1,25,40,48,7,11,3,6,',
      'row 2, column "lat"',
      /200 is impossible/,
    ],
    [
      'a text number',
      '2031-07-14T09:30:00Z,T1,14.2,88.1,big,40,48,7,11,3,6,',
      'row 2, column "area_km2"',
      /"big" is not a number/,
    ],
    [
      'a bad time',
      'noon,T1,14.2,88.1,25,40,48,7,11,3,6,',
      'row 2, column "scan_time_utc"',
      /"noon" is not a time/,
    ],
    [
      'a future time',
      '2040-07-14T09:30:00Z,T1,14.2,88.1,25,40,48,7,11,3,6,',
      'row 2, column "scan_time_utc"',
      /in the future/,
    ],
  ])('names the row and column of %s, and returns no rows', (_what, line, where, problem) => {
    const { rows, problems } = parseCellTable(`${HEADER}\n${line}\n`, mapping(), { latestTime: NOW });
    expect(rows).toEqual([]);
    expect(problems[0].where).toBe(where);
    expect(problems[0].problem).toMatch(problem);
  });

  it('refuses a mapping to columns the file does not have, listing its columns', () => {
    const { problems } = parseCellTable('when,where\n1,2\n', mapping(), { latestTime: NOW });
    expect(problems[0].problem).toMatch(/not in the file; its columns are when, where/);
  });

  it('lists at most the first problems and counts the rest', () => {
    const bad = Array.from({ length: 80 }, () => '2031-07-14T09:30:00Z,T1,14.2,88.1,-1,40,48,7,11,3,6,');
    const { problems } = parseCellTable([HEADER, ...bad].join('\n'), mapping(), {
      latestTime: NOW,
      maxProblems: 10,
    });
    expect(problems).toHaveLength(11);
    expect(problems[10].problem).toBe('… and 70 more problems not listed');
  });
});

describe('parseScanInventory', () => {
  it('reads the scan times and names bad rows', () => {
    expect(
      parseScanInventory('scan_time_utc\n2031-07-14T09:30:00Z\n2031-07-14T09:36:00Z\n', NOW).times,
    ).toHaveLength(2);
    const bad = parseScanInventory('scan_time_utc\n2031-07-14T09:30:00Z\nlater\n', NOW);
    expect(bad.problems).toEqual([{ where: 'row 3', problem: '"later" is not a time' }]);
  });
});
