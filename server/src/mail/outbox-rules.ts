import { createHash } from 'node:crypto';
import type { ErrorDetail } from '@stormhour/shared';

/*
 * The outbox's rules, free of Nest and the database: what may be queued, when a failed message is
 * tried again, which failures are final, and what a row left half-sent by a restart becomes.
 */

/** The first retry waits this long; each later one twice as long as the one before. */
export const RETRY_BASE_MS = 30_000;
/** No wait is longer than this. */
export const RETRY_CAP_MS = 60 * 60_000;
/** After this many tries a message is marked failed and waits for an administrator. */
export const MAX_ATTEMPTS = 8;

export interface OutgoingAttachment {
  filename: string;
  contentType: string;
  content: Buffer;
}

/** One message for one recipient, as a caller (the bulletin sender, the test message) hands it over. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  attachments?: OutgoingAttachment[];
}

/**
 * How long to wait after the given try failed (1 = the first try): 30 s × 2^(attempt − 1), capped at an
 * hour. Doubling waits are common practice for mail retries (RFC 5321 §4.5.4.1 asks only that retries be
 * spaced, at least 30 minutes apart for a mail server's own queue; a sender handing mail to its relay
 * retries sooner).
 */
export function retryDelayMs(attempt: number): number {
  if (!Number.isInteger(attempt) || attempt < 1)
    throw new RangeError(`attempt must be 1 or more, not ${attempt}`);
  return Math.min(RETRY_CAP_MS, RETRY_BASE_MS * 2 ** (attempt - 1));
}

/** What a failed try leads to: another try later, or failure shown to the administrator. */
export type AfterFailure = { state: 'queued'; nextAttemptAt: Date } | { state: 'failed'; reason: string };

export interface SmtpFailure {
  code?: string;
  responseCode?: number;
  message?: string;
}

/**
 * RFC 5321 §4.2.1: a 5yz reply is a permanent refusal (sending the same message again gets the same
 * answer), a 4yz reply is temporary. 503 "bad sequence of commands" is about the session, not the
 * message, so it is retried. No reply at all (refused connection, time-out) is temporary.
 */
export function isPermanentSmtpFailure(failure: SmtpFailure): boolean {
  const code = failure.responseCode;
  return code !== undefined && code >= 500 && code < 600 && code !== 503;
}

export function afterFailure(attempts: number, failure: SmtpFailure, now: Date): AfterFailure {
  if (isPermanentSmtpFailure(failure))
    return { state: 'failed', reason: 'the server refused it for good (a 5xx reply)' };
  if (attempts >= MAX_ATTEMPTS) return { state: 'failed', reason: `it failed ${attempts} times` };
  return { state: 'queued', nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)) };
}

/** The error as an administrator reads it in the outbox table: what failed, and the server's reply. */
export function describeSmtpFailure(failure: SmtpFailure & { response?: string; command?: string }): string {
  const reply = failure.response?.trim();
  if (reply) return `${failure.command ? `${failure.command}: ` : ''}${reply}`;
  const message = failure.message?.trim() || 'unknown error';
  return failure.code && !message.includes(failure.code) ? `${message} (${failure.code})` : message;
}

/** Addresses are compared and stored in lower case, as the users table keeps them (common practice). */
export function normaliseRecipient(address: string): string {
  return address.trim().toLowerCase();
}

/**
 * The Message-ID of the one message for this key and recipient. Derived from them, not random, so a
 * try after an interrupted hand-over carries the same ID and a receiving system (or our mail log) can
 * see it is the same message, not a new one.
 */
export function outboxMessageId(key: string, recipient: string, fromAddress: string): string {
  const digest = createHash('sha256')
    .update(`${key}\n${normaliseRecipient(recipient)}`)
    .digest('hex');
  const domain = fromAddress.split('@').pop() || 'stormhour.invalid';
  return `<${digest.slice(0, 32)}.outbox@${domain}>`;
}

