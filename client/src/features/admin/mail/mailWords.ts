import type { OutboxState } from '@stormhour/shared';

type TagType = 'gray' | 'warm-gray' | 'blue' | 'green' | 'red';

/** How each outbox state reads, with a Carbon tag colour. */
export const OUTBOX_STATE_TAGS: Record<OutboxState, { text: string; type: TagType }> = {
  queued: { text: 'Queued', type: 'gray' },
  sending: { text: 'Sending', type: 'blue' },
  sent: { text: 'Sent', type: 'green' },
  failed: { text: 'Failed', type: 'red' },
};

const RETRY_TEXT = 'Waiting to retry';

/** A byte count as people read it: 812 B, 14.2 kB, 3.1 MB (powers of 1000, as SI prefixes mean). */
export function formatBytes(bytes: number): string {
  if (bytes < 1000) return `${bytes} B`;
  if (bytes < 1_000_000) return `${(bytes / 1000).toFixed(1)} kB`;
  return `${(bytes / 1_000_000).toFixed(1)} MB`;
}

/** A queued row that has failed before is waiting to retry; say so rather than just "queued". */
export function outboxStateText(state: OutboxState, attempts: number): string {
  if (state === 'queued' && attempts > 0) return RETRY_TEXT;
  return OUTBOX_STATE_TAGS[state].text;
}

/** The tag colour for a state as outboxStateText wrote it. */
export function outboxStateTagType(text: string): TagType {
  if (text === RETRY_TEXT) return 'warm-gray';
  return Object.values(OUTBOX_STATE_TAGS).find((t) => t.text === text)?.type ?? 'gray';
}

/** Who a captured message went to, shortened for a table cell. */
export function recipientsText(envelopeTo: string[], max = 2): string {
  if (envelopeTo.length <= max) return envelopeTo.join(', ');
  return `${envelopeTo.slice(0, max).join(', ')} and ${envelopeTo.length - max} more`;
}

/**
 * The HTML body as the sandboxed frame gets it. The frame runs no scripts (sandbox=""), and this page's
 * policy forbids loading anything from elsewhere, so remote images and trackers stay blank.
 */
export function framedHtml(html: string): string {
  return `<!doctype html><html><head><meta charset="utf-8"><base target="_blank"></head><body>${html}</body></html>`;
}
