import { Module } from '@nestjs/common';
import { FakeSmtpServer } from './fake-smtp.server.js';
import { MailController } from './mail.controller.js';
import { MailRepository } from './mail.repository.js';
import { MailService } from './mail.service.js';
import { MailTransport } from './mail-transport.js';
import { MailboxService } from './mailbox.service.js';
import { OutboxSender } from './outbox-sender.js';

/**
 * E-mail: the outbox (MailService.enqueue, the one way to send), its sender loop, the transport (a real
 * SMTP server or the local fake), and the fake's mailbox for the admin's Mail log.
 */
@Module({
  controllers: [MailController],
  providers: [MailRepository, FakeSmtpServer, MailTransport, OutboxSender, MailService, MailboxService],
  exports: [MailService],
})
export class MailModule {}
