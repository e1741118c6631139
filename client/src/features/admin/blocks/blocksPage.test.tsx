import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aBlock, aDistrict, aSessionUser, outlinesOf } from '../../../test/builders';
import type { FakeRoutes } from '../../../test/fakeApi';
import { renderApp } from '../../../test/renderApp';

const riverbend = aDistrict({ id: 1, code: 'RVB', name: 'Riverbend', blockCount: 2, areaKm2: 310.25 });
const lakeshore = aDistrict({ id: 2, code: 'LKS', name: 'Lakeshore', blockCount: 1, areaKm2: 95 });
const blocks = [
  aBlock({ id: 1, code: 'RVB-02', name: 'Marrow Bend', areaKm2: 210.25 }),
  aBlock({ id: 2, code: 'RVB-01', name: 'Sallow Ford', areaKm2: 100 }),
  aBlock({
    id: 3,
    code: 'LKS-01',
    name: 'Reedmere',
    districtId: 2,
    districtCode: 'LKS',
    districtName: 'Lakeshore',
    areaKm2: 95.04,
  }),
];

function renderBlocks(extra: FakeRoutes = {}) {
  return renderApp('/admin/blocks', {
    as: aSessionUser(),
    api: {
      'GET /api/districts': { body: [riverbend, lakeshore] },
      'GET /api/blocks': { body: blocks },
      'GET /api/blocks/geojson': { body: outlinesOf(blocks) },
      ...extra,
    },
  });
}

function blockCodes(): string[] {
  const table = screen.getByRole('table', { name: 'Blocks' });
  return within(table)
    .getAllByRole('row')
    .slice(1)
    .map((row) => within(row).getAllByRole('cell')[0].textContent ?? '');
}

/** Waits until the table shows exactly these block codes, in this order. */
async function expectCodes(codes: string[]) {
  await waitFor(() => expect(blockCodes()).toEqual(codes));
}

