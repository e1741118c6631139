import type { JobView } from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aSessionUser } from '../../../test/builders';
import type { FakeReply, FakeRoutes } from '../../../test/fakeApi';
import { aJob, aSite } from '../../../test/intakeBuilders';
import { renderApp } from '../../../test/renderApp';

const scientist = aSessionUser({
  id: 3,
  role: 'scientist',
  name: 'Oren Vale',
  email: 'oren.vale@vessary.example',
});

function renderUploads(extra: FakeRoutes = {}) {
  return renderApp('/intake', {
    as: scientist,
    api: {
      'GET /api/radar-sites': { body: [aSite()] },
      'GET /api/jobs': { body: [] },
      ...extra,
    },
  });
}

const CSV = [
  'Timestamp,Latitude,Longitude,cell_size_sq,VIL',
  '2026-07-14T09:42:00Z,14.05,88.05,12.5,18',
  '2026-07-14T09:48:00Z,14.07,88.02,20,21',
].join('\n');

function deferred<T>() {
  let resolve: (value: T) => void = () => {};
  const promise = new Promise<T>((r) => {
    resolve = r;
  });
  return { promise, resolve };
}

describe('Intake › Uploads & jobs', () => {
  it('maps a cell table’s columns, pre-selecting matches, and blocks the upload until area is mapped', async () => {
    const { server } = renderUploads({
      'POST /api/intake': { status: 202, body: aJob({ kind: 'cell-table' }) },
    });
    await userEvent.selectOptions(await screen.findByLabelText('Kind of files'), 'Cell table (CSV)');
    await userEvent.upload(
      screen.getByLabelText('Choose files'),
      new File([CSV], 'cells-july.csv', { type: 'text/csv' }),
    );

    // Obvious synonyms are picked: Timestamp → scan_time, Latitude → lat, VIL → vil_max_kg_m2.
    const scanTime = (await screen.findByLabelText('Scan time (scan_time), required')) as HTMLSelectElement;
    expect(scanTime.value).toBe('Timestamp');
    expect(
      (screen.getByLabelText('Latitude of the centroid (°) (lat), required') as HTMLSelectElement).value,
    ).toBe('Latitude');
    expect((screen.getByLabelText('Maximum VIL (kg m⁻²) (vil_max_kg_m2)') as HTMLSelectElement).value).toBe(
      'VIL',
    );
    const preview = screen.getByRole('table', { name: 'Preview of the cell table' });
    expect(within(preview).getAllByRole('row')).toHaveLength(3);

    // "cell_size_sq" is nobody's spelling of area: the user must pick it.
    const uploadButton = screen.getByRole('button', { name: 'Upload' }) as HTMLButtonElement;
    expect(uploadButton.disabled).toBe(true);
    const blockers = screen.getByRole('list', { name: 'Before uploading' });
    expect(within(blockers).getByText('Choose the column with the cell area (area).')).toBeTruthy();

    await userEvent.selectOptions(
      screen.getByLabelText('Cell area, in the unit set below (area), required'),
      'cell_size_sq',
    );
    await userEvent.click(screen.getByRole('radio', { name: 'm²' }));
    expect(screen.queryByRole('list', { name: 'Before uploading' })).toBeNull();
    await userEvent.click(uploadButton);

    await waitFor(() => expect(server.calls.some((c) => c.path === '/api/intake')).toBe(true));
    const form = server.calls.find((c) => c.path === '/api/intake')?.body as FormData;
    expect(form.get('kind')).toBe('cell-table');
    expect(form.get('siteId')).toBe('1');
    expect(JSON.parse(String(form.get('mapping')))).toEqual({
      columns: {
        scan_time: 'Timestamp',
        lat: 'Latitude',
        lon: 'Longitude',
        area: 'cell_size_sq',
        vil_max_kg_m2: 'VIL',
      },
      areaUnit: 'm2',
      timeZone: 'UTC',
      position: 'latlon',
    });
  });

  it('shows each file’s upload progress, then follows the job until it is done', async () => {
    const accepted = deferred<FakeReply>();
    let polls = 0;
    const jobReplies: JobView[] = [
      aJob({ state: 'running', progress: 0.4, stage: 'Finding cells in scan 2 of 3' }),
      aJob({ state: 'done', progress: 1, stage: null }),
    ];
    const { server } = renderUploads({
      'POST /api/intake': () => accepted.promise,
      'GET /api/jobs/11': () => ({ body: jobReplies[Math.min(polls++, jobReplies.length - 1)] }),
    });
    const bytes = 'x'.repeat(100);
    const files = [
      new File([bytes], 'VSR_20260714_0942.tif', { type: 'image/tiff' }),
      new File([bytes], 'VSR_20260714_0948.tif', { type: 'image/tiff' }),
    ];
    await userEvent.upload(await screen.findByLabelText('Choose files'), files);
    await userEvent.type(screen.getByLabelText('File-name time pattern (optional)'), 'VSR_YYYYMMDD_hhmm.tif');
    await userEvent.click(screen.getByRole('radio', { name: 'Stop the job; store nothing' }));
    await userEvent.click(screen.getByRole('button', { name: 'Upload' }));

    // The fake request reports half of all bytes sent: the first of two equal files is through.
    const first = await screen.findByRole('progressbar', { name: 'VSR_20260714_0942.tif' });
    const second = screen.getByRole('progressbar', { name: 'VSR_20260714_0948.tif' });
    expect(first.getAttribute('aria-valuenow')).toBe('100');
    expect(second.getAttribute('aria-valuenow')).toBe('0');

    accepted.resolve({ status: 202, body: aJob({ state: 'queued' }) });
    const job = await screen.findByRole('progressbar', { name: /Job 11: Finding cells in scan 2 of 3/ });
    expect(job.getAttribute('aria-valuenow')).toBe('40');
    // Polled again after a second; the finished job points to its report.
    expect(
      await screen.findByRole('link', { name: 'Open the quality report of job 11' }, { timeout: 3000 }),
    ).toBeTruthy();

    const form = server.calls.find((c) => c.path === '/api/intake')?.body as FormData;
    expect(form.getAll('files[]')).toHaveLength(2);
    expect(form.get('onError')).toBe('fail');
    expect(form.get('timePattern')).toBe('VSR_YYYYMMDD_hhmm.tif');
  });

  it('lists the jobs, newest first, and sorts them', async () => {
    renderUploads({
      'GET /api/jobs': {
        body: [
          aJob({ id: 12, state: 'failed', files: [], startedAt: '2026-07-15T03:00:00Z' }),
          aJob({ id: 11, state: 'done', startedAt: '2026-07-14T03:00:00Z' }),
        ],
      },
    });
    const table = await screen.findByRole('table', { name: 'Jobs' });
    const jobIds = () =>
      within(table)
        .getAllByRole('row')
        .slice(1)
        .map((r) => within(r).getAllByRole('cell')[0].textContent);
    await waitFor(() => expect(jobIds()).toEqual(['Job 12', 'Job 11']));
    expect(within(table).getByText('Failed')).toBeTruthy();
    expect(within(table).getAllByText('VSR')).toHaveLength(2);
    await userEvent.click(within(table).getByRole('button', { name: /Started/ }));
    await waitFor(() => expect(jobIds()).toEqual(['Job 11', 'Job 12']));
  });
  it('asks an anomaly grid’s variable and units, both optional, and sends them', async () => {
    const { server } = renderUploads({
      'POST /api/intake': { status: 202, body: aJob({ kind: 'anomaly-grid' }) },
    });
    await userEvent.selectOptions(
      await screen.findByLabelText('Kind of files'),
      'Anomaly grids (GeoTIFF one band per day, or long-form CSV)',
    );
    const variable = screen.getByLabelText('Variable') as HTMLSelectElement;
    const units = screen.getByLabelText('Units in the file') as HTMLSelectElement;
    expect(variable.value).toBe('');
    expect(
      within(units)
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(["From the file's metadata", 'g/kg', 'kg/kg', 'm/s', 'knots']);
    await userEvent.selectOptions(units, 'kg/kg');
    // Winds are not in kg/kg: the choice goes back to the file's own.
    await userEvent.selectOptions(variable, 'Eastward wind anomaly');
    expect(units.value).toBe('');
    expect(
      within(units)
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(["From the file's metadata", 'm/s', 'knots']);
    await userEvent.selectOptions(units, 'knots');
    await userEvent.upload(
      screen.getByLabelText('Choose files'),
      new File(['II*'], 'u850_2026.tif', { type: 'image/tiff' }),
    );
    await userEvent.click(screen.getByRole('button', { name: 'Upload' }));
    await waitFor(() => expect(server.calls.some((c) => c.path === '/api/intake')).toBe(true));
    const form = server.calls.find((c) => c.path === '/api/intake')?.body as FormData;
    expect(form.get('kind')).toBe('anomaly-grid');
    expect(form.get('variable')).toBe('u');
    expect(form.get('units')).toBe('kt');
    expect(form.get('timePattern')).toBeNull();
    // Unless chosen otherwise, an analysis of anomalies.
    expect(form.get('product')).toBe('analysis');
    expect(form.get('fieldKind')).toBe('anomaly');
  });

  it('lets an anomaly upload be a forecast, or totals, with a date pattern for undated bands', async () => {
    const { server } = renderUploads({
      'POST /api/intake': { status: 202, body: aJob({ kind: 'anomaly-grid' }) },
    });
    await userEvent.selectOptions(
      await screen.findByLabelText('Kind of files'),
      'Anomaly grids (GeoTIFF one band per day, or long-form CSV)',
    );
    await userEvent.selectOptions(
      screen.getByLabelText('Product'),
      'Forecast of coming days (for the expected regime)',
    );
    await userEvent.selectOptions(
      screen.getByLabelText('The values are'),
      'Totals (the stored climatology is subtracted)',
    );
    await userEvent.type(screen.getByLabelText('File-name date pattern (optional)'), 'q850_YYYYMMDD.tif');
    await userEvent.upload(
      screen.getByLabelText('Choose files'),
      new File(['II*'], 'q850_20261001.tif', { type: 'image/tiff' }),
    );
    await userEvent.click(screen.getByRole('button', { name: 'Upload' }));
    await waitFor(() => expect(server.calls.some((c) => c.path === '/api/intake')).toBe(true));
    const form = server.calls.find((c) => c.path === '/api/intake')?.body as FormData;
    expect(form.get('product')).toBe('forecast');
    expect(form.get('fieldKind')).toBe('total');
    expect(form.get('timePattern')).toBe('q850_YYYYMMDD.tif');
  }, 15_000);
});
