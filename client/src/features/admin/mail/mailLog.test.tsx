import type { MailMessageSummary, MailMessageView, OutboxEntry } from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { aSessionUser } from '../../../test/builders';
import type { FakeRequest } from '../../../test/fakeApi';
import { renderApp } from '../../../test/renderApp';

function anOutboxEntry(overrides: Partial<OutboxEntry> = {}): OutboxEntry {
  return {
    id: 1,
    key: 'bulletin:12:v3',
    recipient: 'officer.riverbend@vessary.example',
    subject: 'Riverbend bulletin 23',
    state: 'sent',
    attempts: 1,
    lastError: null,
    nextAttemptAt: null,
    sentAt: '2026-06-02T03:01:00Z',
    messageId: '<a1.outbox@vessary.example>',
    attachments: [],
    createdAt: '2026-06-02T03:00:00Z',
    ...overrides,
  };
}

const OUTBOX = [
  anOutboxEntry(),
  anOutboxEntry({
    id: 2,
    recipient: 'officer.lakeshore@vessary.example',
    state: 'failed',
    attempts: 1,
    sentAt: null,
    lastError: 'RCPT TO: 550 5.1.1 Mailbox unavailable — not tried again: the server refused it for good.',
  }),
];

const SUMMARY: MailMessageSummary = {
  id: 7,
  receivedAt: '2026-06-02T03:01:00Z',
  envelopeFrom: 'bulletins@vessary.example',
  envelopeTo: ['officer.riverbend@vessary.example'],
  subject: 'Riverbend bulletin 23',
  messageId: '<a1.outbox@vessary.example>',
  sizeBytes: 14_200,
  sameMessageIdCount: 1,
};

const MESSAGE: MailMessageView = {
  ...SUMMARY,
  from: 'Stormhour <bulletins@vessary.example>',
  to: 'officer.riverbend@vessary.example',
  cc: null,
  date: '2026-06-02T03:01:00Z',
  headers: [
    { key: 'from', line: 'From: Stormhour <bulletins@vessary.example>' },
    { key: 'x-stormhour-outbox', line: 'X-Stormhour-Outbox: bulletin:12:v3' },
  ],
  text: 'Afternoon storms are likely.\nSpray in the morning.',
  html: '<p>Afternoon storms are <strong>likely</strong>.</p><script>parent.alert(1)</script>',
  attachments: [
    { index: 0, filename: 'riverbend-23.pdf', contentType: 'application/pdf', size: 2048 },
    { index: 1, filename: 'riverbend-23.cap.xml', contentType: 'application/xml', size: 900 },
  ],
};

function outboxServer(req: FakeRequest) {
  const state = req.query.get('state');
  const items = state ? OUTBOX.filter((e) => e.state === state) : OUTBOX;
  return { body: { items, total: items.length, offset: 0, limit: 25 } };
}

const api = {
  'GET /api/mail/settings': {
    body: { mode: 'fake', server: '127.0.0.1:2525', from: 'Stormhour <bulletins@vessary.example>' },
  },
  'GET /api/mail/outbox': outboxServer,
  'GET /api/mail/messages': { body: { items: [SUMMARY], total: 1, offset: 0, limit: 25 } },
  'GET /api/mail/messages/7': { body: MESSAGE },
  'GET /api/mail/messages/7/attachments/0': { body: '%PDF-1.7' },
  'POST /api/mail/outbox/2/retry': { status: 201, body: { ...OUTBOX[1], state: 'queued', attempts: 0 } },
  'POST /api/mail/test': { status: 201, body: anOutboxEntry({ id: 3, state: 'queued', sentAt: null }) },
};

// The first render loads the lazy admin pages; on a busy 2-core machine that alone can take seconds.
const SLOW = 20_000;

