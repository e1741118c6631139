import type { AddressInfo } from 'node:net';
import type { OutboxEntry } from '@stormhour/shared';
// mailparser: a general-purpose mail parser from the npm registry, the outside check of what went out.
import { type AddressObject, simpleParser } from 'mailparser';
// smtp-server: a general-purpose SMTP server package, standing in for a real relay in the failure tests.
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../testing/test-app.js';
import { MailService, type OutgoingMail } from './mail.service.js';
import { MAX_ATTEMPTS } from './outbox-rules.js';
import { OutboxSender } from './outbox-sender.js';

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

/** A small PDF-like file (a PDF starts with "%PDF-", ISO 32000-1 §7.5.2) and an XML file. */
const PDF = Buffer.from('%PDF-1.7\n1 0 obj << /Type /Catalog >> endobj\n%%EOF\n', 'latin1');
const XML = Buffer.from(
  '<?xml version="1.0" encoding="UTF-8"?>\n<alert xmlns="urn:oasis:names:tc:emergency:cap:1.2"><status>Test</status></alert>\n',
);

function bulletinMail(to: string): OutgoingMail {
  return {
    to,
    subject: 'Riverbend bulletin 23: afternoon storms likely',
    text: 'Afternoon storms are likely in Riverbend this week.\nSpray in the morning.',
    html: '<h1>Riverbend bulletin 23</h1><p>Afternoon storms are <strong>likely</strong>.</p>',
    attachments: [
      { filename: 'riverbend-23.pdf', contentType: 'application/pdf', content: PDF },
      { filename: 'riverbend-23.cap.xml', contentType: 'application/xml', content: XML },
    ],
  };
}

const addresses = (value: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(value) ? value : value ? [value] : []).flatMap((a) => a.value.map((v) => v.address));

async function count(t: TestApp, sql: string, params: unknown[] = []): Promise<number> {
  return (await t.db.pg.query<{ n: number }>(sql, params)).rows[0].n;
}

