// The cautions each page carries. Models are approximations and ratings are the maker's and the codes'
// business; pages say so where a reader could get hurt (common practice for engineering datasheets).

import { isClass2Dielectric } from '../model/dielectric.js';
import type { Part } from '../model/part.js';
import { formatEng } from '../units/format.js';
import { formatVoltageRating } from '../model/voltage-rating.js';
import { ratedPeak, storedEnergyJ } from '../analysis/rating-figures.js';
import { MAINS_PRACTICE_CAUTION, safetyClassCaution, safetyFamily } from './mains.js';

export const GENERAL_CAUTION =
  'The model is a small-signal, linear approximation at room temperature. Real parts change with DC bias, temperature, ageing, signal level and mounting; confirm anything that matters by measurement.';

export const RATINGS_CAUTION =
  'Voltage, ripple-current, power and safety ratings are set by the part maker and the applicable codes, not by this folio. Follow the maker\'s derating guidance, local electrical codes and licensed practice.';

// Energy above which a charged capacitor can hurt (a common rule of thumb is around 0.25 J; voltages above
// 50 V DC are commonly treated as hazardous). Both are common practice, not a standard's limits; the voltage
// compared is the peak, √2 times the r.m.s. value of an AC rating.
const HAZARDOUS_ENERGY_J = 0.25;
const HAZARDOUS_VOLTAGE_V = 50;

/** "At the 438 V peak of its 310 V AC rating (√2 × r.m.s.) it holds 9.61 mJ (½·C·V²).", or undefined. */
export function storedEnergyText(part: Part): string | undefined {
  const peak = ratedPeak(part.voltageRatings);
  if (part.behavesAs !== 'capacitor' || part.nominal === undefined || !peak) return undefined;
  const energy = formatEng(storedEnergyJ(part.nominal, peak.volts), 'J');
  if (peak.rating.kind === 'AC') {
    return `At the ${formatEng(peak.volts, 'voltage')} peak of its ${formatVoltageRating(peak.rating)} rating (√2 × r.m.s.) it holds ${energy} (½·C·V²).`;
  }
  return `At its rated ${formatVoltageRating(peak.rating)} it holds ${energy} (½·C·V²).`;
}

/** The cautions for one part, most specific first, the general ones last. */
export function cautionsFor(part: Part): string[] {
  const out: string[] = [];
  const behaves = part.behavesAs;
  const classCaution = safetyClassCaution(part);
  if (classCaution) out.push(classCaution, MAINS_PRACTICE_CAUTION);
  const peak = ratedPeak(part.voltageRatings);
  if (behaves === 'capacitor' && part.nominal !== undefined && peak) {
    const energy = storedEnergyJ(part.nominal, peak.volts);
    if (energy >= HAZARDOUS_ENERGY_J || peak.volts > HAZARDOUS_VOLTAGE_V) {
      // An X part across the line keeps its charge on the plug's pins once unplugged; a bleeder across the
      // line is the usual remedy (common practice). Any other part: discharge and measure before touching.
      const bleed =
        safetyFamily(part) === 'X'
          ? 'Unplugged, it can leave that voltage on the plug\'s pins: common practice is a bleeder resistor across the line that brings it to a safe voltage within the time the equipment safety standard allows, and a check with a meter before touching.'
          : 'Discharge it through a suitable resistor and check with a meter before touching.';
      out.push(`Stored charge: ${lowerFirst(storedEnergyText(part)!)} It can stay charged after power is removed. ${bleed}`);
    }
  }
  if (behaves === 'capacitor') {
    const rating = ratingCaution(part);
    if (rating) out.push(rating);
    if (part.dielectric && isClass2Dielectric(part.dielectric)) {
      out.push(`${part.dielectric} is a class 2 ceramic: its capacitance falls with DC bias, temperature and age. The curves show the zero-bias model${part.dcBias.length > 0 ? '; rail plans use the DC-bias table' : ''}.`);
    }
    if (part.dielectric && /electrolytic|tantalum|polymer/i.test(part.dielectric)) {
      out.push('Polarised capacitor: reverse voltage, ripple current above rating or overvoltage can make it overheat, vent or fail short. Check the ripple-current rating at the operating frequency and temperature.');
    }
  }
  if (behaves === 'inductor' || part.kind === 'inductor') {
    out.push(`Inductance falls as DC current approaches saturation, and winding loss heats the part${part.currentA !== undefined ? `; the rated current is ${formatEng(part.currentA, 'current')}` : ''}. The model holds at small signal and no DC bias.`);
  }
  if (behaves === 'bead') {
    out.push(`A ferrite bead loses much of its impedance under DC current${part.currentA !== undefined ? ` (rated ${formatEng(part.currentA, 'current')})` : ''}; the curves are at zero bias.`);
  }
  if (behaves === 'resistor' && part.powerW !== undefined) {
    out.push(`Rated power ${formatEng(part.powerW, 'power')} applies at the maker's reference temperature and falls above it; a resistor at full power runs hot enough to burn.`);
  }
  out.push(GENERAL_CAUTION, RATINGS_CAUTION);
  return out;
}

