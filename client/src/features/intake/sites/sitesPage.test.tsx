import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aBlock, aSessionUser, outlinesOf } from '../../../test/builders';
import type { FakeRoutes } from '../../../test/fakeApi';
import { aSite } from '../../../test/intakeBuilders';
import { renderApp } from '../../../test/renderApp';

const scientist = aSessionUser({ id: 3, role: 'scientist', name: 'Oren Vale' });
const site = aSite({ id: 1, settingsVersion: 3, blockedSectors: [{ fromDeg: 200, toDeg: 215 }] });
const blocks = [aBlock()];

/** A square ring 0.5° around the radar, as the server would send a coverage (anticlockwise, RFC 7946). */
const coverage = {
  type: 'Feature',
  properties: {},
  geometry: {
    type: 'Polygon',
    coordinates: [
      [
        [87.6, 13.7],
        [88.6, 13.7],
        [88.6, 14.7],
        [87.6, 14.7],
        [87.6, 13.7],
      ],
    ],
  },
};

function renderSites(path: string, extra: FakeRoutes = {}) {
  return renderApp(path, {
    as: scientist,
    api: {
      'GET /api/radar-sites': { body: [site] },
      'GET /api/radar-sites/1': { body: site },
      'GET /api/radar-sites/1/coverage': { body: coverage },
      'GET /api/blocks/geojson': { body: outlinesOf(blocks) },
      ...extra,
    },
  });
}

async function fillNewSite() {
  await userEvent.type(await screen.findByLabelText('Code'), 'VSR2');
  await userEvent.type(screen.getByLabelText('Name'), 'Vessary Hills');
  await userEvent.type(screen.getByLabelText('Latitude (° N)'), '13.8');
  await userEvent.type(screen.getByLabelText('Longitude (° E)'), '88.3');
  await userEvent.type(screen.getByLabelText('Antenna height (m above sea level)'), '720');
  await userEvent.type(screen.getByLabelText('Range (km)'), '150');
  await userEvent.type(screen.getByLabelText('Scan interval (min)'), '6');
  await userEvent.type(screen.getByLabelText('Local time offset (min)'), '360');
}

describe('Intake › Radar sites', () => {
  it('lists the sites and draws the coverage over the blocks with the radar marked', async () => {
    renderSites('/intake/sites');
    const table = await screen.findByRole('table', { name: 'Radar sites' });
    const row = (await within(table).findByText('Vessary Valley')).closest('tr') as HTMLElement;
    expect(within(row).getByText('14.20° N, 88.10° E')).toBeTruthy();
    expect(within(row).getByText('v3')).toBeTruthy();
    const map = await screen.findByRole('img', { name: 'Coverage of VSR over the blocks' });
    expect(map.querySelector('.map-overlay__coverage')?.getAttribute('d')).toMatch(/^M/);
    expect(map.querySelector('.map-overlay__marker title')?.textContent).toBe(
      'Radar VSR at 14.20° N, 88.10° E',
    );
  });

  it('shows the settings sections with units and defaults', async () => {
    renderSites('/intake/sites/new');
    expect(await screen.findByRole('group', { name: 'Finding cells' })).toBeTruthy();
    expect(screen.getByRole('group', { name: 'Tracking' })).toBeTruthy();
    expect(screen.getByRole('group', { name: 'Onsets and coverage' })).toBeTruthy();
    const threshold = screen.getByLabelText('Reflectivity threshold (dBZ)') as HTMLInputElement;
    expect(threshold.value).toBe('35');
    expect(screen.getByText('Grid points at or above this belong to a cell. Default: 35 dBZ.')).toBeTruthy();
  });

  it('refuses a bad code before asking the server', async () => {
    const { server } = renderSites('/intake/sites/new');
    await fillNewSite();
    await userEvent.clear(screen.getByLabelText('Code'));
    await userEvent.type(screen.getByLabelText('Code'), 'vsr two');
    await userEvent.click(screen.getByRole('button', { name: 'Create site' }));
    expect(await screen.findByText('Use 1–24 capital letters, digits, - or _')).toBeTruthy();
    expect(server.calls.some((c) => c.method === 'POST' && c.path === '/api/radar-sites')).toBe(false);
  });

  it('puts the server’s field errors from a 400 on their fields', async () => {
    const { server } = renderSites('/intake/sites/new', {
      'POST /api/radar-sites': {
        status: 400,
        body: {
          statusCode: 400,
          message: 'The site was not valid',
          details: [
            { where: 'code', problem: 'A site with code VSR2 already exists' },
            { where: 'settings.thresholdDbz', problem: 'Must be above the echo-top threshold' },
            { where: 'settings.coverageMask', problem: 'Unknown setting' },
          ],
        },
      },
    });
    await fillNewSite();
    await userEvent.click(screen.getByRole('button', { name: 'Create site' }));

    expect(await screen.findByText('A site with code VSR2 already exists')).toBeTruthy();
    expect(screen.getByLabelText('Code').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByText('Must be above the echo-top threshold')).toBeTruthy();
    expect(screen.getByLabelText('Reflectivity threshold (dBZ)').getAttribute('aria-invalid')).toBe('true');
    // A problem with no field of its own is still shown, under its path.
    const others = screen.getByRole('list', { name: 'Other problems' });
    expect(within(others).getByText('settings.coverageMask')).toBeTruthy();
    expect(screen.getByText('The site was not valid')).toBeTruthy();

    const sent = server.calls.find((c) => c.method === 'POST' && c.path === '/api/radar-sites')?.body;
    expect(sent).toMatchObject({ code: 'VSR2', lat: 13.8, altitudeM: 720, utcOffsetMinutes: 360 });
  });

  it('edits a site: says a new settings version follows and sends only what changed', async () => {
    const { server, router } = renderSites('/intake/sites/1', {
      'PATCH /api/radar-sites/1': (req) => ({
        body: { ...site, settingsVersion: 4, ...(req.body as object) },
      }),
    });
    expect(
      await screen.findByText(
        'Changing settings creates version 4; cells already found keep the version that made them.',
      ),
    ).toBeTruthy();
    // Position and code are fixed once a site exists.
    expect((screen.getByLabelText('Latitude (° N)') as HTMLInputElement).readOnly).toBe(true);
    const edge = screen.getByLabelText('Edge band (km)');
    await userEvent.clear(edge);
    await userEvent.type(edge, '15');
    await userEvent.click(screen.getByRole('button', { name: 'Remove sector 1' }));
    await userEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() =>
      expect(server.calls.find((c) => c.method === 'PATCH')?.body).toEqual({
        blockedSectors: [],
        settings: { edgeBandKm: 15 },
      }),
    );
    await waitFor(() => expect(router.state.location.pathname).toBe('/intake/sites'));
  });
});
