import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aLogin, aSessionUser } from '../test/builders';
import { renderApp } from '../test/renderApp';

async function fillAndSubmit(email: string, password: string) {
  const user = userEvent.setup();
  await user.type(await screen.findByLabelText('Email'), email);
  await user.type(screen.getByLabelText('Password'), password);
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('Sign-in page', () => {
  it('sends a signed-out visitor to sign-in', async () => {
    renderApp('/admin/blocks');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
  });

  it.each([
    [401, 'Email or password is incorrect'],
    [429, 'Too many sign-in attempts. Try again in a minute.'],
  ])('shows the server message when it answers %i', async (status, message) => {
    const { server } = renderApp('/sign-in', {
      api: { 'POST /api/auth/login': { status, body: { statusCode: status, message } } },
    });
    await fillAndSubmit('ila.admin@vessary.example', 'wrong-password');
    expect(await screen.findByText(message)).toBeTruthy();
    // A wrong password must not be retried through the refresh cookie.
    expect(server.calls.filter((c) => c.path === '/api/auth/refresh')).toHaveLength(1);
  });

  it('checks the fields before asking the server', async () => {
    const { server } = renderApp('/sign-in');
    await fillAndSubmit('not-an-address', 'x');
    // Message from the shared LoginRequest schema.
    expect(await screen.findByText('Enter an e-mail address such as name@unit.example')).toBeTruthy();
    expect(server.calls.some((c) => c.path === '/api/auth/login')).toBe(false);
  });

  it("lands a scientist on their role's first section", async () => {
    const scientist = aSessionUser({ role: 'scientist', name: 'Oren Pell' });
    const { server } = renderApp('/sign-in', {
      api: { 'POST /api/auth/login': { body: aLogin(scientist) } },
    });
    await fillAndSubmit('oren.pell@vessary.example', 'a long enough password');
    // sectionsFor('scientist') starts with atlas in the shared SECTIONS table.
    expect(await screen.findByRole('heading', { name: 'Atlas' })).toBeTruthy();
    expect(screen.getByText('Oren Pell')).toBeTruthy();
    const login = server.calls.find((c) => c.path === '/api/auth/login');
    expect(login?.body).toEqual({ email: 'oren.pell@vessary.example', password: 'a long enough password' });
  });
});
