import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type BrowserContext, chromium, type Page } from 'playwright-core';
import { expect, inject } from 'vitest';

export const DEMO_PASSWORD = 'stormhour-demo';
export const baseUrl = () => inject('baseUrl');

export interface Browser {
  context: BrowserContext;
  page: Page;
  close(): Promise<void>;
}

/** Debian's Chromium, headless, with a throw-away profile and no background traffic (machine has no network). */
export async function openBrowser(): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), 'stormhour-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1366, height: 768 },
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Signs in afresh: any earlier session's refresh cookie is dropped first. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.context().clearCookies();
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

/** Every request the page made to a host other than the app's own. */
export function watchOutsideRequests(page: Page): string[] {
  const outside: string[] = [];
  const own = new URL(baseUrl()).host;
  page.on('request', (req) => {
    const url = new URL(req.url());
    if (!['data:', 'blob:'].includes(url.protocol) && url.host !== own) outside.push(req.url());
  });
  return outside;
}

/** An access token for a demo account, for steps a test takes through the API rather than the screen. */
export async function apiToken(email: string): Promise<string> {
  const res = await fetch(`${baseUrl()}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  expect(res.status).toBe(200);
  return ((await res.json()) as { accessToken: string }).accessToken;
}

/** One JSON call with a token; the status and parsed body, for the test to check. */
export async function callApi(token: string, method: string, path: string, body?: unknown) {
  const res = await fetch(`${baseUrl()}${path}`, {
    method,
    headers: { Authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}
