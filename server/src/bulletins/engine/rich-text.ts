import MarkdownIt from 'markdown-it';

/**
 * The writer's free text: a Markdown subset of paragraphs, lists, *emphasis* and **strong**. Raw HTML
 * stays text (markdown-it's "zero" preset with html off), so nothing a writer types can inject markup
 * into the e-mail or the inbox. The same parse feeds the HTML, the plain text and the PDF.
 */
const markdown = new MarkdownIt('zero', { html: false }).enable(['emphasis', 'list']);

export interface TextRun {
  text: string;
  em: boolean;
  strong: boolean;
}

export type RichBlock =
  | { kind: 'paragraph'; runs: TextRun[] }
  | { kind: 'list'; ordered: boolean; items: TextRun[][] };

export function richTextHtml(source: string): string {
  return markdown.render(source);
}

/** The blocks and styled runs of a text, for renderers that are not HTML. */
export function richTextBlocks(source: string): RichBlock[] {
  const blocks: RichBlock[] = [];
  let list: Extract<RichBlock, { kind: 'list' }> | null = null;
  for (const token of markdown.parse(source, {})) {
    if (token.type === 'bullet_list_open' || token.type === 'ordered_list_open') {
      list = { kind: 'list', ordered: token.type === 'ordered_list_open', items: [] };
      blocks.push(list);
    } else if (token.type === 'bullet_list_close' || token.type === 'ordered_list_close') {
      list = null;
    } else if (token.type === 'inline') {
      const runs = inlineRuns(token.children ?? []);
      if (list) list.items.push(runs);
      else blocks.push({ kind: 'paragraph', runs });
    }
  }
  return blocks;
}

function inlineRuns(children: readonly { type: string; content: string }[]): TextRun[] {
  const runs: TextRun[] = [];
  let em = false;
  let strong = false;
  for (const t of children) {
    if (t.type === 'em_open') em = true;
    else if (t.type === 'em_close') em = false;
    else if (t.type === 'strong_open') strong = true;
    else if (t.type === 'strong_close') strong = false;
    else if (t.type === 'softbreak' || t.type === 'hardbreak') runs.push({ text: ' ', em, strong });
    else if (t.content) runs.push({ text: t.content, em, strong });
  }
  return runs;
}

/** Plain text: emphasis dropped, lists as "- item" or "1. item". */
export function richTextPlain(source: string): string {
  return richTextBlocks(source)
    .map((b) =>
      b.kind === 'paragraph'
        ? joinRuns(b.runs)
        : b.items.map((item, i) => `${b.ordered ? `${i + 1}.` : '-'} ${joinRuns(item)}`).join('\n'),
    )
    .join('\n\n');
}

function joinRuns(runs: TextRun[]): string {
  return runs.map((r) => r.text).join('');
}
