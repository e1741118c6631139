import { describe, expect, it } from 'vitest';
import {
  draftFromHeaders,
  guessColumns,
  mappingProblems,
  normaliseHeader,
  toMapping,
} from './cellTableMapping';
import { parseCsvPreview } from './csvPreview';
import { buildIntakeForm, type IntakeDraft, uploadBlockers } from './intakeRequest';
import { perFileProgress } from './uploadProgress';

describe('normaliseHeader', () => {
  it.each([
    ['Area (km²)', 'area_km2'],
    ['  SCAN-TIME ', 'scan_time'],
    ['echo.top', 'echo_top'],
  ])('%j → %s', (header, normal) => {
    expect(normaliseHeader(header)).toBe(normal);
  });
});

describe('guessColumns', () => {
  it('takes our own names first, then obvious synonyms, each column once', () => {
    const columns = guessColumns([
      'Timestamp',
      'Latitude',
      'Longitude',
      'Area (km²)',
      'area',
      'VIL',
      'notes',
    ]);
    expect(columns).toEqual({
      scan_time: 'Timestamp',
      lat: 'Latitude',
      lon: 'Longitude',
      area: 'area',
      vil_max_kg_m2: 'VIL',
    });
  });

  it('leaves a field unmapped when nothing resembles it', () => {
    expect(guessColumns(['when', 'where'])).toEqual({});
  });
});

describe('draftFromHeaders', () => {
  it.each([
    [['time', 'lat', 'lon', 'area_m2'], 'm2', 'latlon'],
    [['time', 'easting', 'northing', 'area_km2'], 'km2', 'xy'],
    [['time', 'lat', 'lon', 'size'], 'km2', 'latlon'],
  ] as const)('%j → area in %s, position %s', (headers, areaUnit, position) => {
    const draft = draftFromHeaders(headers, 'UTC');
    expect(draft.areaUnit).toBe(areaUnit);
    expect(draft.position).toBe(position);
  });
});

describe('mappingProblems', () => {
  const ready = draftFromHeaders(['scan_time', 'lat', 'lon', 'area'], '+06:00');

  it('is empty once time, area and a position are mapped', () => {
    expect(mappingProblems(ready)).toEqual([]);
  });

  it('names each missing required field', () => {
    const draft = draftFromHeaders(['lat', 'when'], 'UTC');
    expect(mappingProblems(draft)).toEqual([
      'Choose the column with the scan time (scan_time).',
      'Choose the column with the cell area (area).',
      'Choose the columns with the latitude and longitude (lat and lon).',
    ]);
  });

  it('asks for the coordinate system of projected positions', () => {
    const draft = { ...draftFromHeaders(['scan_time', 'x', 'y', 'area'], 'UTC'), crs: ' ' };
    expect(mappingProblems(draft)).toEqual([
      'Enter the coordinate system of x and y (an EPSG code or proj4 text).',
    ]);
  });

  it('refuses a time zone that is not UTC or ±hh:mm', () => {
    expect(mappingProblems({ ...ready, timeZone: 'GMT+6' })).toEqual([
      'Write the time zone as UTC or an offset such as +06:00.',
    ]);
  });
});

describe('toMapping', () => {
  it('sends the columns of the chosen position kind only', () => {
    const draft = {
      ...draftFromHeaders(['scan_time', 'lat', 'lon', 'x', 'y', 'area'], '+06:00'),
      position: 'xy' as const,
      crs: 'EPSG:32645',
    };
    expect(toMapping(draft)).toEqual({
      columns: { scan_time: 'scan_time', x: 'x', y: 'y', area: 'area' },
      areaUnit: 'km2',
      timeZone: '+06:00',
      position: 'xy',
      crs: 'EPSG:32645',
    });
  });
});

describe('parseCsvPreview', () => {
  it('reads quoted fields with commas and stops after the preview rows (RFC 4180 quoting)', () => {
    const text =
      'scan_time,name,area\n2026-07-14T09:42Z,"Cell, north",12.5\n2026-07-14T09:48Z,b,13\n2026-07-14T09:54Z,c,14\n';
    const preview = parseCsvPreview(text, 2);
    expect(preview.headers).toEqual(['scan_time', 'name', 'area']);
    expect(preview.rows).toEqual([
      { scan_time: '2026-07-14T09:42Z', name: 'Cell, north', area: '12.5' },
      { scan_time: '2026-07-14T09:48Z', name: 'b', area: '13' },
    ]);
    expect(preview.problems).toEqual([]);
  });

  it('reports a row with too few fields', () => {
    const preview = parseCsvPreview('a,b\n1\n');
    expect(preview.problems).toHaveLength(1);
    expect(preview.problems[0]).toMatch(/^Row 1: /);
  });
});

describe('perFileProgress', () => {
  it.each([
    [[100, 100], 0, [0, 0]],
    [[100, 100], 0.5, [1, 0]],
    [[100, 300], 0.5, [1, 1 / 3]],
    [[100, 100], 1, [1, 1]],
    // Progress events can overshoot slightly; the shares stay within 0–1.
    [[50], 1.2, [1]],
  ])('sizes %j at %d → %j', (sizes, fraction, shares) => {
    expect(perFileProgress(sizes, fraction)).toEqual(shares);
  });
});

describe('the intake request', () => {
  const tif = (name: string) => new File(['II*'], name, { type: 'image/tiff' });
  const draft: IntakeDraft = {
    siteId: 1,
    kind: 'volume',
    files: [tif('VSR_20260714_0942.tif'), tif('VSR_20260714_0948.tif')],
    onError: 'fail',
    timePattern: 'VSR_YYYYMMDD_hhmm.tif',
    mapping: null,
  };

  it('repeats files[] per file and carries the fields', () => {
    const form = buildIntakeForm(draft);
    expect(form.getAll('files[]').map((f) => (f as File).name)).toEqual([
      'VSR_20260714_0942.tif',
      'VSR_20260714_0948.tif',
    ]);
    expect(form.get('siteId')).toBe('1');
    expect(form.get('kind')).toBe('volume');
    expect(form.get('onError')).toBe('fail');
    expect(form.get('timePattern')).toBe('VSR_YYYYMMDD_hhmm.tif');
    expect(form.get('mapping')).toBeNull();
  });

  it('says why it cannot upload yet', () => {
    expect(
      uploadBlockers({ ...draft, siteId: null, files: [tif('scan.csv')], timePattern: 'scan' }, []),
    ).toEqual([
      'Choose the radar site the files come from.',
      'scan.csv does not end in .tif or .tiff.',
      'The file-name time pattern needs at least one of YYYY, MM, DD, hh, mm, ss.',
    ]);
    expect(uploadBlockers(draft, [])).toEqual([]);
  });
});
