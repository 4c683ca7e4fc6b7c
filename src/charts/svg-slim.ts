// Markup vega writes that draws nothing, or says what is already so: dropped from a chart's SVG before it is
// inlined, so a part page carries its four charts in a third fewer bytes. The picture is the same (a
// browser test compares screenshots of every chart of the demo before and after: test/charts/svg-slim.test.ts
// checks each rule on its own, and the site test looks at the pages).
//
//  - attributes at their initial value (SVG 1.1 / SVG 2 property definitions): opacity="1",
//    stroke-miterlimit="4", an empty stroke-dasharray (none);
//  - elements that draw nothing: an empty path, a path hidden with display="none", an empty group, a
//    zero-size group background ("M0,0h0v0h0Z"), and a group background with neither fill nor stroke of
//    its own under the chart's fill="none" (a vega group whose view has no fill or stroke);
//  - the font family, written by vega on every text, said once on the root element (text inherits it);
//  - clip paths that are the same rectangle, kept once and referred to by every element that used one;
//  - a group of straight lines drawn alike (an axis's ticks) as one path of those segments: a solid stroke
//    with butt caps paints the same pixels whether its segments are one path or several lines (SVG 1.1
//    §11.4, §9.5 'line' as the path "M x1 y1 L x2 y2"); dashed lines are left alone.

const TAG = /<[^>]+>/g;
const FONT = / font-family="([^"]*)"/;
const CLIP = /<clipPath id="([^"]+)">(.*?)<\/clipPath>/g;

/**
 * The slimmed body of a chart's SVG (everything between `<svg …>` and `</svg>`), and the font family its
 * texts share, which the caller writes on the root element (undefined when the texts use several).
 * `editTag`, when given, changes every tag first (in the same pass over the markup as the rules here).
 */
export function slimSvgBody(body: string, editTag: (tag: string) => string = (tag) => tag): { body: string; fontFamily?: string } {
  // Attributes are edited inside tags only: text content (a title from a library file) is never touched.
  // Text cannot hold '<' (vega escapes it), so every match of TAG is markup. The font family is taken off
  // every tag in the same pass, as it is said once on the root when the texts share one (vega writes it on
  // texts only, which no rule below looks at); should they use several, the body is slimmed again, keeping it.
  const families = new Set<string>();
  const out = slimmedBody(
    body.replace(TAG, (tag) => {
      const edited = editTag(tag);
      const font = FONT.exec(edited);
      if (!font) return withoutDefaults(edited);
      families.add(font[1]);
      return withoutDefaults(edited.replace(FONT, ''));
    }),
  );
  if (families.size === 1) return { body: out, fontFamily: [...families][0] };
  if (families.size === 0) return { body: out };
  return { body: slimmedBody(body.replace(TAG, (tag) => withoutDefaults(editTag(tag)))) };
}

/** A tag without the attributes at their initial value. */
export const withoutDefaults = (tag: string) => tag.replace(/ (?:opacity="1"|stroke-miterlimit="4"|stroke-dasharray="")/g, '');

/** The rules for elements, after the tags' own attributes are slimmed. */
function slimmedBody(body: string): string {
  let out = body.replace(/<path d=""(?: display="none")?\/>/g, '').replace(/<path d="M0,0h0v0h0Z"\/>/g, '');
  // A group background with no attribute but its outline is invisible only where every fill above it is
  // none: vega writes the chart's root group with fill="none" and no group of its own with another fill.
  // The root group follows the chart's background rectangle, a sibling of it that it inherits nothing from.
  const groupFills = [...out.matchAll(/<g\b[^>]* fill="([^"]*)"/g)].map((m) => m[1]);
  if (out.replace(/^<rect [^>]*\/>/, '').startsWith('<g fill="none"') && groupFills.every((f) => f === 'none')) {
    out = out.replace(/<path d="M0,0h[\d.]+v[\d.]+h-[\d.]+Z"\/>/g, '');
  }
  // Empty groups, innermost first, until none is left.
  for (let before = ''; before !== out; ) {
    before = out;
    out = out.replace(/<g\/>|<g>(?:<\/g>)|<g transform="[^"]*"\/>|<g transform="[^"]*"><\/g>/g, '');
  }
  return sharedClips(mergedLines(out));
}

/** A group of two or more <line>s from its origin only (vega's rules), each moved by a translate. */
const LINE_GROUP = /<g>((?:<line transform="translate\([^)]*\)" x2="[^"]*" y2="[^"]*"[^>]*\/>){2,})<\/g>/g;
const LINE = /<line transform="translate\(([^,)]+),([^)]+)\)" x2="([^"]*)" y2="([^"]*)"([^>]*)\/>/g;

/** Each group of lines that share every attribute but their place, undashed, as one path with those attributes. */
export function mergedLines(body: string): string {
  return body.replace(LINE_GROUP, (group, lines: string) => {
    let style: string | undefined;
    let d = '';
    for (const m of lines.matchAll(LINE)) {
      if (style === undefined) style = m[5];
      else if (m[5] !== style) return group;
      const [x, y, dx, dy] = [m[1], m[2], m[3], m[4]];
      // The segment from (x, y) to (x + dx, y + dy), written relative to its start.
      d += `M${x},${y}${dx === '0' ? `v${dy}` : dy === '0' ? `h${dx}` : `l${dx},${dy}`}`;
    }
    if (style === undefined || style.includes('stroke-dasharray') || !/ stroke="/.test(style)) return group;
    return `<path d="${d}"${style}/>`;
  });
}

/** Clip paths with the same content kept once; references to the others point at the one kept. */
function sharedClips(body: string): string {
  const firstOf = new Map<string, string>();
  const renamed = new Map<string, string>();
  for (const m of body.matchAll(CLIP)) {
    const first = firstOf.get(m[2]);
    if (first === undefined) firstOf.set(m[2], m[1]);
    else renamed.set(m[1], first);
  }
  if (renamed.size === 0) return body;
  return body
    .replace(CLIP, (whole, id: string) => (renamed.has(id) ? '' : whole))
    .replace(/url\(#([^)]+)\)/g, (whole, id: string) => {
      const to = renamed.get(id);
      return to === undefined ? whole : `url(#${to})`;
    });
}
