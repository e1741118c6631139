import { describe, expect, it } from 'vitest';
import {
  afterFailure,
  checkOutgoing,
  describeSmtpFailure,
  isPermanentSmtpFailure,
  MAX_ATTEMPTS,
  newRecipientsOnly,
  type OutgoingMail,
  outboxMessageId,
  RETRY_CAP_MS,
  retryDelayMs,
  settleInterrupted,
} from './outbox-rules.js';

const mail = (to: string, over: Partial<OutgoingMail> = {}): OutgoingMail => ({
  to,
  subject: 'Riverbend bulletin, week 23',
  text: 'Spray in the morning.',
  ...over,
});

describe('retry schedule', () => {
  // Doubling waits from 30 s, capped at an hour: common practice for retrying mail hand-over.
  it.each([
    [1, 30],
    [2, 60],
    [3, 120],
    [4, 240],
    [5, 480],
    [6, 960],
    [7, 1920],
    [8, 3600], // 30 s × 2^7 = 3840 s, capped at 3600 s
    [20, 3600],
  ])('after try %i waits %i s', (attempt, seconds) => {
    expect(retryDelayMs(attempt)).toBe(seconds * 1000);
  });

  it('never waits longer than the cap, and refuses a try number below 1', () => {
    expect(RETRY_CAP_MS).toBe(3_600_000);
    expect(() => retryDelayMs(0)).toThrow(/attempt must be 1 or more/);
  });

  const now = new Date('2026-06-02T04:00:00Z');

  // RFC 5321 §4.2.1: 5yz replies are permanent negative completions, 4yz transient; 503 is a
  // sequence error of the session, and no reply at all (refused connection) is not a refusal.
  it.each([
    [{ responseCode: 550 }, true],
    [{ responseCode: 554 }, true],
    [{ responseCode: 552 }, true],
    [{ responseCode: 503 }, false],
    [{ responseCode: 451 }, false],
    [{ responseCode: 421 }, false],
    [{ code: 'ESOCKET', message: 'connect ECONNREFUSED 127.0.0.1:2' }, false],
    [{ code: 'ETIMEDOUT' }, false],
  ])('%o is permanent: %s', (failure, permanent) => {
    expect(isPermanentSmtpFailure(failure)).toBe(permanent);
  });

  it('schedules a temporary failure for later and fails a permanent one at once', () => {
    expect(afterFailure(1, { code: 'ESOCKET' }, now)).toEqual({
      state: 'queued',
      nextAttemptAt: new Date('2026-06-02T04:00:30Z'),
    });
    expect(afterFailure(3, { responseCode: 451 }, now)).toEqual({
      state: 'queued',
      nextAttemptAt: new Date('2026-06-02T04:02:00Z'),
    });
    expect(afterFailure(1, { responseCode: 550 }, now)).toMatchObject({ state: 'failed' });
  });

  it('gives up after the last allowed try', () => {
    expect(afterFailure(MAX_ATTEMPTS - 1, { code: 'ESOCKET' }, now).state).toBe('queued');
    expect(afterFailure(MAX_ATTEMPTS, { code: 'ESOCKET' }, now)).toEqual({
      state: 'failed',
      reason: `it failed ${MAX_ATTEMPTS} times`,
    });
  });

  it('describes a failure by the server reply when there is one, else by the socket error', () => {
    expect(
      describeSmtpFailure({
        responseCode: 550,
        command: 'RCPT TO',
        response: '550 5.1.1 No such mailbox',
      }),
    ).toBe('RCPT TO: 550 5.1.1 No such mailbox');
    expect(describeSmtpFailure({ code: 'ESOCKET', message: 'connect ECONNREFUSED 127.0.0.1:9' })).toBe(
      'connect ECONNREFUSED 127.0.0.1:9 (ESOCKET)',
    );
  });
});

describe('idempotency', () => {
  it('gives one fixed Message-ID per key and recipient, in the RFC 5322 msg-id form', () => {
    const id = outboxMessageId('bulletin:12:v3', 'officer@unit.example', 'bulletins@unit.example');
    // RFC 5322 §3.6.4: msg-id = "<" id-left "@" id-right ">"
    expect(id).toMatch(/^<[0-9a-f]{32}\.outbox@unit\.example>$/);
    expect(outboxMessageId('bulletin:12:v3', ' Officer@Unit.example ', 'bulletins@unit.example')).toBe(id);
    expect(outboxMessageId('bulletin:12:v4', 'officer@unit.example', 'bulletins@unit.example')).not.toBe(id);
    expect(outboxMessageId('bulletin:12:v3', 'other@unit.example', 'bulletins@unit.example')).not.toBe(id);
  });

  it('queues only recipients the key has not had, whatever their case', () => {
    const batch = [mail('a@unit.example'), mail('B@unit.example'), mail('c@unit.example')];
    const fresh = newRecipientsOnly(batch, ['b@unit.example', 'z@unit.example']);
    expect(fresh.map((m) => m.to)).toEqual(['a@unit.example', 'c@unit.example']);
    expect(
      newRecipientsOnly(
        batch,
        batch.map((m) => m.to),
      ),
    ).toEqual([]);
  });

  it('accepts a well-formed batch', () => {
    const pdf = {
      filename: 'bulletin.pdf',
      contentType: 'application/pdf',
      content: Buffer.from('%PDF-1.7'),
    };
    expect(checkOutgoing('bulletin:12:v3', [mail('a@unit.example', { attachments: [pdf] })])).toEqual([]);
  });

  it('names every problem of a bad batch by message and field', () => {
    const problems = checkOutgoing('bulletin 12', [
      mail('not-an-address'),
      mail('a@unit.example'),
      mail('A@unit.example', { subject: 'two\nlines' }),
      mail('b@unit.example', {
        text: ' ',
        attachments: [{ filename: '../x.pdf', contentType: 'pdf', content: Buffer.alloc(0) }],
      }),
    ]);
    expect(problems.map((p) => p.where)).toEqual([
      'key',
      'messages[0].to',
      'messages[2].to',
      'messages[2].subject',
      'messages[3].text',
      'messages[3].attachments[0].filename',
      'messages[3].attachments[0].contentType',
      'messages[3].attachments[0].content',
    ]);
    expect(problems[2].problem).toBe('a@unit.example is already messages[1]; one message per recipient');
    expect(checkOutgoing('bulletin:1:v1', [])).toEqual([
      { where: 'messages', problem: 'there is no message to send' },
    ]);
  });
});

describe('a row interrupted while sending', () => {
  it('is settled from the local mailbox, which stores a message before accepting it', () => {
    expect(settleInterrupted('fake', true)).toEqual({ state: 'sent' });
    expect(settleInterrupted('fake', false)).toEqual({ state: 'queued' });
  });

  it('is never re-sent on its own through a real server (at most once)', () => {
    const settled = settleInterrupted('smtp', false);
    expect(settled.state).toBe('failed');
    expect(settled.state === 'failed' && settled.error).toMatch(/may or may not have been delivered/);
  });
});
