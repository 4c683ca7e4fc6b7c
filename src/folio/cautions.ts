// The cautions each page carries. Models are approximations and ratings are the maker's and the codes'
// business; pages say so where a reader could get hurt (common practice for engineering datasheets).

import type { Part } from '../model/part.js';
import { formatEng } from '../units/format.js';

export const GENERAL_CAUTION =
  'The model is a small-signal, linear approximation at room temperature. Real parts change with DC bias, temperature, ageing, signal level and mounting; confirm anything that matters by measurement.';

export const RATINGS_CAUTION =
  'Voltage, ripple-current, power and safety ratings are set by the part maker and the applicable codes, not by this folio. Follow the maker\'s derating guidance, local electrical codes and licensed practice.';

// Energy above which a charged capacitor can hurt (a common rule of thumb is around 0.25 J; voltages above
// 50 V DC are commonly treated as hazardous). Both are common practice, not a standard's limits.
const HAZARDOUS_ENERGY_J = 0.25;
const HAZARDOUS_VOLTAGE_V = 50;

const CLASS_2 = /^[XYZ][4-9][PRSTUV]$/;

/** The cautions for one part, most specific first, the general ones last. */
export function cautionsFor(part: Part): string[] {
  const out: string[] = [];
  const behaves = part.behavesAs;
  if (part.safetyClass) {
    out.push(
      `Safety capacitor, class ${part.safetyClass} (IEC 60384-14). Across the mains only an approved part of the required class may be fitted, and a replacement must carry the same or a higher class. Design, installation and repair of mains equipment fall under local electrical codes and must be done or checked by a qualified person.`,
    );
  }
  if (behaves === 'capacitor' && part.nominal !== undefined && part.voltageV !== undefined) {
    const energy = 0.5 * part.nominal * part.voltageV ** 2;
    if (energy >= HAZARDOUS_ENERGY_J || part.voltageV > HAZARDOUS_VOLTAGE_V) {
      out.push(
        `Stored charge: at its rated ${formatEng(part.voltageV, 'voltage')} this capacitor holds ${formatEng(energy, 'J')}. It can stay charged after power is removed; discharge it through a suitable resistor and check with a meter before touching.`,
      );
    }
  }
  if (behaves === 'capacitor') {
    if (part.voltageV !== undefined) {
      out.push(`Do not exceed the rated ${formatEng(part.voltageV, 'voltage')} including ripple peaks and transients; rail plans warn above the library's derating fraction of the rating.`);
    }
    if (part.dielectric && CLASS_2.test(part.dielectric)) {
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