describe('Admin › Districts & blocks', () => {
  it('lists districts with their area to one decimal', async () => {
    renderBlocks();
    const table = await screen.findByRole('table', { name: 'Districts' });
    const row = (await within(table).findByText('Riverbend')).closest('tr') as HTMLElement;
    // ECMA-402 Intl.NumberFormat rounds half away from zero by default (roundingMode halfExpand): 310.25 → 310.3.
    expect(within(row).getByText('310.3')).toBeTruthy();
  });

  it('sorts the blocks table by a column, both ways', async () => {
    renderBlocks();
    await expectCodes(['RVB-02', 'RVB-01', 'LKS-01']);
    const table = screen.getByRole('table', { name: 'Blocks' });
    const codeHeader = within(table).getByRole('button', { name: /Code/ });
    await userEvent.click(codeHeader);
    await expectCodes(['LKS-01', 'RVB-01', 'RVB-02']);
    await userEvent.click(codeHeader);
    await expectCodes(['RVB-02', 'RVB-01', 'LKS-01']);
    // Area sorts as a number: 95.04 < 100 < 210.25, although "100" < "95.04" as text.
    await userEvent.click(within(table).getByRole('button', { name: /Area/ }));
    await expectCodes(['LKS-01', 'RVB-01', 'RVB-02']);
  });

  it('filters the blocks by text and by district', async () => {
    renderBlocks();
    await expectCodes(['RVB-02', 'RVB-01', 'LKS-01']);
    await userEvent.type(screen.getByRole('searchbox', { name: 'Search blocks' }), 'sallow');
    await expectCodes(['RVB-01']);
    await userEvent.clear(screen.getByRole('searchbox', { name: 'Search blocks' }));
    await userEvent.selectOptions(screen.getByLabelText('Filter by district'), 'Lakeshore');
    await expectCodes(['LKS-01']);
  });

  it('shows each refused feature when an import is rejected', async () => {
    const { server } = renderBlocks({
      'POST /api/blocks/import': {
        status: 400,
        body: {
          statusCode: 400,
          message: 'The file has 2 invalid features; nothing was imported',
          details: [
            { where: 'features[3]', problem: 'block_code is missing' },
            { where: 'features[7]', problem: 'The polygon crosses itself' },
          ],
        },
      },
    });
    const file = new File(['{"type":"FeatureCollection","features":[]}'], 'blocks.geojson', {
      type: 'application/geo+json',
    });
    await userEvent.upload(await screen.findByLabelText('Import blocks'), file);

    expect(await screen.findByText('The file has 2 invalid features; nothing was imported')).toBeTruthy();
    const problems = screen.getByRole('table', { name: 'Problems in the file' });
    const rows = within(problems)
      .getAllByRole('row')
      .slice(1)
      .map((row) => row.textContent);
    expect(rows).toEqual(['features[3]block_code is missing', 'features[7]The polygon crosses itself']);
    const upload = server.calls.find((c) => c.path === '/api/blocks/import');
    const form = upload?.body as FormData | undefined;
    expect(form).toBeInstanceOf(FormData);
    expect(form?.get('file')).toBeInstanceOf(File);
    expect(upload?.headers.authorization).toBe('Bearer token-for-1');
  });

  it('reports what an import did and reloads the lists', async () => {
    const { server } = renderBlocks({
      'POST /api/blocks/import': { body: { districtsCreated: 1, blocksCreated: 5, blocksUpdated: 2 } },
    });
    await expectCodes(['RVB-02', 'RVB-01', 'LKS-01']);
    const loadsBefore = server.calls.filter((c) => c.path === '/api/blocks').length;
    const file = new File(['{}'], 'vessary-blocks.json', { type: 'application/json' });
    await userEvent.upload(screen.getByLabelText('Import blocks'), file);
    expect(await screen.findByText('Imported: 5 blocks created, 2 updated, 1 district created')).toBeTruthy();
    expect(server.calls.filter((c) => c.path === '/api/blocks').length).toBeGreaterThan(loadsBefore);
  });

  it('refuses a file that is not GeoJSON without uploading it', async () => {
    const { server } = renderBlocks();
    const file = new File(['a,b'], 'blocks.csv', { type: 'text/csv' });
    // As if dropped: a drop ignores the file picker's accept filter.
    await userEvent.setup({ applyAccept: false }).upload(await screen.findByLabelText('Import blocks'), file);
    expect(await screen.findByText('blocks.csv is not a .geojson or .json file.')).toBeTruthy();
    expect(server.calls.some((c) => c.path === '/api/blocks/import')).toBe(false);
  });

  it('draws every block on the map and names the one in focus', async () => {
    renderBlocks();
    const map = await screen.findByRole('img', { name: 'Map of blocks' });
    const outlines = map.querySelectorAll('path');
    expect(outlines).toHaveLength(3);
    expect(outlines[0].querySelector('title')?.textContent).toContain('Marrow Bend (RVB-02)');
    (outlines[2] as SVGPathElement).focus();
    const readout = screen.getByRole('complementary', { name: 'Selected block' });
    expect(await within(readout).findByText('Reedmere')).toBeTruthy();
    expect(within(readout).getByText('LKS-01')).toBeTruthy();
  });

  it('edits a block and sends only what changed', async () => {
    const { server } = renderBlocks({
      'PATCH /api/blocks/2': (req) => ({ body: { ...blocks[1], ...(req.body as object) } }),
    });
    await expectCodes(['RVB-02', 'RVB-01', 'LKS-01']);
    await userEvent.click(screen.getByRole('button', { name: 'Edit Sallow Ford' }));
    const dialog = await screen.findByRole('dialog');
    await userEvent.selectOptions(within(dialog).getByLabelText('District'), 'Lakeshore (LKS)');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Save' }));
    await waitFor(() =>
      expect(server.calls.find((c) => c.method === 'PATCH')?.body).toEqual({ districtId: 2 }),
    );
  });
  it('renames a district and reloads the districts and blocks', async () => {
    const { server } = renderBlocks({
      'PATCH /api/districts/1': (req) => ({ body: { ...riverbend, ...(req.body as object) } }),
    });
    await userEvent.click(await screen.findByRole('button', { name: 'Rename Riverbend' }));
    const dialog = await screen.findByRole('dialog');
    const name = within(dialog).getByLabelText('Name');
    await userEvent.clear(name);
    await userEvent.click(within(dialog).getByRole('button', { name: 'Save' }));
    expect(await within(dialog).findByText('Enter the district’s name')).toBeTruthy();
    expect(server.calls.some((c) => c.method === 'PATCH')).toBe(false);

    const reads = (path: string) => server.calls.filter((c) => c.method === 'GET' && c.path === path).length;
    const before = { districts: reads('/api/districts'), blocks: reads('/api/blocks') };
    await userEvent.type(name, 'Riverbend North');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Save' }));
    await waitFor(() =>
      expect(server.calls.find((c) => c.method === 'PATCH')?.body).toEqual({ name: 'Riverbend North' }),
    );
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    await waitFor(() => expect(reads('/api/districts')).toBeGreaterThan(before.districts));
    expect(reads('/api/blocks')).toBeGreaterThan(before.blocks);
  });
});
