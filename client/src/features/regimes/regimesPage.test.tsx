import {
  type AnomalySource,
  type RegimeComposite,
  type RegimeDay,
  RegimeSettings,
  type RegimesResponse,
} from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aBlock, aSessionUser, outlinesOf } from '../../test/builders';
import type { FakeRequest, FakeRoutes } from '../../test/fakeApi';
import { aSite } from '../../test/intakeBuilders';
import { renderApp } from '../../test/renderApp';
import { calendarLayout, compassWord, compositeScale, formatWind } from './regimeFormat';

// Invented anomalies of the demo province's season; no real analysis.

const scientist = aSessionUser({ id: 3, role: 'scientist', name: 'Oren Vale' });
const blocks = [aBlock({ id: 1, code: 'RVB-01', name: 'Sallow Ford' })];
const settings = RegimeSettings.parse({});

function aDay(overrides: Partial<RegimeDay> = {}): RegimeDay {
  return {
    date: '2026-07-14',
    q: 0.8,
    u: -2,
    v: 2,
    speedMs: 2.83,
    directionFromDeg: 135,
    moisture: 'moist',
    flow: 'onshore',
    regime: 'moist / onshore',
    coverage: 1,
    ...overrides,
  };
}

const days: RegimeDay[] = [
  aDay({ date: '2026-07-13' }),
  aDay({
    date: '2026-07-14',
    q: -0.9,
    u: 3,
    v: 0,
    speedMs: 3,
    directionFromDeg: 270,
    moisture: 'dry',
    flow: 'along-shore',
    regime: 'dry / along-shore',
  }),
  aDay({
    date: '2026-07-15',
    q: 0.1,
    u: 0.2,
    v: 0.1,
    speedMs: 0.22,
    directionFromDeg: 243,
    moisture: 'near-normal',
    flow: 'weak',
    regime: 'near-normal / weak',
  }),
  aDay({
    date: '2026-07-16',
    q: null,
    u: null,
    v: null,
    speedMs: null,
    directionFromDeg: null,
    moisture: null,
    flow: null,
    regime: null,
    coverage: 0,
  }),
];

function aResponse(overrides: Partial<RegimesResponse> = {}): RegimesResponse {
  return {
    siteId: 1,
    settings,
    moistureBoundsGKg: [-0.3, 0.3],
    days,
    counts: [
      { regime: 'moist / onshore', days: 1 },
      { regime: 'dry / along-shore', days: 1 },
      { regime: 'near-normal / weak', days: 1 },
    ],
    ...overrides,
  };
}

function aComposite(regime: string): RegimeComposite {
  return {
    regime,
    days: 1,
    lons: [88, 88.25],
    lats: [14.25, 14],
    q: [
      [0.5, null],
      [-0.2, 0.9],
    ],
    u: [
      [1, 0],
      [-1, 2],
    ],
    v: [
      [0, 1],
      [1, null],
    ],
  };
}

const sources: AnomalySource[] = [
  {
    product: 'analysis',
    variable: 'q',
    sourceFile: 'totals-q850.tif',
    derivation: 'total-minus-climatology',
    climatologyFile: 'clim-q850.tif',
    days: 4,
    first: '2026-07-13',
    last: '2026-07-16',
  },
  {
    product: 'forecast',
    variable: 'u',
    sourceFile: 'forecast-u850.tif',
    derivation: 'anomaly',
    climatologyFile: null,
    days: 7,
    first: '2026-10-01',
    last: '2026-10-07',
  },
];

function renderRegimes(regimes: RegimesResponse = aResponse(), extra: FakeRoutes = {}) {
  return renderApp('/regimes', {
    as: scientist,
    api: {
      'GET /api/radar-sites': { body: [aSite(), aSite({ id: 2, code: 'KTR', name: 'Kettering Ridge' })] },
      'GET /api/regimes': { body: regimes },
      'GET /api/regimes/composite': (req) => ({ body: aComposite(req.query.get('regime') ?? '') }),
      'GET /api/radar-sites/1/coverage': {
        body: {
          type: 'Feature',
          properties: {},
          geometry: {
            type: 'Polygon',
            coordinates: [
              [
                [87.9, 13.9],
                [88.3, 13.9],
                [88.3, 14.3],
                [87.9, 14.3],
                [87.9, 13.9],
              ],
            ],
          },
        },
      },
      'GET /api/blocks/geojson': { body: outlinesOf(blocks) },
      'GET /api/regimes/sources': { body: sources },
      ...extra,
    },
  });
}

