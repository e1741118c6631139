import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Browser, baseUrl, openBrowser, signIn } from './browser.js';

const fixture = (name: string) => fileURLToPath(new URL(`../fixtures/${name}`, import.meta.url));

describe('admin manages blocks', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
    await signIn(browser.page, 'admin@vessary.example');
  });
  afterAll(() => browser.close());

  it('is told exactly what is wrong with a broken blocks file, and nothing is imported', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/admin/blocks`);
    await page.getByLabel('Import blocks').setInputFiles(fixture('blocks-broken.geojson'));
    await page.getByText('6 feature(s) have problems; nothing was imported.').waitFor();
    const problems = page.getByRole('table', { name: 'Problems in the file' });
    await problems.getByText('features[1] (TFA-02)').waitFor();
    await problems
      .getByText(/boundary crosses itself/)
      .first()
      .waitFor();
    await problems
      .getByText(/not closed/)
      .first()
      .waitFor();
    const table = page.getByRole('table', { name: 'Blocks' });
    expect(await table.getByText('TFA-01').count()).toBe(0);
  });

  it('imports a valid file and sees the blocks in the table and on the map', async () => {
    const { page } = browser;
    await page.getByLabel('Import blocks').setInputFiles(fixture('blocks-valid.geojson'));
    await page.getByText(/Imported: 4 blocks created, 0 updated, 2 districts created/).waitFor();
    const table = page.getByRole('table', { name: 'Blocks' });
    await table.getByText('TFA-01').waitFor();
    await table.getByText('Twin Spurs').waitFor();
    const map = page.getByRole('img', { name: 'Map of blocks' });
    await map.waitFor();
    expect(await map.locator('path').count()).toBeGreaterThanOrEqual(4);
    await page.screenshot({
      path: fileURLToPath(new URL('./screenshots/admin-blocks.png', import.meta.url)),
    });
  });

  it('filters the blocks table by text', async () => {
    const { page } = browser;
    const table = page.getByRole('table', { name: 'Blocks' });
    await page.getByRole('searchbox', { name: 'Search blocks' }).fill('Reedmarsh');
    await table.getByText('TFA-02').waitFor();
    await expect.poll(() => table.getByText('TFA-01').count()).toBe(0);
  });
});
