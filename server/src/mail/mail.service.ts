import { createHash } from 'node:crypto';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type { OutboxEntry, OutboxQuery, OutboxRecipientStatus, Page, SessionUser } from '@stormhour/shared';
import addressparser from 'nodemailer/lib/addressparser';
import { AuditService } from '../audit/audit.service.js';
import type { Executor } from '../database/database.js';
import type { OutboxAttachmentRef } from '../database/schema.js';
import { MailRepository, type NewOutboxRow, type OutboxRow } from './mail.repository.js';
import { MailTransport } from './mail-transport.js';
import {
  checkOutgoing,
  newRecipientsOnly,
  normaliseRecipient,
  type OutgoingMail,
  outboxMessageId,
} from './outbox-rules.js';
import { OutboxSender, type SendRun } from './outbox-sender.js';

export type { OutgoingMail } from './outbox-rules.js';

export interface EnqueueResult {
  key: string;
  /** Rows made now, one per new recipient. */
  queued: OutboxEntry[];
  /** Recipients this key already had a row for: left as they were, not sent again. */
  alreadyQueued: string[];
}

type Actor = Pick<SessionUser, 'id' | 'email'> | null;

export function toOutboxEntry(row: OutboxRow): OutboxEntry {
  return {
    id: row.id,
    key: row.dedupeKey,
    recipient: row.recipient,
    subject: row.subject,
    state: row.state,
    attempts: row.attempts,
    lastError: row.lastError,
    nextAttemptAt: row.state === 'queued' ? row.nextAttemptAt.toISOString() : null,
    sentAt: row.sentAt?.toISOString() ?? null,
    messageId: row.messageId,
    attachments: row.attachments.map((a) => ({
      filename: a.filename,
      contentType: a.contentType,
      size: a.size,
    })),
    createdAt: row.createdAt.toISOString(),
  };
}

function toStatus(row: OutboxRow): OutboxRecipientStatus {
  const { id, recipient, state, attempts, lastError, nextAttemptAt, sentAt, messageId } = toOutboxEntry(row);
  return { id, recipient, state, attempts, lastError, nextAttemptAt, sentAt, messageId };
}

/**
 * The one way to send e-mail from Stormhour. Callers queue messages under a dedupe key (e.g.
 * `bulletin:12:v3`); each (key, recipient) is sent at most once, by the outbox sender, with retries.
 */
@Injectable()
export class MailService {
  constructor(
    private readonly repo: MailRepository,
    private readonly sender: OutboxSender,
    private readonly transport: MailTransport,
    private readonly audit: AuditService,
  ) {}

  /**
   * Queues one message per recipient under `key`, all in one transaction (the caller's, when given, so a
   * bulletin's state and its outbox rows commit together). Idempotent: recipients the key already has are
   * skipped. Throws a 400 naming each bad message and field; nothing is queued then.
   */
  async enqueue(
    key: string,
    messages: OutgoingMail[],
    options: { actor?: Actor; tx?: Executor } = {},
  ): Promise<EnqueueResult> {
    const problems = checkOutgoing(key, messages);
    if (problems.length > 0)
      throw new BadRequestException({
        message: `The messages for ${key || 'this send'} were not queued: ${problems
          .map((p) => `${p.where}: ${p.problem}`)
          .join('; ')}`,
        details: problems,
      });
    const work = async (tx: Executor): Promise<EnqueueResult> => {
      const existing = await this.repo.recipientsOf(key, tx);
      const fresh = newRecipientsOnly(messages, existing);
      // A bulletin's PDF goes to every officer: hash each distinct buffer once and store it once.
      const hashes = new Map<Buffer, string>();
      const stored = new Set<string>();
      const rows: NewOutboxRow[] = [];
      for (const m of fresh) {
        const attachments: OutboxAttachmentRef[] = [];
        for (const a of m.attachments ?? []) {
          let sha256 = hashes.get(a.content);
          if (!sha256) {
            sha256 = createHash('sha256').update(a.content).digest('hex');
            hashes.set(a.content, sha256);
          }
          if (!stored.has(sha256)) {
            await this.repo.storeBlob(sha256, a.content, tx);
            stored.add(sha256);
          }
          attachments.push({
            filename: a.filename.trim(),
            contentType: a.contentType,
            sha256,
            size: a.content.length,
          });
        }
        const recipient = normaliseRecipient(m.to);
        rows.push({
          dedupeKey: key,
          recipient,
          subject: m.subject.trim(),
          text: m.text,
          html: m.html ?? null,
          attachments,
          messageId: outboxMessageId(key, recipient, this.fromAddress()),
          createdBy: options.actor?.id ?? null,
        });
      }
      // The unique index backs the check above: a concurrent enqueue of the same key cannot add a second row.
      const inserted = await this.repo.insertOutbox(rows, tx);
      const insertedRecipients = new Set(inserted.map((r) => r.recipient));
      const alreadyQueued = messages
        .map((m) => normaliseRecipient(m.to))
        .filter((to) => !insertedRecipients.has(to));
      await this.audit.record(
        options.actor ?? null,
        'mail.enqueue',
        `mail:${key}`,
        { queued: inserted.length, alreadyQueued: alreadyQueued.length },
        tx,
      );
      return { key, queued: inserted.map(toOutboxEntry), alreadyQueued };
    };
    const result = options.tx ? await work(options.tx) : await this.repo.transaction(work);
    if (result.queued.length > 0) this.sender.kick();
    return result;
  }

