import type {
  AtlasDiurnalResponse,
  AtlasMapResponse,
  AtlasMotionResponse,
  AtlasScope,
  DiurnalCurve,
} from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { aBlock, aDistrict, aSessionUser, outlinesOf } from '../../test/builders';
import type { FakeRequest } from '../../test/fakeApi';
import { aSite } from '../../test/intakeBuilders';
import { renderApp } from '../../test/renderApp';
import { standaloneSvg, toCsv } from './exportFigure';

// Invented onsets of the demo province; no real observation.

const scientist = aSessionUser({ id: 3, role: 'scientist', name: 'Oren Vale' });
const blocks = [aBlock({ id: 1, code: 'HLF-01', name: 'Tarn Rise' })];

function aScope(overrides: Partial<AtlasScope> = {}): AtlasScope {
  return {
    siteId: 1,
    source: 'cell-table',
    onsetsBySource: [{ source: 'cell-table', onsets: 2 }],
    from: null,
    to: null,
    regime: null,
    districtId: null,
    cellType: null,
    days: 10,
    onsets: 2,
    utcOffsetMinutes: 360,
    regimes: [{ regime: 'moist / onshore', days: 4 }],
    ...overrides,
  };
}

const square = [
  [
    [
      [87.9, 13.9],
      [88.1, 13.9],
      [88.1, 14.1],
      [87.9, 14.1],
      [87.9, 13.9],
    ],
  ],
];

function aMap(scope: AtlasScope): AtlasMapResponse {
  return {
    scope,
    binHours: 3,
    bin: null,
    hours: [0, 24],
    bandwidthKm: 15,
    points: [
      {
        trackId: 11,
        time: '2025-07-01T08:12:00Z',
        localHour: 14.2,
        lat: 13.95,
        lon: 88,
        blockId: 1,
        cellType: 'deep',
      },
      {
        trackId: 12,
        time: '2025-07-02T07:00:00Z',
        localHour: 13,
        lat: 14.05,
        lon: 88.05,
        blockId: 1,
        cellType: null,
      },
    ],
    density: {
      unit: 'onsets per 1000 km² per day',
      gridKm: 4,
      max: 0.31,
      integral: 1.998,
      bands: [{ threshold: 0.1, geometry: { type: 'MultiPolygon', coordinates: square } }],
    },
  };
}

const curve = (group: DiurnalCurve['group'], peak: number): DiurnalCurve => {
  const values = new Array<number | null>(24).fill(0);
  values[peak] = 5;
  return { group, values, peakHour: peak, n: 5 };
};

function aDiurnal(scope: AtlasScope): AtlasDiurnalResponse {
  return {
    scope,
    onsets: [curve('all', 14), curve('shallow', 12), curve('congestus', 14), curve('deep', 15)],
    properties: [{ property: 'areaKm2', unit: 'km²', curves: [curve('all', 15)] }],
    cells: 40,
  };
}

function aMotion(scope: AtlasScope): AtlasMotionResponse {
  const names = [
    'N',
    'NNE',
    'NE',
    'ENE',
    'E',
    'ESE',
    'SE',
    'SSE',
    'S',
    'SSW',
    'SW',
    'WSW',
    'W',
    'WNW',
    'NW',
    'NNW',
  ];
  return {
    scope,
    sectors: names.map((name, k) => ({
      centreDeg: k * 22.5,
      name,
      counts: [0, k === 14 ? 2 : 0, 0, 0, 0],
      total: k === 14 ? 2 : 0,
    })),
    speedClassesMs: [0, 2, 4, 6, 8],
    withMotion: 2,
    modeSector: 'NW',
    anomalyWind: { u: -2, v: 2, speedMs: 2.83, fromDeg: 135, towardDeg: 315, days: 10 },
  };
}

const scopeOf = (req: FakeRequest) =>
  aScope({ cellType: (req.query.get('cellType') as AtlasScope['cellType']) ?? null });

function renderAtlas(path = '/atlas') {
  return renderApp(path, {
    as: scientist,
    api: {
      'GET /api/radar-sites': { body: [aSite()] },
      'GET /api/radar-sites/1/coverage': {
        body: { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: square[0] } },
      },
      'GET /api/blocks/geojson': { body: outlinesOf(blocks) },
      'GET /api/districts': { body: [aDistrict({ id: 3, code: 'HLF', name: 'Hillfoot' })] },
      'GET /api/regimes': {
        body: {
          siteId: 1,
          settings: {},
          moistureBoundsGKg: null,
          days: [],
          counts: [{ regime: 'moist / onshore', days: 4 }],
        },
      },
      'GET /api/atlas/map': (req) => ({ body: aMap(scopeOf(req)) }),
      'GET /api/atlas/diurnal': (req) => ({ body: aDiurnal(scopeOf(req)) }),
      'GET /api/atlas/motion': (req) => ({ body: aMotion(scopeOf(req)) }),
    },
  });
}

