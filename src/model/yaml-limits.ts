// Limits on what a library file may hold, checked on the raw text before the YAML reader sees it: the
// reader builds nested structures by recursion and slows down on very long flow lists, so a file nested
// thousands of levels deep or with a million-item list could exhaust the stack or memory. One linear scan
// finds the first place a limit is passed and says so there.

/** A library file larger than this is refused unread: a part, plan or review file is a few kilobytes. */
export const MAX_FILE_BYTES = 5 * 1024 * 1024;
/** Lines in one file. */
export const MAX_LINES = 100_000;
/** Lists and mappings nested in one another. */
export const MAX_DEPTH = 64;
/** Items in one list or mapping. */
export const MAX_ITEMS = 10_000;
/**
 * Items of all flow lists and mappings ("[a, b]", "{a: 1}") in one file. The YAML reader takes about 15 µs
 * an item in flow style, so this keeps a file within a couple of seconds however its items are split up.
 */
export const MAX_FLOW_ITEMS = 100_000;

export interface LimitProblem {
  /** Character offset (UTF-16) where the limit is passed. */
  offset: number;
  message: string;
}

export const depthMessage = `lists and mappings are nested more than ${MAX_DEPTH} levels deep here; a library file needs only a few levels`;
export const widthMessage = `a list or mapping with more than ${MAX_ITEMS} items; split it up`;
export const flowItemsMessage = `more than ${MAX_FLOW_ITEMS} items in "[...]" and "{...}" lists and mappings in one file; a library file is expected to be far smaller`;

/**
 * The first limit the text passes, found without parsing: nesting of block and flow collections (block
 * indentation and "- " / "? " indicators, flow brackets outside quotes and comments), items of one flow
 * collection, and the number of lines. Block collections' item counts are checked after parsing, where
 * they are cheap to count.
 */
export function firstLimitProblem(text: string): LimitProblem | undefined {
  // The scan counts a "- " item's line as a level of its own, one more than the sequence really nests; with
  // one level of slack it fires only where the file surely passes the limit. Depths up to it are checked
  // exactly after parsing.
  const limit = MAX_DEPTH + 1;
  const indents: number[] = [];
  // Items counted in each open flow collection.
  const flow: number[] = [];
  let line = 0;
  let i = 0;
  const n = text.length;
  let quote: '"' | "'" | undefined;
  // A block scalar ("|" or ">") owns every following line indented deeper than this; -1: none.
  let blockScalarIndent = -1;
  // Block nesting where the outermost open flow collection started.
  let indentsAtFlowStart = 0;
  let flowItems = 0;

  while (i < n) {
    // Start of a line.
    line++;
    if (line > MAX_LINES) return { offset: i, message: `the file has more than ${MAX_LINES} lines; a library file is expected to be far smaller` };
    let indent = 0;
    while (i + indent < n && text[i + indent] === ' ') indent++;
    const end = lineEnd(text, i);
    const blank = i + indent >= end || text[i + indent] === '#';
    if (blockScalarIndent >= 0 && !quote && flow.length === 0) {
      if (blank || indent > blockScalarIndent) {
        i = end + 1;
        continue;
      }
      blockScalarIndent = -1;
    }
    if (blank && !quote && flow.length === 0) {
      i = end + 1;
      continue;
    }
    let j = i + indent;
    if (!quote && flow.length === 0) {
      while (indents.length > 0 && indents[indents.length - 1] >= indent) indents.pop();
      indents.push(indent);
      // Compact nesting on one line: "- - x", "? - x", "- key: ...".
      let column = indent;
      while (j + 1 < end && (text[j] === '-' || text[j] === '?' || text[j] === ':') && (text[j + 1] === ' ' || text[j + 1] === '\t')) {
        j += 2;
        column += 2;
        while (j < end && text[j] === ' ') {
          j++;
          column++;
        }
        indents.push(column);
        if (indents.length > limit) return { offset: j, message: depthMessage };
      }
      if (indents.length > limit) return { offset: i + indent, message: depthMessage };
    }
    const blockDepth = flow.length === 0 && !quote ? indents.length : indentsAtFlowStart;
    // Scan the rest of the line for quotes, comments and flow brackets.
    let atValueStart = true;
    for (; j < end; j++) {
      const c = text[j];
      if (quote) {
        if (quote === '"' && c === '\\') j++;
        else if (c === quote) {
          if (quote === "'" && text[j + 1] === "'") j++;
          else quote = undefined;
        }
        continue;
      }
      if (c === '#' && (j === 0 || text[j - 1] === ' ' || text[j - 1] === '\t')) break;
      if (flow.length === 0) {
        // Block context: a flow collection, quote or block scalar can only open where a value starts.
        if (c === ' ' || c === '\t') continue;
        if (atValueStart) {
          if (c === '[' || c === '{') {
            indentsAtFlowStart = blockDepth;
            flow.push(0);
            if (blockDepth + flow.length > limit) return { offset: j, message: depthMessage };
            continue;
          }
          if (c === '"' || c === "'") {
            quote = c;
            continue;
          }
          if (c === '|' || c === '>') {
            blockScalarIndent = indent;
            break;
          }
        }
        atValueStart = c === ':' && (j + 1 >= end || text[j + 1] === ' ' || text[j + 1] === '\t');
        continue;
      }
      // Flow context.
      if (c === '[' || c === '{') {
        flow.push(0);
        if (indentsAtFlowStart + flow.length > limit) return { offset: j, message: depthMessage };
      } else if (c === ']' || c === '}') {
        flow.pop();
        atValueStart = false;
      } else if (c === ',') {
        if (++flow[flow.length - 1] >= MAX_ITEMS) return { offset: j, message: widthMessage };
        if (++flowItems >= MAX_FLOW_ITEMS) return { offset: j, message: flowItemsMessage };
      } else if ((c === '"' || c === "'") && isFlowValueStart(text, j)) {
        quote = c;
      }
    }
    i = end + 1;
  }
  return undefined;
}

/** A quote opens a quoted scalar only where a flow item or value starts. */
function isFlowValueStart(text: string, j: number): boolean {
  let k = j - 1;
  while (k >= 0 && (text[k] === ' ' || text[k] === '\t' || text[k] === '\n' || text[k] === '\r')) k--;
  return k < 0 || '[{,:'.includes(text[k]);
}

function lineEnd(text: string, from: number): number {
  const end = text.indexOf('\n', from);
  return end < 0 ? text.length : end;
}
