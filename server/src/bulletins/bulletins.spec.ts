import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BulletinView, DistrictView, InboxItem, OutboxEntry } from '@stormhour/shared';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
// mailparser: a general-purpose mail parser from the npm registry, the outside check of what went out.
import { type AddressObject, simpleParser } from 'mailparser';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { MailService } from '../mail/mail.service.js';
import { DEMO_DIR, DEMO_FILES, DEMO_SITE } from '../testing/demo-season.js';
import { createTestApp, type TestApp } from '../testing/test-app.js';
import { BulletinRenderer } from './bulletin-renderer.js';

type Auth = { Authorization: string };
const bearer = (token: string): Auth => ({ Authorization: `Bearer ${token}` });
const addresses = (value: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(value) ? value : value ? [value] : []).flatMap((a) => a.value.map((v) => v.address));

/** The demo's blocks, radar site (no radar data: every chance reads "no data") and crop calendars. */
async function province(t: TestApp) {
  const admin = bearer(await t.signedIn('admin'));
  await t.http
    .post('/api/blocks/import')
    .set(admin)
    .attach('file', readFileSync(join(DEMO_DIR, DEMO_FILES.blocks)), DEMO_FILES.blocks)
    .expect(201);
  await t.http
    .post('/api/crop-calendars/import')
    .set(admin)
    .attach('file', readFileSync(join(DEMO_DIR, 'crop-calendars.csv')), 'crop-calendars.csv')
    .expect(201);
  const scientist = bearer(await t.signedIn('scientist'));
  await t.http.post('/api/radar-sites').set(scientist).send(DEMO_SITE.createSiteRequest).expect(201);
  const districts: DistrictView[] = (await t.http.get('/api/districts').set(admin).expect(200)).body;
  const id = (code: string) => (districts.find((d) => d.code === code) as DistrictView).id;
  return { admin, scientist, rvb: id('RVB'), lks: id('LKS') };
}

async function count(t: TestApp, sql: string, params: unknown[] = []): Promise<number> {
  return (await t.db.pg.query<{ n: number }>(sql, params)).rows[0].n;
}

async function rawMessage(t: TestApp, admin: Auth, id: number): Promise<Buffer> {
  const res = await t.http
    .get(`/api/mail/messages/${id}/source`)
    .set(admin)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    })
    .expect(200);
  return res.body as Buffer;
}

async function pdfText(pdf: Buffer): Promise<string> {
  const doc = await getDocument({ data: new Uint8Array(pdf), useSystemFonts: false }).promise;
  let text = '';
  for (let p = 1; p <= doc.numPages; p++) {
    const items = (await (await doc.getPage(p)).getTextContent()).items as { str: string }[];
    text += items.map((i) => i.str).join(' ');
  }
  return text.replace(/\s+/g, ' ');
}

const WEEK = '2025-09-29';

