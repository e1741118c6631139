import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  apiToken,
  type Browser,
  baseUrl,
  callApi,
  openBrowser,
  signIn,
  watchOutsideRequests,
} from './browser.js';

const screenshot = (name: string) => fileURLToPath(new URL(`./screenshots/${name}.png`, import.meta.url));

// Two weeks of the demo season (ISO weeks 28 and 29 of 2025, Monday to Sunday), away from the weeks the
// bulletins test uses, so the two files can share one server.
const WEEKS = ['2025-07-07', '2025-07-14'];
const FROM = '2025-07-07';
const TO = '2025-07-20';

/** The writer drafts and sends a Riverbend bulletin for each week, a scientist approving it in between. */
async function sendRiverbendBulletins() {
  const writer = await apiToken('writer@vessary.example');
  const scientist = await apiToken('scientist@vessary.example');
  const districts = (await (
    await fetch(`${baseUrl()}/api/districts`, { headers: { Authorization: `Bearer ${writer}` } })
  ).json()) as { id: number; name: string }[];
  const riverbend = districts.find((d) => d.name === 'Riverbend');
  for (const weekStart of WEEKS) {
    const created = await callApi(writer, 'POST', '/api/bulletins', { districtId: riverbend?.id, weekStart });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    expect((await callApi(writer, 'POST', `/api/bulletins/${id}/submit`, {})).status).toBe(201);
    expect((await callApi(scientist, 'POST', `/api/bulletins/${id}/approve`, {})).status).toBe(201);
    expect((await callApi(writer, 'POST', `/api/bulletins/${id}/send`, {})).status).toBe(201);
  }
}

describe('the scientist reads the scorecard of sent bulletins', () => {
  let browser: Browser;
  let outside: string[];
  beforeAll(async () => {
    await sendRiverbendBulletins();
    browser = await openBrowser();
    outside = watchOutsideRequests(browser.page);
    await signIn(browser.page, 'scientist@vessary.example');
  }, 120_000);
  afterAll(() => browser.close());

  it('picks Riverbend and two weeks, sees the scores, the reliability diagram and the worst blocks, and downloads the pairs and the report', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'Scorecard' }).click();
    await page.getByRole('heading', { name: 'Scorecard', level: 1 }).waitFor();
    await page.getByLabel('District').selectOption({ label: 'Riverbend' });
    await page.getByLabel('First day (local)').fill(FROM);
    await page.getByLabel('Last day (local)').fill(TO);
    await page.getByLabel('What happened, from').selectOption({ label: 'Radar onsets' });

    const scores = page.locator('dl[aria-label="Scores"]');
    await scores.waitFor({ timeout: 120_000 });
    await page
      .getByText(
        /^Riverbend, 2025-07-07 to 2025-07-20: 2 bulletins sent; \d+ block-days scored over \d+ days/,
      )
      .waitFor();
    // Each score with its interval from the day bootstrap, as the page promises.
    expect(
      await scores.getByText(/^\d\.\d{3} \(90 % interval \d\.\d{3}–\d\.\d{3}\)$/).count(),
    ).toBeGreaterThanOrEqual(1);
    await scores.getByText(/0 is perfect/).waitFor();

    await page.getByRole('img', { name: 'Reliability diagram' }).waitFor();
    await page.getByRole('img', { name: 'How often each chance was issued' }).waitFor();
    await page.getByRole('img', { name: 'ROC curve' }).waitFor();
    const blocks = page.getByRole('table', { name: 'Blocks, worst scored first' });
    await blocks.waitFor();
    // Riverbend's seven demo blocks at most; each row links to the bulletins that scored it.
    const rows = await blocks.locator('tbody tr').count();
    expect(rows).toBeGreaterThanOrEqual(1);
    expect(rows).toBeLessThanOrEqual(7);
    expect(await blocks.locator('tbody tr').first().getByRole('link').count()).toBeGreaterThanOrEqual(1);

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download the pairs (CSV)' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe(`scorecard-riverbend-${FROM}-to-${TO}-radar.csv`);
    const lines = readFileSync((await download.path()) as string, 'utf8')
      .trim()
      .split(/\r?\n/);
    expect(lines[0]).toBe('date,block_code,block_name,bulletin,chance,climatology_chance,observed,source');
    expect(lines.length).toBeGreaterThan(1);

    const [report] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download the season’s report (PDF)' }).click(),
    ]);
    expect(report.suggestedFilename()).toBe(`scorecard-riverbend-${FROM}-to-${TO}-radar.pdf`);
    // Every PDF starts with its version header (ISO 32000-1, 7.5.2).
    expect(
      readFileSync((await report.path()) as string)
        .subarray(0, 5)
        .toString('latin1'),
    ).toBe('%PDF-');
    await page.screenshot({ path: screenshot('scorecard-scientist'), fullPage: true });
    expect(outside).toEqual([]);
  }, 240_000);
});
