import { describe, expect, it } from 'vitest';
import { richTextHtml } from './richText';

describe('richTextHtml (the bulletin preview)', () => {
  // Expected HTML as CommonMark 0.31 specifies it (spec examples for emphasis, strong emphasis and lists);
  // markdown-it follows that spec.
  it.each([
    ['*spray early*', '<p><em>spray early</em></p>\n'],
    ['**do not spray**', '<p><strong>do not spray</strong></p>\n'],
    ['- drain fields\n- cover produce', '<ul>\n<li>drain fields</li>\n<li>cover produce</li>\n</ul>\n'],
    ['1. first\n2. second', '<ol>\n<li>first</li>\n<li>second</li>\n</ol>\n'],
  ])('renders %j as the subset allows', (source, html) => {
    expect(richTextHtml(source)).toBe(html);
  });

  // The subset leaves everything else as text (common practice for untrusted input: escape, never interpret).
  it('shows raw HTML as text, so nothing typed can inject markup', () => {
    const html = richTextHtml('<script>alert(1)</script> <img src=x onerror=alert(1)>');
    expect(html).not.toContain('<script');
    expect(html).not.toContain('<img');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
  });

  it('leaves links, headings and images as the text that was typed', () => {
    const html = richTextHtml('# Title\n\n[site](http://example.invalid) ![x](y.png)');
    expect(html).toBe('<p># Title</p>\n<p>[site](http://example.invalid) ![x](y.png)</p>\n');
  });
});
