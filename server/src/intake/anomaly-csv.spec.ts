import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { AnomalyCsvMapping } from '@stormhour/shared';
import { describe, expect, it } from 'vitest';
import { parseAnomalyCsv, readDate } from './anomaly-csv.js';
import { readAnomalyTiff } from './anomaly-reader.js';

const demo = fileURLToPath(new URL('../../../sample-data/vessary/', import.meta.url));
const file = (re: RegExp) => join(demo, readdirSync(demo).find((f) => re.test(f)) as string);

describe('parseAnomalyCsv', () => {
  it('builds the same daily grids from the demo CSV as from its GeoTIFF (to the CSV’s 3 decimals)', async () => {
    const fields = parseAnomalyCsv(readFileSync(file(/^anomalies-.*\.csv$/), 'utf8'));
    expect(fields.map((f) => f.variable).sort()).toEqual(['q', 'u', 'v']);
    const q = fields.find((f) => f.variable === 'q');
    // The geotiff package reads the GeoTIFF twin of the same data.
    const tif = await readAnomalyTiff(readFileSync(file(/^anomalies-.*-q850\.tif$/)), {});
    expect(q?.grid).toMatchObject({ nx: tif.grid.nx, ny: tif.grid.ny });
    expect(q?.grid.lon0).toBeCloseTo(tif.grid.lon0, 9);
    expect(q?.grid.lat0).toBeCloseTo(tif.grid.lat0, 9);
    expect(q?.days).toHaveLength(tif.days.length);
    const a = q?.days[40].values as Float32Array;
    const b = tif.days[40].values;
    for (let i = 0; i < a.length; i += 7) expect(Math.abs(a[i] - b[i])).toBeLessThanOrEqual(0.0005 + 1e-6);
    expect(q?.conversion).toBe('no units given: read as g/kg');
  });

  it('converts stated units where they fit and leaves missing points NaN', () => {
    const text =
      'date,lat,lon,variable,level_hpa,value\n2025-06-01,14,88,u,850,10\n2025-06-01,14,88.25,u,850,\n2025-06-01,14,88,q,850,1\n';
    const fields = parseAnomalyCsv(text, { units: 'kt' });
    const u = fields.find((f) => f.variable === 'u');
    // 1 knot = 1852 m per 3600 s (international nautical mile, by definition).
    expect(u?.days[0].values[0]).toBeCloseTo(10 * (1852 / 3600), 5);
    expect(u?.days[0].values[1]).toBeNaN();
    expect(u?.conversion).toBe('kt × 0.514444 → m/s');
    expect(fields.find((f) => f.variable === 'q')?.conversion).toBe('no units given: read as g/kg');
  });

  it('converts a units column row by row: kg/kg to g/kg (× 1000) and knots to m/s', () => {
    const text =
      'date,lat,lon,variable,level_hpa,value,units\n2025-06-01,14,88,q,850,0.0012,kg/kg\n2025-06-01,14,88,u,850,4,kt\n';
    const fields = parseAnomalyCsv(text);
    // 1 kg/kg = 1000 g/kg (SI prefixes); 1 kt = 1852 m / 3600 s (definition of the knot).
    expect(fields.find((f) => f.variable === 'q')?.days[0].values[0]).toBeCloseTo(1.2, 5);
    expect(fields.find((f) => f.variable === 'u')?.days[0].values[0]).toBeCloseTo(4 * 0.514444, 5);
    expect(fields.find((f) => f.variable === 'q')?.conversion).toBe('kg/kg × 1000.00 → g/kg');
  });

  it.each([
    [
      'mixed units in one upload',
      'date,lat,lon,variable,level_hpa,value,units\n2025-06-01,14,88,q,850,1,g/kg\n2025-06-02,14,88,q,850,0.001,kg/kg\n',
      'row 3, column "units"',
      /mixed units for q in one upload: kg\/kg here, g\/kg on row 2/,
    ],
    [
      'a duplicate date at one point',
      'date,lat,lon,variable,level_hpa,value\n2025-06-01,14,88,q,850,1\n2025-06-01,14,88,q,850,2\n',
      'row 3',
      /repeats 2025-06-01, 14° N, 88° E, q at 850 hPa of row 2/,
    ],
    ['a missing column', 'date,lat,lon,value\n', 'header', /missing column\(s\) variable, level_hpa/],
    [
      'a bad date',
      'date,lat,lon,variable,level_hpa,value\n1 June,14,88,q,850,1\n',
      'row 2, column "date"',
      /not a date/,
    ],
    [
      'an unknown variable',
      'date,lat,lon,variable,level_hpa,value\n2025-06-01,14,88,t,850,1\n',
      'row 2, column "variable"',
      /not one of q, u, v/,
    ],
    [
      'an irregular grid',
      'date,lat,lon,variable,level_hpa,value\n2025-06-01,14,88,q,850,1\n2025-06-01,14,88.25,q,850,1\n2025-06-01,14,88.6,q,850,1\n',
      'column lon',
      /not evenly spaced/,
    ],
  ])('refuses %s, saying where', (_what, text, where, problem) => {
    try {
      parseAnomalyCsv(text);
      expect.unreachable();
    } catch (e) {
      expect(e).toMatchObject({ where, message: expect.stringMatching(problem) });
    }
  });

  describe('with a column mapping', () => {
    const ours =
      'date,lat,lon,variable,level_hpa,value\n2025-06-01,14,88,q,850,1.5\n2025-06-01,14,88.25,q,850,-0.5\n2025-06-02,14,88,u,850,3\n';
    const mapping = (m: unknown) => AnomalyCsvMapping.parse(m);

    it('reads a file with other headers, variable names and date format as the same grids as ours', () => {
      const theirs =
        'Valid Day;Latitude;Longitude;Param;Level (hPa);Anom\n20250601;14;88;shum;850;1.5\n20250601;14;88.25;shum;850;-0.5\n20250602;14;88;uwnd;850;3\n'.replaceAll(
          ';',
          ',',
        );
      const mapped = parseAnomalyCsv(theirs, {
        mapping: mapping({
          columns: {
            date: 'Valid Day',
            lat: 'Latitude',
            lon: 'Longitude',
            variable: 'Param',
            level_hpa: 'Level (hPa)',
            value: 'Anom',
          },
          variableNames: { q: 'SHUM', u: 'uwnd' },
          dateFormat: 'YYYYMMDD',
        }),
      });
      expect(mapped).toEqual(parseAnomalyCsv(ours));
    });

    it('takes the variable and level for the whole file when the file has no such columns', () => {
      const oneField = 'day,lat,lon,anomaly\n01/06/2025,14,88,1.5\n01/06/2025,14,88.25,-0.5\n';
      const [q] = parseAnomalyCsv(oneField, {
        variable: 'q',
        mapping: mapping({
          columns: { date: 'day', lat: 'lat', lon: 'lon', value: 'anomaly' },
          levelHpa: 850,
          dateFormat: 'DD/MM/YYYY',
        }),
      });
      expect(q).toMatchObject({ variable: 'q', levelHpa: 850 });
      expect(q.days.map((d) => d.date)).toEqual(['2025-06-01']);
      expect([...q.days[0].values]).toEqual([1.5, -0.5]);
    });

    it.each([
      [
        'a mapped column the file lacks',
        {
          columns: {
            date: 'when',
            lat: 'lat',
            lon: 'lon',
            variable: 'variable',
            level_hpa: 'level_hpa',
            value: 'value',
          },
        },
        'header',
        /"when" \(mapped to date\) are not in the file, whose columns are date, lat, lon/,
      ],
      [
        'no level column and no level for the file',
        { columns: { date: 'date', lat: 'lat', lon: 'lon', variable: 'variable', value: 'value' } },
        'header',
        /no column is mapped to level_hpa; map one, or give the level for the whole file/,
      ],
      [
        'a date in another format than chosen',
        {
          columns: {
            date: 'date',
            lat: 'lat',
            lon: 'lon',
            variable: 'variable',
            level_hpa: 'level_hpa',
            value: 'value',
          },
          dateFormat: 'DD/MM/YYYY',
        },
        'row 2, column "date"',
        /"2025-06-01" is not a date written DD\/MM\/YYYY \(e.g. 01\/06\/2025\)/,
      ],
    ])('refuses %s, saying where', (_what, m, where, problem) => {
      try {
        parseAnomalyCsv(ours, { mapping: mapping(m) });
        expect.unreachable();
      } catch (e) {
        expect(e).toMatchObject({ where, message: expect.stringMatching(problem) });
      }
    });

    it('names the file’s own column and the mapped names when a variable is not known', () => {
      const text = 'Param,date,lat,lon,level_hpa,value\ntemp,2025-06-01,14,88,850,1\n';
      try {
        parseAnomalyCsv(text, {
          mapping: mapping({
            columns: {
              date: 'date',
              lat: 'lat',
              lon: 'lon',
              variable: 'Param',
              level_hpa: 'level_hpa',
              value: 'value',
            },
            variableNames: { q: 'shum' },
          }),
        });
        expect.unreachable();
      } catch (e) {
        expect(e).toMatchObject({
          where: 'row 2, column "Param"',
          message: expect.stringMatching(/"temp" is not one of q, u, v or the names mapped to them \(shum\)/),
        });
      }
    });
  });

  describe('readDate', () => {
    it.each([
      ['2025-06-01', 'YYYY-MM-DD', '2025-06-01'],
      ['20250601', 'YYYYMMDD', '2025-06-01'],
      ['1/6/2025', 'DD/MM/YYYY', '2025-06-01'],
      ['6/1/2025', 'MM/DD/YYYY', '2025-06-01'],
      // Gregorian calendar (ISO 8601): 2024 is a leap year, 2025 is not, and June has 30 days.
      ['2024-02-29', 'YYYY-MM-DD', '2024-02-29'],
      ['2025-02-29', 'YYYY-MM-DD', null],
      ['31/06/2025', 'DD/MM/YYYY', null],
      ['2025-6-1', 'YYYY-MM-DD', null],
    ] as const)('reads %s written %s as %s', (text, format, expected) => {
      expect(readDate(text, format)).toBe(expected);
    });
  });
});