const compositeCalls = (calls: FakeRequest[]) => calls.filter((c) => c.path === '/api/regimes/composite');

describe('Regimes', () => {
  it('lists the stored fields: analysis or forecast, and totals − climatology with its file', async () => {
    renderRegimes();
    const table = await screen.findByRole('table', { name: 'Stored anomaly fields' });
    expect(within(table).getByText('totals − climatology (clim-q850.tif)')).toBeTruthy();
    expect(within(table).getByText('forecast')).toBeTruthy();
    expect(within(table).getByText('7 (2026-10-01 – 2026-10-07)')).toBeTruthy();
  });

  it('shows a square per day in the calendar, named by date and regime, and explains one on focus', async () => {
    const { server } = renderRegimes();
    const calendar = await screen.findByRole('group', { name: 'Season calendar' });
    const squares = within(calendar).getAllByRole('button');
    expect(squares).toHaveLength(4);
    expect(within(calendar).getByRole('button', { name: 'Mon 13 Jul 2026: moist / onshore' })).toBeTruthy();
    expect(within(calendar).getByRole('button', { name: 'Thu 16 Jul 2026: no data' })).toBeTruthy();
    expect(server.calls.find((c) => c.path === '/api/regimes')?.query.get('siteId')).toBe('1');

    // One Tab stop; the arrow keys move on a day.
    squares[0].focus();
    await userEvent.keyboard('{ArrowDown}');
    expect(document.activeElement).toBe(squares[1]);
    const readout = screen.getByRole('complementary', { name: 'Day in focus' });
    expect(within(readout).getByText('dry / along-shore')).toBeTruthy();
    expect(within(readout).getByText('-0.90 g/kg')).toBeTruthy();
    expect(within(readout).getByText('3.0 m/s from 270° (west)')).toBeTruthy();

    expect(screen.getByRole('img', { name: 'Days by moisture and flow' })).toBeTruthy();
    expect(screen.getByText(/dry below -0.30 g\/kg/)).toBeTruthy();
  });

  it('counts the days of each regime in a sortable table', async () => {
    renderRegimes();
    const table = await screen.findByRole('table', { name: 'Days per regime' });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(4);
    expect(within(table).getByText('moist / onshore')).toBeTruthy();
    expect(within(table).getByText('near-normal / weak')).toBeTruthy();
    expect(within(rows[1]).getByText('33.3')).toBeTruthy();
    await userEvent.click(within(table).getByRole('button', { name: /Regime/ }));
    expect(within(within(table).getAllByRole('row')[1]).getByText('dry / along-shore')).toBeTruthy();
  });

  it('says where anomaly grids come from when there are none yet', async () => {
    renderRegimes(aResponse({ days: [], counts: [], moistureBoundsGKg: null }));
    expect(
      await screen.findByText(
        'No anomaly grids for this site yet: upload them under Intake (kind: anomaly grid).',
      ),
    ).toBeTruthy();
    expect(screen.queryByRole('group', { name: 'Season calendar' })).toBeNull();
  });

  it('asks for the composite of the regime picked', async () => {
    const { server } = renderRegimes();
    expect(await screen.findByRole('img', { name: 'Composite of dry / along-shore' })).toBeTruthy();
    expect(compositeCalls(server.calls)[0].query.get('regime')).toBe('dry / along-shore');
    expect(screen.getByRole('list', { name: 'q′ colours (g/kg)' })).toBeTruthy();

    await userEvent.selectOptions(screen.getByLabelText('Regime for the composite'), 'moist / onshore');
    expect(await screen.findByRole('img', { name: 'Composite of moist / onshore' })).toBeTruthy();
    const last = compositeCalls(server.calls).at(-1);
    expect(last?.query.get('regime')).toBe('moist / onshore');
    expect(last?.query.get('siteId')).toBe('1');
  });

  it('reads another site and period when asked', async () => {
    const { server } = renderRegimes();
    await screen.findByRole('group', { name: 'Season calendar' });
    await userEvent.selectOptions(screen.getByLabelText('Radar site'), 'KTR — Kettering Ridge');
    await waitFor(() =>
      expect(
        server.calls
          .filter((c) => c.path === '/api/regimes')
          .at(-1)
          ?.query.get('siteId'),
      ).toBe('2'),
    );
  });

  it('saves the regime settings after the schema accepts them, and reclassifies the days', async () => {
    let version = 3;
    const { server } = renderRegimes(aResponse(), {
      'GET /api/regimes/settings': () => ({ body: { version, settings } }),
      'PUT /api/regimes/settings': (req) => {
        version += 1;
        return { body: { version, settings: req.body } };
      },
    });
    await screen.findByRole('group', { name: 'Season calendar' });
    const readsBefore = server.calls.filter((c) => c.path === '/api/regimes').length;
    await userEvent.click(screen.getByRole('button', { name: 'Edit regime settings' }));
    const dialog = await screen.findByRole('dialog', { name: 'Regime settings' });
    expect(server.calls.find((c) => c.path === '/api/regimes/settings')?.query.get('siteId')).toBe('1');
    await within(dialog).findByLabelText('Sector 1 name');

    await userEvent.click(within(dialog).getByLabelText('Fixed bounds'));
    const dry = within(dialog).getByLabelText('Dry bound (g/kg)');
    const moist = within(dialog).getByLabelText('Moist bound (g/kg)');
    await userEvent.clear(dry);
    await userEvent.type(dry, '0.6');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Save settings' }));
    expect(await within(dialog).findByText('The dry bound must be below the moist bound')).toBeTruthy();
    expect(moist.getAttribute('aria-invalid')).toBe('true');
    expect(server.calls.some((c) => c.method === 'PUT')).toBe(false);

    await userEvent.clear(dry);
    await userEvent.type(dry, '-0.4');
    await userEvent.clear(within(dialog).getByLabelText('Weak wind below (m/s)'));
    await userEvent.type(within(dialog).getByLabelText('Weak wind below (m/s)'), '1.5');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Remove sector 4' }));
    await userEvent.click(within(dialog).getByRole('button', { name: 'Add a sector' }));
    await userEvent.type(within(dialog).getByLabelText('Sector 4 name'), 'northerly');
    await userEvent.type(within(dialog).getByLabelText('Sector 4 from (°)'), '10');
    await userEvent.type(within(dialog).getByLabelText('Sector 4 to (°)'), '100');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByText('Saved as version 4; the days are classified again.')).toBeTruthy();
    const put = server.calls.find((c) => c.method === 'PUT');
    expect(put?.query.get('siteId')).toBe('1');
    expect(put?.body).toEqual({
      moistureMethod: 'fixed',
      fixedBoundsGKg: [-0.4, 0.5],
      weakBelowMs: 1.5,
      sectors: [
        { name: 'onshore', fromDeg: 100, toDeg: 190 },
        { name: 'along-shore', fromDeg: 190, toDeg: 280 },
        { name: 'offshore', fromDeg: 280, toDeg: 10 },
        { name: 'northerly', fromDeg: 10, toDeg: 100 },
      ],
    });
    await waitFor(() => expect(screen.queryByRole('dialog', { name: 'Regime settings' })).toBeNull());
    await waitFor(() =>
      expect(server.calls.filter((c) => c.path === '/api/regimes').length).toBeGreaterThan(readsBefore),
    );
  });
});

describe('regime helpers', () => {
  it('lays days out Monday to Sunday in week columns', () => {
    const layout = calendarLayout([aDay({ date: '2026-07-05' }), aDay({ date: '2026-07-07' })]);
    // 5 July 2026 is a Sunday; the 6th is missing and shown as no data.
    expect(layout.cells.map((c) => [c.week, c.weekday, c.day.regime])).toEqual([
      [0, 6, 'moist / onshore'],
      [1, 0, null],
      [1, 1, 'moist / onshore'],
    ]);
    expect(layout.weeks).toBe(2);
  });

  it('names directions and winds in words', () => {
    expect(compassWord(225)).toBe('south-west');
    expect(compassWord(359)).toBe('north');
    expect(formatWind(2.83, 135)).toBe('2.8 m/s from 135° (south-east)');
    expect(formatWind(null, null)).toBe('no data');
  });

  it('centres the composite colours on zero', () => {
    const { classes, limit } = compositeScale([[-0.34, 0.8]]);
    expect(limit).toBe(0.8);
    expect(classes[0].from).toBeCloseTo(-0.8);
    expect(classes[classes.length - 1].to).toBeCloseTo(0.8);
  });
});