describe('mail through the local fake SMTP server', () => {
  let t: TestApp;
  let admin: string;
  let mail: MailService;
  beforeAll(async () => {
    t = await createTestApp();
    admin = await t.signedIn('admin');
    mail = t.app.get(MailService);
  });
  afterAll(() => t.close());

  const outbox = async (key: string): Promise<OutboxEntry[]> =>
    (await t.http.get('/api/mail/outbox').query({ key }).set(bearer(admin)).expect(200)).body.items;

  it('sends one message per recipient with both bodies and both attachments, as mailparser reads it', async () => {
    const queued = await mail.enqueue('bulletin:12:v3', [
      bulletinMail('officer.a@unit.example'),
      bulletinMail('Officer.B@unit.example'),
    ]);
    expect(queued.queued).toHaveLength(2);
    expect(await mail.sendDue()).toMatchObject({ failed: 0 });

    const rows = await outbox('bulletin:12:v3');
    expect(rows.map((r) => [r.recipient, r.state, r.attempts])).toEqual([
      ['officer.b@unit.example', 'sent', 1],
      ['officer.a@unit.example', 'sent', 1],
    ]);
    const list = await t.http.get('/api/mail/messages').set(bearer(admin)).expect(200);
    expect(list.body.total).toBe(2);

    for (const row of rows) {
      const summary = list.body.items.find(
        (m: { envelopeTo: string[] }) => m.envelopeTo[0] === row.recipient,
      );
      expect(summary).toMatchObject({ messageId: row.messageId, sameMessageIdCount: 1 });
      // The raw source as the fake server received it, parsed independently of the app.
      const source = await t.http
        .get(`/api/mail/messages/${summary.id}/source`)
        .set(bearer(admin))
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        })
        .expect(200);
      const parsed = await simpleParser(source.body as Buffer);
      expect(addresses(parsed.to)).toEqual([row.recipient]);
      expect(addresses(parsed.from)).toEqual(['bulletins@stormhour.invalid']);
      expect(parsed.subject).toBe('Riverbend bulletin 23: afternoon storms likely');
      expect(parsed.text?.trim()).toBe(
        'Afternoon storms are likely in Riverbend this week.\nSpray in the morning.',
      );
      expect(parsed.html).toContain('<strong>likely</strong>');
      expect(parsed.messageId).toBe(row.messageId);
      expect(parsed.attachments.map((a) => [a.filename, a.contentType])).toEqual([
        ['riverbend-23.pdf', 'application/pdf'],
        ['riverbend-23.cap.xml', 'application/xml'],
      ]);
      expect(parsed.attachments[0].content.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      expect(parsed.attachments[0].content.equals(PDF)).toBe(true);
      expect(parsed.attachments[1].content.equals(XML)).toBe(true);
    }
  });

  it('shows a captured message parsed, and serves its attachments as downloads', async () => {
    const list = await t.http
      .get('/api/mail/messages')
      .query({ q: 'officer.a' })
      .set(bearer(admin))
      .expect(200);
    expect(list.body.total).toBe(1);
    const id = list.body.items[0].id;
    const view = await t.http.get(`/api/mail/messages/${id}`).set(bearer(admin)).expect(200);
    expect(view.body).toMatchObject({
      subject: 'Riverbend bulletin 23: afternoon storms likely',
      to: 'officer.a@unit.example',
      from: '"Stormhour test" <bulletins@stormhour.invalid>',
      envelopeFrom: 'bulletins@stormhour.invalid',
      attachments: [
        { index: 0, filename: 'riverbend-23.pdf', contentType: 'application/pdf', size: PDF.length },
        { index: 1, filename: 'riverbend-23.cap.xml', contentType: 'application/xml', size: XML.length },
      ],
    });
    expect(view.body.html).toContain('<h1>Riverbend bulletin 23</h1>');
    expect(view.body.text).toContain('Spray in the morning.');
    expect(view.body.headers.map((h: { key: string }) => h.key)).toEqual(
      expect.arrayContaining(['message-id', 'subject', 'from', 'to', 'date', 'x-stormhour-outbox']),
    );
    const pdf = await t.http.get(`/api/mail/messages/${id}/attachments/0`).set(bearer(admin)).expect(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    // Always a download (RFC 6266 "attachment"), never shown inline on the app's origin.
    expect(pdf.headers['content-disposition']).toMatch(/^attachment; filename="?riverbend-23\.pdf"?$/);
    expect(Buffer.from(pdf.body).equals(PDF)).toBe(true);
    const missing = await t.http.get(`/api/mail/messages/${id}/attachments/2`).set(bearer(admin)).expect(404);
    expect(missing.body.message).toBe(`Message ${id} has 2 attachment(s); there is no attachment 2.`);
  });

  it('sends a key to each recipient once, however often it is queued', async () => {
    const again = await mail.enqueue('bulletin:12:v3', [
      bulletinMail('officer.a@unit.example'),
      bulletinMail('OFFICER.B@unit.example'),
      bulletinMail('officer.c@unit.example'),
    ]);
    expect(again.queued.map((r) => r.recipient)).toEqual(['officer.c@unit.example']);
    expect(again.alreadyQueued).toEqual(['officer.a@unit.example', 'officer.b@unit.example']);
    await mail.sendDue();
    await mail.sendDue();
    for (const to of ['officer.a@unit.example', 'officer.b@unit.example', 'officer.c@unit.example'])
      expect(
        await count(t, `select count(*)::int as n from mail_received where envelope_to ? $1`, [to]),
      ).toBe(1);
    expect((await mail.statusOf('bulletin:12:v3')).map((s) => [s.recipient, s.state])).toEqual([
      ['officer.a@unit.example', 'sent'],
      ['officer.b@unit.example', 'sent'],
      ['officer.c@unit.example', 'sent'],
    ]);
    expect(await count(t, `select count(*)::int as n from mail_blobs`)).toBe(2);
    expect(await count(t, `select count(*)::int as n from audit_log where action = 'mail.sent'`)).toBe(3);
  });

  it('refuses a bad batch whole, naming each message and field', async () => {
    const before = await count(t, 'select count(*)::int as n from mail_outbox');
    await expect(
      mail.enqueue('bulletin:13:v1', [
        bulletinMail('officer.d@unit.example'),
        { ...bulletinMail('nobody'), text: '' },
      ]),
    ).rejects.toMatchObject({
      response: {
        details: [
          { where: 'messages[1].to', problem: '"nobody" is not an e-mail address' },
          { where: 'messages[1].text', problem: 'the plain-text body is empty' },
        ],
      },
    });
    expect(await count(t, 'select count(*)::int as n from mail_outbox')).toBe(before);
  });

  it('settles rows a restart left half-sent without sending anything twice', async () => {
    await mail.enqueue('bulletin:14:v1', [
      bulletinMail('delivered@unit.example'),
      bulletinMail('not-delivered@unit.example'),
      bulletinMail('real-server@unit.example'),
    ]);
    // As if the process had stopped mid-hand-over: the first reached the fake's mailbox, the second did
    // not, the third was being handed to a real server.
    await t.db.pg.query(
      `update mail_outbox set state = 'sending', attempts = 1, last_attempt_at = now(),
         via = case when recipient = 'real-server@unit.example' then 'smtp' else 'fake' end
       where dedupe_key = 'bulletin:14:v1'`,
    );
    const delivered = (await mail.statusOf('bulletin:14:v1')).find(
      (s) => s.recipient === 'delivered@unit.example',
    );
    await t.db.pg.query(
      `insert into mail_received (envelope_from, envelope_to, message_id, subject, size_bytes, raw)
       values ('bulletins@stormhour.invalid', '["delivered@unit.example"]', $1, 'x', 1, '\\x00')`,
      [delivered?.messageId],
    );
    await t.app.get(OutboxSender).onApplicationBootstrap();
    await mail.sendDue();
    const status = Object.fromEntries((await mail.statusOf('bulletin:14:v1')).map((s) => [s.recipient, s]));
    expect(status['delivered@unit.example'].state).toBe('sent');
    expect(status['not-delivered@unit.example'].state).toBe('sent');
    expect(status['real-server@unit.example'].state).toBe('failed');
    expect(status['real-server@unit.example'].lastError).toMatch(/may or may not have been delivered/);
    for (const to of ['delivered@unit.example', 'not-delivered@unit.example'])
      expect(
        await count(t, `select count(*)::int as n from mail_received where envelope_to ? $1`, [to]),
      ).toBe(1);
    expect(
      await count(
        t,
        `select count(*)::int as n from mail_received where envelope_to ? 'real-server@unit.example'`,
      ),
    ).toBe(0);
  });

  it('sends an administrator a test message, audited', async () => {
    const res = await t.http.post('/api/mail/test').set(bearer(admin)).expect(201);
    expect(res.body).toMatchObject({ subject: 'Stormhour test message', state: 'queued' });
    await mail.sendDue();
    const list = await t.http
      .get('/api/mail/messages')
      .query({ q: 'test message' })
      .set(bearer(admin))
      .expect(200);
    expect(list.body.items[0].envelopeTo).toEqual([res.body.recipient]);
    expect(await count(t, `select count(*)::int as n from audit_log where action = 'mail.test'`)).toBe(1);
    const settings = await t.http.get('/api/mail/settings').set(bearer(admin)).expect(200);
    expect(settings.body).toMatchObject({
      mode: 'fake',
      server: expect.stringMatching(/^127\.0\.0\.1:\d+$/),
    });
  });
});

