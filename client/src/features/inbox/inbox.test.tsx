import type { FieldReportView, InboxItem } from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aSessionUser } from '../../test/builders';
import { anInboxBulletin } from '../../test/bulletinBuilders';
import type { FakeRoutes } from '../../test/fakeApi';
import { renderApp } from '../../test/renderApp';
import { checkReportForm, emptyReportForm } from './reportForm';

// An invented officer of the demo province.
const officer = aSessionUser({
  id: 11,
  role: 'officer',
  email: 'officer.riverbend@vessary.example',
  districtId: 1,
});

function itemOf(overrides: Partial<InboxItem> = {}): InboxItem {
  const { content, blocks, ...item } = anInboxBulletin(overrides);
  return item;
}

function aReport(overrides: Partial<FieldReportView> = {}): FieldReportView {
  return {
    id: 1,
    bulletinId: 5,
    blockCode: 'RVB-01',
    blockName: 'Sallow Ford',
    officerEmail: officer.email,
    stormSeen: true,
    startTime: '2025-07-01T15:30',
    startTimeUtc: '2025-07-01T09:30:00.000Z',
    hail: true,
    windDamage: false,
    cropDamage: false,
    actionTaken: 'Spraying moved to the morning.',
    usefulness: 4,
    notes: '',
    at: '2025-07-02T05:00:00.000Z',
    ...overrides,
  };
}

function routes(extra: FakeRoutes = {}): FakeRoutes {
  return {
    'GET /api/inbox': {
      body: [
        itemOf(),
        itemOf({
          id: 4,
          number: 'RVB-2025-26',
          unread: false,
          readAt: '2025-06-22T04:00:00.000Z',
          sentAt: '2025-06-21T03:00:00.000Z',
        }),
      ],
    },
    'GET /api/inbox/5': { body: anInboxBulletin({ readAt: '2025-06-28T05:00:00.000Z', unread: false }) },
    'GET /api/inbox/5/reports': { body: [] },
    ...extra,
  };
}

describe('Inbox', () => {
  it('lists the district’s bulletins newest first with the unread one marked', async () => {
    renderApp('/inbox', { as: officer, api: routes() });
    const table = await screen.findByRole('table', { name: 'Inbox' }, { timeout: 5000 });
    await waitFor(() => expect(within(table).getAllByRole('row')).toHaveLength(3));
    const [first, second] = within(table).getAllByRole('row').slice(1);
    expect(first.textContent).toContain('RVB-2025-27');
    expect(within(first).getByText('Unread')).toBeTruthy();
    expect(within(second).getByText('Read')).toBeTruthy();
    expect(screen.getByText(/1 unread bulletin\./)).toBeTruthy();
  });

  it('acknowledges the bulletin and shows when', async () => {
    const { server } = renderApp('/inbox/5', {
      as: officer,
      api: routes({
        'POST /api/inbox/5/acknowledge': {
          body: anInboxBulletin({ unread: false, acknowledgedAt: '2025-06-28T05:10:00.000Z' }),
        },
      }),
    });
    await screen.findByRole(
      'heading',
      { name: 'Riverbend: crop-weather bulletin RVB-2025-27' },
      { timeout: 5000 },
    );
    await userEvent.click(screen.getByRole('button', { name: 'Acknowledge' }));
    expect(await screen.findByText(/^Acknowledged /)).toBeTruthy();
    expect(server.calls.filter((c) => c.path === '/api/inbox/5/acknowledge')).toHaveLength(1);
  });

  it('refuses an incomplete field report beside each field, then files it', async () => {
    const filed = aReport();
    const { server } = renderApp('/inbox/5', {
      as: officer,
      api: routes({ 'POST /api/inbox/5/reports': { status: 201, body: filed } }),
    });
    const form = await screen.findByRole('form', { name: 'Field report' }, { timeout: 5000 });
    await userEvent.click(within(form).getByRole('button', { name: 'File report' }));
    expect(await within(form).findByText('The report was not filed.')).toBeTruthy();
    expect(within(form).getAllByText('Choose the block').length).toBeGreaterThan(0);
    expect(within(form).getByText('Say whether a storm was seen')).toBeTruthy();
    expect(server.calls.some((c) => c.path === '/api/inbox/5/reports' && c.method === 'POST')).toBe(false);

    await userEvent.selectOptions(within(form).getByLabelText('Block'), 'RVB-01');
    await userEvent.click(within(form).getByLabelText('Yes'));
    await userEvent.click(within(form).getByLabelText('Hail'));
    await userEvent.click(within(form).getByLabelText('4'));
    await userEvent.click(within(form).getByRole('button', { name: 'File report' }));
    expect(await within(form).findByText('Give the local time the storm started')).toBeTruthy();

    await userEvent.type(within(form).getByLabelText('Start time (local)'), '2025-07-01T15:30');
    await userEvent.type(within(form).getByLabelText('Action taken'), 'Spraying moved to the morning.');
    await userEvent.click(within(form).getByRole('button', { name: 'File report' }));
    expect(await screen.findByText('Report for Sallow Ford filed.')).toBeTruthy();
    expect(server.calls.find((c) => c.path === '/api/inbox/5/reports' && c.method === 'POST')?.body).toEqual({
      blockCode: 'RVB-01',
      stormSeen: true,
      startTime: '2025-07-01T15:30',
      hail: true,
      windDamage: false,
      cropDamage: false,
      actionTaken: 'Spraying moved to the morning.',
      usefulness: 4,
      notes: '',
    });
  }, 30_000);

  it('shows a withdrawn bulletin with its reason and the reports already filed', async () => {
    renderApp('/inbox/5', {
      as: officer,
      api: routes({
        'GET /api/inbox/5': {
          body: anInboxBulletin({
            state: 'withdrawn',
            withdrawnAt: '2025-06-29T03:00:00.000Z',
            withdrawalReason: 'The chances were drawn from the wrong week.',
          }),
        },
        'GET /api/inbox/5/reports': { body: [aReport()] },
      }),
    });
    expect(
      await screen.findByText('The chances were drawn from the wrong week.', {}, { timeout: 5000 }),
    ).toBeTruthy();
    const reports = await screen.findByRole('table', { name: 'Field reports filed' });
    const row = await within(reports).findByRole('row', { name: /Sallow Ford/ });
    expect(row.textContent).toContain('hail');
    expect(row.textContent).toContain('4 of 5');
  });
});

describe('checkReportForm', () => {
  // The rules are the shared FieldReportRequest schema's, which the server applies too.
  it('says hail without a storm is a contradiction', () => {
    const checked = checkReportForm({
      ...emptyReportForm('RVB-01'),
      stormSeen: 'no',
      hail: true,
      usefulness: '3',
    });
    expect(checked).toEqual({
      ok: false,
      errors: { hail: 'Hail or wind damage means a storm was seen: tick "storm seen"' },
    });
  });

  it('keeps the minutes of a start time given with seconds', () => {
    const checked = checkReportForm({
      ...emptyReportForm('RVB-01'),
      stormSeen: 'yes',
      startTime: '2025-07-01T15:30:00',
      usefulness: '5',
    });
    expect(checked.ok && checked.body.startTime).toBe('2025-07-01T15:30');
  });
});
