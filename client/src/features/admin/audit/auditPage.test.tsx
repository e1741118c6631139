import type { AuditEntry } from '@stormhour/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aSessionUser } from '../../../test/builders';
import type { FakeRequest } from '../../../test/fakeApi';
import { renderApp } from '../../../test/renderApp';

function entry(id: number, action: string): AuditEntry {
  return {
    id,
    at: '2026-06-02T03:00:00Z',
    actorId: 1,
    actorEmail: 'ila.admin@vessary.example',
    action,
    target: `user:${id}`,
    detail: { role: 'writer' },
  };
}

/** 60 entries; answers the requested slice, filtered by action like the server would. */
function auditServer(req: FakeRequest) {
  const all = Array.from({ length: 60 }, (_, i) => entry(i + 1, i % 2 ? 'user.update' : 'user.create'));
  const action = req.query.get('action');
  const matching = action ? all.filter((e) => e.action === action) : all;
  const offset = Number(req.query.get('offset'));
  const limit = Number(req.query.get('limit'));
  return { body: { items: matching.slice(offset, offset + limit), total: matching.length, offset, limit } };
}

describe('Admin › Audit trail', () => {
  it('pages through the trail and filters by action', async () => {
    const { server } = renderApp('/admin/audit', {
      as: aSessionUser(),
      api: { 'GET /api/audit': auditServer },
    });
    const table = await screen.findByRole('table', { name: 'Audit trail' });
    await waitFor(() => expect(within(table).getAllByRole('row')).toHaveLength(26));
    expect(within(table).getAllByText('role: writer')).toHaveLength(25);

    await userEvent.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(server.calls.at(-1)?.query.get('offset')).toBe('25'));

    await userEvent.type(screen.getByRole('searchbox', { name: 'Filter by action' }), 'user.create');
    await waitFor(() => {
      const last = server.calls.at(-1);
      expect(last?.query.get('action')).toBe('user.create');
      // A new filter starts again from the first page.
      expect(last?.query.get('offset')).toBe('0');
    });
    await waitFor(() => expect(within(table).getAllByRole('row')).toHaveLength(26));
    expect(within(table).queryByText('user.update')).toBeNull();
  });
});
