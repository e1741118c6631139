import {
  type BeforeApplicationShutdown,
  Injectable,
  Logger,
  type OnApplicationBootstrap,
} from '@nestjs/common';
import type { NodemailerError } from 'nodemailer';
import { AuditService } from '../audit/audit.service.js';
import { MailRepository, type OutboxRow } from './mail.repository.js';
import { MailTransport } from './mail-transport.js';
import { afterFailure, describeSmtpFailure, settleInterrupted } from './outbox-rules.js';

/** The loop looks again at least this often, and sooner when a queued row falls due. */
const IDLE_POLL_MS = 60_000;
const MIN_WAIT_MS = 1_000;

export interface SendRun {
  sent: number;
  retrying: number;
  failed: number;
}

/**
 * Sends due outbox rows, one at a time, in this process: a timer set for the next due row (never
 * busy-polling), woken at once when something is queued. Each row is claimed ('sending', committed),
 * handed to SMTP outside any transaction, then marked sent or scheduled for a retry.
 */
@Injectable()
export class OutboxSender implements OnApplicationBootstrap, BeforeApplicationShutdown {
  private readonly logger = new Logger('Outbox');
  private chain: Promise<unknown> = Promise.resolve();
  private timer: NodeJS.Timeout | null = null;
  private stopped = false;

  constructor(
    private readonly repo: MailRepository,
    private readonly transport: MailTransport,
    private readonly audit: AuditService,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    await this.settleInterrupted();
    this.kick();
  }

  async beforeApplicationShutdown(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    // Let a message being handed over finish and be recorded before the database closes.
    await this.chain.catch(() => undefined);
    await this.transport.close();
  }

  /** Sends soon, without waiting (after an enqueue or a retry). */
  kick(): void {
    if (this.stopped) return;
    setImmediate(() => {
      this.sendDue().catch((err: unknown) => this.logger.error(`Sending failed: ${String(err)}`));
    });
  }

  /**
   * Sends every row due at `now` (default: the real clock at each row), after any run already going.
   * Tests pass a later `now` to reach rows waiting for a retry.
   */
  sendDue(now?: Date): Promise<SendRun> {
    const run = this.chain.then(() => this.run(now));
    this.chain = run.catch(() => undefined);
    return run;
  }

  private async run(fixedNow?: Date): Promise<SendRun> {
    const clock = () => fixedNow ?? new Date();
    const tally: SendRun = { sent: 0, retrying: 0, failed: 0 };
    // Attachments are shared by a send's recipients: read each from the database once per run.
    const blobCache = new Map<string, Buffer>();
    try {
      while (!this.stopped) {
        const row = await this.repo.claimDue(clock(), this.transport.mode);
        if (!row) break;
        tally[await this.sendOne(row, clock, blobCache)]++;
      }
    } finally {
      if (!this.stopped) await this.scheduleNext();
    }
    return tally;
  }

  private async sendOne(
    row: OutboxRow,
    clock: () => Date,
    blobs: Map<string, Buffer>,
  ): Promise<keyof SendRun> {
    const target = `outbox:${row.id}`;
    try {
      const missing = row.attachments.map((a) => a.sha256).filter((h) => !blobs.has(h));
      if (missing.length > 0) {
        // Bounded: a run's cache never holds more than a few sends' attachments.
        if (blobs.size > 32) blobs.clear();
        for (const [hash, content] of await this.repo.blobs(missing)) blobs.set(hash, content);
      }
      const info = await this.transport.send({
        to: row.recipient,
        subject: row.subject,
        text: row.text,
        html: row.html ?? undefined,
        messageId: row.messageId,
        headers: { 'X-Stormhour-Outbox': row.dedupeKey },
        attachments: row.attachments.map((a) => {
          const content = blobs.get(a.sha256);
          if (!content) throw new Error(`The attachment ${a.filename} is missing from the database`);
          return { filename: a.filename, contentType: a.contentType, content };
        }),
      });
      await this.repo.transaction(async (tx) => {
        await this.repo.updateOutbox(
          row.id,
          'sending',
          { state: 'sent', sentAt: clock(), lastError: null },
          tx,
        );
        await this.audit.record(
          null,
          'mail.sent',
          target,
          {
            key: row.dedupeKey,
            to: row.recipient,
            messageId: row.messageId,
            attempt: row.attempts,
            response: info.response,
          },
          tx,
        );
      });
      return 'sent';
    } catch (err) {
      const failure = err as NodemailerError;
      const error = describeSmtpFailure({
        code: failure.code,
        responseCode: failure.responseCode,
        response: failure.response,
        command: failure.command,
        message: failure.message,
      });
      const next = afterFailure(row.attempts, failure, clock());
      await this.repo.transaction(async (tx) => {
        await this.repo.updateOutbox(
          row.id,
          'sending',
          next.state === 'queued'
            ? { state: 'queued', lastError: error, nextAttemptAt: next.nextAttemptAt }
            : { state: 'failed', lastError: `${error} — not tried again: ${next.reason}.` },
          tx,
        );
        await this.audit.record(
          null,
          next.state === 'queued' ? 'mail.send-failed' : 'mail.failed',
          target,
          {
            key: row.dedupeKey,
            to: row.recipient,
            attempt: row.attempts,
            error,
            ...(next.state === 'queued'
              ? { retryAt: next.nextAttemptAt.toISOString() }
              : { reason: next.reason }),
          },
          tx,
        );
      });
      this.logger.warn(`Message ${target} to ${row.recipient} failed (try ${row.attempts}): ${error}`);
      return next.state === 'queued' ? 'retrying' : 'failed';
    }
  }

  /** Rows a stop left in 'sending' (see settleInterrupted for what each becomes, and why). */
  private async settleInterrupted(): Promise<void> {
    for (const row of await this.repo.inState('sending')) {
      const via = row.via ?? 'smtp';
      const delivered = via === 'fake' && (await this.repo.hasReceived(row.messageId));
      const settled = settleInterrupted(via, delivered);
      await this.repo.transaction(async (tx) => {
        await this.repo.updateOutbox(
          row.id,
          'sending',
          settled.state === 'sent'
            ? { state: 'sent', sentAt: row.lastAttemptAt ?? new Date(), lastError: null }
            : settled.state === 'queued'
              ? { state: 'queued', nextAttemptAt: new Date() }
              : { state: 'failed', lastError: settled.error },
          tx,
        );
        await this.audit.record(
          null,
          'mail.interrupted',
          `outbox:${row.id}`,
          { key: row.dedupeKey, to: row.recipient, via, settledAs: settled.state },
          tx,
        );
      });
    }
  }

  private async scheduleNext(): Promise<void> {
    if (this.timer) clearTimeout(this.timer);
    const due = await this.repo.nextDueAt();
    const wait = due
      ? Math.min(IDLE_POLL_MS, Math.max(MIN_WAIT_MS, due.getTime() - Date.now()))
      : IDLE_POLL_MS;
    this.timer = setTimeout(() => this.kick(), wait);
    // The timer alone must not keep the process alive.
    this.timer.unref();
  }
}
