import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Browser, baseUrl, openBrowser, signIn, watchOutsideRequests } from './browser.js';

describe('admin reads the mail log', () => {
  let browser: Browser;
  let outside: string[];
  beforeAll(async () => {
    browser = await openBrowser();
    outside = watchOutsideRequests(browser.page);
    await signIn(browser.page, 'admin@vessary.example');
  });
  afterAll(() => browser.close());

  it('sends a test message to themself and sees it arrive in the local mailbox', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/admin/blocks`);
    await page.getByRole('tab', { name: 'Mail log' }).click();
    await page.getByText(/mail goes to the local capture server on 127\.0\.0\.1:\d+/).waitFor();

    await page.getByRole('button', { name: 'Send a test message to myself' }).click();
    await page.getByText('Test message queued.').waitFor();
    const outbox = page.getByRole('table', { name: 'Outbox' });
    // The outbox refreshes on its own while the sender works in the background.
    // Bulletins sent earlier are listed too: look at the test message's own row.
    const row = outbox.getByRole('row').filter({ hasText: 'admin@vessary.example' }).first();
    await row.waitFor();
    await row.getByText('Sent', { exact: true }).waitFor({ timeout: 20_000 });

    const received = page.getByRole('table', { name: 'Received messages' });
    await received.getByText('Stormhour test message').first().waitFor({ timeout: 20_000 });
    await page.screenshot({ path: fileURLToPath(new URL('./screenshots/mail-log.png', import.meta.url)) });
    await received.getByRole('link', { name: /Open/ }).first().click();

    await page.getByRole('heading', { name: 'Stormhour test message' }).waitFor();
    await page.getByText('X-Stormhour-Outbox: test:', { exact: false }).waitFor();
    // The HTML body renders inside the sandboxed frame, with scripts off.
    const frame = page.locator('iframe[title="HTML body"]');
    expect(await frame.getAttribute('sandbox')).toBe('');
    await page
      .frameLocator('iframe[title="HTML body"]')
      .getByText('If you can read it, sending works.')
      .waitFor();
    await page.getByRole('tab', { name: 'Plain text' }).click();
    await page
      .locator('pre.mail-text')
      .getByText(/This is a test message from Stormhour/)
      .waitFor();

    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download mail-settings.txt' }).click();
    const file = await download;
    expect(file.suggestedFilename()).toBe('mail-settings.txt');
    expect(readFileSync(await file.path(), 'utf8')).toMatch(/^mode: fake\nserver: 127\.0\.0\.1:\d+\n/);
    await page.screenshot({
      path: fileURLToPath(new URL('./screenshots/mail-message.png', import.meta.url)),
    });
    expect(outside).toEqual([]);
  });
});
