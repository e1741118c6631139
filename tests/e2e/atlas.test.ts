import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiToken, type Browser, callApi, openBrowser, signIn, watchOutsideRequests } from './browser.js';

describe('the scientist explores the demo season in the Atlas', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
    await signIn(browser.page, 'scientist@vessary.example');
  });
  afterAll(() => browser.close());

  async function downloaded(button: string, group: string): Promise<{ name: string; text: string }> {
    const { page } = browser;
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('group', { name: group }).getByRole('button', { name: button }).click(),
    ]);
    return { name: download.suggestedFilename(), text: readFileSync(await download.path(), 'utf8') };
  }

  it('opens the onset map, switches views, changes a filter and exports CSV and SVG', async () => {
    const { page } = browser;
    const outside = watchOutsideRequests(page);
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Atlas' }).click();
    await page.getByRole('heading', { name: 'Atlas' }).waitFor();
    await page
      .getByRole('img', { name: 'Onsets and their density, the whole day' })
      .waitFor({ timeout: 60_000 });
    await page.getByRole('list', { name: 'Onset density (onsets per 1000 km² per day)' }).waitFor();
    // The demo season has 3 546 onsets from the cell table (sample-data/README.md); a browser test run
    // before this one may have added a few (the intake test uploads a small cell table). The screen
    // must show what the server counts, and at least the demo's.
    const token = await apiToken('scientist@vessary.example');
    const sites = (await callApi(token, 'GET', '/api/radar-sites')).body as unknown as {
      id: number;
      code: string;
    }[];
    const vsr = sites.find((s) => s.code === 'VSR') as { id: number };
    const scope = (await callApi(token, 'GET', `/api/atlas/map?siteId=${vsr.id}`)).body.scope as {
      onsets: number;
      days: number;
    };
    expect(scope.onsets).toBeGreaterThanOrEqual(3546);
    await page.getByText(`${scope.onsets} onsets on ${scope.days} days from the cell table`).waitFor();
    await page.screenshot({
      path: fileURLToPath(new URL('./screenshots/atlas-map.png', import.meta.url)),
      fullPage: true,
    });

    const csv = await downloaded('CSV', 'Export the onset map');
    expect(csv.name).toBe('atlas-onset-map.csv');
    const lines = csv.text.trim().split('\n');
    expect(lines[0]).toBe('track_id,time_utc,local_hour,lat,lon,block_id,cell_type');
    expect(lines).toHaveLength(scope.onsets + 1);

    await page.getByRole('tab', { name: 'Daily cycle' }).click();
    await page.getByRole('img', { name: 'Onsets by local hour' }).waitFor();
    // The generator's afternoon peak, 14–15 h local.
    await page.getByText(new RegExp(`all cells \\(n = ${scope.onsets}, peak 1[3-5]–1[4-6] h\\)`)).waitFor();
    await page.getByLabel('Cell type').selectOption('deep');
    await page.getByText(/onsets on 122 days from the cell table, deep cells\./).waitFor();
    const svg = await downloaded('SVG', 'Export the daily cycle');
    expect(svg.name).toBe('atlas-daily-cycle-onsets.svg');
    expect(svg.text).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(svg.text).toContain('<path');

    await page.getByLabel('Cell type').selectOption('');
    await page.getByRole('tab', { name: 'Motion rose' }).click();
    await page.getByRole('img', { name: 'Rose of storm motion' }).waitFor();
    await page.getByText(/most moved toward (NW|NNW|WNW)/).waitFor();
    const [png] = await Promise.all([
      page.waitForEvent('download'),
      page
        .getByRole('group', { name: 'Export the motion rose' })
        .getByRole('button', { name: 'PNG' })
        .click(),
    ]);
    expect(png.suggestedFilename()).toBe('atlas-motion-rose.png');
    // The PNG signature (ISO/IEC 15948, §5.2): 89 50 4E 47 0D 0A 1A 0A.
    expect(
      readFileSync(await png.path())
        .subarray(0, 8)
        .toString('hex'),
    ).toBe('89504e470d0a1a0a');
    await page.screenshot({ path: fileURLToPath(new URL('./screenshots/atlas-rose.png', import.meta.url)) });

    await page.getByRole('tab', { name: 'Time–distance' }).click();
    await page.getByRole('img', { name: 'Onsets by local time and distance along the axis' }).waitFor();
    // Draw an axis with two clicks: A in the south-west of the map, B in the north-east.
    const picker = page.getByRole('img', { name: 'Map for drawing the time–distance axis' });
    const box = await picker.boundingBox();
    if (!box) throw new Error('no axis map');
    await picker.click({ position: { x: box.width * 0.35, y: box.height * 0.8 } });
    await page.getByText('Click the map again to place B, the axis’s end.').waitFor();
    await picker.click({ position: { x: box.width * 0.6, y: box.height * 0.2 } });
    await page.waitForFunction(() => new URL(location.href).searchParams.has('toLat'));
    const url = new URL(page.url());
    expect(Number(url.searchParams.get('fromLat'))).toBeLessThan(Number(url.searchParams.get('toLat')));
    await page.getByText(/onsets within 40 km of the \d+ km axis/).waitFor();
    await page.getByRole('tab', { name: 'Distributions' }).click();
    await page.getByRole('img', { name: 'Histogram of duration' }).waitFor();
    await page.getByText(/too lenient \(Lilliefors 1967\)/).waitFor();
    await page.screenshot({
      path: fileURLToPath(new URL('./screenshots/atlas-distributions.png', import.meta.url)),
      fullPage: true,
    });
    expect(outside).toEqual([]);
  }, 180_000);
});