// A practical check (one @, no spaces, a dot in the domain), not RFC 5322's full grammar: common practice.
const ADDRESS = /^[^\s@<>(),;:"]+@[^\s@<>(),;:"]+\.[^\s@<>(),;:"]+$/;
const KEY = /^[a-z0-9][a-z0-9:._-]{0,199}$/i;
const ATTACHMENT_LIMIT_BYTES = 20 * 1024 * 1024;

/** Every problem with a batch to queue, each naming the message and field. Empty when all is well. */
export function checkOutgoing(key: string, messages: OutgoingMail[]): ErrorDetail[] {
  const problems: ErrorDetail[] = [];
  if (!KEY.test(key))
    problems.push({
      where: 'key',
      problem: 'use letters, digits and : . _ - only (e.g. bulletin:12:v3), at most 200 characters',
    });
  if (messages.length === 0) problems.push({ where: 'messages', problem: 'there is no message to send' });
  const firstIndexOf = new Map<string, number>();
  messages.forEach((m, i) => {
    const at = `messages[${i}]`;
    const to = normaliseRecipient(m.to ?? '');
    if (!ADDRESS.test(to))
      problems.push({ where: `${at}.to`, problem: `"${m.to}" is not an e-mail address` });
    else if (firstIndexOf.has(to))
      problems.push({
        where: `${at}.to`,
        problem: `${to} is already messages[${firstIndexOf.get(to)}]; one message per recipient`,
      });
    else firstIndexOf.set(to, i);
    if (!m.subject?.trim()) problems.push({ where: `${at}.subject`, problem: 'the subject is empty' });
    else if (/[\r\n]/.test(m.subject))
      problems.push({ where: `${at}.subject`, problem: 'the subject must be one line' });
    if (!m.text?.trim()) problems.push({ where: `${at}.text`, problem: 'the plain-text body is empty' });
    (m.attachments ?? []).forEach((a, j) => {
      const where = `${at}.attachments[${j}]`;
      if (!a.filename?.trim() || /[\\/\r\n]/.test(a.filename))
        problems.push({ where: `${where}.filename`, problem: 'give a file name without folders' });
      if (!/^[a-z]+\/[a-z0-9.+-]+$/i.test(a.contentType ?? ''))
        problems.push({ where: `${where}.contentType`, problem: `"${a.contentType}" is not a content type` });
      if (!Buffer.isBuffer(a.content) || a.content.length === 0)
        problems.push({ where: `${where}.content`, problem: 'the attachment is empty' });
      else if (a.content.length > ATTACHMENT_LIMIT_BYTES)
        problems.push({ where: `${where}.content`, problem: 'the attachment is larger than 20 MB' });
    });
  });
  return problems;
}

/**
 * Of a checked batch, the messages whose recipient has no row for this key yet. The others were queued
 * (and perhaps sent) before, and are left alone: the same version never goes to anyone twice.
 */
export function newRecipientsOnly(messages: OutgoingMail[], alreadyQueued: Iterable<string>): OutgoingMail[] {
  const known = new Set([...alreadyQueued].map(normaliseRecipient));
  return messages.filter((m) => !known.has(normaliseRecipient(m.to)));
}

/**
 * A row found in 'sending' at start: the process stopped while handing it to SMTP, so whether the
 * server took it is unknown. With the local fake server the answer is in its mailbox (the fake stores a
 * message before it says "250 OK"), so the row is settled exactly. With a real server we cannot ask, and
 * we choose at-most-once: the row is marked failed with an explanation, never re-sent on its own; an
 * administrator may retry it after checking with the recipient.
 */
export function settleInterrupted(
  mailbox: 'fake' | 'smtp',
  deliveredToFake: boolean,
): { state: 'sent' } | { state: 'queued' } | { state: 'failed'; error: string } {
  if (mailbox === 'fake') return deliveredToFake ? { state: 'sent' } : { state: 'queued' };
  return {
    state: 'failed',
    error:
      'The server stopped while this message was being handed to the SMTP server, so it may or may not have ' +
      'been delivered. It is not sent again on its own; check with the recipient, then retry if needed ' +
      '(a retry carries the same Message-ID).',
  };
}
