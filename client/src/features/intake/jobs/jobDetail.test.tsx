import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { aSessionUser } from '../../../test/builders';
import { aJob, aReport, aSite } from '../../../test/intakeBuilders';
import { renderApp } from '../../../test/renderApp';

const scientist = aSessionUser({ id: 3, role: 'scientist', name: 'Oren Vale' });

const finished = aJob({
  id: 21,
  kind: 'volume',
  state: 'done',
  progress: 1,
  startedAt: '2026-07-14T03:00:00Z',
  finishedAt: '2026-07-14T03:02:00Z',
  files: [
    {
      uploadId: 1,
      fileName: 'VSR_20260714_0942.tif',
      sizeBytes: 2_400_000,
      duplicate: false,
      state: 'imported',
    },
    {
      uploadId: 2,
      fileName: 'VSR_20260714_0948.tif',
      sizeBytes: 2_400_000,
      duplicate: true,
      state: 'duplicate',
    },
    { uploadId: 3, fileName: 'VSR_20260714_0954.tif', sizeBytes: 1_000, duplicate: false, state: 'skipped' },
  ],
  problems: [
    { file: 'VSR_20260714_0954.tif', where: 'band 4', problem: 'No height in the band metadata' },
    { file: 'VSR_20260714_0954.tif', where: null, problem: 'Skipped; the job went on' },
  ],
  report: aReport({
    filesRead: 2,
    filesSkipped: 1,
    duplicates: 1,
    scans: 2,
    cellsFound: 1234,
    cellsRejectedTooSmall: 56,
    cellsOutsideCoverage: 7,
    tracks: 40,
    storms: 31,
    onsets: 25,
    flaggedStarts: { split: 3, 'data-start': 1, 'after-gap': 2, 'edge-band': 0 },
    gaps: [{ from: '2026-07-14T04:00:00Z', to: '2026-07-14T04:30:00Z', minutes: 30 }],
    cellsPerScan: [
      { time: '2026-07-14T03:42:00Z', cells: 10 },
      { time: '2026-07-14T03:48:00Z', cells: 14 },
    ],
    availabilityByDay: [
      { date: '2026-07-13', share: 0.95 },
      { date: '2026-07-14', share: 0.5 },
    ],
  }),
});

function bodyRows(name: string): string[][] {
  const table = screen.getByRole('table', { name });
  return within(table)
    .getAllByRole('row')
    .slice(1)
    .map((row) =>
      within(row)
        .getAllByRole('cell')
        .map((c) => c.textContent ?? ''),
    );
}

describe('Intake › job detail', () => {
  it('shows the files, the problems and the report’s figures and plots', async () => {
    renderApp('/intake/jobs/21', {
      as: scientist,
      api: { 'GET /api/jobs/21': { body: finished }, 'GET /api/radar-sites': { body: [aSite()] } },
    });
    expect(await screen.findByRole('heading', { name: 'Job 21: Volume scans (GeoTIFF)' })).toBeTruthy();
    expect(screen.getByRole('tab', { name: 'Uploads & jobs', selected: true })).toBeTruthy();

    expect(bodyRows('Files')).toEqual([
      ['VSR_20260714_0942.tif', '2.4 MB', 'Imported'],
      ['VSR_20260714_0948.tif', '2.4 MB', 'Already imported — not counted twice'],
      ['VSR_20260714_0954.tif', '1 kB', 'Skipped'],
    ]);
    expect(bodyRows('Problems')).toEqual([
      ['VSR_20260714_0954.tif', 'band 4', 'No height in the band metadata'],
      ['VSR_20260714_0954.tif', 'whole file', 'Skipped; the job went on'],
    ]);

    const figures = screen.getByLabelText('Figures of the report');
    const figure = (term: string) => within(figures).getByText(term).nextElementSibling?.textContent;
    expect(figure('Cells found')).toBe('1,234');
    expect(figure('Rejected as too small')).toBe('56');
    expect(figure('Onsets')).toBe('25');
    const flagged = screen.getByLabelText('Track starts not counted as onsets');
    expect(within(flagged).getByText('Split from another track').nextElementSibling?.textContent).toBe('3');

    // The gap is shown in the site's local time: 04:00 UTC + 6 h = 10:00.
    expect(bodyRows('Gaps in the data')).toEqual([['14 Jul 2026, 10:00', '14 Jul 2026, 10:30', '30']]);

    const cellsPlot = screen.getByRole('img', { name: 'Cells per scan over time' });
    expect(cellsPlot.querySelectorAll('circle')).toHaveLength(2);
    const availability = screen.getByRole('img', { name: 'Availability by day' });
    expect(availability.querySelectorAll('rect.plot__bar')).toHaveLength(2);
    // Only the 50 % day falls below the 80 % a day needs to count.
    expect(availability.querySelectorAll('rect.plot__bar--below')).toHaveLength(1);
    expect(
      screen.getByText(
        '1 of 2 days have at least 80 % of the expected scans; the lowest is 50 % on 2026-07-14.',
      ),
    ).toBeTruthy();
  });

  it('says why a failed job stored nothing', async () => {
    renderApp('/intake/jobs/22', {
      as: scientist,
      api: {
        'GET /api/jobs/22': {
          body: aJob({ id: 22, state: 'failed', progress: 0.3, error: 'VSR_0948.tif is not a GeoTIFF' }),
        },
        'GET /api/radar-sites': { body: [aSite()] },
      },
    });
    expect(await screen.findByText('The job failed; nothing of it was stored.')).toBeTruthy();
    expect(screen.getByText('VSR_0948.tif is not a GeoTIFF')).toBeTruthy();
    expect(screen.getByText('This job has no report.')).toBeTruthy();
  });
});