describe('bulletins: drafting, review, sending and the inbox', () => {
  let t: TestApp;
  let admin: Auth;
  let scientist: Auth;
  let reviewer: Auth;
  let writer: Auth;
  let otherWriter: Auth;
  let officerA: Auth;
  let officerB: Auth;
  let lakeshoreOfficer: Auth;
  let rvb: number;
  let lks: number;
  let bulletin: BulletinView;

  beforeAll(async () => {
    t = await createTestApp({ uploadLimitBytes: 20 * 1024 * 1024 });
    ({ admin, scientist, rvb, lks } = await province(t));
    reviewer = bearer(await t.signedIn('scientist', { email: 'reviewer@unit.example' }));
    writer = bearer(await t.signedIn('writer', { email: 'writer@unit.example' }));
    otherWriter = bearer(await t.signedIn('writer'));
    officerA = bearer(await t.signedIn('officer', { email: 'officer.a@unit.example', districtId: rvb }));
    officerB = bearer(await t.signedIn('officer', { email: 'officer.b@unit.example', districtId: rvb }));
    lakeshoreOfficer = bearer(
      await t.signedIn('officer', { email: 'officer.l@unit.example', districtId: lks }),
    );
  }, 120_000);
  afterAll(() => t.close());

  const get = async (id: number, as: Auth = writer): Promise<BulletinView> =>
    (await t.http.get(`/api/bulletins/${id}`).set(as).expect(200)).body;

  it('refuses a week that does not start on Monday, naming the Monday to use', async () => {
    const res = await t.http
      .post('/api/bulletins')
      .set(writer)
      .send({ districtId: rvb, weekStart: '2025-10-01' })
      .expect(400);
    expect(res.body.details).toEqual([
      {
        where: 'weekStart',
        problem:
          '2025-10-01 is a Wednesday; bulletins run over ISO weeks from Monday to Sunday: use 2025-09-29',
      },
    ]);
  });

  it('drafts a bulletin pre-filled with the district’s blocks, crops of the week, cautions and header', async () => {
    const res = await t.http
      .post('/api/bulletins')
      .set(writer)
      .send({ districtId: rvb, weekStart: WEEK })
      .expect(201);
    bulletin = res.body;
    const blocks = (await t.http.get('/api/blocks').query({ districtId: rvb }).set(writer).expect(200)).body;
    expect(bulletin).toMatchObject({
      // ISO week 40 of 2025 (Python datetime.date(2025, 9, 29).isocalendar() = (2025, 40, 1)).
      number: 'RVB-2025-40',
      state: 'draft',
      weekStart: WEEK,
      weekEnd: '2025-10-05',
      currentVersion: 1,
      approvedVersion: null,
      recipientsCount: 2,
      draftedFrom: {
        regime: 'all',
        regimeChosenBy: 'no-forecast',
        binHours: 3,
        afternoonFrom: 12,
        afternoonTo: 18,
      },
      can: { edit: true, submit: true, approve: false, send: false },
    });
    expect(bulletin.content.outlook.map((b) => b.blockCode).sort()).toEqual(
      blocks.items?.map((b: { code: string }) => b.code).sort() ??
        blocks.map((b: { code: string }) => b.code).sort(),
    );
    // No radar data loaded: every block says so rather than showing a zero.
    for (const row of bulletin.content.outlook)
      expect(row).toMatchObject({ afternoonChance: null, inWords: 'no radar data' });
    // Riverbend's calendar (sample-data crop-calendars.csv) in ISO week 40: rice grain filling (38–42),
    // vegetables fruiting (35–40) and harvest (37–44).
    expect(bulletin.content.crops.map((c) => `${c.crop}/${c.stage}`)).toEqual([
      'rice/grain filling',
      'vegetables/fruiting',
      'vegetables/harvest',
    ]);
    expect(bulletin.content.cautions.join(' ')).toContain('not an official weather warning');
    expect(bulletin.content.unitName).toBe('Agro-met advisory unit');
    expect(bulletin.events.map((e) => [e.transition, e.to, e.actor])).toEqual([
      ['create', 'draft', 'writer@unit.example'],
    ]);
  });

  it('keeps one live bulletin per district and week (409 naming the district)', async () => {
    const res = await t.http
      .post('/api/bulletins')
      .set(scientist)
      .send({ districtId: rvb, weekStart: WEEK })
      .expect(409);
    expect(res.body.message).toBe(
      `Riverbend already has a bulletin for the week of ${WEEK}: open it, or withdraw it once sent before drafting another.`,
    );
  });

  it('saves new versions for the author or a writer only, and refuses an edit over a newer version', async () => {
    const edit = (baseVersion: number, extra: Record<string, unknown> = {}) => ({
      baseVersion,
      issueDate: '2025-09-26',
      summary: bulletin.content.summary,
      crops: bulletin.content.crops,
      generalAdvice: 'Lightning: go indoors when thunder is heard.',
      ...extra,
    });
    const saved = await t.http.put(`/api/bulletins/${bulletin.id}`).set(writer).send(edit(1)).expect(200);
    expect(saved.body).toMatchObject({
      currentVersion: 2,
      content: { generalAdvice: 'Lightning: go indoors when thunder is heard.' },
    });
    // The outlook's numbers and the cautions are not the writer's to change.
    expect(saved.body.content.outlook).toEqual(bulletin.content.outlook);
    const stale = await t.http
      .put(`/api/bulletins/${bulletin.id}`)
      .set(otherWriter)
      .send(edit(1))
      .expect(409);
    expect(stale.body.details).toEqual([{ where: 'baseVersion', problem: 'is 1, the bulletin is at 2' }]);
    const notAuthor = await t.http
      .put(`/api/bulletins/${bulletin.id}`)
      .set(scientist)
      .send(edit(2))
      .expect(403);
    expect(notAuthor.body.message).toBe(
      'Only the author (writer@unit.example) or an advisory writer may edit bulletin RVB-2025-40.',
    );
    const bad = await t.http
      .put(`/api/bulletins/${bulletin.id}`)
      .set(writer)
      .send(edit(2, { issueDate: '26/09/2025' }))
      .expect(400);
    expect(bad.body.details[0]).toMatchObject({ where: 'issueDate' });
    await t.http
      .put(`/api/bulletins/${bulletin.id}`)
      .set(otherWriter)
      .send(edit(2, { summary: 'Edited by a colleague.' }))
      .expect(200);
    const v2 = await t.http.get(`/api/bulletins/${bulletin.id}/versions/2`).set(writer).expect(200);
    expect(v2.body).toMatchObject({ version: 2, savedBy: 'writer@unit.example' });
    const diff = await t.http.get(`/api/bulletins/${bulletin.id}/diff`).set(writer).expect(200);
    expect(diff.body.previousSent.against).toBeNull();
    expect(diff.body.previousVersion.against).toMatchObject({ version: 2 });
    expect(diff.body.previousVersion.lines).toEqual(
      expect.arrayContaining([{ op: 'added', text: 'Edited by a colleague.' }]),
    );
    // Any two saved versions: the first against the newest holds the colleague's line too, and a version
    // against itself changes nothing.
    const compare = (from: number, to: number) =>
      t.http.get(`/api/bulletins/${bulletin.id}/compare`).query({ from, to }).set(writer);
    const oneToThree = (await compare(1, 3).expect(200)).body;
    expect(oneToThree.against).toEqual({ bulletinId: bulletin.id, number: 'RVB-2025-40', version: 1 });
    expect(oneToThree.lines).toEqual(
      expect.arrayContaining([{ op: 'added', text: 'Edited by a colleague.' }]),
    );
    const same = (await compare(2, 2).expect(200)).body;
    expect([same.added, same.removed]).toEqual([0, 0]);
    expect(same.lines.length).toBeGreaterThan(0);
    const missing = (await compare(1, 9).expect(404)).body;
    expect(missing.message).toBe('Bulletin RVB-2025-40 has no version 9: it has versions 1 to 3.');
    expect(missing.details).toEqual([{ where: 'to', problem: 'no version 9' }]);
    expect((await compare(0, 2).expect(400)).body.details[0]).toMatchObject({ where: 'from' });
  });

  it('refuses to send a bulletin that is not approved, and to let its author approve it', async () => {
    const unsent = await t.http.post(`/api/bulletins/${bulletin.id}/send`).set(writer).send({}).expect(409);
    expect(unsent.body.message).toBe('Bulletin RVB-2025-40 is a draft: it can be sent only when approved.');
    // A scientist who drafts may not approve their own bulletin.
    const own = (
      await t.http
        .post('/api/bulletins')
        .set(scientist)
        .send({ districtId: lks, weekStart: WEEK })
        .expect(201)
    ).body as BulletinView;
    await t.http.post(`/api/bulletins/${own.id}/submit`).set(scientist).send({}).expect(201);
    const refused = await t.http.post(`/api/bulletins/${own.id}/approve`).set(scientist).send({}).expect(403);
    expect(refused.body.message).toBe(
      'You wrote bulletin LKS-2025-40, so you cannot approve it: another scientist or administrator must review it.',
    );
    expect((await get(own.id)).state).toBe('in_review');
  });

  it('moves draft → in review → returned (comment required) → in review → approved, each step in the history', async () => {
    await t.http.post(`/api/bulletins/${bulletin.id}/submit`).set(writer).send({}).expect(201);
    const locked = await t.http
      .put(`/api/bulletins/${bulletin.id}`)
      .set(writer)
      .send({ baseVersion: 3, issueDate: '2025-09-26', summary: 'x', crops: [], generalAdvice: 'x' })
      .expect(409);
    expect(locked.body.message).toBe(
      'Bulletin RVB-2025-40 is in review: only a draft or a returned bulletin can be edited.',
    );
    const noComment = await t.http
      .post(`/api/bulletins/${bulletin.id}/return`)
      .set(reviewer)
      .send({})
      .expect(400);
    expect(noComment.body.details[0]).toMatchObject({ where: 'comment' });
    await t.http
      .post(`/api/bulletins/${bulletin.id}/return`)
      .set(reviewer)
      .send({ comment: 'Name the blocks in the summary.' })
      .expect(201);
    expect((await get(bulletin.id)).can.edit).toBe(true);
    await t.http.post(`/api/bulletins/${bulletin.id}/submit`).set(writer).send({}).expect(201);
    const approved = (
      await t.http.post(`/api/bulletins/${bulletin.id}/approve`).set(reviewer).send({}).expect(201)
    ).body as BulletinView;
    expect(approved).toMatchObject({
      state: 'approved',
      approvedVersion: 3,
      can: { send: true, edit: false },
    });
    expect(approved.approvedFrom?.fingerprint).toMatch(/^[0-9a-f]{40}$/);
    expect(approved.events.map((e) => [e.transition, e.from, e.to, e.actor, e.comment])).toEqual([
      ['create', null, 'draft', 'writer@unit.example', null],
      ['submit', 'draft', 'in_review', 'writer@unit.example', null],
      ['return', 'in_review', 'returned', 'reviewer@unit.example', 'Name the blocks in the summary.'],
      ['submit', 'returned', 'in_review', 'writer@unit.example', null],
      ['approve', 'in_review', 'approved', 'reviewer@unit.example', null],
    ]);
    expect(
      await count(
        t,
        `select count(*)::int as n from audit_log where target = $1 and action like 'bulletin.%'`,
        [`bulletin:${bulletin.id}`],
      ),
    ).toBe(7); // create, the writer's and the colleague's saves, submit, return, submit, approve
  });

  it('queues nothing and stays approved when the PDF cannot be made', async () => {
    const renderer = t.app.get(BulletinRenderer);
    const spy = vi.spyOn(renderer, 'pdf').mockRejectedValueOnce(new Error('font file unreadable'));
    const res = await t.http.post(`/api/bulletins/${bulletin.id}/send`).set(writer).send({}).expect(422);
    spy.mockRestore();
    expect(res.body.message).toBe(
      'Bulletin RVB-2025-40 could not be turned into its PDF and CAP files (font file unreadable). Nothing was sent; it stays approved.',
    );
    expect((await get(bulletin.id)).state).toBe('approved');
    expect(
      await count(t, `select count(*)::int as n from mail_outbox where dedupe_key like $1`, [
        `bulletin:${bulletin.id}:%`,
      ]),
    ).toBe(0);
  });

  it('e-mails each officer of the district once: subject, both bodies, PDF and CAP attachments, Message-ID', async () => {
    const sent = (await t.http.post(`/api/bulletins/${bulletin.id}/send`).set(writer).send({}).expect(201))
      .body;
    expect(sent).toMatchObject({ state: 'sent' });
    const mail = t.app.get(MailService);
    expect(await mail.sendDue()).toMatchObject({ failed: 0 });
    const key = `bulletin:${bulletin.id}:v3`;
    const delivery = (await t.http.get(`/api/bulletins/${bulletin.id}/delivery`).set(writer).expect(200))
      .body;
    expect(delivery).toMatchObject({ key, counts: { sent: 2, failed: 0, queued: 0 } });
    expect(delivery.recipients.map((r: { recipient: string }) => r.recipient)).toEqual([
      'officer.a@unit.example',
      'officer.b@unit.example',
    ]);

    const list = await t.http.get('/api/mail/messages').query({ q: 'RVB-2025-40' }).set(admin).expect(200);
    // Only Riverbend's two officers: the Lakeshore officer gets nothing.
    expect(list.body.items.flatMap((m: { envelopeTo: string[] }) => m.envelopeTo).sort()).toEqual([
      'officer.a@unit.example',
      'officer.b@unit.example',
    ]);
    const outbox: OutboxEntry[] = (await t.http.get('/api/mail/outbox').query({ key }).set(admin).expect(200))
      .body.items;
    for (const item of list.body.items) {
      const parsed = await simpleParser(await rawMessage(t, admin, item.id));
      const to = addresses(parsed.to);
      expect(to).toHaveLength(1);
      expect(parsed.subject).toBe('Riverbend crop-weather bulletin RVB-2025-40, 2025-09-29 to 2025-10-05');
      expect(parsed.text).toContain('CHANCE OF AN AFTERNOON STORM (12:00–18:00 local time)');
      expect(parsed.text).toContain('not an official weather warning');
      expect(parsed.html).toContain(
        '<h1 style="font-size:20px">Riverbend: crop-weather bulletin RVB-2025-40</h1>',
      );
      expect(parsed.messageId).toBe(outbox.find((o) => o.recipient === to[0])?.messageId);
      expect(parsed.attachments.map((a) => [a.filename, a.contentType])).toEqual([
        ['rvb-2025-40.pdf', 'application/pdf'],
        ['rvb-2025-40.cap.xml', 'application/xml'],
      ]);
      // A PDF file starts with "%PDF-" (ISO 32000-1 §7.5.2); its text read back by pdf.js names the district.
      const pdf = parsed.attachments[0].content;
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      expect(await pdfText(pdf)).toContain('Riverbend');
      // OASIS CAP 1.2 §3.2: namespace, identifier, status Actual, msgType Alert, one area per block.
      const xml = parsed.attachments[1].content.toString('utf8');
      expect(XMLValidator.validate(xml)).toBe(true);
      const alert = new XMLParser({ ignoreAttributes: false }).parse(xml).alert;
      expect(alert['@_xmlns']).toBe('urn:oasis:names:tc:emergency:cap:1.2');
      expect(alert).toMatchObject({
        identifier: 'stormhour-RVB-2025-40-v3',
        status: 'Actual',
        msgType: 'Alert',
        scope: 'Public',
      });
      expect(alert.info.area).toHaveLength(bulletin.content.outlook.length);
      // CAP 1.2 §3.2.2: the effective time is the week's first local midnight, with the offset written out.
      expect(alert.info.effective).toBe('2025-09-29T00:00:00+06:00');
    }
  });

  it('sends a version once: a second send queues nothing', async () => {
    const before = await count(t, 'select count(*)::int as n from mail_outbox');
    const again = await t.http.post(`/api/bulletins/${bulletin.id}/send`).set(writer).send({}).expect(409);
    expect(again.body.message).toBe('Bulletin RVB-2025-40 is sent: it can be sent only when approved.');
    expect(await count(t, 'select count(*)::int as n from mail_outbox')).toBe(before);
  });

  it('exports the sent version as PDF, CAP, plain text and SMS', async () => {
    const text = await t.http.get(`/api/bulletins/${bulletin.id}/text`).set(writer).expect(200);
    expect(text.text).toContain('Riverbend crop-weather bulletin RVB-2025-40');
    const sms = await t.http.get(`/api/bulletins/${bulletin.id}/sms`).set(writer).expect(200);
    expect(sms.text).toContain('Statistical guidance, not an official warning.');
    const cap = await t.http.get(`/api/bulletins/${bulletin.id}/cap.xml`).set(writer).expect(200);
    expect(cap.headers['content-type']).toMatch(/^application\/xml/);
    expect(cap.text).toContain('<status>Actual</status>');
    const pdf = await t.http
      .get(`/api/bulletins/${bulletin.id}/pdf`)
      .set(writer)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect((pdf.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('refuses to send to a district without officers, naming it and where to add one', async () => {
    const created = await t.http
      .post('/api/districts')
      .set(admin)
      .send({ code: 'EMP', name: 'Emptyvale' })
      .expect(201);
    const empty = (
      await t.http
        .post('/api/bulletins')
        .set(writer)
        .send({ districtId: created.body.id, weekStart: WEEK })
        .expect(201)
    ).body as BulletinView;
    expect(empty.recipientsCount).toBe(0);
    await t.http.post(`/api/bulletins/${empty.id}/submit`).set(writer).send({}).expect(201);
    await t.http.post(`/api/bulletins/${empty.id}/approve`).set(reviewer).send({}).expect(201);
    const res = await t.http.post(`/api/bulletins/${empty.id}/send`).set(writer).send({}).expect(409);
    expect(res.body.message).toBe(
      'District Emptyvale has no extension officers: add one in Admin › People before sending.',
    );
    expect((await get(empty.id)).state).toBe('approved');
  });

  it('shows the officer the district’s bulletins, unread until opened, and records the acknowledgement', async () => {
    const inbox: InboxItem[] = (await t.http.get('/api/inbox').set(officerA).expect(200)).body;
    expect(inbox.map((i) => [i.number, i.state, i.unread])).toEqual([['RVB-2025-40', 'sent', true]]);
    expect((await t.http.get('/api/inbox').set(lakeshoreOfficer).expect(200)).body).toEqual([]);
    await t.http.get(`/api/inbox/${bulletin.id}`).set(lakeshoreOfficer).expect(404);
    const opened = (await t.http.get(`/api/inbox/${bulletin.id}`).set(officerA).expect(200)).body;
    expect(opened).toMatchObject({
      number: 'RVB-2025-40',
      acknowledgedAt: null,
      content: { districtName: 'Riverbend' },
    });
    expect(opened.readAt).not.toBeNull();
    expect((await t.http.get('/api/inbox').set(officerA).expect(200)).body[0].unread).toBe(false);
    expect((await t.http.get('/api/inbox').set(officerB).expect(200)).body[0].unread).toBe(true);
    const ack = (await t.http.post(`/api/inbox/${bulletin.id}/acknowledge`).set(officerA).expect(201)).body;
    expect(ack.acknowledgedAt).not.toBeNull();
    expect(ack.readAt).toBe(opened.readAt);
  });

  it('takes field reports per block, refusing a foreign block, a bad rating and a time outside the week', async () => {
    const post = (body: Record<string, unknown>) =>
      t.http.post(`/api/inbox/${bulletin.id}/reports`).set(officerA).send(body);
    const good = {
      blockCode: 'RVB-02',
      stormSeen: true,
      startTime: '2025-09-30T15:30',
      hail: true,
      usefulness: 4,
    };
    const foreign = await post({ ...good, blockCode: 'LKS-01' }).expect(400);
    expect(foreign.body.details[0]).toMatchObject({ where: 'blockCode' });
    expect(foreign.body.details[0].problem).toMatch(
      /^LKS-01 is not a block of Riverbend; choose one of RVB-01, /,
    );
    const rating = await post({ ...good, usefulness: 6 }).expect(400);
    expect(rating.body.details).toEqual([
      {
        where: 'usefulness',
        problem: 'Rate the bulletin’s usefulness from 1 (not useful) to 5 (very useful)',
      },
    ]);
    const late = await post({ ...good, startTime: '2025-10-06T01:00' }).expect(400);
    expect(late.body.details).toEqual([
      {
        where: 'startTime',
        problem:
          "2025-10-06T01:00 is outside the bulletin's week, 2025-09-29 00:00 to 2025-10-05 23:59 local time",
      },
    ]);
    const noTime = await post({ ...good, startTime: null }).expect(400);
    expect(noTime.body.details).toEqual([
      { where: 'startTime', problem: 'Give the local time the storm started' },
    ]);
    const saved = (await post(good).expect(201)).body;
    // 15:30 at the demo site's UTC+06:00 is 09:30 UTC.
    expect(saved).toMatchObject({
      blockCode: 'RVB-02',
      startTime: '2025-09-30T15:30',
      startTimeUtc: '2025-09-30T09:30:00.000Z',
      hail: true,
    });
    expect(
      (await t.http.get(`/api/inbox/${bulletin.id}/reports`).set(officerA).expect(200)).body,
    ).toHaveLength(1);
    expect(
      (await t.http.get(`/api/inbox/${bulletin.id}/reports`).set(officerB).expect(200)).body,
    ).toHaveLength(0);
    const all = (await t.http.get(`/api/bulletins/${bulletin.id}/reports`).set(scientist).expect(200)).body;
    expect(all.map((r: { officerEmail: string }) => r.officerEmail)).toEqual(['officer.a@unit.example']);
  });

  it('withdraws with a correction notice to the same officers, and lets the week be drafted again', async () => {
    const noReason = await t.http
      .post(`/api/bulletins/${bulletin.id}/withdraw`)
      .set(reviewer)
      .send({})
      .expect(400);
    expect(noReason.body.details[0]).toMatchObject({ where: 'reason' });
    const withdrawn = (
      await t.http
        .post(`/api/bulletins/${bulletin.id}/withdraw`)
        .set(reviewer)
        .send({ reason: 'The chances were computed before the late scans arrived.' })
        .expect(201)
    ).body as BulletinView;
    expect(withdrawn.state).toBe('withdrawn');
    await t.app.get(MailService).sendDue();
    const delivery = (await t.http.get(`/api/bulletins/${bulletin.id}/delivery`).set(writer).expect(200))
      .body;
    expect(
      delivery.withdrawal.map((r: { recipient: string; state: string }) => [r.recipient, r.state]),
    ).toEqual([
      ['officer.a@unit.example', 'sent'],
      ['officer.b@unit.example', 'sent'],
    ]);
    const list = await t.http.get('/api/mail/messages').query({ q: 'Withdrawn:' }).set(admin).expect(200);
    expect(list.body.total).toBe(2);
    const parsed = await simpleParser(await rawMessage(t, admin, list.body.items[0].id));
    expect(parsed.text).toContain('Reason: The chances were computed before the late scans arrived.');
    // OASIS CAP 1.2 §3.2.1: a Cancel names the alert it cancels in <references> as sender,identifier,sent.
    const cancel = new XMLParser().parse(parsed.attachments[0].content.toString('utf8')).alert;
    expect(cancel.msgType).toBe('Cancel');
    expect(cancel.references).toMatch(
      /^bulletins@stormhour\.invalid,stormhour-RVB-2025-40-v3,\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\+06:00$/,
    );

    const inbox: InboxItem[] = (await t.http.get('/api/inbox').set(officerB).expect(200)).body;
    expect(inbox[0]).toMatchObject({
      state: 'withdrawn',
      withdrawalReason: 'The chances were computed before the late scans arrived.',
    });

    const again = (
      await t.http.post('/api/bulletins').set(writer).send({ districtId: rvb, weekStart: WEEK }).expect(201)
    ).body as BulletinView;
    expect(again.number).toBe('RVB-2025-40-R1');
    const diff = (await t.http.get(`/api/bulletins/${again.id}/diff`).set(writer).expect(200)).body;
    expect(diff.previousSent.against).toEqual({ bulletinId: bulletin.id, number: 'RVB-2025-40', version: 3 });
    expect(diff.previousSent.lines).toEqual(
      expect.arrayContaining([
        { op: 'removed', text: 'Riverbend crop-weather bulletin RVB-2025-40, 2025-09-29 to 2025-10-05' },
        { op: 'added', text: 'Riverbend crop-weather bulletin RVB-2025-40-R1, 2025-09-29 to 2025-10-05' },
      ]),
    );
  });

  it('refuses an advice rule with an unknown placeholder, naming it and its position', async () => {
    const res = await t.http
      .post('/api/advice-rules')
      .set(scientist)
      .send({
        crop: null,
        stage: null,
        condition: { combine: 'all', clauses: [] },
        priority: 50,
        text: 'Storms in {blocks} on {weekday}.',
        source: 'common practice',
        active: true,
      })
      .expect(400);
    expect(res.body.details[0]).toMatchObject({ where: 'text' });
    expect(res.body.details[0].problem).toMatch(/^\{weekday\} at character 23: unknown placeholder/);
  });
});
