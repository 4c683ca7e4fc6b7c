// The option line of a Touchstone file, as the Touchstone File Format Specification 2.0 (IBIS Open Forum,
// 2009, "Option Line") defines it: "# <frequency unit> <parameter> <format> R <n>", fields in any order and
// letter case, each optional, defaults GHz, S, MA and R 50.

import { describe, expect, it } from 'vitest';
import { DEFAULT_OPTIONS, readOptionLine } from '../../src/measure/touchstone-options.js';
import { tokensOf } from '../../src/measure/touchstone-tokens.js';

/** The option line's fields after "#", and every problem with its column. */
function read(line: string) {
  const problems: string[] = [];
  const hash = line.indexOf('#');
  const options = readOptionLine(tokensOf(line, hash + 1, line.length, 0), (column, message) => problems.push(`${column}: ${message}`));
  return { options, problems };
}

describe('readOptionLine', () => {
  it('gives the specification\'s defaults for a bare "#": GHz, S, MA, R 50', () => {
    expect(read('#')).toEqual({ options: { unit: 'GHz', parameter: 'S', format: 'MA', reference: 50 }, problems: [] });
    expect(DEFAULT_OPTIONS).toEqual({ unit: 'GHz', parameter: 'S', format: 'MA', reference: 50 });
  });

  it('reads the fields in any order and letter case', () => {
    expect(read('# Hz Z RI R 1').options).toEqual({ unit: 'Hz', parameter: 'Z', format: 'RI', reference: 1, referenceColumn: 11 });
    expect(read('# r 75 db y mhz').options).toEqual({ unit: 'MHz', parameter: 'Y', format: 'DB', reference: 75, referenceColumn: 3 });
    expect(read('#kHz').options.unit).toBe('kHz');
  });

  it('names an unknown option, a missing or bad resistance and a repeated option, each at its column', () => {
    expect(read('# GHz S MA R').problems).toEqual(['12: expected the reference resistance after R (e.g. R 50), found the end of the line']);
    expect(read('# GHz S MA R -5').problems).toEqual(['14: expected the reference resistance after R, a number above zero in Ω, found "-5"']);
    expect(read('# GHz S MA X 50').problems).toEqual(['12: unknown option "X"; the option line takes Hz, kHz, MHz or GHz; S, Y or Z; MA, DB or RI; R and a resistance']);
    expect(read('# GHz MHz S').problems).toEqual(['7: the option line gives a second frequency unit, "MHz", after "GHz"; give each option once']);
  });

  it('refuses H and G parameters, which the specification allows but are not an impedance', () => {
    expect(read('# GHz H MA').problems).toEqual(['7: hybrid (H) parameters are not read: zfolio takes S, Y or Z parameters, found "H"']);
    expect(read('# GHz g MA').problems).toEqual(['7: inverse hybrid (G) parameters are not read: zfolio takes S, Y or Z parameters, found "g"']);
  });
});
