import type { SessionUser } from '@stormhour/shared';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { routes } from '../app/routes';
import { setAccessToken } from '../lib/api';
import { AuthProvider } from '../lib/auth';
import { aLogin } from './builders';
import { type FakeReply, type FakeRoutes, fakeApi } from './fakeApi';

/**
 * Renders the whole app at `path` against a faked API. With `as`, the session cookie is "valid"
 * for that user, exactly as after a reload; without it, the visitor is signed out.
 */
export function renderApp(path: string, options: { as?: SessionUser; api?: FakeRoutes } = {}) {
  setAccessToken(null);
  const refresh: FakeReply = options.as
    ? { body: aLogin(options.as) }
    : { status: 401, body: { statusCode: 401, message: 'No session' } };
  const server = fakeApi({ 'POST /api/auth/refresh': refresh, ...options.api });
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const view = render(
    <QueryClientProvider client={queryClient}>
      <AuthProvider>
        <RouterProvider router={router} />
      </AuthProvider>
    </QueryClientProvider>,
  );
  return { ...view, server, router };
}
