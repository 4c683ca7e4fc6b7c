// The physical dimensions zfolio reads and prints, with their SI symbols and accepted spellings.

export type Dimension =
  | 'capacitance'
  | 'inductance'
  | 'resistance'
  | 'frequency'
  | 'voltage'
  | 'current'
  | 'power'
  | 'time'
  | 'ratio';

export interface DimensionInfo {
  /** SI symbol printed at the edges. */
  symbol: string;
  /** Spellings accepted after the number, besides the symbol itself. */
  aliases: readonly string[];
  /** Word used in messages: "a capacitance in F". */
  noun: string;
}

export const DIMENSIONS: Readonly<Record<Dimension, DimensionInfo>> = {
  capacitance: { symbol: 'F', aliases: [], noun: 'a capacitance' },
  inductance: { symbol: 'H', aliases: [], noun: 'an inductance' },
  // U+03A9 is the preferred omega; U+2126 (OHM SIGN) is accepted because keyboards and PDFs produce it.
  resistance: { symbol: 'Ω', aliases: ['\u2126', 'ohm', 'ohms', 'Ohm', 'Ohms'], noun: 'a resistance' },
  frequency: { symbol: 'Hz', aliases: ['hz', 'HZ'], noun: 'a frequency' },
  voltage: { symbol: 'V', aliases: [], noun: 'a voltage' },
  current: { symbol: 'A', aliases: [], noun: 'a current' },
  power: { symbol: 'W', aliases: [], noun: 'a power' },
  time: { symbol: 's', aliases: [], noun: 'a time' },
  ratio: { symbol: '', aliases: [], noun: 'a ratio' },
};

/** The dimension of a part's nominal value, by the kind the part behaves as (a bead's is its rated |Z|). */
export const NOMINAL_DIMENSION = {
  capacitor: 'capacitance',
  inductor: 'inductance',
  resistor: 'resistance',
  bead: 'resistance',
} as const satisfies Readonly<Record<string, Dimension>>;

/** Which dimension a unit spelling denotes, or undefined when it is not a unit zfolio knows. */
export function dimensionOfUnit(unit: string): Dimension | undefined {
  for (const [dim, info] of Object.entries(DIMENSIONS) as [Dimension, DimensionInfo][]) {
    if (dim === 'ratio') continue;
    if (unit === info.symbol || info.aliases.includes(unit)) return dim;
  }
  return undefined;
}

/** SI prefixes as powers of ten (BIPM SI Brochure, 9th ed., table 7), the subset used for passive parts. */
export const SI_PREFIX_EXPONENTS: Readonly<Record<string, number>> = {
  f: -15,
  p: -12,
  n: -9,
  u: -6,
  µ: -6, // U+00B5 MICRO SIGN
  μ: -6, // U+03BC GREEK SMALL LETTER MU
  m: -3,
  k: 3,
  M: 6,
  G: 9,
  T: 12,
};
