// Part families: the library's automatic comparisons, small enough to read. Each kind of part is one
// family when it has at most FAMILY_SIZE parts; a larger set is split by package, then by the decade of the
// nominal value, then by dielectric, then by rating, neighbouring small groups packed back together up to
// FAMILY_SIZE at each step, and what is still too large is cut, in order of value, into near-equal runs.
// Every family is one chart of at most FAMILY_SIZE curves, titled by what set its parts apart.

import { NOMINAL_DIMENSION, type Part, type PartKind } from '../model/part.js';
import { pageName } from '../model/page-names.js';
import { kindPlural } from '../present/kinds.js';
import { ratingTexts } from '../present/part-words.js';
import { formatEng } from '../units/format.js';

export { FAMILY_FIELDS } from '../model/part-facts.js';

/** Most curves on one family's chart: beyond about a dozen, colours and dashes stop telling parts apart. */
export const FAMILY_SIZE = 12;

export const KIND_ORDER: readonly PartKind[] = ['capacitor', 'inductor', 'resistor', 'bead', 'network'];

export interface PartFamily {
  /** Folder name under comparisons/, unique among families. */
  slug: string;
  kind: PartKind;
  /** "Capacitors, 0402, 10 nF–100 nF, X7R (1 of 2: 10 nF to 22 nF)". */
  title: string;
  /** What the parts share, as a phrase: "every capacitor in package 0402, from 10 nF to below 100 nF, X7R". */
  selection: string;
  /** What the family holds, for the families' index: its packages, the range of its values, its dielectrics and ratings. */
  packageText: string;
  valuesText: string;
  subsetText: string;
  /** In order of value, then id. */
  parts: Part[];
}

interface Facet {
  name: string;
  key(p: Part): string;
  /** Sort order of the facet's values (ties: by key). */
  order(p: Part): number;
  /** The label of one or more neighbouring groups packed together, and the phrase a selection says it with. */
  label(groups: readonly Part[][]): string;
  phrase(label: string): string;
}

/** A few values listed, more as a range: "X5R or X7R", "6.3 V DC to 50 V DC (5 ratings)". */
function listed(texts: readonly string[], noun: string): string {
  return texts.length <= 3 ? texts.join(' or ') : `${texts[0]} to ${texts[texts.length - 1]} (${texts.length} ${noun})`;
}

/** The decade of a value: 10 nF to below 100 nF is -8. */
export function valueDecade(value: number): number {
  // log10 lands a hair below an exact power of ten for some inputs (1e-8 parsed from "10n").
  return Math.floor(Math.log10(value) + 1e-9);
}

const dimensionOf = (p: Part) => (p.behavesAs ? NOMINAL_DIMENSION[p.behavesAs] : undefined);
const hasValue = (p: Part) => p.nominal !== undefined && p.nominal > 0 && dimensionOf(p) !== undefined;

const PACKAGE: Facet = {
  name: 'package',
  key: (p) => p.package ?? '',
  order: (p) => (p.package === undefined ? 1 : 0),
  label: (groups) => listed(groups.map((g) => g[0].package ?? 'no package'), 'packages'),
  phrase: (label) => `in package ${label}`,
};

const DECADE: Facet = {
  name: 'values',
  key: (p) => (hasValue(p) ? `${dimensionOf(p)} ${valueDecade(p.nominal!)}` : ''),
  order: (p) => (hasValue(p) ? valueDecade(p.nominal!) : Infinity),
  label(groups) {
    const valued = groups.filter((g) => hasValue(g[0]));
    const none = valued.length < groups.length ? 'no nominal value' : '';
    if (valued.length === 0) return none;
    const lo = valueDecade(valued[0][0].nominal!);
    const hi = valueDecade(valued[valued.length - 1][0].nominal!) + 1;
    const dimension = dimensionOf(valued[0][0])!;
    return [`${formatEng(10 ** lo, dimension)}–${formatEng(10 ** hi, dimension)}`, none].filter(Boolean).join(', ');
  },
  phrase: (label) => `valued ${label.replace('–', ' to below ')}`,
};

const DIELECTRIC: Facet = {
  name: 'dielectric',
  key: (p) => p.dielectric ?? '',
  order: (p) => (p.dielectric === undefined ? 1 : 0),
  label: (groups) => listed(groups.map((g) => g[0].dielectric ?? 'no dielectric'), 'dielectrics'),
  phrase: (label) => label,
};

/** The rating facet, reading each part's rating text from `rating` (ratingText, remembered for one call). */
const ratingFacet = (rating: (p: Part) => string): Facet => ({
  name: 'rating',
  key: rating,
  order: (p) => p.voltageV ?? p.voltageAcV ?? p.currentA ?? p.powerW ?? -1,
  label: (groups) => listed(groups.map((g) => rating(g[0]) || 'no rating'), 'ratings'),
  phrase: (label) => `rated ${label}`,
});

const byValueThenId = (a: Part, b: Part) => (a.nominal ?? -1) - (b.nominal ?? -1) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);

function groupBy(parts: readonly Part[], key: (p: Part) => string): Part[][] {
  const groups = new Map<string, Part[]>();
  for (const p of parts) {
    const k = key(p);
    const g = groups.get(k);
    if (g) g.push(p);
    else groups.set(k, [p]);
  }
  return [...groups.values()];
}

