import { ROLES, type Role } from '@stormhour/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../testing/test-app.js';

/**
 * Who may call what. Every route the application registers must be listed here: a new route without an
 * entry fails this test, so access is always decided on purpose.
 */
const EXPECTED: Record<string, 'public' | readonly Role[]> = {
  'GET /api/health': 'public',
  'POST /api/auth/login': 'public',
  'POST /api/auth/refresh': 'public',
  'POST /api/auth/logout': ROLES,
  'GET /api/auth/me': ROLES,
  'POST /api/auth/password': ROLES,
  'GET /api/users': ['admin'],
  'POST /api/users': ['admin'],
  'PATCH /api/users/:id': ['admin'],
  'GET /api/districts': ROLES,
  'POST /api/districts': ['admin'],
  'PATCH /api/districts/:id': ['admin'],
  'GET /api/blocks': ROLES,
  'GET /api/blocks/geojson': ROLES,
  'PATCH /api/blocks/:id': ['admin'],
  'POST /api/blocks/import': ['admin'],
  'GET /api/audit': ['admin'],
  'GET /api/audit/actions': ['admin'],
  'GET /api/radar-sites': ['scientist', 'writer', 'admin'],
  'GET /api/radar-sites/:id': ['scientist', 'writer', 'admin'],
  'GET /api/radar-sites/:id/coverage': ['scientist', 'writer', 'admin'],
  'GET /api/radar-sites/:id/settings': ['scientist'],
  'POST /api/radar-sites': ['scientist'],
  'PATCH /api/radar-sites/:id': ['scientist'],
  'POST /api/intake': ['scientist'],
  'GET /api/jobs': ['scientist', 'admin'],
  'GET /api/jobs/:id': ['scientist', 'admin'],
  'GET /api/tracks': ['scientist'],
  'GET /api/tracks/:id': ['scientist'],
  'GET /api/cells': ['scientist'],
  'GET /api/regimes': ['scientist', 'writer'],
  'GET /api/regimes/composite': ['scientist', 'writer'],
  'GET /api/regimes/settings': ['scientist', 'writer'],
  'GET /api/regimes/expected': ['scientist', 'writer'],
  'GET /api/regimes/sources': ['scientist', 'writer'],
  'PUT /api/regimes/settings': ['scientist'],
  'GET /api/mail/settings': ['admin'],
  'GET /api/mail/outbox': ['admin'],
  'POST /api/mail/outbox/:id/retry': ['admin'],
  'POST /api/mail/test': ['admin'],
  'GET /api/mail/messages': ['admin'],
  'GET /api/mail/messages/:id': ['admin'],
  'GET /api/mail/messages/:id/source': ['admin'],
  'GET /api/mail/messages/:id/attachments/:index': ['admin'],
  'GET /api/districts/:id/crop-calendar': ['scientist', 'writer', 'admin'],
  'PUT /api/districts/:id/crop-calendar': ['scientist', 'admin'],
  'POST /api/crop-calendars/import': ['scientist', 'admin'],
  'GET /api/advice-rules': ['scientist', 'writer'],
  'POST /api/advice-rules': ['scientist'],
  'PUT /api/advice-rules/:id': ['scientist'],
  'GET /api/outlook': ['scientist', 'writer'],
  'GET /api/outlook.csv': ['scientist', 'writer'],
  'GET /api/scorecard': ['scientist', 'admin'],
  'GET /api/scorecard.csv': ['scientist', 'admin'],
  'GET /api/scorecard.pdf': ['scientist', 'admin'],
  'GET /api/atlas/map': ['scientist'],
  'GET /api/atlas/diurnal': ['scientist'],
  'GET /api/atlas/distributions': ['scientist'],
  'GET /api/atlas/time-distance': ['scientist'],
  'GET /api/atlas/motion': ['scientist'],
  'POST /api/bulletins': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins/:id': ['writer', 'scientist', 'admin'],
  'PUT /api/bulletins/:id': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins/:id/versions/:n': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins/:id/diff': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins/:id/compare': ['writer', 'scientist', 'admin'],
  'POST /api/bulletins/:id/submit': ['writer', 'scientist', 'admin'],
  'POST /api/bulletins/:id/approve': ['scientist', 'admin'],
  'POST /api/bulletins/:id/return': ['scientist', 'admin'],
  'POST /api/bulletins/:id/send': ['writer', 'scientist', 'admin'],
  'POST /api/bulletins/:id/withdraw': ['scientist', 'admin'],
  'GET /api/bulletins/:id/delivery': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins/:id/reports': ['scientist', 'admin'],
  'GET /api/bulletins/:id/pdf': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins/:id/cap.xml': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins/:id/text': ['writer', 'scientist', 'admin'],
  'GET /api/bulletins/:id/sms': ['writer', 'scientist', 'admin'],
  'GET /api/inbox': ['officer'],
  'GET /api/inbox/:id': ['officer'],
  'POST /api/inbox/:id/acknowledge': ['officer'],
  'POST /api/inbox/:id/reports': ['officer'],
  'GET /api/inbox/:id/reports': ['officer'],
};

interface ExpressLayer {
  route?: { path: string; methods: Record<string, boolean> };
}

/** The routes Express actually serves, read from the running application. */
function registeredRoutes(t: TestApp): string[] {
  const express = t.app.getHttpAdapter().getInstance() as { router: { stack: ExpressLayer[] } };
  const routes = new Set<string>();
  for (const layer of express.router.stack) {
    // Middleware bound to every method (body parsing) is not an endpoint.
    if (!layer.route || Object.keys(layer.route.methods).length > 20) continue;
    for (const [method, on] of Object.entries(layer.route.methods)) {
      if (on && method !== '_all') routes.add(`${method.toUpperCase()} ${layer.route.path}`);
    }
  }
  // The API documentation pages are served by the docs module and are public on purpose.
  return [...routes].filter((r) => !r.includes('/api/docs'));
}

describe('authorization matrix', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  beforeAll(async () => {
    t = await createTestApp();
    for (const role of ROLES) tokens[role] = await t.signedIn(role);
  });
  afterAll(() => t.close());

  it('lists every registered route, and no route that does not exist', () => {
    const routes = registeredRoutes(t).sort();
    expect(routes.filter((r) => !(r in EXPECTED))).toEqual([]);
    expect(Object.keys(EXPECTED).filter((r) => !routes.includes(r))).toEqual([]);
  });

  it.each(Object.entries(EXPECTED))('%s answers each role as expected', async (route, allowed) => {
    const [method, path] = route.split(' ');
    const url = path.replace(/:id/g, '999999');
    const call = (token?: string) => {
      const req = t.http[method.toLowerCase() as 'get' | 'post' | 'patch' | 'put'](url);
      if (token) req.set('Authorization', `Bearer ${token}`);
      return req.send({});
    };
    const anonymous = await call();
    if (allowed === 'public') {
      expect(anonymous.status).not.toBe(403);
      return;
    }
    expect(anonymous.status).toBe(401);
    for (const role of ROLES) {
      const res = await call(tokens[role]);
      if (allowed.includes(role))
        expect([401, 403], `${role} should pass ${route}`).not.toContain(res.status);
      else expect(res.status, `${role} should be refused ${route}`).toBe(403);
    }
  });
});
