import MarkdownIt from 'markdown-it';

/**
 * The writer's free text as officers will see it. This is the server's own parser set-up
 * (server/src/bulletins/engine/rich-text.ts): markdown-it's "zero" preset with raw HTML off and only
 * emphasis and lists turned on, so the preview renders exactly what the e-mail and the inbox render,
 * and anything a writer types that looks like markup stays text.
 */
const markdown = new MarkdownIt('zero', { html: false }).enable(['emphasis', 'list']);

export function richTextHtml(source: string): string {
  return markdown.render(source);
}