/** "Do not exceed the rated 16 V including ripple peaks and transients; …" for a capacitor with a rating. */
function ratingCaution(part: Part): string | undefined {
  if (part.behavesAs !== 'capacitor' || part.voltageRatings.length === 0) return undefined;
  const limits = part.voltageRatings.map((r) => (r.kind === 'AC' ? `the rated ${formatVoltageRating(r)} (r.m.s., in continuous service)` : `the rated ${formatVoltageRating(r)} including ripple peaks and transients`));
  return `Do not exceed ${limits.join(', nor ')}; ${part.voltageV !== undefined ? DC_RATING_PLANS : AC_ONLY_PLANS}.`;
}

const DC_RATING_PLANS = "rail plans warn above the library's derating fraction of the DC rating";
const AC_ONLY_PLANS = 'an AC rating is not a DC rating, and rail plans, which check DC ratings only, cannot check this part on a DC rail';

/** One caution of a set of parts, with the parts it applies to (each with the figure it concerns, if any). */
export interface GroupedCaution {
  text: string;
  /** The parts it applies to, in the order given; empty when it applies to every part. */
  parts: { id: string; detail: string }[];
}

/**
 * The cautions of several parts (a review pack's), each said once with the parts it applies to, in the order
 * of the first part that brings it; the general cautions, which every part carries, last and unlisted.
 * A DC voltage rating differs from part to part, so those cautions are one, with each part's rating beside it.
 */
export function groupedCautions(parts: readonly Part[]): GroupedCaution[] {
  const groups = new Map<string, GroupedCaution>();
  const add = (text: string, id: string, detail: string) => {
    let g = groups.get(text);
    if (!g) groups.set(text, (g = { text, parts: [] }));
    if (!g.parts.some((p) => p.id === id)) g.parts.push({ id, detail });
  };
  for (const part of parts) {
    const rating = ratingCaution(part);
    for (const c of cautionsFor(part)) {
      if (c === GENERAL_CAUTION || c === RATINGS_CAUTION) continue;
      const dcOnly = part.voltageRatings.length > 0 && part.voltageRatings.every((r) => r.kind === 'DC');
      if (c === rating && dcOnly) add(`Do not exceed a capacitor's rated DC voltage (beside each part) including ripple peaks and transients; ${DC_RATING_PLANS}.`, part.id, part.voltageRatings.map(formatVoltageRating).join(', '));
      else add(c, part.id, '');
    }
  }
  return [...groups.values(), { text: GENERAL_CAUTION, parts: [] }, { text: RATINGS_CAUTION, parts: [] }];
}

function lowerFirst(text: string): string {
  return text.charAt(0).toLowerCase() + text.slice(1);
}
