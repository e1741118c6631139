import { ALL_DAYS, type OutlookBlock, type OutlookFigure, type OutlookResponse } from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { aBlock, aSessionUser, outlinesOf } from '../../test/builders';
import type { FakeRequest, FakeRoutes } from '../../test/fakeApi';
import { aSite } from '../../test/intakeBuilders';
import { renderApp } from '../../test/renderApp';
import { CHANCE_STEPS, chanceColour, describeFigure, NO_DATA_FILL } from './outlookFormat';

// Invented figures for the demo province; no real observation.

const writer = aSessionUser({ id: 4, role: 'writer', name: 'Ilse Marrow' });
const blocks = [
  aBlock({ id: 1, code: 'HLF-01', name: 'Rookenvale', districtCode: 'HLF', districtName: 'Hillfoot' }),
  aBlock({ id: 2, code: 'RVB-01', name: 'Lorrendal', districtCode: 'RVB', districtName: 'Riverbend' }),
  aBlock({ id: 3, code: 'RVB-02', name: 'Umberlyn', districtCode: 'RVB', districtName: 'Riverbend' }),
];

function fig(x: number, n: number): OutlookFigure {
  return {
    n,
    x,
    rate: x / n,
    lower: Math.max(0, x / n - 0.1),
    upper: Math.min(1, x / n + 0.1),
    shrunk: x / n,
    per100Km2: 0.01,
  };
}
const none: OutlookFigure = {
  n: null,
  x: null,
  rate: null,
  lower: null,
  upper: null,
  shrunk: null,
  per100Km2: null,
};

function aBlockOutlook(id: number, afternoon: OutlookFigure, hasData = true): OutlookBlock {
  const b = blocks[id - 1];
  return {
    blockId: id,
    code: b.code,
    name: b.name,
    districtId: b.districtId,
    districtCode: b.districtCode,
    districtName: b.districtName,
    areaKm2: 300,
    coverage: hasData ? 1 : 0.3,
    hasData,
    bins: Array.from({ length: 8 }, (_, k) =>
      hasData ? fig(k === 4 ? (afternoon.x ?? 0) : 1, afternoon.n ?? 1) : none,
    ),
    afternoon: hasData ? afternoon : none,
    climatologyRate: hasData ? 0.3 : null,
    ratioToClimatology: hasData ? 1.2 : null,
    week: { windows: hasData ? 100 : 0, hits: 60, rate: hasData ? 0.6 : null, lower: 0.5, upper: 0.7 },
    peakBin: hasData ? 4 : null,
  };
}

function anOutlook(regime = ALL_DAYS): OutlookResponse {
  return {
    siteId: 1,
    siteCode: 'VSR',
    utcOffsetMinutes: 360,
    source: 'cell-table',
    sources: [{ source: 'cell-table', onsets: 3500 }],
    measure: 'onsets',
    regime,
    from: '2025-06-01',
    to: '2025-09-30',
    binHours: 3,
    bins: Array.from({ length: 8 }, (_, index) => ({
      index,
      fromHour: index * 3,
      toHour: index * 3 + 3,
      label: `${String(index * 3).padStart(2, '0')}–${String(index * 3 + 3).padStart(2, '0')}`,
    })),
    afternoon: { fromHour: 12, toHour: 18 },
    radiusKm: 0,
    interval: 'jeffreys',
    level: 0.9,
    minAvailability: 0.8,
    minBlockCoverage: 0.5,
    daysInPeriod: 122,
    regimeDays: regime === ALL_DAYS ? 122 : 20,
    regimes: [
      { regime: 'moist / onshore', days: 20 },
      { regime: 'dry / offshore', days: 15 },
    ],
    priors: { bins: [], afternoon: { mean: 0.3, strength: 20, alpha: 6, beta: 14 }, method: 'moments' },
    blocks: [aBlockOutlook(1, fig(60, 118)), aBlockOutlook(2, fig(2, 7)), aBlockOutlook(3, none, false)],
  };
}

function renderOutlook(extra: FakeRoutes = {}) {
  return renderApp('/outlook', {
    as: writer,
    api: {
      'GET /api/radar-sites': { body: [aSite()] },
      'GET /api/outlook': (req) => ({ body: anOutlook(req.query.get('regime') ?? ALL_DAYS) }),
      'GET /api/blocks/geojson': { body: outlinesOf(blocks) },
      ...extra,
    },
  });
}

/** The first render loads the page's code lazily, which takes a while on a busy machine. */
const mainTable = () =>
  screen.findByRole(
    'table',
    { name: 'Chance of a storm starting, by block and local time' },
    { timeout: 15_000 },
  );

const outlookCalls = (calls: FakeRequest[]) => calls.filter((c) => c.path === '/api/outlook');

afterEach(() => vi.unstubAllGlobals());

