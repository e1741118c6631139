import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
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

// The demo has one extension officer per district (server/src/demo/demo.seeder.ts).
const RIVERBEND_OFFICER = 'officer.riverbend@vessary.example';
const OTHER_OFFICERS = ['lakeshore', 'hillfoot', 'upland'].map((d) => `officer.${d}@vessary.example`);

async function openBulletin(page: Page, path: string) {
  await page.goto(`${baseUrl()}${path}`);
  await page.getByRole('tablist', { name: 'Bulletin details' }).waitFor({ timeout: 30_000 });
}

describe('a bulletin from draft to the officer’s field report', () => {
  let browser: Browser;
  let outside: string[];
  let bulletinPath = '';
  let number = '';
  beforeAll(async () => {
    browser = await openBrowser();
    outside = watchOutsideRequests(browser.page);
  });
  afterAll(() => browser.close());

  it('the writer drafts a Riverbend bulletin, edits it with a live preview and submits it', async () => {
    const { page } = browser;
    await signIn(page, 'writer@vessary.example');
    await page.goto(`${baseUrl()}/bulletins`);
    await page.getByRole('table', { name: 'Bulletins' }).waitFor();
    await page.getByRole('button', { name: 'New bulletin' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('District').selectOption({ label: 'Riverbend (RVB)' });
    // A Wednesday of the demo season; the draft covers its ISO week (2025-W32, checked with GNU date).
    await dialog.getByLabel('Week (any day of it)').fill('2025-08-06');
    await dialog.getByText('ISO week 32 of 2025: Mon 4 Aug – Sun 10 Aug').waitFor();
    await dialog.getByRole('button', { name: 'Draft bulletin' }).click();
    await page.waitForURL(/\/bulletins\/\d+$/, { timeout: 60_000 });
    bulletinPath = new URL(page.url()).pathname;

    const form = page.getByRole('form', { name: 'Bulletin text' });
    await form.waitFor();
    const heading = await page.locator('.bulletin-head .section-title').textContent();
    number = heading?.split(':')[0].trim() ?? '';
    expect(number).toMatch(/^\w+-2025-32/);
    // The outlook table was filled from the block outlook: every Riverbend block has a row.
    const outlook = page.getByRole('table', { name: 'Afternoon storm chance by block' });
    expect(await outlook.locator('tbody tr').count()).toBeGreaterThan(0);

    await form
      .getByLabel('Summary', { exact: true })
      .fill('Afternoon storms are **likely** over the hills this week.');
    await page
      .getByRole('region', { name: 'Summary: preview' })
      .locator('strong', { hasText: 'likely' })
      .waitFor();
    await page.getByRole('article').locator('strong', { hasText: 'likely' }).waitFor();
    await form.getByRole('button', { name: 'Save as version 2' }).click();
    await page.getByText('Saved as version 2.').waitFor();
    await page.screenshot({ path: screenshot('bulletin-editor'), fullPage: true });

    // The author is offered no review step of their own.
    expect(await page.getByRole('button', { name: 'Approve' }).count()).toBe(0);
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Submit for review' }).click();
    await page.getByText('Submitted for review.').waitFor();
    await page.locator('.bulletin-head').getByText('In review').waitFor();
  });

  it('the author of a bulletin cannot approve it, and is told why', async () => {
    // A scientist drafts and submits one of their own (Lakeshore, another week); approving it is refused.
    const token = await apiToken('scientist@vessary.example');
    const districts = (await (
      await fetch(`${baseUrl()}/api/districts`, { headers: { Authorization: `Bearer ${token}` } })
    ).json()) as { id: number; name: string }[];
    const lakeshore = districts.find((d) => d.name === 'Lakeshore');
    const created = await callApi(token, 'POST', '/api/bulletins', {
      districtId: lakeshore?.id,
      weekStart: '2025-08-11',
    });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    expect((await callApi(token, 'POST', `/api/bulletins/${id}/submit`, {})).status).toBe(201);
    const approve = await callApi(token, 'POST', `/api/bulletins/${id}/approve`, {});
    expect(approve.status).toBe(403);
    expect(approve.body.message).toMatch(/you cannot approve it/);

    // The page offers the scientist no approval of their own bulletin either.
    const { page } = browser;
    await signIn(page, 'scientist@vessary.example');
    await openBulletin(page, `/bulletins/${id}`);
    await page.locator('.bulletin-head').getByText('In review').waitFor();
    expect(await page.getByRole('button', { name: 'Approve' }).count()).toBe(0);
  });

  it('a scientist who is not the author approves the writer’s bulletin', async () => {
    const { page } = browser;
    await openBulletin(page, bulletinPath);
    await page.getByRole('button', { name: 'Approve' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText(/Approving freezes version 2/).waitFor();
    await dialog.getByRole('button', { name: 'Approve' }).click();
    await page.getByText('Approved. The writer can now send it.').waitFor();
    await page.getByRole('tab', { name: 'History' }).click();
    await page.getByRole('list', { name: 'History' }).getByText('by scientist@vessary.example').waitFor();
  });

  it('the writer sees how many officers will receive it, sends it and follows the delivery', async () => {
    const { page } = browser;
    await signIn(page, 'writer@vessary.example');
    await openBulletin(page, bulletinPath);
    await page.getByRole('button', { name: 'Send to officers' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText(/will be e-mailed to 1 officer of Riverbend/).waitFor();
    await dialog.getByRole('button', { name: 'Send to officers' }).click();
    await page.getByText('Sent. Delivery to each officer is shown below.').waitFor();
    await page.getByRole('tab', { name: 'Delivery' }).click();
    const delivery = page.getByRole('table', { name: 'Delivery' });
    await delivery.getByText(RIVERBEND_OFFICER).waitFor();
    await delivery.getByText('Sent', { exact: true }).waitFor({ timeout: 30_000 });
    await page.screenshot({ path: screenshot('bulletin-delivery'), fullPage: true });
  });

  it('the admin’s mail log holds one message per Riverbend officer and none to other officers', async () => {
    const { page } = browser;
    await signIn(page, 'admin@vessary.example');
    await page.goto(`${baseUrl()}/admin/mail`);
    await page.getByPlaceholder('Search by subject, sender or recipient').fill(number);
    const received = page.getByRole('table', { name: 'Received messages' });
    const rows = received.locator('tbody tr').filter({ hasText: number });
    await rows.first().waitFor({ timeout: 30_000 });
    expect(await rows.count()).toBe(1);
    expect(await rows.first().textContent()).toContain(RIVERBEND_OFFICER);

    const token = await apiToken('admin@vessary.example');
    const all = await callApi(token, 'GET', `/api/mail/messages?limit=200&q=${encodeURIComponent(number)}`);
    const items = all.body.items as { envelopeTo: string[] }[];
    expect(items.map((m) => m.envelopeTo)).toEqual([[RIVERBEND_OFFICER]]);
    for (const other of OTHER_OFFICERS) {
      const theirs = await callApi(
        token,
        'GET',
        `/api/mail/messages?limit=200&q=${encodeURIComponent(other)}`,
      );
      const subjects = (theirs.body.items as { subject: string | null }[]).map((m) => m.subject ?? '');
      expect(subjects.filter((s) => s.includes(number))).toEqual([]);
    }
  });

  it('the Riverbend officer reads it, acknowledges it and files a field report', async () => {
    const { page } = browser;
    await signIn(page, RIVERBEND_OFFICER);
    await page.goto(`${baseUrl()}/inbox`);
    const inbox = page.getByRole('table', { name: 'Inbox' });
    const row = inbox.locator('tbody tr').filter({ hasText: number });
    await row.getByText('Unread').waitFor();
    await row.getByRole('link', { name: /^Open/ }).click();

    await page.getByRole('heading', { name: `Riverbend: crop-weather bulletin ${number}` }).waitFor();
    await page.getByRole('article').locator('strong', { hasText: 'likely' }).waitFor();
    await page
      .getByText(/not an official weather warning/)
      .first()
      .waitFor();
    await page.getByRole('button', { name: 'Acknowledge' }).click();
    await page.getByText(/^Acknowledged /).waitFor();

    const form = page.getByRole('form', { name: 'Field report' });
    await form.getByRole('button', { name: 'File report' }).click();
    await form.getByText('The report was not filed.').waitFor();
    const block = form.getByLabel('Block');
    const firstBlock = await block.locator('option').nth(1).getAttribute('value');
    await block.selectOption(firstBlock ?? '');
    await form.getByText('Yes', { exact: true }).click();
    await form.getByLabel('Start time (local)').fill('2025-08-05T15:30');
    await form.getByText('Hail', { exact: true }).click();
    await form.getByLabel('Action taken').fill('Spraying moved to the morning.');
    await form.getByText('4', { exact: true }).click();
    await form.getByRole('button', { name: 'File report' }).click();
    await page.getByText(/^Report for .+ filed\.$/).waitFor();
    const filed = page.getByRole('table', { name: 'Field reports filed' });
    await filed.getByText('2025-08-05 15:30').waitFor();
    await filed.getByText('4 of 5').waitFor();
    await page.screenshot({ path: screenshot('inbox-bulletin'), fullPage: true });

    await page.goto(`${baseUrl()}/inbox`);
    await row.getByText('Acknowledged').waitFor();
    expect(outside).toEqual([]);
  });
});
