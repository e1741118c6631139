import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Browser, baseUrl, openBrowser, signIn } from './browser.js';

const screenshot = (name: string) => fileURLToPath(new URL(`./screenshots/${name}.png`, import.meta.url));

describe('the scientist keeps the advice rules and crop calendars', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
    await signIn(browser.page, 'scientist@vessary.example');
  });
  afterAll(() => browser.close());

  it('edits a shipped rule and sees the live preview follow the example week and the text', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/bulletins/rules`);
    const table = page.getByRole('table', { name: 'Advice rules' });
    // The defaults were loaded into the empty database at first start.
    await table.getByText(/^Lightning: storms are possible/).waitFor();
    const sprayRow = table.getByRole('row').filter({ hasText: 'Afternoon storms are likely' });
    await sprayRow.getByRole('button', { name: /^Edit/ }).click();
    const preview = page.getByRole('region', { name: 'Preview' });
    // The example week starts at 30 % in every block, below the rule's 40 %.
    await preview.getByText('Does not fire this week').waitFor();

    const firstBlock = page.getByRole('spinbutton', { name: /^Afternoon chance in / }).first();
    await firstBlock.fill('60');
    await firstBlock.press('Tab');
    await preview.getByText('Fires this week').waitFor();
    // Only the block set to 60 % meets "≥ 40 % in any block". 0.6 is 3/5 on the documented ladder; the
    // example's usual chance is 25 % ("usually 1 in 4").
    const advice = preview.getByTestId('preview-text');
    const filled = /likely in (.+): about 3 afternoons in 5 \(60 %\), usually 1 in 4 \(25 %\)/;
    await expect.poll(() => advice.textContent()).toMatch(filled);
    const blockName = filled.exec((await advice.textContent()) ?? '')?.[1] ?? '';
    await page.getByRole('spinbutton', { name: `Afternoon chance in ${blockName} (%)` }).waitFor();

    const text = page.getByLabel('Advice text');
    await text.fill(
      'Spray only in the morning in {blocks}, before {peakHour}. Follow the label and licensed local advice.',
    );
    await expect
      .poll(() => advice.textContent())
      .toBe(
        `Spray only in the morning in ${blockName}, before 15:00. Follow the label and licensed local advice.`,
      );
    await page.screenshot({ path: screenshot('advice-rule-preview'), fullPage: true });

    await page.getByRole('button', { name: 'Save rule' }).click();
    await page.getByText(/^Rule \d+ saved\.$/).waitFor();
    await table.getByText(/^Spray only in the morning/).waitFor();
  });

  it('imports a calendar CSV with a bad row, sees the row named, and keeps the calendar', async () => {
    const { page } = browser;
    await page.getByRole('tab', { name: 'Crop calendars' }).click();
    const calendar = page.getByRole('table', { name: 'Crop calendar of Hillfoot' });
    await page.getByLabel('District').selectOption({ label: 'Hillfoot' });
    // The demo calendar came in through the same import at first start.
    await calendar.getByLabel('Crop, row 1', { exact: true }).waitFor();
    const before = await calendar.getByRole('row').count();
    expect(before).toBeGreaterThan(10);

    const csv = [
      'district_code,crop,stage,from_week,to_week',
      'HLF,maize,sowing,23,25',
      'HLF,maize,harvest,36,sixty',
    ].join('\n');
    await page
      .getByLabel('Import crop calendars')
      .setInputFiles({ name: 'hillfoot.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByText('hillfoot.csv: 1 row(s) have problems; nothing was imported.').waitFor();
    const problems = page.getByRole('table', { name: 'Problems in the file' });
    await problems.getByText('row 3, column "to_week"').waitFor();
    await problems.getByText('"sixty" is not a week number; give an ISO week from 1 to 53').waitFor();
    expect(await calendar.getByRole('row').count()).toBe(before);
    await page.getByRole('img', { name: 'Stages by ISO week' }).waitFor();
    await page.screenshot({ path: screenshot('crop-calendar'), fullPage: true });
  });
});
