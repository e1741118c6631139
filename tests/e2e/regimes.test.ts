import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Browser, baseUrl, openBrowser, signIn } from './browser.js';

describe('the scientist reads the season by regime', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
    await signIn(browser.page, 'scientist@vessary.example');
  });
  afterAll(() => browser.close());

  it('sees a calendar of the demo season coloured by regime, the counts and a composite map', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/regimes`);
    const calendar = page.getByRole('group', { name: 'Season calendar' });
    await calendar.waitFor();
    // The demo season: 1 June to 30 September, every day with its regime.
    expect(await calendar.getByRole('button', { name: /: (dry|near-normal|moist) \// }).count()).toBe(122);
    await page.getByRole('table', { name: 'Days per regime' }).waitFor();
    await page.getByRole('img', { name: 'Days by moisture and flow' }).waitFor();
    await page.getByRole('img', { name: /^Composite of / }).waitFor();
    await page.screenshot({
      path: fileURLToPath(new URL('./screenshots/regimes.png', import.meta.url)),
      fullPage: true,
    });
  });
});
