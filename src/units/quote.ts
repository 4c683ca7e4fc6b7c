// A found value as a message quotes it: short, in double quotes, with control characters escaped.

/** The most characters of a found value a message quotes; longer ones are cut with "…" and their length. */
export const QUOTE_LIMIT = 80;

/**
 * A found value for a message: in double quotes, control characters escaped, at most QUOTE_LIMIT characters
 * (a longer one says how long it was), so no input can make a message longer than a line or two.
 */
export function quote(text: string, limit = QUOTE_LIMIT): string {
  const chars = [...text];
  if (chars.length <= limit) return JSON.stringify(text).replace(/[\u007f-\u009f\u2028\u2029]/g, escapeChar);
  const head = JSON.stringify(chars.slice(0, limit).join('')).replace(/[\u007f-\u009f\u2028\u2029]/g, escapeChar);
  return `${head.slice(0, -1)}…" (${chars.length} characters)`;
}

function escapeChar(c: string): string {
  return `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`;
}

