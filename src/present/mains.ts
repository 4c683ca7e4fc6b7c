// What pages say about capacitors for the supply mains (IEC 60384-14 safety classes): the class caution,
// the banner at the top of the sheet and the mark in the index. X parts sit across the line, Y parts across
// the insulation barrier; the two fail in different ways and are chosen by different rules, so each has its
// own wording. zfolio certifies nothing: every text defers to the equipment safety standard, local codes and
// licensed practice.

import type { Part } from '../model/part.js';
import { formatEng } from '../units/format.js';
import { formatVoltageRating } from '../model/voltage-rating.js';
import { leakageCurrentA } from '../analysis/rating-figures.js';

/** The mains frequency a leakage figure is given at: the higher of the two in common use (common practice). */
export const LEAKAGE_FREQUENCY_HZ = 60;

// Which insulation a Y subclass may bridge (IEC 60384-14, from memory: Y1 double or reinforced insulation;
// Y2, Y3 and Y4 basic or supplementary insulation only).
const Y_INSULATION: Readonly<Record<string, string>> = {
  Y1: 'class Y1 may bridge double or reinforced insulation',
  Y2: 'class Y2 may bridge basic or supplementary insulation only; double or reinforced insulation needs class Y1',
  Y3: 'class Y3 may bridge basic or supplementary insulation only; double or reinforced insulation needs class Y1',
  Y4: 'class Y4 may bridge basic or supplementary insulation only; double or reinforced insulation needs class Y1',
};

export type SafetyFamily = 'X' | 'Y';

export function safetyFamily(part: Part): SafetyFamily | undefined {
  const c = part.safetyClass;
  return c?.startsWith('X') ? 'X' : c?.startsWith('Y') ? 'Y' : undefined;
}

/** Where the class is used, in a few words. */
function position(family: SafetyFamily): string {
  return family === 'X' ? 'across the line (line to line or line to neutral)' : 'across the insulation barrier (line to protective earth, or across basic or reinforced insulation to parts a person can touch)';
}

/** The caution of the part's safety class, or none for an ordinary part. */
export function safetyClassCaution(part: Part): string | undefined {
  const family = safetyFamily(part);
  const c = part.safetyClass;
  if (!family || !c) return undefined;
  if (family === 'X') {
    return (
      `Class ${c} safety capacitor (IEC 60384-14), for use ${position('X')}. ` +
      `A failure there short-circuits the supply, so the part must fail safe: only a certified X part of class ${c}, or a class the equipment safety standard accepts in its place, may be fitted, ` +
      'because such parts are built and tested to fail without fire and without a lasting short. ' +
      'The X subclasses differ in the impulse voltage they withstand in service (X1 the highest, then X2, then X3). An X part must never be used where a Y part is required.'
    );
  }
  let leakage = '';
  if (part.voltageAcV !== undefined && part.nominal !== undefined) {
    const amps = leakageCurrentA(part.nominal, part.voltageAcV, LEAKAGE_FREQUENCY_HZ);
    leakage = `; at its ${formatEng(part.voltageAcV, 'voltage')} AC rating and ${LEAKAGE_FREQUENCY_HZ} Hz this part alone passes about ${formatEng(amps, 'current')} (I = 2π·f·C·V), and every Y capacitor of the product adds to it`;
  }
  return (
    `Class ${c} safety capacitor (IEC 60384-14), for use ${position('Y')}. ` +
    'A failure there can make touchable metal live, so only a certified Y part of the subclass the insulation calls for may be used there, never an X part or an ordinary capacitor: ' +
    `${Y_INSULATION[c] ?? 'see IEC 60384-14 for the insulation this subclass may bridge'}. ` +
    `Its value is limited so that the touch (leakage) current it passes stays within the limit of the applicable equipment safety standard${leakage}.`
  );
}

/** Said of every mains part after its class caution. */
export const MAINS_PRACTICE_CAUTION =
  'Mains equipment: the choice of part, its position, creepage and clearance distances, fusing and any bleeder resistor follow the applicable equipment safety standard, local electrical codes and licensed practice, and the design and any repair must be done or checked by a qualified person. This folio describes the part\'s impedance for filter design; it certifies nothing.';

export interface MainsBanner {
  heading: string;
  text: string;
}

/** The banner at the top of a mains part's sheet (page and PDF). */
export function mainsBanner(part: Part, storedEnergyText?: string): MainsBanner | undefined {
  const family = safetyFamily(part);
  if (!family) return undefined;
  const rating = part.voltageRatings.map(formatVoltageRating).join(', ');
  const what = family === 'X' ? 'a failure short-circuits the supply' : 'a failure can make touchable metal live; its value sets the touch current';
  return {
    heading: `Mains part: class ${part.safetyClass} safety capacitor (IEC 60384-14)`,
    text:
      `Hazardous voltage${rating ? ` (rated ${rating})` : ''}. For use ${position(family)}: ${what}. ` +
      `Fit only a certified part of the required class.${storedEnergyText ? ` ${storedEnergyText}` : ''} ` +
      'Follow the equipment safety standard, local electrical codes and licensed practice; the cautions at the end of this sheet say more.',
  };
}

export interface MainsMark {
  /** Short text shown in the index beside the id: "MAINS X2". */
  label: string;
  /** The same in words, for the tooltip and for screen readers. */
  title: string;
}

export function mainsMark(part: Part): MainsMark | undefined {
  const family = safetyFamily(part);
  if (!family) return undefined;
  return {
    label: `MAINS ${part.safetyClass}`,
    title: `Mains safety capacitor, class ${part.safetyClass} (IEC 60384-14), for use ${position(family)}: hazardous voltage; its page lists the cautions.`,
  };
}

/** The legend under the index, shown when the library holds a mains part. */
export const MAINS_LEGEND =
  'MAINS X… and MAINS Y… mark safety-class capacitors for the supply mains (IEC 60384-14): X across the line, Y across the insulation barrier (line to protective earth). They carry hazardous voltage; read the cautions on their pages.';
