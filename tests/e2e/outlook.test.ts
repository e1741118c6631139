import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Browser, baseUrl, openBrowser, signIn } from './browser.js';

const TABLE = 'Chance of a storm starting, by block and local time';

describe.each([
  ['writer', 'writer@vessary.example'],
  ['scientist', 'scientist@vessary.example'],
])('the %s reads the block outlook of the demo season', (role, email) => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
    await signIn(browser.page, email);
  });
  afterAll(() => browser.close());

  it('sees the table and the map, sorts, filters by district and exports CSV', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/outlook`);
    const table = page.getByRole('table', { name: TABLE });
    await table.waitFor({ timeout: 60_000 });
    // The demo's 31 blocks, each row with its n beside the figures.
    expect(await table.locator('tbody tr').count()).toBe(31);
    expect(await table.getByText(/^n \d+$/).count()).toBeGreaterThan(31 * 8);
    await page.getByRole('img', { name: 'Map of the afternoon chance (12–18 local) per block' }).waitFor();
    await page.getByRole('img', { name: /^Diurnal cycle of / }).waitFor();

    // Sort by the afternoon chance, highest first: a hill block leads (storms start over the hills).
    const afternoon = table.getByRole('button', { name: /Afternoon 12–18/ });
    await afternoon.click();
    await afternoon.click();
    const firstBlock = await table.locator('tbody tr').first().locator('td').nth(1).textContent();
    expect(firstBlock).toMatch(/Hillfoot|Upland/);

    await page.getByLabel('District', { exact: true }).selectOption({ label: 'Riverbend' });
    expect(await table.locator('tbody tr').count()).toBe(7);
    expect(await table.getByText('Hillfoot').count()).toBe(0);

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Export CSV' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('outlook-VSR-all-days.csv');
    const csv = readFileSync((await download.path()) as string, 'utf8');
    const lines = csv.trim().split(/\r?\n/);
    expect(lines[0]).toMatch(/^site,source,measure,regime/);
    expect(lines).toHaveLength(1 + 31 * 8);
    await page.screenshot({
      path: fileURLToPath(new URL(`./screenshots/outlook-${role}.png`, import.meta.url)),
      fullPage: true,
    });
  }, 120_000);
});
