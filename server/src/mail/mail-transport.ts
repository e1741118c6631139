import { Inject, Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import type { MailSettingsView } from '@stormhour/shared';
import nodemailer, { type SendMailOptions, type SMTPSentMessageInfo, type Transporter } from 'nodemailer';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { FakeSmtpServer } from './fake-smtp.server.js';

// Short enough that a dead server fails a try quickly; the outbox retries later.
const TIMEOUTS = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 60_000 };

/**
 * Where mail goes: the SMTP server of SMTP_URL, or else the local fake started here on 127.0.0.1.
 * Only the outbox sender calls send(); nobody else hands mail to SMTP directly.
 */
@Injectable()
export class MailTransport implements OnModuleInit {
  private readonly logger = new Logger('Mail');
  private transporter: Transporter<SMTPSentMessageInfo> | null = null;
  readonly mode: 'fake' | 'smtp';

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly fake: FakeSmtpServer,
  ) {
    this.mode = config.smtpUrl ? 'smtp' : 'fake';
  }

  async onModuleInit(): Promise<void> {
    if (this.config.smtpUrl) {
      // A real server keeps its TLS: nodemailer upgrades with STARTTLS whenever the server offers it.
      this.transporter = nodemailer.createTransport({ url: this.config.smtpUrl, ...TIMEOUTS });
      this.logger.log(`Sending mail through ${this.settings().server}`);
      return;
    }
    const port = await this.fake.start(this.config.mailFakePort).catch((err: NodeJS.ErrnoException) => {
      throw new Error(
        err.code === 'EADDRINUSE'
          ? `MAIL_FAKE_PORT: port ${this.config.mailFakePort} on 127.0.0.1 is already in use; choose another or leave it unset for a free one.`
          : `The local mail capture server could not start: ${err.message}`,
      );
    });
    // The fake offers no STARTTLS (smtp-server's built-in certificate has expired) and is on loopback.
    this.transporter = nodemailer.createTransport({
      host: '127.0.0.1',
      port,
      secure: false,
      ignoreTLS: true,
      ...TIMEOUTS,
    });
    this.logger.log(`No SMTP_URL: mail is captured by the local fake server on 127.0.0.1:${port}`);
  }

  settings(): MailSettingsView {
    if (this.config.smtpUrl) {
      const url = new URL(this.config.smtpUrl);
      const port = url.port || (url.protocol === 'smtps:' ? '465' : '587');
      return { mode: 'smtp', server: `${url.hostname}:${port}`, from: this.config.mailFrom };
    }
    return { mode: 'fake', server: `127.0.0.1:${this.fake.port}`, from: this.config.mailFrom };
  }

  get from(): string {
    return this.config.mailFrom;
  }

  /** Hands one message to SMTP; rejects with nodemailer's error (code, responseCode, response). */
  send(message: SendMailOptions): Promise<SMTPSentMessageInfo> {
    if (!this.transporter) throw new Error('The mail transport is not started');
    return this.transporter.sendMail({ from: this.config.mailFrom, ...message });
  }

  async close(): Promise<void> {
    this.transporter?.close();
    this.transporter = null;
    await this.fake.stop();
  }
}
