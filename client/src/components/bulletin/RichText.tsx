import { richTextHtml } from '../../lib/richText';

/** A writer's text in the Markdown subset, rendered as officers see it. */
export function RichText({ source, className }: { source: string; className?: string }) {
  return (
    <div
      className={['rich-text', className].filter(Boolean).join(' ')}
      // The subset's parser keeps raw HTML as text (html: false), so its output is safe to insert.
      // biome-ignore lint/security/noDangerouslySetInnerHtml: output of the escaping Markdown subset only
      dangerouslySetInnerHTML={{ __html: richTextHtml(source) }}
    />
  );
}
