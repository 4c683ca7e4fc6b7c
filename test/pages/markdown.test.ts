// Markdown in review files: emphasis, code and lists as CommonMark (spec 0.31) renders them, and nothing
// from outside: raw HTML is shown as text, links and images stay their text, no URL reaches the page.

import { describe, expect, it } from 'vitest';
import { markdownBlock, markdownInline } from '../../src/pages/markdown.js';

describe('review markdown', () => {
  it('renders emphasis, code, lists and paragraphs', () => {
    expect(markdownInline('**VDD_CORE** is accepted; see `zfolio plan`')).toBe('<strong>VDD_CORE</strong> is accepted; see <code>zfolio plan</code>');
    expect(markdownBlock('first\n\n- one\n- two')).toBe('<p>first</p>\n<ul>\n<li>one</li>\n<li>two</li>\n</ul>');
  });

  it('escapes raw HTML instead of passing it through', () => {
    expect(markdownInline('<script>alert(1)</script> and <b>bold</b>')).toBe('&lt;script&gt;alert(1)&lt;/script&gt; and &lt;b&gt;bold&lt;/b&gt;');
    expect(markdownBlock('<div onclick="x()">block</div>')).toBe('<p>&lt;div onclick=&quot;x()&quot;&gt;block&lt;/div&gt;</p>');
  });

  it('leaves links, images and autolinks as their text: no URL becomes an address', () => {
    for (const text of ['[the plan](https://example.invalid/plan)', '![chart](https://example.invalid/c.png)', '<https://example.invalid>']) {
      const html = markdownInline(text);
      expect(html).not.toMatch(/<a\b|<img\b|href=|src=/);
    }
  });
});
