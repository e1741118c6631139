import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Browser, baseUrl, openBrowser, signIn } from './browser.js';

const fixture = (name: string) => fileURLToPath(new URL(`../fixtures/${name}`, import.meta.url));
const demoDir = fileURLToPath(new URL('../../sample-data/vessary/', import.meta.url));
const shot = (name: string) => fileURLToPath(new URL(`./screenshots/${name}.png`, import.meta.url));

describe('the scientist takes radar data in', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
    await signIn(browser.page, 'scientist@vessary.example');
  });
  afterAll(() => browser.close());

  /** The upload form's site list (the jobs table below has a site filter of the same name). */
  async function chooseDemoSite() {
    const select = browser.page
      .locator('form, section, div')
      .getByRole('combobox', { name: 'Radar site' })
      .first();
    const value = await select.locator('option', { hasText: 'VSR' }).getAttribute('value');
    await select.selectOption(value as string);
  }

  it('sees the demo site, loaded at first start, with its settings', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/intake/sites`);
    const table = page.getByRole('table', { name: 'Radar sites' });
    await table.getByText('VSR').waitFor();
    await page.getByRole('img', { name: /Coverage of VSR over the blocks/ }).waitFor();
    await page.screenshot({ path: shot('intake-sites') });
  });

  it('uploads a cell table with the mapping pre-filled, follows the job and reads its report', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/intake`);
    await chooseDemoSite();
    await page.getByLabel('Kind of files').selectOption('cell-table');
    await page.getByLabel('Choose files').setInputFiles(fixture('cells-small.csv'));
    await page.getByRole('table', { name: 'Preview of the cell table' }).waitFor();
    // Our own column names are recognised, so nothing stands before the upload.
    const blockers = page.getByRole('list', { name: 'Before uploading' });
    expect(await blockers.count(), (await blockers.allInnerTexts()).join(' ')).toBe(0);
    await page.getByRole('button', { name: 'Upload' }).click();
    const report = page.getByRole('link', { name: /Open the quality report of job \d+/ });
    await report.waitFor({ timeout: 30_000 });
    await report.click();
    await page.getByText('Cells found').waitFor();
    await page.getByRole('table', { name: 'Files' }).getByText('Imported').waitFor();
    await page.getByRole('img', { name: 'Cells per scan over time' }).waitFor();
    await page.screenshot({ path: shot('intake-job') });
  });

  it('maps an anomaly CSV with its own column and variable names, then uploads it', async () => {
    const { page } = browser;
    // One day of the demo's q anomalies, written as another centre might: own headers, names and dates.
    const csv = readdirSync(demoDir).find((f) => /^anomalies-.*\.csv$/.test(f)) as string;
    const rows = readFileSync(`${demoDir}${csv}`, 'utf8')
      .split('\n')
      .filter((line) => line.startsWith('2025-06-01,') && line.includes(',q,'))
      .map((line) => {
        const [date, lat, lon, , level, value] = line.split(',');
        return [date.replaceAll('-', ''), lat, lon, 'shum', level, value].join(',');
      });
    await page.goto(`${baseUrl()}/intake`);
    await chooseDemoSite();
    await page.getByLabel('Kind of files').selectOption('anomaly-grid');
    await page.getByLabel('Choose files').setInputFiles({
      name: 'their-q850.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(['Valid Day,Latitude,Longitude,Param,Level,Anomaly', ...rows].join('\n')),
    });
    await page.getByRole('table', { name: 'Preview of the anomaly CSV' }).waitFor();
    const blockers = page.getByRole('list', { name: 'Before uploading' });
    await blockers.getByText('The file names variables "shum": say which of q, u, v each one is.').waitFor();
    expect(await page.getByLabel('Dates are written').inputValue()).toBe('YYYYMMDD');
    await page.getByLabel('Name of q (specific humidity anomaly)').fill('shum');
    await blockers.waitFor({ state: 'detached' });
    await page.screenshot({ path: shot('intake-anomaly-mapping') });
    await page.getByRole('button', { name: 'Upload' }).click();
    const report = page.getByRole('link', { name: /Open the quality report of job \d+/ });
    await report.waitFor({ timeout: 30_000 });
    await report.click();
    await page.getByRole('table', { name: 'Files' }).getByText('Imported').waitFor();
    await page.getByText(/q at 850 hPa, 1 day/).waitFor();
  });

  it('is shown the problems of a broken file, by row and column', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/intake`);
    await chooseDemoSite();
    await page.getByLabel('Kind of files').selectOption('scan-inventory');
    await page.getByLabel('Choose files').setInputFiles({
      name: 'scans-bad.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('scan_time_utc\n2025-08-21T10:00:00Z\nhalf past ten\n'),
    });
    await page.getByRole('button', { name: 'Upload' }).click();
    const link = page.getByRole('link', { name: /Open the quality report of job \d+/ });
    await link.waitFor({ timeout: 30_000 });
    await link.click();
    const problems = page.getByRole('table', { name: 'Problems' });
    await problems.getByText('row 3').waitFor();
    await problems.getByText('"half past ten" is not a time').waitFor();
  });

  it('browses the season’s tracks and opens one on the map', async () => {
    const { page } = browser;
    await page.goto(`${baseUrl()}/intake/tracks`);
    const table = page.getByRole('table', { name: 'Tracks' });
    await table.locator('tbody tr').first().waitFor();
    expect(await table.locator('tbody tr').count()).toBeGreaterThan(5);
    await table.locator('tbody tr a').first().click();
    await page.getByRole('img', { name: /Path of track \d+ over the blocks/ }).waitFor();
    await page.getByRole('table', { name: 'Cells of the track' }).waitFor();
    await page.screenshot({ path: shot('intake-track') });
  });
});
