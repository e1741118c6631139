import type { Page, TrackView } from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aBlock, aSessionUser, outlinesOf } from '../../../test/builders';
import type { FakeRequest } from '../../../test/fakeApi';
import { aCell, aSite, aTrack } from '../../../test/intakeBuilders';
import { renderApp } from '../../../test/renderApp';

const scientist = aSessionUser({ id: 3, role: 'scientist', name: 'Oren Vale' });
const blocks = [
  aBlock({ id: 1, code: 'RVB-01', name: 'Sallow Ford' }),
  aBlock({ id: 2, code: 'RVB-02', name: 'Marrow Bend' }),
];

function pageOf(items: TrackView[], total = items.length): Page<TrackView> {
  return { items, total, offset: 0, limit: 50 };
}

function renderTracks(path = '/intake/tracks') {
  return renderApp(path, {
    as: scientist,
    api: {
      'GET /api/radar-sites': { body: [aSite()] },
      'GET /api/blocks': { body: blocks },
      'GET /api/blocks/geojson': { body: outlinesOf(blocks) },
      'GET /api/tracks': {
        body: pageOf(
          [
            aTrack(),
            aTrack({
              id: 102,
              firstTime: '2026-07-14T11:00:00.000Z',
              onset: false,
              notOnsetReason: 'edge-band',
              directionToDeg: 90,
              cellType: 'congestus',
            }),
          ],
          120,
        ),
      },
      'GET /api/tracks/101': {
        body: {
          track: aTrack(),
          cells: [
            aCell({ id: 3, scanTime: '2026-07-14T09:54:00Z', lon: 88.03, lat: 14.08, areaKm2: 60 }),
            aCell({ id: 1, scanTime: '2026-07-14T09:42:00Z', lon: 88.05, lat: 14.05, areaKm2: 40 }),
            aCell({ id: 2, scanTime: '2026-07-14T09:48:00Z', lon: 88.04, lat: 14.06, areaKm2: 85 }),
          ],
        },
      },
    },
  });
}

function lastTracksQuery(calls: FakeRequest[]): URLSearchParams {
  const list = calls.filter((c) => c.path === '/api/tracks');
  return list[list.length - 1].query;
}

describe('Intake › Tracks', () => {
  it('shows tracks in the site’s local time with heading and onset in words', async () => {
    renderTracks();
    const table = await screen.findByRole('table', { name: 'Tracks' });
    expect(within(table).getByRole('columnheader', { name: /Start \(UTC\+06:00\)/ })).toBeTruthy();
    const first = (await within(table).findByRole('link', { name: '14 Jul 2026, 15:42' })).closest(
      'tr',
    ) as HTMLElement;
    expect(within(first).getByText('315° NW')).toBeTruthy();
    expect(within(first).getByText('Yes')).toBeTruthy();
    const rows = within(table).getAllByRole('row');
    expect(within(rows[2]).getByText('At the edge of coverage')).toBeTruthy();
    expect(within(rows[2]).getByText('90° E')).toBeTruthy();
    expect(screen.getByText('120 tracks match')).toBeTruthy();
  });

  it('sends sorting, filters and the page to the server', async () => {
    const { server } = renderTracks();
    const table = await screen.findByRole('table', { name: 'Tracks' });
    await waitFor(() => expect(lastTracksQuery(server.calls).get('siteId')).toBe('1'));
    expect(lastTracksQuery(server.calls).get('sort')).toBe('firstTime');

    await userEvent.click(within(table).getByRole('button', { name: /Duration \(min\)/ }));
    await waitFor(() => expect(lastTracksQuery(server.calls).get('sort')).toBe('durationMin'));
    expect(lastTracksQuery(server.calls).get('order')).toBe('asc');
    await userEvent.click(within(table).getByRole('button', { name: /Duration \(min\)/ }));
    await waitFor(() => expect(lastTracksQuery(server.calls).get('order')).toBe('desc'));

    await userEvent.selectOptions(screen.getByLabelText('Cell type'), 'Deep convection');
    await userEvent.selectOptions(screen.getByLabelText('Start block'), 'RVB-02 — Marrow Bend');
    await userEvent.click(screen.getByLabelText('Onsets only'));
    await userEvent.type(screen.getByLabelText('Shortest duration (min)'), '30');
    await waitFor(() => expect(lastTracksQuery(server.calls).get('minDurationMin')).toBe('30'));
    const query = lastTracksQuery(server.calls);
    expect(query.get('type')).toBe('deep');
    expect(query.get('blockId')).toBe('2');
    expect(query.get('onsetOnly')).toBe('true');
    expect(query.get('sort')).toBe('durationMin');
    expect(query.get('order')).toBe('desc');

    await userEvent.click(screen.getByRole('button', { name: 'Next page' }));
    // Page 2 of 50 rows starts at row 50.
    await waitFor(() => expect(lastTracksQuery(server.calls).get('offset')).toBe('50'));
    expect(lastTracksQuery(server.calls).get('limit')).toBe('50');
  });

  it('turns the local days of the date range into UTC instants', async () => {
    const { server } = renderTracks('/intake/tracks?from=2026-07-14&to=2026-07-15');
    await screen.findByRole('table', { name: 'Tracks' });
    await waitFor(() => expect(lastTracksQuery(server.calls).get('from')).toBe('2026-07-13T18:00:00.000Z'));
    // The last day is included: the range ends at local midnight after 15 July.
    expect(lastTracksQuery(server.calls).get('to')).toBe('2026-07-15T18:00:00.000Z');
  });

  it('opens a track: its path over the blocks, plots over time and its cells', async () => {
    renderTracks();
    await userEvent.click(await screen.findByRole('link', { name: '14 Jul 2026, 15:42' }));
    expect(await screen.findByRole('heading', { name: 'Track 101 at VSR' })).toBeTruthy();
    const map = await screen.findByRole('img', { name: 'Path of track 101 over the blocks' });
    expect(map.querySelector('.map-overlay__track')?.getAttribute('d')).toMatch(/^M/);
    expect(map.querySelectorAll('.map-overlay__step')).toHaveLength(3);
    for (const name of [
      'Area over time',
      'Volume over time',
      'Echo top over time',
      'Maximum VIL over time',
    ]) {
      expect(screen.getByRole('img', { name })).toBeTruthy();
    }
    // Cells arrive out of order; the summary reads them in time order (09:42, 09:48, 09:54 UTC).
    expect(
      screen.getByText('Area started at 40 km², peaked at 85 km² at 15:48 and ended at 60 km².'),
    ).toBeTruthy();
    const cells = screen.getByRole('table', { name: 'Cells of the track' });
    const times = within(cells)
      .getAllByRole('row')
      .slice(1)
      .map((r) => within(r).getAllByRole('cell')[0].textContent);
    expect(times).toEqual(['14 Jul 2026, 15:42', '14 Jul 2026, 15:48', '14 Jul 2026, 15:54']);
  });
});
