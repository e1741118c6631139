import { Injectable, NotFoundException } from '@nestjs/common';
import type { MailMessageSummary, MailMessagesQuery, MailMessageView, Page } from '@stormhour/shared';
import { type AddressObject, simpleParser } from 'mailparser';
import { MailRepository, toSummary } from './mail.repository.js';

function addressText(value: AddressObject | AddressObject[] | undefined): string | null {
  if (!value) return null;
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

/** The local fake server's mailbox, as the admin's Mail log reads it. */
@Injectable()
export class MailboxService {
  constructor(private readonly repo: MailRepository) {}

  list(query: MailMessagesQuery): Promise<Page<MailMessageSummary>> {
    return this.repo.pageReceived(query.offset, query.limit, query.q);
  }

  private async row(id: number) {
    const row = await this.repo.findReceived(id);
    if (!row) throw new NotFoundException(`There is no received message with id ${id}.`);
    return row;
  }

  /** The message parsed (mailparser): headers as received, both bodies, and its attachments. */
  async view(id: number): Promise<MailMessageView> {
    const row = await this.row(id);
    const parsed = await simpleParser(row.raw, { skipTextToHtml: true, skipHtmlToText: true });
    return {
      ...toSummary(row),
      from: addressText(parsed.from),
      to: addressText(parsed.to),
      cc: addressText(parsed.cc),
      date: parsed.date?.toISOString() ?? null,
      headers: parsed.headerLines.map((h) => ({ key: h.key, line: h.line })),
      text: parsed.text ?? null,
      html: typeof parsed.html === 'string' ? parsed.html : null,
      attachments: parsed.attachments.map((a, index) => ({
        index,
        filename: a.filename ?? null,
        contentType: a.contentType,
        size: a.size,
      })),
    };
  }

  async attachment(
    id: number,
    index: number,
  ): Promise<{ filename: string; contentType: string; content: Buffer }> {
    const row = await this.row(id);
    const parsed = await simpleParser(row.raw, { skipTextToHtml: true, skipHtmlToText: true });
    const found = parsed.attachments[index];
    if (!found)
      throw new NotFoundException({
        message: `Message ${id} has ${parsed.attachments.length} attachment(s); there is no attachment ${index}.`,
        details: [{ where: `attachments[${index}]`, problem: 'no such attachment' }],
      });
    return {
      filename: found.filename ?? `attachment-${index + 1}`,
      contentType: found.contentType,
      content: found.content,
    };
  }

  /** The message exactly as received (an .eml file). */
  async source(id: number): Promise<{ filename: string; content: Buffer }> {
    const row = await this.row(id);
    return { filename: `message-${id}.eml`, content: row.raw };
  }
}
