// The plan file (plans/*.yaml): a power rail, its target impedance and the capacitors placed on it.

import type { Node } from 'yaml';
import { formatEng, formatPercent } from '../units/format.js';
import { formatPosition, quote, type Diagnostic, type DiagnosticList, type SourcePosition } from './diagnostics.js';
import { Fields, type ReadContext } from './fields.js';
import { ID_PATTERN, type Part } from './part.js';
import { MAX_ID_LENGTH } from './page-names.js';
import type { SourceFile } from './source.js';
import { readBand, readCount, readMountingByPackage, readPlacedPart, readTarget } from './plan-fields.js';
import { readRange, type TemperatureRange } from './spread.js';
import { formatCelsius } from '../units/temperature.js';

/** The target impedance, given or from ripple and step. An explicit target may come with a step for the load-step check. */
export type PlanTarget = { kind: 'explicit'; ohms: number; stepA?: number } | { kind: 'ripple'; ripple: number; stepA: number };

/**
 * Where a placement's mounting inductance comes from, most specific first: the plan entry's own
 * `mounting`, the part file's `mounting`, the plan's `mounting-by-package` entry for the part's package,
 * the plan's `mounting` (the rail default).
 */
export type MountingSource = 'entry' | 'part' | 'package' | 'rail';

export interface Mounting {
  mountingH: number;
  mountingFrom: MountingSource;
}

export interface Placement extends Mounting {
  part: Part;
  /** Identical placements in parallel. */
  count: number;
  /** Where the entry's part id is written. */
  at: SourcePosition;
}

export interface Plan {
  rail: string;
  title: string;
  notes?: string;
  voltageV: number;
  target: PlanTarget;
  band: { fromHz: number; toHz: number };
  /** Default mounting inductance per placement, H (zero allowed: an ideal mount). */
  mountingH: number;
  /** Mounting inductance by package name (exactly as the part files write it), H. */
  mountingByPackage: Readonly<Record<string, number>>;
  regulator?: { rOhm?: number; lH?: number };
  plane?: { cF: number; rOhm?: number };
  /** The load step's edge time, s (`rise`); absent: 0.35/band.to. */
  riseS?: number;
  /** How long the load-step response is followed, s (`duration`); absent: from the rail's slowest pole. */
  durationS?: number;
  /** The rail's own operating temperatures (`temperature`), within the library's; absent: the library's. */
  temperature?: TemperatureRange;
  placements: Placement[];
  /** Warnings about this plan (also among the library's diagnostics), for its page. */
  warnings: Diagnostic[];
  source: SourceFile;
  /** Where the rail name is written. */
  at: SourcePosition;
}

const PLAN_FIELDS = ['rail', 'title', 'notes', 'voltage', 'ripple', 'step', 'target', 'band', 'mounting', 'mounting-by-package', 'regulator', 'plane', 'capacitors', 'rise', 'duration', 'temperature'];
const ENTRY_FIELDS = ['part', 'count', 'mounting'];

export type VoltageStress = 'ok' | 'unrated' | 'above-derating' | 'over-rating';

/**
 * How a DC rail voltage stands against a part's DC rating: over it, above `derating` × it (common practice:
 * 80%), or fine. Only a DC rating counts: a part rated in AC alone ("310V AC", r.m.s.) is 'unrated' here,
 * because an AC rating states nothing certain about DC.
 */
export function voltageStress(part: Part, railV: number, derating: number): VoltageStress {
  if (part.voltageV === undefined) return 'unrated';
  if (railV > part.voltageV) return 'over-rating';
  if (railV > derating * part.voltageV) return 'above-derating';
  return 'ok';
}

/** A part's mounting on this rail when no plan entry gives one: its own, else its package's, else the rail's. */
export function defaultMounting(plan: Pick<Plan, 'mountingH' | 'mountingByPackage'>, part: Part): Mounting {
  if (part.mountingH !== undefined) return { mountingH: part.mountingH, mountingFrom: 'part' };
  const byPackage = part.package !== undefined && Object.hasOwn(plan.mountingByPackage, part.package) ? plan.mountingByPackage[part.package] : undefined;
  if (byPackage !== undefined) return { mountingH: byPackage, mountingFrom: 'package' };
  return { mountingH: plan.mountingH, mountingFrom: 'rail' };
}

