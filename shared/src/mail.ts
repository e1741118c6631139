import { z } from 'zod';

/**
 * An outbox row's life: queued (waiting, perhaps after a failed try) → sending (handed to SMTP now) →
 * sent, or failed (a permanent refusal, too many tries, or an interrupted hand-over; see the error).
 */
export const OUTBOX_STATES = ['queued', 'sending', 'sent', 'failed'] as const;
export type OutboxState = (typeof OUTBOX_STATES)[number];

export interface OutboxAttachmentInfo {
  filename: string;
  contentType: string;
  size: number;
}

/** One (dedupe key, recipient) of the outbox, without its bodies. */
export interface OutboxEntry {
  id: number;
  key: string;
  recipient: string;
  subject: string;
  state: OutboxState;
  attempts: number;
  lastError: string | null;
  /** When the sender will try next (queued rows only). */
  nextAttemptAt: string | null;
  sentAt: string | null;
  messageId: string;
  attachments: OutboxAttachmentInfo[];
  createdAt: string;
}

export const OutboxQuery = z.object({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  state: z.enum(OUTBOX_STATES, { message: `state must be one of ${OUTBOX_STATES.join(', ')}` }).optional(),
  key: z.string().trim().min(1).optional(),
});
export type OutboxQuery = z.infer<typeof OutboxQuery>;

export const MailMessagesQuery = z.object({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  /** Matches the subject, the sender or a recipient, ignoring case. */
  q: z.string().trim().min(1).optional(),
});
export type MailMessagesQuery = z.infer<typeof MailMessagesQuery>;

/** A message the local fake SMTP server received, as listed in the Mail log. */
export interface MailMessageSummary {
  id: number;
  receivedAt: string;
  envelopeFrom: string;
  envelopeTo: string[];
  subject: string | null;
  messageId: string | null;
  sizeBytes: number;
  /** How many captured messages share this Message-ID (more than 1 means a duplicate was delivered). */
  sameMessageIdCount: number;
}

export interface MailAttachmentInfo {
  index: number;
  filename: string | null;
  contentType: string;
  size: number;
}

/** A captured message, parsed, as the Mail log shows it. */
export interface MailMessageView extends MailMessageSummary {
  from: string | null;
  to: string | null;
  cc: string | null;
  date: string | null;
  /** Header lines exactly as received, in order. */
  headers: { key: string; line: string }[];
  text: string | null;
  /** The HTML body as sent; the client shows it only in a sandboxed frame with scripts off. */
  html: string | null;
  attachments: MailAttachmentInfo[];
}

/** What the sender reports for one recipient of a dedupe key (a bulletin version, say). */
export interface OutboxRecipientStatus {
  id: number;
  recipient: string;
  state: OutboxState;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string | null;
  sentAt: string | null;
  messageId: string;
}

export interface MailSettingsView {
  /** 'fake': the local capture server (nothing leaves the machine); 'smtp': a real server. */
  mode: 'fake' | 'smtp';
  /** Host and port only: credentials in SMTP_URL are never shown. */
  server: string;
  from: string;
}
