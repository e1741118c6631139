import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseAnomalyCsv } from './anomaly-csv.js';
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
    const fields = parseAnomalyCsv(text, 'kt');
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
});
