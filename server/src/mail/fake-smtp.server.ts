import type { AddressInfo } from 'node:net';
import { Injectable, Logger } from '@nestjs/common';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { MailRepository } from './mail.repository.js';

/** The largest message the fake accepts; a bulletin with its PDF is far smaller. */
const MAX_MESSAGE_BYTES = 25 * 1024 * 1024;

/**
 * The local stand-in for a mail server, used when no SMTP_URL is set: it listens on 127.0.0.1 only,
 * accepts every message and keeps it, exactly as received, in mail_received — the mailbox the admin's
 * Mail log shows. A message is stored before the server answers "250 OK"; the outbox relies on that to
 * settle rows a restart interrupted.
 */
@Injectable()
export class FakeSmtpServer {
  private readonly logger = new Logger('FakeSmtp');
  private server: SMTPServer | null = null;
  private boundPort = 0;

  constructor(private readonly repo: MailRepository) {}

  get port(): number {
    return this.boundPort;
  }

  /** Starts listening on 127.0.0.1; port 0 takes a free one. Resolves with the port. */
  async start(port: number): Promise<number> {
    const server = new SMTPServer({
      // smtp-server's built-in certificate has expired; on loopback nothing needs encrypting.
      disabledCommands: ['STARTTLS', 'AUTH'],
      authOptional: true,
      size: MAX_MESSAGE_BYTES,
      logger: false,
      banner: 'Stormhour local mail capture (nothing leaves this machine)',
      onData: (stream, session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (chunk: Buffer) => chunks.push(chunk));
        stream.on('error', callback);
        stream.on('end', () => {
          if (stream.sizeExceeded) {
            callback(Object.assign(new Error('Message is larger than 25 MB'), { responseCode: 552 }));
            return;
          }
          const raw = Buffer.concat(chunks);
          const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          this.store(raw, envelopeFrom, envelopeTo).then(
            () => callback(),
            (err: unknown) => {
              this.logger.error(`Could not store a received message: ${String(err)}`);
              callback(Object.assign(new Error('Could not store the message'), { responseCode: 451 }));
            },
          );
        });
      },
    });
    server.on('error', (err) => this.logger.warn(`Fake SMTP server: ${err.message}`));
    await new Promise<void>((resolve, reject) => {
      const listener = server.listen(port, '127.0.0.1', () => resolve());
      listener.once('error', reject);
    });
    this.server = server;
    this.boundPort = (server.server.address() as AddressInfo).port;
    return this.boundPort;
  }

  async stop(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }

  private async store(raw: Buffer, envelopeFrom: string, envelopeTo: string[]): Promise<void> {
    // Subject and Message-ID are read once here, for the list, from the header block alone (the bodies
    // and attachments are parsed only when someone opens the message). A message we cannot parse is kept.
    const headerEnd = raw.indexOf('\r\n\r\n');
    const headerBlock = headerEnd >= 0 ? raw.subarray(0, headerEnd + 4) : raw;
    const headers = await simpleParser(headerBlock, { skipHtmlToText: true, skipTextToHtml: true }).catch(
      () => null,
    );
    await this.repo.insertReceived({
      envelopeFrom,
      envelopeTo,
      messageId: headers?.messageId ?? null,
      subject: headers?.subject ?? null,
      sizeBytes: raw.length,
      raw,
    });
  }
}
