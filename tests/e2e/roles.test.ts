import { type Role, sectionsFor } from '@stormhour/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiToken, type Browser, baseUrl, openBrowser, signIn, watchOutsideRequests } from './browser.js';

const SECTION_NAMES: Record<string, string> = {
  atlas: 'Atlas',
  intake: 'Intake',
  regimes: 'Regimes',
  outlook: 'Outlook',
  bulletins: 'Bulletins',
  inbox: 'Inbox',
  scorecard: 'Scorecard',
  admin: 'Admin',
};

const DEMO_ACCOUNTS: [string, Role][] = [
  ['admin@vessary.example', 'admin'],
  ['scientist@vessary.example', 'scientist'],
  ['writer@vessary.example', 'writer'],
  ['officer.riverbend@vessary.example', 'officer'],
];

describe('each demo role sees only its sections', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(() => browser.close());

  it.each(DEMO_ACCOUNTS)('%s', async (email, role) => {
    const { page } = browser;
    const outside = watchOutsideRequests(page);
    await signIn(page, email);
    const nav = page.getByRole('navigation', { name: 'Sections' });
    const links = (await nav.getByRole('link').allInnerTexts()).map((s) => s.trim());
    expect(links).toEqual(sectionsFor(role).map((s) => SECTION_NAMES[s]));
    // Every page carries the caution that these are not official warnings.
    await page.getByText(/statistical guidance .* not official\s+warnings/).waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    // Fonts and every asset ship with the app.
    expect(outside).toEqual([]);
  });

  it('keeps an officer out of Admin: the screen and its API', async () => {
    const { page } = browser;
    await signIn(page, 'officer.riverbend@vessary.example');
    await page.goto(`${baseUrl()}/admin/people`);
    await page.getByText("You don't have access to this section").waitFor();
    expect(await page.getByRole('table', { name: 'People' }).count()).toBe(0);

    const token = await apiToken('officer.riverbend@vessary.example');
    for (const path of ['/api/users', '/api/audit']) {
      const res = await fetch(`${baseUrl()}${path}`, { headers: { Authorization: `Bearer ${token}` } });
      expect(res.status).toBe(403);
      expect(((await res.json()) as { message: string }).message).toBe(
        'Your role does not give access to this.',
      );
    }
  });

  it('tells a user with a wrong password what went wrong, without saying which part', async () => {
    const { page } = browser;
    await page.context().clearCookies();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByLabel('Email').fill('admin@vessary.example');
    await page.getByLabel('Password', { exact: true }).fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Email or password is incorrect, or the account is not active.').waitFor();
  });

  it('keeps the session across a reload through the refresh cookie', async () => {
    const { page } = browser;
    await signIn(page, 'writer@vessary.example');
    await page.reload();
    await page.getByRole('button', { name: 'Sign out' }).waitFor();
    expect(page.url()).not.toContain('/sign-in');
  });
});
