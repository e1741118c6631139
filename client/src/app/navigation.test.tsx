import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aSessionUser } from '../test/builders';
import { renderApp } from '../test/renderApp';

const officer = aSessionUser({ id: 7, role: 'officer', name: 'Mira Tollan', districtId: 2 });
const admin = aSessionUser();

async function sectionLinks() {
  const nav = await screen.findByRole('navigation', { name: 'Sections' });
  return within(nav)
    .getAllByRole('link')
    .map((a) => a.textContent);
}

describe('Navigation by role', () => {
  it('shows an officer only the Inbox', async () => {
    renderApp('/', { as: officer });
    // SECTION_ROLES in shared/roles.ts gives officers the inbox alone.
    expect(await screen.findByRole('heading', { name: 'Inbox' })).toBeTruthy();
    expect(await sectionLinks()).toEqual(['Inbox']);
    expect(screen.getByText('Extension officer')).toBeTruthy();
  });

  it('shows an admin Bulletins (to review them), Scorecard and Admin, in that order', async () => {
    renderApp('/', {
      as: admin,
      api: { 'GET /api/districts': { body: [] }, 'GET /api/blocks': { body: [] } },
    });
    expect(await sectionLinks()).toEqual(['Bulletins', 'Scorecard', 'Admin']);
  });

  it('refuses a section the role lacks, even by typed address', async () => {
    const { server } = renderApp('/admin/people', { as: officer });
    expect(
      await screen.findByRole('heading', { name: "You don't have access to this section" }),
    ).toBeTruthy();
    // The screen is not rendered, so it asks the server nothing.
    expect(server.calls.some((c) => c.path === '/api/users')).toBe(false);
  });

  it('says so when a page does not exist', async () => {
    renderApp('/no/such/page', { as: officer });
    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeTruthy();
  });

  it('opens Admin on Districts & blocks', async () => {
    const { router } = renderApp('/admin', {
      as: admin,
      api: {
        'GET /api/districts': { body: [] },
        'GET /api/blocks': { body: [] },
        'GET /api/blocks/geojson': { body: { type: 'FeatureCollection', features: [] } },
      },
    });
    expect(await screen.findByRole('tab', { name: 'Districts & blocks', selected: true })).toBeTruthy();
    // The redirect lands in an effect after the first render of the tabs.
    await waitFor(() => expect(router.state.location.pathname).toBe('/admin/blocks'));
  });

  it('signs out and returns to sign-in', async () => {
    const { server } = renderApp('/', { as: officer, api: { 'POST /api/auth/logout': { status: 204 } } });
    await userEvent.click(await screen.findByRole('button', { name: 'Sign out' }));
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
    expect(server.calls.some((c) => c.path === '/api/auth/logout')).toBe(true);
  });

  it('sends the user to sign-in when the session cannot be renewed', async () => {
    let refreshes = 0;
    renderApp('/admin/people', {
      as: admin,
      api: {
        // The first refresh restores the session on load; the second, after a 401, fails.
        'POST /api/auth/refresh': () =>
          ++refreshes === 1
            ? { body: { accessToken: 't1', expiresIn: 900, user: admin } }
            : { status: 401, body: { statusCode: 401, message: 'Session expired' } },
        'GET /api/users': { status: 401, body: { statusCode: 401, message: 'Token expired' } },
        'GET /api/districts': { body: [] },
      },
    });
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
    expect(refreshes).toBe(2);
  });
});