describe('Outlook', { timeout: 30_000 }, () => {
  it('shows every figure with its n, marks small n, and says "no data" rather than zero', async () => {
    renderOutlook();
    const table = await mainTable();
    const hill = within(table).getByRole('row', { name: /Rookenvale/ });
    // 60 of 118 days in the 12–15 bin and in the afternoon window.
    expect(within(hill).getAllByText('51 %')).toHaveLength(2);
    expect(within(hill).getAllByText('n 118').length).toBe(9);
    const small = within(table).getByRole('row', { name: /Lorrendal/ });
    expect(within(small).getAllByTitle('Fewer than 10 days').length).toBeGreaterThan(0);
    const noData = within(table).getByRole('row', { name: /Umberlyn/ });
    expect(within(noData).getAllByText('no data')).toHaveLength(9);
    expect(within(noData).queryByText('0 %')).toBeNull();
    expect(screen.getByRole('list', { name: 'How to read the table' })).toBeTruthy();
    expect(screen.getByText(/statistical guidance from past radar data, not a warning/)).toBeTruthy();
  });

  it('sorts by the afternoon chance and filters by district', async () => {
    renderOutlook();
    const table = await mainTable();
    await userEvent.click(within(table).getByRole('button', { name: /Afternoon 12–18/ }));
    const first = () => within(within(table).getAllByRole('row')[1]).getAllByRole('cell')[0].textContent;
    // Ascending: no data (sorted as −1) first, then 2/7, then 60/118.
    expect(first()).toMatch(/Umberlyn/);
    await userEvent.click(within(table).getByRole('button', { name: /Afternoon 12–18/ }));
    expect(first()).toMatch(/Rookenvale/);

    await userEvent.selectOptions(screen.getByLabelText('District'), 'RVB');
    expect(within(table).queryByRole('row', { name: /Rookenvale/ })).toBeNull();
    expect(within(table).getByRole('row', { name: /Lorrendal/ })).toBeTruthy();
  });

  it('draws the afternoon map with a legend and a diurnal plot of the chosen block', async () => {
    renderOutlook();
    await mainTable();
    expect(
      await screen.findByRole('img', { name: 'Map of the afternoon chance (12–18 local) per block' }),
    ).toBeTruthy();
    expect(screen.getByRole('list', { name: 'Afternoon chance (12–18 local)' })).toBeTruthy();
    expect(screen.getByRole('img', { name: 'Diurnal cycle of Rookenvale' })).toBeTruthy();
    await userEvent.selectOptions(screen.getByLabelText('Block'), '2');
    expect(screen.getByRole('img', { name: 'Diurnal cycle of Lorrendal' })).toBeTruthy();
    // A block on the map is picked by a click, or by Enter when reached with the keyboard.
    const map = screen.getByRole('img', { name: 'Map of the afternoon chance (12–18 local) per block' });
    await userEvent.click(within(map).getByLabelText('Rookenvale (HLF-01), Hillfoot'));
    expect(screen.getByRole('img', { name: 'Diurnal cycle of Rookenvale' })).toBeTruthy();
    within(map).getByLabelText('Umberlyn (RVB-02), Riverbend').focus();
    await userEvent.keyboard('{Enter}');
    expect(screen.getByRole('img', { name: 'Diurnal cycle of Umberlyn' })).toBeTruthy();
    // The afternoon and week figures per block, with their intervals and n.
    const figures = screen.getByRole('table', { name: 'Afternoon and week, per block' });
    expect(within(within(figures).getByRole('row', { name: /Rookenvale/ })).getByText('60 %')).toBeTruthy();
  });

  it('asks for the regime picked, and for the expected regime of a coming week', async () => {
    const { server } = renderOutlook({
      'GET /api/regimes/expected': { status: 404, body: { statusCode: 404, message: 'No forecast grids' } },
    });
    await mainTable();
    expect(outlookCalls(server.calls)[0].query.get('regime')).toBe('all');
    await userEvent.selectOptions(screen.getByLabelText('Regime'), 'moist / onshore');
    await waitFor(() =>
      expect(outlookCalls(server.calls).at(-1)?.query.get('regime')).toBe('moist / onshore'),
    );

    await userEvent.selectOptions(screen.getByLabelText('Regime'), 'expected');
    const week = screen.getByLabelText('Week starting (local)');
    await userEvent.type(week, '2025-08-04');
    expect(
      await screen.findByText('No forecast grids uploaded for this week — pick the regime by hand.'),
    ).toBeTruthy();
    const expectedCall = server.calls.find((c) => c.path === '/api/regimes/expected');
    expect(expectedCall?.query.get('to')).toBe('2025-08-10');
    await userEvent.selectOptions(screen.getByLabelText('Regime picked by hand'), 'dry / offshore');
    await waitFor(() =>
      expect(outlookCalls(server.calls).at(-1)?.query.get('regime')).toBe('dry / offshore'),
    );
  });

  it('exports the table as CSV through the API', async () => {
    vi.stubGlobal(
      'URL',
      Object.assign(URL, { createObjectURL: vi.fn(() => 'blob:x'), revokeObjectURL: vi.fn() }),
    );
    const { server } = renderOutlook({ 'GET /api/outlook.csv': { body: 'site,block_code\nVSR,HLF-01' } });
    await mainTable();
    await userEvent.click(screen.getByRole('button', { name: 'Export CSV' }));
    expect(await screen.findByText('CSV downloaded.')).toBeTruthy();
    expect(server.calls.find((c) => c.path === '/api/outlook.csv')?.query.get('siteId')).toBe('1');
  });
});

describe('outlook colours and words', () => {
  it('colours chances on Carbon’s blue steps up to the top of the scale, and no data grey', () => {
    expect(chanceColour(0, 0.5)).toBe(CHANCE_STEPS[0]);
    expect(chanceColour(0.5, 0.5)).toBe(CHANCE_STEPS[8]);
    expect(chanceColour(0.26, 0.5)).toBe(CHANCE_STEPS[4]);
    expect(chanceColour(null, 0.5)).toBe(NO_DATA_FILL);
  });

  it('describes a figure with its interval and its days', () => {
    expect(describeFigure(fig(3, 10))).toBe('30 % (90 % interval 20 %–40 %, 3 of 10 days)');
    expect(describeFigure(none)).toBe('no data');
  });
});