afterEach(() => vi.restoreAllMocks());

describe('Atlas', () => {
  it('draws the onset map with its density legend in onsets per 1000 km² per day', async () => {
    const { server } = renderAtlas();
    expect(
      await screen.findByRole(
        'img',
        { name: 'Onsets and their density, the whole day' },
        { timeout: 10_000 },
      ),
    ).toBeTruthy();
    const legend = screen.getByRole('list', { name: 'Onset density (onsets per 1000 km² per day)' });
    expect(within(legend).getByText('≥ 0.1')).toBeTruthy();
    expect(screen.getByText(/2 onsets on 10 days from the cell table/)).toBeTruthy();
    const call = server.calls.find((c) => c.path === '/api/atlas/map');
    expect(call?.query.get('siteId')).toBe('1');
    expect(call?.query.get('bandwidthKm')).toBe('15');
  });

  it('switches to the daily cycle, marks each peak, and follows a change of cell type', async () => {
    const { server } = renderAtlas();
    await screen.findByRole('img', { name: 'Onsets and their density, the whole day' }, { timeout: 10_000 });
    await userEvent.click(screen.getByRole('tab', { name: 'Daily cycle' }));
    expect(await screen.findByRole('img', { name: 'Onsets by local hour' })).toBeTruthy();
    const curves = screen.getByRole('list', { name: 'Curves' });
    expect(within(curves).getByText(/all cells \(n = 5, peak 14–15 h\)/)).toBeTruthy();
    expect(within(curves).getByText(/deep \(n = 5, peak 15–16 h\)/)).toBeTruthy();

    await userEvent.selectOptions(screen.getByLabelText('Cell type'), 'deep');
    await waitFor(() =>
      expect(
        server.calls.some((c) => c.path === '/api/atlas/diurnal' && c.query.get('cellType') === 'deep'),
      ).toBe(true),
    );
    expect(await screen.findByText(/deep cells\./)).toBeTruthy();
  });

  it('shows the motion rose with the anomaly wind drawn toward where it blows', async () => {
    renderAtlas('/atlas?view=motion');
    expect(
      await screen.findByRole('img', { name: 'Rose of storm motion' }, { timeout: 10_000 }),
    ).toBeTruthy();
    expect(screen.getByText(/most moved toward NW/)).toBeTruthy();
    expect(
      screen.getByText(/from 135° \(meteorological convention\), so the arrow points toward 315°/),
    ).toBeTruthy();
  });

  it('exports the map’s data as CSV and its figure as a standalone SVG', async () => {
    const made: Blob[] = [];
    vi.spyOn(URL, 'createObjectURL').mockImplementation((blob) => {
      made.push(blob as Blob);
      return 'blob:atlas-test';
    });
    vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => {});
    renderAtlas();
    await screen.findByRole('img', { name: 'Onsets and their density, the whole day' }, { timeout: 10_000 });
    const bar = screen.getByRole('group', { name: 'Export the onset map' });
    await userEvent.click(within(bar).getByRole('button', { name: 'CSV' }));
    const csv = await made[0].text();
    expect(csv.split('\n')[0]).toBe('track_id,time_utc,local_hour,lat,lon,block_id,cell_type');
    expect(csv.split('\n')[1]).toBe('11,2025-07-01T08:12:00Z,14.2,13.95,88,1,deep');
    await userEvent.click(within(bar).getByRole('button', { name: 'SVG' }));
    const svg = await made[1].text();
    expect(made[1].type).toBe('image/svg+xml');
    expect(svg).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(svg).toContain('<circle');
  });
});

describe('export helpers', () => {
  it('writes CSV with papaparse, quoting where needed', () => {
    expect(toCsv([{ regime: 'moist / onshore', note: 'a, b', n: 3 }])).toBe(
      'regime,note,n\nmoist / onshore,"a, b",3',
    );
  });

  it('makes an SVG that stands alone: namespace, size and a white background', () => {
    const host = document.createElement('div');
    host.innerHTML = '<svg viewBox="0 0 40 20"><line x1="0" y1="0" x2="40" y2="20" stroke="red"/></svg>';
    document.body.append(host);
    const text = standaloneSvg(host.querySelector('svg') as SVGSVGElement);
    expect(text).toContain('width="40"');
    expect(text).toContain('height="20"');
    expect(text).toContain('fill="#ffffff"');
    expect(text).toContain('<line');
    host.remove();
  });
});