describe('Admin › Mail log', () => {
  it(
    'shows the outbox with states and errors, filters by state and retries a failed message',
    async () => {
      const { server } = renderApp('/admin/mail', { as: aSessionUser(), api });
      const outbox = await screen.findByRole('table', { name: 'Outbox' }, { timeout: 5000 });
      await within(outbox).findByText('officer.lakeshore@vessary.example');
      expect(within(outbox).getByText(/550 5\.1\.1 Mailbox unavailable/)).toBeTruthy();
      expect(within(outbox).getByText('Failed')).toBeTruthy();
      expect(within(outbox).getByText('Sent')).toBeTruthy();
      // Only the failed row can be retried; a sent one never is.
      expect(
        within(outbox).queryByRole('button', { name: /Retry the message to officer.riverbend/ }),
      ).toBeNull();

      await userEvent.selectOptions(screen.getByLabelText('Filter by state'), 'failed');
      await waitFor(() =>
        expect(
          server.calls.some((c) => c.path === '/api/mail/outbox' && c.query.get('state') === 'failed'),
        ).toBe(true),
      );
      await waitFor(() => expect(within(outbox).queryByText('officer.riverbend@vessary.example')).toBeNull());

      await userEvent.click(
        within(outbox).getByRole('button', {
          name: 'Retry the message to officer.lakeshore@vessary.example',
        }),
      );
      await waitFor(() =>
        expect(server.calls.some((c) => c.method === 'POST' && c.path === '/api/mail/outbox/2/retry')).toBe(
          true,
        ),
      );
      expect(screen.getByText(/mail goes to the local capture server on 127\.0\.0\.1:2525/)).toBeTruthy();
    },
    SLOW,
  );

  it(
    'queues a test message to the signed-in administrator',
    async () => {
      const { server } = renderApp('/admin/mail', { as: aSessionUser(), api });
      await userEvent.click(
        await screen.findByRole('button', { name: 'Send a test message to myself' }, { timeout: 5000 }),
      );
      await screen.findByText('Test message queued.');
      expect(server.calls.filter((c) => c.method === 'POST' && c.path === '/api/mail/test')).toHaveLength(1);
    },
    SLOW,
  );

  it(
    'opens a received message: headers, the HTML in a script-less sandbox, the text, and attachments',
    async () => {
      const createObjectURL = vi.fn(() => 'blob:attachment');
      vi.stubGlobal('URL', Object.assign(URL, { createObjectURL, revokeObjectURL: vi.fn() }));
      const { server } = renderApp('/admin/mail', { as: aSessionUser(), api });
      const received = await screen.findByRole('table', { name: 'Received messages' }, { timeout: 5000 });
      await within(received).findByText('Riverbend bulletin 23');
      expect(within(received).getByText('14.2 kB')).toBeTruthy();
      await userEvent.click(within(received).getByRole('link', { name: /Open/ }));

      await screen.findByRole('heading', { name: 'Riverbend bulletin 23' });
      expect(screen.getByText(/X-Stormhour-Outbox: bulletin:12:v3/)).toBeTruthy();
      const frame = screen.getByTitle('HTML body') as HTMLIFrameElement;
      // An empty sandbox: no scripts, no forms, no same-origin access (HTML Living Standard, iframe sandbox).
      expect(frame.getAttribute('sandbox')).toBe('');
      expect(frame.getAttribute('srcdoc')).toContain('<strong>likely</strong>');

      await userEvent.click(screen.getByRole('tab', { name: 'Plain text' }));
      expect(screen.getByText(/Spray in the morning\./)).toBeTruthy();

      const attachments = screen.getByRole('table', { name: 'Attachments' });
      expect(within(attachments).getByText('2.0 kB')).toBeTruthy();
      expect(within(attachments).getByText('riverbend-23.cap.xml')).toBeTruthy();
      await userEvent.click(screen.getByRole('button', { name: 'Download riverbend-23.pdf' }));
      await waitFor(() => expect(createObjectURL).toHaveBeenCalledTimes(1));
      expect(server.calls.some((c) => c.path === '/api/mail/messages/7/attachments/0')).toBe(true);
    },
    SLOW,
  );
});
