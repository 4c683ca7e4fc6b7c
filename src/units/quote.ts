// A found value as a message quotes it: short, in double quotes, with control characters escaped.

/** The most characters of a found value a message quotes; longer ones are cut with "…" and their length. */
export const QUOTE_LIMIT = 80;

/**
 * A found value for a message: in double quotes, control characters escaped, at most QUOTE_LIMIT characters
 * (a longer one says how long it was), so no input can make a message longer than a line or two.
 */
export function quote(text: string, limit = QUOTE_LIMIT): string {
  // Only the head is split into characters: the value may be megabytes long.
  const head: string[] = [];
  for (const c of text) {
    if (head.length === limit) break;
    head.push(c);
  }
  const shown = JSON.stringify(head.join('')).replace(/[\u007f-\u009f\u2028\u2029]/g, escapeChar);
  const length = codePointLength(text);
  return length <= limit ? shown : `${shown.slice(0, -1)}…" (${length} characters)`;
}

/** Characters (code points) in `text`: UTF-16 units less the second half of each surrogate pair. */
function codePointLength(text: string): number {
  let n = text.length;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0xdc00 && c <= 0xdfff && i > 0) {
      const p = text.charCodeAt(i - 1);
      if (p >= 0xd800 && p <= 0xdbff) n--;
    }
  }
  return n;
}

function escapeChar(c: string): string {
  return `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`;
}

