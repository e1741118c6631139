import type { BulletinSummaryView, BulletinView } from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aDistrict, aSessionUser } from '../../test/builders';
import { aBulletinView } from '../../test/bulletinBuilders';
import type { FakeRoutes } from '../../test/fakeApi';
import { renderApp } from '../../test/renderApp';

// Invented people and districts of the demo province.
const writer = aSessionUser({ id: 8, role: 'writer', email: 'writer@vessary.example' });
const scientist = aSessionUser({ id: 7, role: 'scientist', email: 'scientist@vessary.example' });
const districts = [
  aDistrict({ id: 1, code: 'RVB', name: 'Riverbend' }),
  aDistrict({ id: 2, code: 'LKS', name: 'Lakeshore' }),
];

function summaryOf(b: BulletinView): BulletinSummaryView {
  const {
    content,
    versions,
    events,
    warnings,
    recipientsCount,
    draftedFrom,
    approvedFrom,
    outlookChangedSinceDraft,
    can,
    ...rest
  } = b;
  return rest;
}

function routes(bulletin: BulletinView, extra: FakeRoutes = {}): FakeRoutes {
  return {
    'GET /api/districts': { body: districts },
    'GET /api/bulletins': { body: [summaryOf(bulletin)] },
    [`GET /api/bulletins/${bulletin.id}`]: { body: bulletin },
    [`GET /api/bulletins/${bulletin.id}/diff`]: {
      body: {
        version: bulletin.currentVersion,
        previousSent: { against: null, lines: [], added: 0, removed: 0 },
        previousVersion: { against: null, lines: [], added: 0, removed: 0 },
      },
    },
    ...extra,
  };
}

