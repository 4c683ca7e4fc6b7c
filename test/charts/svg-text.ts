// Reading a finished chart SVG back in tests: its text items, unescaped, in document order.

const ENTITIES: Record<string, string> = { '&lt;': '<', '&gt;': '>', '&amp;': '&', '&quot;': '"', '&#39;': "'" };

export function unescapeXml(text: string): string {
  return text.replace(/&(?:lt|gt|amp|quot|#39|#\d+|#x[\da-fA-F]+);/g, (e) =>
    e.startsWith('&#x') ? String.fromCodePoint(parseInt(e.slice(3, -1), 16)) : e.startsWith('&#') && e !== '&#39;' ? String.fromCodePoint(Number(e.slice(2, -1))) : ENTITIES[e],
  );
}

/** Contents of every <text> element. */
export function svgTexts(svg: string): string[] {
  return [...svg.matchAll(/<text\b[^>]*>([^<]*)<\/text>/g)].map((m) => unescapeXml(m[1]));
}

/** Every opening or self-closing tag. */
export function svgTags(svg: string): string[] {
  return [...svg.matchAll(/<[^/!][^>]*>/g)].map((m) => m[0]);
}