interface Cut {
  parts: Part[];
  /** What set this cut apart, facet by facet: the label of each facet it was split by. */
  labels: { facet: Facet; label: string }[];
  /** Its place among the runs of one set cut by value, when it was. */
  run?: { index: number; of: number };
}

/** Split `parts` by the facets in turn, packing neighbours, then into runs by value. */
function split(parts: Part[], facets: readonly Facet[], labels: Cut['labels']): Cut[] {
  if (parts.length <= FAMILY_SIZE) return [{ parts, labels }];
  if (facets.length === 0) {
    const sorted = [...parts].sort(byValueThenId);
    const runs = Math.ceil(sorted.length / FAMILY_SIZE);
    return Array.from({ length: runs }, (_, i) => ({
      parts: sorted.slice(Math.round((i * sorted.length) / runs), Math.round(((i + 1) * sorted.length) / runs)),
      labels,
      run: { index: i + 1, of: runs },
    }));
  }
  const [facet, ...rest] = facets;
  const keyOrder = (a: Part, b: Part) => facet.order(a) - facet.order(b) || (facet.key(a) < facet.key(b) ? -1 : facet.key(a) > facet.key(b) ? 1 : 0);
  const groups = groupBy(parts, facet.key).sort((a, b) => keyOrder(a[0], b[0]));
  if (groups.length === 1) return split(parts, rest, labels);
  const out: Cut[] = [];
  let packed: Part[][] = [];
  let count = 0;
  const flush = () => {
    if (packed.length > 0) out.push({ parts: packed.flat(), labels: [...labels, { facet, label: facet.label(packed) }] });
    packed = [];
    count = 0;
  };
  for (const group of groups) {
    if (group.length > FAMILY_SIZE) {
      flush();
      out.push(...split(group, rest, [...labels, { facet, label: facet.label([group]) }]));
      continue;
    }
    if (count + group.length > FAMILY_SIZE) flush();
    packed.push(group);
    count += group.length;
  }
  flush();
  return out;
}

/** The range of a set's nominal values: "22 nF to 47 nF", "100 nF", or "" when none has one. */
export function valueRange(parts: readonly Part[]): string {
  const valued = parts.filter(hasValue);
  if (valued.length === 0) return '';
  const dims = new Set(valued.map(dimensionOf));
  if (dims.size > 1) return 'mixed';
  const values = valued.map((p) => p.nominal!);
  const [lo, hi] = [Math.min(...values), Math.max(...values)];
  const d = dimensionOf(valued[0])!;
  const text = lo === hi ? formatEng(lo, d) : `${formatEng(lo, d)} to ${formatEng(hi, d)}`;
  return valued.length < parts.length ? `${text}, and without a value` : text;
}

/** The distinct values of a field over a set, in the order met, as a short list. */
function distinct(parts: readonly Part[], field: (p: Part) => string | undefined, noun: string): string {
  const seen = [...new Set(parts.map(field).filter((v): v is string => Boolean(v)))];
  return seen.length <= 3 ? seen.join(', ') : `${seen.length} ${noun}`;
}

function slugPart(text: string): string {
  return text.replace(/ \(\d+ \w+\)$/, '').toLowerCase().replace(/µ/g, 'u').replace(/Ω/g, 'ohm').replace(/[^a-z0-9.]+/g, '-').replace(/^-+|-+$/g, '');
}

/** The library's parts as families: kinds in KIND_ORDER, then as the facets sort them. */
export function partFamilies(parts: readonly Part[]): PartFamily[] {
  const families: PartFamily[] = [];
  const slugs = new Set<string>();
  // A part's rating text is read twice (to split by rating, to list a family's ratings), and formatting its
  // numbers was most of this function's time at 10,000 parts: each distinct rating's text is made once a call.
  const rating = ratingTexts();
  const facets: readonly Facet[] = [PACKAGE, DECADE, DIELECTRIC, ratingFacet(rating)];
  for (const kind of KIND_ORDER) {
    const ofKind = parts.filter((p) => p.kind === kind);
    if (ofKind.length === 0) continue;
    const kinds = kindPlural(kind);
    for (const cut of split(ofKind, facets, [])) {
      const members = [...cut.parts].sort(byValueThenId);
      const labels = cut.labels.map((l) => l.label);
      const valuesText = valueRange(members);
      const run = cut.run ? ` (${cut.run.index} of ${cut.run.of}: ${valuesText || 'no values'})` : '';
      const title = [`${kinds[0].toUpperCase()}${kinds.slice(1)}`, ...labels].join(', ') + run;
      const phrases = cut.labels.map((l) => l.facet.phrase(l.label));
      const selection = [`every ${kind}${phrases.length > 0 ? ' ' : ''}${phrases.join(', ')}`, ...(cut.run ? [`run ${cut.run.index} of ${cut.run.of} in order of value`] : [])].join('; ');
      const wanted = pageName(['family', kind, ...labels.map(slugPart), ...(cut.run ? [`${cut.run.index}`] : [])].join('-'));
      let slug = wanted;
      for (let n = 2; slugs.has(slug); n++) slug = `${wanted}-${n}`;
      slugs.add(slug);
      families.push({
        slug,
        kind,
        title,
        selection,
        packageText: distinct(members, (p) => p.package, 'packages'),
        valuesText,
        subsetText: [distinct(members, (p) => p.dielectric, 'dielectrics'), distinct(members, rating, 'ratings')].filter(Boolean).join('; '),
        parts: members,
      });
    }
  }
  return families;
}