/**
 * When `railV` lies above the last point of the part's DC-bias table: the warning, naming the part, the
 * table's last voltage, the rail voltage and the fraction held there (src/analysis/dc-bias.ts holds it).
 */
export function beyondBiasTable(part: Part, railV: number): string | undefined {
  const last = part.dcBias[part.dcBias.length - 1];
  if (!last || !(railV > last.voltageV)) return undefined;
  return `the DC-bias table of ${part.id} ends at ${formatEng(last.voltageV, 'V')}, below the rail's ${formatEng(railV, 'V')}; its last fraction, ${formatPercent(last.fraction)}, is used, which is likely optimistic (class 2 ceramics keep losing capacitance as the voltage rises)`;
}

/** `temperature: {from, to}`: the rail's own operating range, which may narrow the library's but not widen it. */
function readPlanTemperature(root: Fields, operating: TemperatureRange | undefined): TemperatureRange | undefined {
  const block = root.map('temperature');
  if (!block) return undefined;
  block.expect(['from', 'to'], ['from', 'to']);
  const range = readRange(block);
  if (!range || !operating || (range.fromC >= operating.fromC && range.toC <= operating.toC)) return range;
  block.error(
    range.fromC < operating.fromC ? 'from' : 'to',
    `expected a range within the library's operating temperatures (folio.yaml "temperature", ${formatCelsius(operating.fromC)} to ${formatCelsius(operating.toC)}), found ${formatCelsius(range.fromC)} to ${formatCelsius(range.toC)}; widen the library's range first`,
  );
  return undefined;
}

/** Rounded up to three significant figures, so that the rating a warning asks for is never below the need. */
function roundUp3(x: number): number {
  const step = 10 ** (Math.floor(Math.log10(x)) - 2);
  return Math.ceil(x / step - 1e-9) * step;
}