describe('Bulletins › list and new draft', () => {
  it('lists bulletins with their state and opens the new-draft form, which says what is missing', async () => {
    const { server, router } = renderApp('/bulletins', {
      as: writer,
      api: routes(aBulletinView(), {
        'POST /api/bulletins': { status: 201, body: aBulletinView({ id: 9, number: 'LKS-2025-27' }) },
        'GET /api/bulletins/9': { body: aBulletinView({ id: 9, number: 'LKS-2025-27' }) },
        'GET /api/bulletins/9/diff': {
          body: {
            version: 1,
            previousSent: { against: null, lines: [], added: 0, removed: 0 },
            previousVersion: { against: null, lines: [], added: 0, removed: 0 },
          },
        },
      }),
    });
    const table = await screen.findByRole('table', { name: 'Bulletins' }, { timeout: 5000 });
    const row = await within(table).findByRole('row', { name: /RVB-2025-27/ });
    expect(within(row).getByText('Draft')).toBeTruthy();
    expect(screen.getByRole('tab', { name: 'Bulletins', selected: true })).toBeTruthy();

    await userEvent.click(screen.getByRole('button', { name: 'New bulletin' }));
    const dialog = await screen.findByRole('dialog');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Draft bulletin' }));
    expect(await within(dialog).findByText('Choose a district')).toBeTruthy();
    expect(server.calls.filter((c) => c.method === 'POST' && c.path === '/api/bulletins')).toEqual([]);

    await userEvent.selectOptions(within(dialog).getByLabelText('District'), '2');
    const week = within(dialog).getByLabelText('Week (any day of it)');
    await userEvent.clear(week);
    await userEvent.type(week, '2025-07-02');
    // A Wednesday: the bulletin covers its ISO week, Monday 30 June to Sunday 6 July (checked with GNU date).
    expect(within(dialog).getByText('ISO week 27 of 2025: Mon 30 Jun – Sun 6 Jul')).toBeTruthy();
    await userEvent.click(within(dialog).getByRole('button', { name: 'Draft bulletin' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/bulletins/9'));
    const post = server.calls.find((c) => c.method === 'POST' && c.path === '/api/bulletins');
    expect(post?.body).toEqual({ districtId: 2, weekStart: '2025-06-30' });
  }, 20_000);
});

describe('Bulletins › one bulletin', () => {
  it('lets the writer edit with a live preview, refuses a crop row without a crop, and saves the version', async () => {
    const bulletin = aBulletinView({
      warnings: [
        {
          kind: 'afternoon-work',
          where: 'crops[0].advice',
          message: 'Spraying in the afternoon while Sallow Ford has a 52 % chance.',
        },
      ],
    });
    const { server } = renderApp('/bulletins/5', {
      as: writer,
      api: routes(bulletin, {
        'PUT /api/bulletins/5': (req) => ({
          body: aBulletinView({
            currentVersion: 2,
            content: { ...bulletin.content, summary: (req.body as { summary: string }).summary },
          }),
        }),
      }),
    });
    const form = await screen.findByRole('form', { name: 'Bulletin text' }, { timeout: 5000 });
    // The server's warning sits beside the advice it concerns, and in the warnings list.
    expect(
      within(form).getByText('Spraying in the afternoon while Sallow Ford has a 52 % chance.'),
    ).toBeTruthy();
    expect(
      within(screen.getByRole('list', { name: 'Warnings' })).getByText('Crop advice, row 1'),
    ).toBeTruthy();

    const summary = within(form).getByLabelText('Summary');
    await userEvent.clear(summary);
    await userEvent.type(summary, 'Storms **likely** in the hills.');
    const preview = screen.getByRole('region', { name: 'Summary: preview' });
    expect(within(preview).getByText('likely').tagName).toBe('STRONG');
    // The officers' view follows too.
    const document = screen.getByRole('article');
    expect(within(document).getByText('likely').tagName).toBe('STRONG');
    // Unsaved edits cannot go to review.
    expect((screen.getByRole('button', { name: 'Submit for review' }) as HTMLButtonElement).disabled).toBe(
      true,
    );

    await userEvent.clear(within(form).getByLabelText('Crop, row 1'));
    await userEvent.click(within(form).getByRole('button', { name: 'Save as version 2' }));
    expect(await within(form).findAllByText(/Name the crop/)).not.toHaveLength(0);
    expect(server.calls.filter((c) => c.method === 'PUT')).toEqual([]);

    await userEvent.type(within(form).getByLabelText('Crop, row 1'), 'rice');
    await userEvent.click(within(form).getByRole('button', { name: 'Save as version 2' }));
    expect(await screen.findByText('Saved as version 2.')).toBeTruthy();
    const put = server.calls.find((c) => c.method === 'PUT');
    expect(put?.body).toEqual({
      baseVersion: 1,
      issueDate: '2025-06-28',
      summary: 'Storms **likely** in the hills.',
      crops: [{ crop: 'rice', stage: 'tillering', advice: 'Spray in the morning.' }],
      generalAdvice: 'Keep livestock away from lone trees.',
    });
  }, 30_000);

  it('gives the reviewer approve and return, needs a comment to return, and shows the server’s refusal', async () => {
    const bulletin = aBulletinView({
      state: 'in_review',
      can: { edit: false, submit: false, approve: true, return: true, send: false, withdraw: false },
    });
    const { server } = renderApp('/bulletins/5', {
      as: scientist,
      api: routes(bulletin, {
        'POST /api/bulletins/5/approve': {
          status: 403,
          body: {
            statusCode: 403,
            message:
              'You wrote bulletin RVB-2025-27, so you cannot approve it: another scientist or administrator must review it.',
            details: [],
          },
        },
      }),
    });
    await screen.findByRole('heading', { name: 'The bulletin' }, { timeout: 5000 });
    expect(screen.queryByRole('form', { name: 'Bulletin text' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Send to officers' })).toBeNull();

    await userEvent.click(screen.getByRole('button', { name: 'Return to writer' }));
    let dialog = await screen.findByRole('dialog');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Return to writer' }));
    expect(await within(dialog).findByText('Say what should change')).toBeTruthy();
    expect(server.calls.some((c) => c.path.endsWith('/return'))).toBe(false);
    await userEvent.click(within(dialog).getByRole('button', { name: 'Cancel' }));

    await userEvent.click(screen.getByRole('button', { name: 'Approve' }));
    dialog = await screen.findByRole('dialog');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Approve' }));
    expect(await within(dialog).findByText(/so you cannot approve it/)).toBeTruthy();
  }, 30_000);

  it('says before sending how many officers will receive it, and refuses a district with none', async () => {
    const approved = aBulletinView({
      state: 'approved',
      approvedVersion: 1,
      can: { edit: false, submit: false, approve: false, return: false, send: true, withdraw: false },
    });
    const first = renderApp('/bulletins/5', { as: writer, api: routes({ ...approved, recipientsCount: 3 }) });
    await userEvent.click(await screen.findByRole('button', { name: 'Send to officers' }, { timeout: 5000 }));
    expect((await screen.findByRole('dialog')).textContent).toContain('3 officers');
    first.unmount();

    const { server } = renderApp('/bulletins/5', {
      as: writer,
      api: routes({ ...approved, recipientsCount: 0 }),
    });
    await userEvent.click(await screen.findByRole('button', { name: 'Send to officers' }, { timeout: 5000 }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText('No extension officer in Riverbend would receive it.')).toBeTruthy();
    await userEvent.click(within(dialog).getByRole('button', { name: 'Send to officers' }));
    expect(server.calls.some((c) => c.path.endsWith('/send'))).toBe(false);
  }, 30_000);

  it('shows a sent bulletin’s delivery per officer and needs a reason to withdraw it', async () => {
    const sent = aBulletinView({
      state: 'sent',
      approvedVersion: 1,
      sentAt: '2025-06-28T03:00:00.000Z',
      can: { edit: false, submit: false, approve: false, return: false, send: false, withdraw: true },
    });
    const recipient = { attempts: 1, nextAttemptAt: null, sentAt: null, messageId: '<m@stormhour.invalid>' };
    const { server } = renderApp('/bulletins/5', {
      as: scientist,
      api: routes(sent, {
        'GET /api/bulletins/5/delivery': {
          body: {
            bulletinId: 5,
            key: 'bulletin:5:v1',
            recipients: [
              {
                ...recipient,
                id: 1,
                recipient: 'officer.riverbend@vessary.example',
                state: 'sent',
                lastError: null,
              },
              {
                ...recipient,
                id: 2,
                recipient: 'officer2.riverbend@vessary.example',
                state: 'failed',
                lastError: '550 no such mailbox',
              },
            ],
            withdrawalKey: null,
            withdrawal: [],
            counts: { queued: 0, sending: 0, sent: 1, failed: 1 },
          },
        },
        'GET /api/bulletins/5/reports': { body: [] },
      }),
    });
    await userEvent.click(await screen.findByRole('tab', { name: 'Delivery' }, { timeout: 5000 }));
    const delivery = await screen.findByRole('table', { name: 'Delivery' });
    const failed = within(delivery).getByRole('row', { name: /officer2\.riverbend/ });
    expect(failed.textContent).toContain('Failed');
    expect(failed.textContent).toContain('550 no such mailbox');
    expect(screen.getByText(/1 sent, 0 on the way, 1 failed\./)).toBeTruthy();

    await userEvent.click(screen.getByRole('button', { name: 'Withdraw' }));
    const dialog = await screen.findByRole('dialog');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Withdraw' }));
    expect(await within(dialog).findByText('Give the reason for withdrawing')).toBeTruthy();
    expect(server.calls.some((c) => c.path.endsWith('/withdraw'))).toBe(false);
  }, 30_000);
});

describe('Bulletins › versions', () => {
  it('compares any two saved versions the user picks, as the server compares them', async () => {
    const bulletin = aBulletinView({
      currentVersion: 3,
      versions: [1, 2, 3].map((version) => ({
        version,
        savedBy: 'writer@vessary.example',
        savedAt: `2025-06-2${version}T08:00:00.000Z`,
      })),
    });
    const { server } = renderApp('/bulletins/5', {
      as: writer,
      api: routes(bulletin, {
        'GET /api/bulletins/5/compare': (req) => ({
          body: {
            against: { bulletinId: 5, number: bulletin.number, version: Number(req.query.get('from')) },
            lines: [
              { op: 'removed', text: 'Storms possible.' },
              { op: 'added', text: 'Storms likely in the hills.' },
            ],
            added: 1,
            removed: 1,
          },
        }),
      }),
    });
    await userEvent.click(
      await screen.findByRole('tab', { name: 'Versions and changes' }, { timeout: 5000 }),
    );
    const section = screen.getByRole('region', { name: 'Compare two versions' });
    await userEvent.selectOptions(within(section).getByLabelText('From version'), '1');
    // Nothing is asked until both ends are chosen.
    expect(server.calls.some((c) => c.path === '/api/bulletins/5/compare')).toBe(false);
    await userEvent.selectOptions(within(section).getByLabelText('To version'), '3');
    const changes = await within(section).findByRole('list', { name: 'Changes from version 1 to version 3' });
    expect(within(changes).getByText('Storms likely in the hills.')).toBeTruthy();
    expect(within(section).getByText('1 line added, 1 removed.')).toBeTruthy();
    const asked = server.calls.filter((c) => c.path === '/api/bulletins/5/compare');
    expect(asked.map((c) => [c.query.get('from'), c.query.get('to')])).toEqual([['1', '3']]);
  });
});
