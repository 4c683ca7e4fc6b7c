// Short markdown in review files (decisions, open points, summary): emphasis, code, lists and paragraphs.
// Raw HTML is escaped, and links and images are left as their text, so a review can bring in nothing from
// outside and run nothing.

import MarkdownIt from 'markdown-it';

const md = new MarkdownIt('commonmark', { html: false, linkify: false, typographer: false }).disable(['link', 'image', 'autolink', 'html_inline', 'html_block', 'reference']);

/** A block of markdown as HTML (paragraphs, lists). */
export function markdownBlock(text: string): string {
  return md.render(text).trim();
}

/** One line of markdown as inline HTML (no surrounding paragraph). */
export function markdownInline(text: string): string {
  return md.renderInline(text);
}