/** Read one plan file against the library's parts. Returns undefined when it has errors (all reported). */
export function readPlan(ctx: ReadContext, partsById: ReadonlyMap<string, Part>, derating: number, operating?: TemperatureRange): Plan | undefined {
  const { diagnostics } = ctx;
  const before = diagnostics.errorCount;
  const warnings: Diagnostic[] = [];
  const warn = (at: SourcePosition, message: string, advice?: string) => {
    diagnostics.warning(at, message);
    warnings.push({ ...at, severity: 'warning', message, ...(advice ? { advice } : {}) });
  };
  const root = Fields.of(ctx, ctx.source.document.contents as Node | null, '');
  if (!root) return undefined;
  root.expect(PLAN_FIELDS, ['rail', 'voltage', 'band', 'mounting']);

  const rail = root.text('rail', { maxLength: MAX_ID_LENGTH, pattern: ID_PATTERN, patternHint: 'a rail name of letters, digits, ".", "_" and "-" only' });
  const voltageV = root.quantity('voltage', 'voltage');
  const target = readTarget(root);
  const band = readBand(root);
  const mountingH = root.quantity('mounting', 'inductance', { allowZero: true });
  const mountingByPackage = readMountingByPackage(root, partsById, warn);

  let regulator: Plan['regulator'];
  const reg = root.map('regulator');
  if (reg) {
    reg.expect(['r', 'l']);
    regulator = { rOhm: reg.quantity('r', 'resistance'), lH: reg.quantity('l', 'inductance') };
    if (!reg.has('r') && !reg.has('l')) reg.error(undefined, 'regulator: expected its output resistance "r", inductance "l" or both, found neither');
  }
  let plane: Plan['plane'];
  const pl = root.map('plane');
  if (pl) {
    pl.expect(['c', 'r'], ['c']);
    const cF = pl.quantity('c', 'capacitance');
    if (cF !== undefined) plane = { cF, rOhm: pl.quantity('r', 'resistance') };
  }

  const riseS = root.quantity('rise', 'time');
  const durationS = root.quantity('duration', 'time');
  if (target && target.stepA === undefined) {
    for (const name of ['rise', 'duration']) {
      if (root.has(name)) root.error(name, `a load step needs its current: give "step" (ΔI, e.g. step: 2A) with the target`);
    }
  }

  const temperature = readPlanTemperature(root, operating);

  const placements: Placement[] = [];
  const list = root.seq('capacitors');
  list?.items.forEach((item, i) => {
    const label = `capacitors[${i}]`;
    const entry = Fields.of(ctx, item, label);
    if (!entry) return;
    entry.expect(ENTRY_FIELDS, ['part', 'count']);
    const part = readPlacedPart(entry, partsById);
    const count = readCount(ctx, entry);
    const ownMounting = entry.quantity('mounting', 'inductance', { allowZero: true });
    if (!part || count === undefined || (entry.has('mounting') && ownMounting === undefined)) return;
    const at = entry.position('part');
    if (voltageV !== undefined) {
      const stress = voltageStress(part, voltageV, derating);
      const rating = part.voltageV ?? 0;
      if (stress === 'over-rating') {
        entry.error('part', `the rail's ${formatEng(voltageV, 'V')} exceeds the ${formatEng(rating, 'V')} rating of ${part.id}; choose a part rated above the rail`);
      } else if (stress === 'above-derating') {
        warn(
          at,
          `${label}.part: the rail's ${formatEng(voltageV, 'V')} is ${formatPercent(voltageV / rating)} of the ${formatEng(rating, 'V')} rating of ${part.id}, above the derating limit of ${formatPercent(derating)} (folio.yaml "derating")`,
          `Place a part rated ${formatEng(roundUp3(voltageV / derating), 'V')} or more (the rail's voltage over the derating limit), or let the review record why ${part.id} may stay.`,
        );
      } else if (stress === 'unrated') {
        const why = part.voltageAcV !== undefined ? `is rated ${formatEng(part.voltageAcV, 'V')} AC only, and an AC rating is not a DC rating` : 'states no voltage rating';
        warn(at, `${label}.part: ${part.id} ${why}, so the rail's ${formatEng(voltageV, 'V')} cannot be checked against it`, `Give ${part.id} a DC rating in its part file, or place a part that has one.`);
      }
      const beyond = beyondBiasTable(part, voltageV);
      if (beyond) warn(at, `${label}.part: ${beyond}`, `Extend the DC-bias table of ${part.id} to the rail voltage from the maker's curve, or treat this rail's margin as optimistic.`);
    }

    const mounting: Mounting = ownMounting !== undefined ? { mountingH: ownMounting, mountingFrom: 'entry' } : defaultMounting({ mountingH: mountingH ?? 0, mountingByPackage }, part);
    placements.push({ part, count, ...mounting, at });
  });

  if (!reg && !pl && (!list || list.items.length === 0)) {
    warn(root.position(), 'the rail has no regulator, plane or capacitors yet; "zfolio plan --suggest" can choose capacitors for it');
  }
  if (diagnostics.errorCount > before || rail === undefined || voltageV === undefined || !target || !band || mountingH === undefined) return undefined;
  return {
    rail,
    title: root.text('title') ?? rail,
    notes: root.text('notes'),
    voltageV,
    target,
    band,
    mountingH,
    mountingByPackage,
    regulator,
    plane,
    riseS,
    durationS,
    temperature,
    placements,
    warnings,
    source: ctx.source,
    at: root.position('rail'),
  };
}

/**
 * Plans with a rail name already taken are reported and dropped; the rest keep their order. Names that differ
 * only in letter case (VDD_CORE, vdd_core) are one rail: their pages would be one folder on many file systems.
 */
export function uniqueRails(plans: readonly Plan[], diagnostics: DiagnosticList): Plan[] {
  const seen = new Map<string, Plan>();
  return plans.filter((plan) => {
    const earlier = seen.get(plan.rail.toLowerCase());
    if (earlier) {
      const how = earlier.rail === plan.rail ? `duplicate rail ${quote(plan.rail)}` : `rail ${quote(plan.rail)} differs from ${quote(earlier.rail)} only in letter case`;
      diagnostics.error(plan.at, `${how}: already planned at ${formatPosition(earlier.at)}`);
      return false;
    }
    seen.set(plan.rail.toLowerCase(), plan);
    return true;
  });
}