describe('mail through an SMTP server that fails', () => {
  let t: TestApp;
  let admin: string;
  let mail: MailService;
  let relay: SMTPServer;
  let port = 0;
  const received: { to: string[]; messageId: string | undefined }[] = [];
  const refused = new Set(['blocked@unit.example']);

  /** A relay that refuses the addresses in `refused` with 550, as a real server does an unknown mailbox. */
  async function startRelay(onPort: number): Promise<number> {
    relay = new SMTPServer({
      disabledCommands: ['STARTTLS', 'AUTH'],
      authOptional: true,
      logger: false,
      onRcptTo(address, _session, callback) {
        if (refused.has(address.address))
          return callback(Object.assign(new Error('5.1.1 Mailbox unavailable'), { responseCode: 550 }));
        callback();
      },
      onData(stream, session, callback) {
        simpleParser(stream).then((parsed) => {
          received.push({ to: session.envelope.rcptTo.map((r) => r.address), messageId: parsed.messageId });
          callback();
        }, callback);
      },
    });
    await new Promise<void>((resolve) => relay.listen(onPort, '127.0.0.1', () => resolve()));
    return (relay.server.address() as AddressInfo).port;
  }
  const stopRelay = () => new Promise<void>((resolve) => relay.close(() => resolve()));
  const deliveriesTo = (to: string) => received.filter((r) => r.to.includes(to)).length;
  const row = async (key: string, to: string) =>
    (await mail.statusOf(key)).find((s) => s.recipient === to) as NonNullable<
      Awaited<ReturnType<MailService['statusOf']>>[number]
    >;

  beforeAll(async () => {
    port = await startRelay(0);
    t = await createTestApp({ smtpUrl: `smtp://127.0.0.1:${port}` });
    admin = await t.signedIn('admin');
    mail = t.app.get(MailService);
  });
  afterAll(async () => {
    await t.close();
    await stopRelay();
  });

  it('marks a recipient refused with 550 failed at once, keeps the others, and a retry sends it once', async () => {
    await mail.enqueue('bulletin:20:v1', [
      bulletinMail('ok@unit.example'),
      bulletinMail('blocked@unit.example'),
    ]);
    expect(await mail.sendDue()).toMatchObject({ sent: 1, failed: 1 });
    const blocked = await row('bulletin:20:v1', 'blocked@unit.example');
    expect(blocked).toMatchObject({ state: 'failed', attempts: 1 });
    expect(blocked.lastError).toMatch(/550 5\.1\.1 Mailbox unavailable[\s\S]*not tried again/);
    expect(await count(t, `select count(*)::int as n from audit_log where action = 'mail.failed'`)).toBe(1);

    // The administrator fixes the mailbox and retries from the outbox.
    refused.clear();
    const retried = await t.http.post(`/api/mail/outbox/${blocked.id}/retry`).set(bearer(admin)).expect(201);
    expect(retried.body).toMatchObject({ state: 'queued', attempts: 0, lastError: blocked.lastError });
    await mail.sendDue();
    expect(await row('bulletin:20:v1', 'blocked@unit.example')).toMatchObject({ state: 'sent' });
    expect(deliveriesTo('ok@unit.example')).toBe(1);
    expect(deliveriesTo('blocked@unit.example')).toBe(1);

    const again = await t.http.post(`/api/mail/outbox/${blocked.id}/retry`).set(bearer(admin)).expect(409);
    expect(again.body.message).toMatch(/already sent .* second copy/);
  });

  it('retries a server that is down on the backoff schedule, then delivers once', async () => {
    await stopRelay();
    await mail.enqueue('bulletin:21:v1', [bulletinMail('later@unit.example')]);
    await mail.sendDue();
    const first = await row('bulletin:21:v1', 'later@unit.example');
    expect(first).toMatchObject({ state: 'queued', attempts: 1 });
    expect(first.lastError).toMatch(/ECONNREFUSED/);
    // The first retry waits 30 s after the failed try (retry schedule, see outbox-rules); the try
    // itself (from claim to refusal) takes a few milliseconds.
    const gap = await t.db.pg.query<{ s: number }>(
      `select extract(epoch from next_attempt_at - last_attempt_at)::float8 as s from mail_outbox where id = $1`,
      [first.id],
    );
    expect(gap.rows[0].s).toBeGreaterThanOrEqual(30);
    expect(gap.rows[0].s).toBeLessThan(31);

    await mail.sendDue(new Date(Date.now() + 10_000));
    expect(await row('bulletin:21:v1', 'later@unit.example')).toMatchObject({ state: 'queued', attempts: 1 });

    await startRelay(port);
    await mail.sendDue(new Date(Date.now() + 31_000));
    expect(await row('bulletin:21:v1', 'later@unit.example')).toMatchObject({ state: 'sent', attempts: 2 });
    expect(deliveriesTo('later@unit.example')).toBe(1);
    expect(received.find((r) => r.to.includes('later@unit.example'))?.messageId).toBe(first.messageId);
  });

  it('gives up after the last try and shows the row failed', async () => {
    await stopRelay();
    await mail.enqueue('bulletin:22:v1', [bulletinMail('never@unit.example')]);
    for (let i = 1; i <= MAX_ATTEMPTS + 1; i++) await mail.sendDue(new Date(Date.now() + i * 2 * 3_600_000));
    const last = await row('bulletin:22:v1', 'never@unit.example');
    expect(last).toMatchObject({ state: 'failed', attempts: MAX_ATTEMPTS });
    expect(last.lastError).toMatch(new RegExp(`ECONNREFUSED[\\s\\S]*it failed ${MAX_ATTEMPTS} times`));
    const failed = await t.http
      .get('/api/mail/outbox')
      .query({ state: 'failed' })
      .set(bearer(admin))
      .expect(200);
    expect(failed.body.items.map((r: OutboxEntry) => r.recipient)).toContain('never@unit.example');
    await startRelay(port);
  });
});
