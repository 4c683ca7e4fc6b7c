// Escaping text from library files wherever it lands: HTML/SVG text and attributes, JSON inside HTML.

const XML_ENTITIES: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text safe inside XML/HTML text and double- or single-quoted attributes. */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => XML_ENTITIES[c]);
}

/** JSON text with <, >, & and U+2028/9 as \u escapes: parses to the same value, inert inside HTML. */
export function escapeJsonMarkup(json: string): string {
  return json
    .replace(/</g, '\\u003c')
    .replace(/>/g, '\\u003e')
    .replace(/&/g, '\\u0026')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}
