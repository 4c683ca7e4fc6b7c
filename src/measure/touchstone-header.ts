// The comment lines a Touchstone file opens with, before its option line or first keyword: where makers and
// analysers say what was measured, how and when (Touchstone File Format Specification 2.0, IBIS Open Forum,
// 2009: "!" starts a comment anywhere). A datasheet page quotes them beside the measurement.

export interface FileHeader {
  /** The opening comments, each without its "!" and surrounding blanks; blank comment lines dropped. */
  lines: string[];
  /** How many further opening comment lines there were beyond `maxLines`. */
  more: number;
}

/** The file's opening comment lines, at most `maxLines` of them. */
export function headerComments(text: string, maxLines = 8): FileHeader {
  const lines: string[] = [];
  let more = 0;
  for (const raw of text.split(/\r\n|\r|\n/)) {
    const line = raw.trim();
    if (line === '') continue;
    if (!line.startsWith('!')) break;
    const comment = line.slice(1).trim();
    if (comment === '') continue;
    if (lines.length < maxLines) lines.push(comment);
    else more++;
  }
  return { lines, more };
}
