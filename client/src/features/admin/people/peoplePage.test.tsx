import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aDistrict, aSessionUser, aUser } from '../../../test/builders';
import type { FakeRoutes } from '../../../test/fakeApi';
import { renderApp } from '../../../test/renderApp';

const admin = aSessionUser();
const people = [
  aUser({ id: 1, email: admin.email, name: admin.name, role: 'admin', lastSignInAt: '2026-06-02T03:00:00Z' }),
  aUser({ id: 2, email: 'tovan.reed@vessary.example', name: 'Tovan Reed', role: 'writer' }),
  aUser({ id: 3, email: 'mira.tollan@vessary.example', name: 'Mira Tollan', role: 'officer', districtId: 2 }),
];

function renderPeople(extra: FakeRoutes = {}) {
  return renderApp('/admin/people', {
    as: admin,
    api: {
      'GET /api/users': { body: people },
      'GET /api/districts': { body: [aDistrict(), aDistrict({ id: 2, code: 'LKS', name: 'Lakeshore' })] },
      ...extra,
    },
  });
}

async function openAddPerson() {
  await userEvent.click(await screen.findByRole('button', { name: 'Add person' }));
  return screen.findByRole('dialog');
}

function names(): string[] {
  const table = screen.getByRole('table', { name: 'People' });
  return within(table)
    .getAllByRole('row')
    .slice(1)
    .map((row) => within(row).getAllByRole('cell')[1].textContent ?? '');
}

describe('Admin › People', () => {
  it('lists people with their district and filters them by role', async () => {
    renderPeople();
    const table = await screen.findByRole('table', { name: 'People' });
    const mira = (await within(table).findByText('Mira Tollan')).closest('tr') as HTMLElement;
    expect(within(mira).getByText('Lakeshore')).toBeTruthy();
    expect(within(mira).getByText('Never')).toBeTruthy();
    await userEvent.selectOptions(screen.getByLabelText('Filter by role'), 'Advisory writer');
    await waitFor(() => expect(names()).toEqual(['Tovan Reed']));
  });

  it('shows the shared schema’s message beside each wrong field', async () => {
    const { server } = renderPeople();
    const dialog = await openAddPerson();
    await userEvent.type(within(dialog).getByLabelText('Email'), 'not-an-address');
    await userEvent.selectOptions(within(dialog).getByLabelText('Role'), 'Extension officer');
    await userEvent.type(within(dialog).getByLabelText('Initial password'), 'short');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Add person' }));

    // Messages of CreateUserRequest in shared/users.ts and NewPassword in shared/auth.ts.
    expect(await within(dialog).findByText('Enter a valid e-mail address')).toBeTruthy();
    expect(within(dialog).getByText('Enter the person’s name')).toBeTruthy();
    expect(within(dialog).getByText('Use at least 10 characters')).toBeTruthy();
    expect(within(dialog).getByText('An extension officer must be assigned to a district')).toBeTruthy();
    expect(server.calls.some((c) => c.method === 'POST' && c.path === '/api/users')).toBe(false);
  });

  it('shows the server’s field problems beside the field', async () => {
    const { server } = renderPeople({
      'POST /api/users': {
        status: 409,
        body: {
          statusCode: 409,
          message: 'Someone already uses this e-mail address',
          details: [{ where: 'email', problem: 'Already used by another person' }],
        },
      },
    });
    const dialog = await openAddPerson();
    await userEvent.type(within(dialog).getByLabelText('Email'), 'Tovan.Reed@Vessary.example');
    await userEvent.type(within(dialog).getByLabelText('Name'), 'Tovan Reed');
    await userEvent.selectOptions(within(dialog).getByLabelText('Role'), 'Extension officer');
    await userEvent.selectOptions(within(dialog).getByLabelText('District'), 'Lakeshore');
    await userEvent.type(within(dialog).getByLabelText('Initial password'), 'a long initial password');
    await userEvent.click(within(dialog).getByRole('button', { name: 'Add person' }));

    expect(await within(dialog).findByText('Already used by another person')).toBeTruthy();
    expect(within(dialog).getByText('Someone already uses this e-mail address')).toBeTruthy();
    const sent = server.calls.find((c) => c.method === 'POST' && c.path === '/api/users');
    // The shared schema lower-cases the address before it is sent.
    expect(sent?.body).toEqual({
      email: 'tovan.reed@vessary.example',
      name: 'Tovan Reed',
      role: 'officer',
      districtId: 2,
      password: 'a long initial password',
    });
  });

  it('deactivates a person after confirmation', async () => {
    const { server } = renderPeople({
      'PATCH /api/users/2': (req) => ({ body: { ...people[1], ...(req.body as object) } }),
    });
    await userEvent.click(await screen.findByRole('button', { name: 'Deactivate Tovan Reed' }));
    const dialog = await screen.findByRole('dialog');
    expect(server.calls.some((c) => c.method === 'PATCH')).toBe(false);
    await userEvent.click(within(dialog).getByRole('button', { name: 'Deactivate' }));
    await waitFor(() =>
      expect(server.calls.find((c) => c.method === 'PATCH')?.body).toEqual({ active: false }),
    );
  });

  it('does not offer to deactivate yourself', async () => {
    renderPeople();
    const button = await screen.findByRole('button', { name: `Deactivate ${admin.name}` });
    expect((button as HTMLButtonElement).disabled).toBe(true);
  });
});
