// Which fields of a YAML file changed between two revisions, as written: paths like "parasitics.esl" or
// "capacitors[ORV-C-0402-100N-X7R].count", each with the value before and after (null where absent).
// Files are compared as the data they hold (the failsafe reading: every scalar a string), so a comment or a
// reflowed line is no change, while "0.45n" → "450p" is one even though the number is the same: this is
// what the file says, and the moved figures say what it means.

export interface FieldChange {
  /** Dotted path; list items by their key field ([PART-ID]) when the list has one, else by index ([2]). */
  path: string;
  /** The value before, as written (a string, list or mapping), or null when the field was absent. */
  before: unknown;
  after: unknown;
}

/** Fields that name a list item, so an inserted item does not shift every later index. */
const KEY_FIELDS = ['part', 'id', 'name', 'text', 'file'];

type Plain = Record<string, unknown>;

const isPlain = (v: unknown): v is Plain => typeof v === 'object' && v !== null && !Array.isArray(v);

export function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => sameValue(x, b[i]));
  if (isPlain(a) && isPlain(b)) {
    const ka = Object.keys(a);
    const kb = Object.keys(b);
    return ka.length === kb.length && ka.every((k) => Object.hasOwn(b, k) && sameValue(a[k], b[k]));
  }
  return false;
}

/** The key field every item of both lists has, with values unique in each; undefined when there is none. */
function keyFieldOf(before: unknown[], after: unknown[]): string | undefined {
  const items = [...before, ...after];
  if (items.length === 0 || !items.every(isPlain)) return undefined;
  return KEY_FIELDS.find((key) =>
    [before, after].every((list) => {
      const values = list.map((item) => (item as Plain)[key]);
      return values.every((v) => typeof v === 'string') && new Set(values).size === values.length;
    }),
  );
}

const join = (path: string, key: string) => (path === '' ? key : `${path}.${key}`);

/** Every field that differs between `before` and `after` (the data of one file at two revisions), in file order. */
export function fieldChanges(before: unknown, after: unknown, path = ''): FieldChange[] {
  if (sameValue(before, after)) return [];
  if (isPlain(before) && isPlain(after)) {
    const keys = [...Object.keys(before), ...Object.keys(after).filter((k) => !Object.hasOwn(before, k))];
    return keys.flatMap((k) => fieldChanges(Object.hasOwn(before, k) ? before[k] : null, Object.hasOwn(after, k) ? after[k] : null, join(path, k)));
  }
  // A keyed list added or removed whole (a part's first measurement) is listed item by item, like an item
  // added to a list that was there.
  if (before === null && Array.isArray(after) && keyFieldOf([], after) !== undefined) return fieldChanges([], after, path);
  if (after === null && Array.isArray(before) && keyFieldOf(before, []) !== undefined) return fieldChanges(before, [], path);
  if (Array.isArray(before) && Array.isArray(after)) {
    const key = keyFieldOf(before, after);
    if (key !== undefined) {
      const byKey = (list: unknown[]) => new Map(list.map((item) => [(item as Plain)[key] as string, item]));
      const old = byKey(before);
      const now = byKey(after);
      const names = [...old.keys(), ...[...now.keys()].filter((k) => !old.has(k))];
      return names.flatMap((name) => fieldChanges(old.get(name) ?? null, now.get(name) ?? null, `${path}[${name}]`));
    }
    // Lists of plain values (tags, decisions) change as a whole unless only items in place changed.
    if (before.length === after.length && before.every((x, i) => isPlain(x) && isPlain(after[i]))) {
      return before.flatMap((x, i) => fieldChanges(x, after[i], `${path}[${i}]`));
    }
  }
  return [{ path: path === '' ? '(file)' : path, before: before ?? null, after: after ?? null }];
}

/** A value as a short line of text: scalars as written, lists and mappings in YAML's flow style, absence as "(none)". */
export function valueText(value: unknown, limit = 60): string {
  const text = flow(value);
  return text.length > limit ? `${text.slice(0, limit - 1)}…` : text;
}

function flow(value: unknown): string {
  if (value === null || value === undefined) return '(none)';
  if (Array.isArray(value)) return `[${value.map(flow).join(', ')}]`;
  if (isPlain(value)) return `{${Object.entries(value).map(([k, v]) => `${k}: ${flow(v)}`).join(', ')}}`;
  // Control characters would reach a terminal: show them escaped.
  return String(value).replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}