  /** Per recipient, where the messages of a key stand (for a bulletin's "sent to" list). */
  async statusOf(key: string): Promise<OutboxRecipientStatus[]> {
    return (await this.repo.byKey(key)).map(toStatus);
  }

  /**
   * Puts a failed (or waiting) row back in the queue now, with a fresh retry schedule. A sent row or one
   * being sent is refused: sending it again would give the recipient a second copy.
   */
  async retry(actor: Actor, id: number): Promise<OutboxEntry> {
    const row = await this.repo.findOutbox(id);
    if (!row) throw new NotFoundException(`There is no outbox message with id ${id}.`);
    if (row.state === 'sent')
      throw new ConflictException({
        message: `The message to ${row.recipient} was already sent (${row.sentAt?.toISOString()}); sending it again would give them a second copy.`,
        details: [{ where: `outbox:${id}`, problem: 'already sent' }],
      });
    if (row.state === 'sending')
      throw new ConflictException({
        message: `The message to ${row.recipient} is being sent right now; wait for the outcome.`,
        details: [{ where: `outbox:${id}`, problem: 'being sent' }],
      });
    const changed = await this.repo.transaction(async (tx) => {
      const ok = await this.repo.updateOutbox(
        id,
        row.state,
        { state: 'queued', attempts: 0, nextAttemptAt: new Date() },
        tx,
      );
      if (ok)
        await this.audit.record(
          actor,
          'mail.retry',
          `outbox:${id}`,
          { key: row.dedupeKey, to: row.recipient, was: row.state, lastError: row.lastError },
          tx,
        );
      return ok;
    });
    if (!changed)
      throw new ConflictException({
        message: 'The message changed state meanwhile; reload the outbox and try again.',
        details: [{ where: `outbox:${id}`, problem: 'changed meanwhile' }],
      });
    this.sender.kick();
    return toOutboxEntry((await this.repo.findOutbox(id)) as OutboxRow);
  }

  async outbox(query: OutboxQuery): Promise<Page<OutboxEntry>> {
    const page = await this.repo.pageOutbox(query.offset, query.limit, {
      state: query.state,
      key: query.key,
    });
    return { ...page, items: page.items.map(toOutboxEntry) };
  }

  /** Sends every due message now and waits (tests; the sender also runs on its own timer). */
  sendDue(now?: Date): Promise<SendRun> {
    return this.sender.sendDue(now);
  }

  /** A message to the signed-in administrator, to check the mail settings end to end. */
  async sendTest(actor: SessionUser): Promise<OutboxEntry> {
    const settings = this.transport.settings();
    const when = new Date().toISOString();
    const where =
      settings.mode === 'fake'
        ? 'the local capture server (it appears in the Mail log and goes nowhere else)'
        : `the SMTP server ${settings.server}`;
    const result = await this.enqueue(
      `test:${actor.id}:${Date.now()}`,
      [
        {
          to: actor.email,
          subject: 'Stormhour test message',
          text: `This is a test message from Stormhour, asked for by ${actor.email} at ${when}.\n\nIt was sent through ${where} from ${settings.from}. If you can read it, sending works.\n`,
          html: `<p>This is a test message from <strong>Stormhour</strong>, asked for by ${escapeHtml(actor.email)} at ${when}.</p><p>It was sent through ${escapeHtml(where)} from ${escapeHtml(settings.from)}. If you can read it, sending works.</p>`,
          attachments: [
            {
              filename: 'mail-settings.txt',
              contentType: 'text/plain',
              content: Buffer.from(
                `mode: ${settings.mode}\nserver: ${settings.server}\nfrom: ${settings.from}\n`,
              ),
            },
          ],
        },
      ],
      { actor },
    );
    await this.audit.record(actor, 'mail.test', `outbox:${result.queued[0].id}`, {
      to: actor.email,
      mode: settings.mode,
    });
    return result.queued[0];
  }

  private fromAddress(): string {
    const [first] = addressparser(this.transport.from, { flatten: true });
    return first?.address ?? 'bulletins@stormhour.invalid';
  }
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}
