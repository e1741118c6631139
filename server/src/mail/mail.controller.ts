import { Controller, Get, Param, ParseIntPipe, Post, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { MailMessagesQuery, OutboxQuery, type SessionUser } from '@stormhour/shared';
import type { Response } from 'express';
import type { z } from 'zod';
import { CurrentUser, Roles } from '../common/access.decorators.js';
import { zodQuery } from '../common/zod-validation.pipe.js';
import { MailService } from './mail.service.js';
import { MailTransport } from './mail-transport.js';
import { MailboxService } from './mailbox.service.js';

/** A download: always saved, never shown inline, so a captured HTML file cannot run on our origin. */
function download(res: Response, filename: string, contentType: string, content: Buffer): StreamableFile {
  res.attachment(filename);
  res.type(contentType);
  return new StreamableFile(content, { length: content.length });
}

@ApiTags('mail')
@ApiBearerAuth()
@Controller('mail')
@Roles('admin')
export class MailController {
  constructor(
    private readonly mail: MailService,
    private readonly mailbox: MailboxService,
    private readonly transport: MailTransport,
  ) {}

  @Get('settings')
  settings() {
    return this.transport.settings();
  }

  @Get('outbox')
  outbox(@Query(zodQuery(OutboxQuery)) q: z.infer<typeof OutboxQuery>) {
    return this.mail.outbox(q);
  }

  @Post('outbox/:id/retry')
  retry(@CurrentUser() user: SessionUser, @Param('id', ParseIntPipe) id: number) {
    return this.mail.retry(user, id);
  }

  @Post('test')
  sendTest(@CurrentUser() user: SessionUser) {
    return this.mail.sendTest(user);
  }

  @Get('messages')
  messages(@Query(zodQuery(MailMessagesQuery)) q: z.infer<typeof MailMessagesQuery>) {
    return this.mailbox.list(q);
  }

  @Get('messages/:id')
  message(@Param('id', ParseIntPipe) id: number) {
    return this.mailbox.view(id);
  }

  @Get('messages/:id/source')
  async source(@Param('id', ParseIntPipe) id: number, @Res({ passthrough: true }) res: Response) {
    const { filename, content } = await this.mailbox.source(id);
    return download(res, filename, 'message/rfc822', content);
  }

  @Get('messages/:id/attachments/:index')
  async attachment(
    @Param('id', ParseIntPipe) id: number,
    @Param('index', ParseIntPipe) index: number,
    @Res({ passthrough: true }) res: Response,
  ) {
    const file = await this.mailbox.attachment(id, index);
    return download(res, file.filename, file.contentType, file.content);
  }
}
