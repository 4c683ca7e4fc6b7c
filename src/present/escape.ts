// Escaping text from library files wherever it lands: HTML and SVG text and attributes (pages, charts, PDF
// page furniture, schematics), text handed to vega, and JSON inside HTML.

// XML 1.0 forbids most C0 controls; they are dropped (the loader refuses them in library files, so this
// only guards text from elsewhere).
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;

const XML_ENTITIES: Readonly<Record<string, string>> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text safe inside XML/HTML text and double- or single-quoted attributes. */
export function escapeXml(text: string): string {
  return text.replace(CONTROL, '').replace(/[&<>"']/g, (c) => XML_ENTITIES[c]);
}

/** Control characters removed, for text handed to vega (which escapes markup but keeps controls). */
export function cleanText(text: string): string {
  return text.replace(CONTROL, '');
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
