import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aSessionUser } from '../../test/builders';
import { renderApp } from '../../test/renderApp';

async function fill(current: string, next: string, again: string) {
  await userEvent.type(await screen.findByLabelText('Current password'), current);
  await userEvent.type(screen.getByLabelText('New password'), next);
  await userEvent.type(screen.getByLabelText('Repeat the new password'), again);
  await userEvent.click(screen.getByRole('button', { name: 'Change password' }));
}

describe('Change password', () => {
  it('asks for the new password twice', async () => {
    const { server } = renderApp('/account/password', { as: aSessionUser({ role: 'writer' }) });
    await fill('old password', 'a new long password', 'a new long passwrod');
    expect(await screen.findByText('The two new passwords differ')).toBeTruthy();
    expect(server.calls.some((c) => c.path === '/api/auth/password')).toBe(false);
  });

  it('shows the server’s verdict on the current password', async () => {
    renderApp('/account/password', {
      as: aSessionUser({ role: 'writer' }),
      api: {
        'POST /api/auth/password': {
          status: 400,
          body: {
            statusCode: 400,
            message: 'The password was not changed',
            details: [{ where: 'currentPassword', problem: 'This is not your current password' }],
          },
        },
      },
    });
    await fill('old password', 'a new long password', 'a new long password');
    expect(await screen.findByText('This is not your current password')).toBeTruthy();
  });

  it('confirms a change and clears the form', async () => {
    const { server } = renderApp('/account/password', {
      as: aSessionUser({ role: 'writer' }),
      api: { 'POST /api/auth/password': { status: 204 } },
    });
    await fill('old password', 'a new long password', 'a new long password');
    expect(await screen.findByText('Your password has been changed.')).toBeTruthy();
    await waitFor(() =>
      expect(server.calls.find((c) => c.path === '/api/auth/password')?.body).toEqual({
        currentPassword: 'old password',
        newPassword: 'a new long password',
      }),
    );
    expect((screen.getByLabelText('New password') as HTMLInputElement).value).toBe('');
  });
});
