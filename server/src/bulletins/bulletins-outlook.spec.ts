import { createServer } from 'node:net';
import type { BulletinView, DistrictView, OutlookResponse } from '@stormhour/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailService } from '../mail/mail.service.js';
import { loadDemoSeason, uploadDemo } from '../testing/demo-season.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';

type Auth = { Authorization: string };
const WEEK = '2025-09-29';

/** A port on which nothing listens: the SMTP server is "down" for the whole spec. */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe('bulletins on the demo season', () => {
  let t: TestApp;
  let siteId: number;
  let scientist: Auth;
  let writer: Auth;
  let districts: DistrictView[];
  let outlook: OutlookResponse;
  let bulletin: BulletinView;

  beforeAll(async () => {
    t = await createTestApp({
      uploadLimitBytes: 20 * 1024 * 1024,
      smtpUrl: `smtp://127.0.0.1:${await closedPort()}`,
    });
    ({ siteId, scientist } = await loadDemoSeason(t));
    // The coming week's forecast grids (sample-data README: a moist south-easterly spell, 1–7 October).
    const forecast = ['q', 'u', 'v'].map((v) => `forecast-2025-10-01-${v}850.tif`);
    expect(
      (await uploadDemo(t, scientist, siteId, 'anomaly-grid', forecast, { product: 'forecast' })).state,
    ).toBe('done');
    writer = { Authorization: `Bearer ${await t.signedIn('writer')}` };
    districts = (await t.http.get('/api/districts').set(writer).expect(200)).body;
  }, 400_000);
  afterAll(() => t.close());

  it('drafts with the week’s expected regime and exactly the outlook’s numbers for each block', async () => {
    const hillfoot = districts.find((d) => d.name === 'Hillfoot') as DistrictView;
    bulletin = (
      await t.http
        .post('/api/bulletins')
        .set(writer)
        .send({ districtId: hillfoot.id, weekStart: WEEK })
        .expect(201)
    ).body;
    expect(bulletin.draftedFrom).toMatchObject({
      siteId,
      regimeChosenBy: 'forecast',
      regime: 'moist / onshore',
    });
    expect(bulletin.content.regimeLabel).toBe('moist / onshore');
    outlook = (
      await t.http.get('/api/outlook').query({ siteId, regime: 'moist / onshore' }).set(writer).expect(200)
    ).body;
    const blocks = outlook.blocks.filter((b) => b.districtId === hillfoot.id);
    expect(bulletin.content.outlook).toHaveLength(blocks.length);
    for (const row of bulletin.content.outlook) {
      const b = blocks.find((x) => x.code === row.blockCode);
      if (!b) throw new Error(`block ${row.blockCode} is not in the outlook`);
      // The same figures GET /api/outlook gives (outlook.spec.ts checks those against x/n and the intervals).
      expect(row).toMatchObject({
        afternoonChance: b.afternoon.rate,
        lower: b.afternoon.lower,
        upper: b.afternoon.upper,
        n: b.afternoon.n,
        climatologyChance: b.climatologyRate,
        peakHourLocal: (b.peakBin as number) * outlook.binHours,
      });
      expect(row.afternoonChance).toBeCloseTo((b.afternoon.x as number) / (b.afternoon.n as number), 5);
    }
  });

  it('warns the writer of advice that contradicts the numbers, without refusing the save', async () => {
    const top = Math.max(...bulletin.content.outlook.map((b) => b.afternoonChance ?? 0));
    // The generator triggers storms over the hills (sample-data README): Hillfoot's moist-regime chance is high.
    expect(top).toBeGreaterThanOrEqual(0.4);
    const saved = (
      await t.http
        .put(`/api/bulletins/${bulletin.id}`)
        .set(writer)
        .send({
          baseVersion: 1,
          issueDate: '2025-09-26',
          summary: 'A dry spell is expected.',
          crops: bulletin.content.crops,
          generalAdvice: 'Spray fungicide in the afternoon.',
        })
        .expect(200)
    ).body as BulletinView;
    const kinds = new Set(saved.warnings.map((w) => `${w.kind}@${w.where}`));
    expect(kinds).toContain('dry-wording@summary');
    expect(kinds).toContain('afternoon-work@generalAdvice');
    // The lightning rule's text was in the general advice, now replaced: every high-chance block is named.
    const high = saved.content.outlook
      .filter((b) => (b.afternoonChance ?? 0) >= 0.4)
      .map((b) => `outlook[${b.blockCode}]`);
    expect(saved.warnings.filter((w) => w.kind === 'no-lightning-advice').map((w) => w.where)).toEqual(high);
  });

  it('freezes the content at approval: later data change the outlook, not the bulletin', async () => {
    await t.http.post(`/api/bulletins/${bulletin.id}/submit`).set(writer).send({}).expect(201);
    const approved = (
      await t.http.post(`/api/bulletins/${bulletin.id}/approve`).set(scientist).send({}).expect(201)
    ).body as BulletinView;
    // A stricter availability threshold takes days out of every figure (a new settings version).
    await t.http
      .patch(`/api/radar-sites/${siteId}`)
      .set(scientist)
      .send({ settings: { minAvailability: 0.99 } })
      .expect(200);
    const later: OutlookResponse = (
      await t.http.get('/api/outlook').query({ siteId, regime: 'moist / onshore' }).set(writer).expect(200)
    ).body;
    const changed = later.blocks.filter(
      (b, i) =>
        b.afternoon.n !== outlook.blocks[i].afternoon.n ||
        b.afternoon.rate !== outlook.blocks[i].afternoon.rate,
    );
    expect(changed.length).toBeGreaterThan(0);
    const after = (await t.http.get(`/api/bulletins/${bulletin.id}`).set(writer).expect(200))
      .body as BulletinView;
    expect(after.content).toEqual(approved.content);
    expect(after.approvedFrom?.fingerprint).toBe(approved.approvedFrom?.fingerprint);
  });

  it('is sent once queued; an SMTP server that is down shows as retries in the delivery status', async () => {
    const hillfoot = districts.find((d) => d.name === 'Hillfoot') as DistrictView;
    await t.signedIn('officer', { email: 'officer.h@unit.example', districtId: hillfoot.id });
    const sent = (await t.http.post(`/api/bulletins/${bulletin.id}/send`).set(writer).send({}).expect(201))
      .body as BulletinView;
    expect(sent.state).toBe('sent');
    await t.app.get(MailService).sendDue();
    const delivery = (await t.http.get(`/api/bulletins/${bulletin.id}/delivery`).set(writer).expect(200))
      .body;
    expect(delivery.counts).toMatchObject({ queued: 1, sent: 0 });
    expect(delivery.recipients[0]).toMatchObject({ recipient: 'officer.h@unit.example', attempts: 1 });
    expect(delivery.recipients[0].lastError).toMatch(/ECONNREFUSED/);
    expect((await t.http.get(`/api/bulletins/${bulletin.id}`).set(writer).expect(200)).body.state).toBe(
      'sent',
    );
  });
});
