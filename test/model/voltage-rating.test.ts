// Voltage ratings carry their kind: a bare "16V" is DC (as ordinary parts are rated), "310V AC" is an r.m.s.
// rating whose peak is √2 times higher (a sinusoid's peak over its r.m.s. value, any circuits text), and a
// mains (safety-class) capacitor must say which it is (IEC 60384-14 rates these parts for the supply mains).

import { describe, expect, it } from 'vitest';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { formatVoltageRating, parseVoltageRating } from '../../src/model/voltage-rating.js';

function read(yaml: string): { part?: Part; messages: string[] } {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/under-test.yaml', yaml, diagnostics);
  const part = source ? readPart({ source, diagnostics }) : undefined;
  return { part, messages: diagnostics.sorted().map(formatDiagnostic) };
}

const CAP = 'id: T-C\nkind: capacitor\nnominal: 100n\n';

describe('parseVoltageRating', () => {
  it.each([
    ['16V', 16, 'DC', false],
    ['6.3 V', 6.3, 'DC', false],
    ['400V DC', 400, 'DC', true],
    ['400 V dc', 400, 'DC', true],
    ['310V AC', 310, 'AC', true],
    ['310 V AC', 310, 'AC', true],
    ['310VAC', 310, 'AC', true],
    ['310 Vac', 310, 'AC', true],
    ['250 V~', 250, 'AC', true],
    ['1kV DC', 1000, 'DC', true],
  ] as const)('%j is %d V %s (kind stated: %s)', (text, volts, kind, stated) => {
    const parsed = parseVoltageRating(text);
    expect(parsed).toEqual({ ok: true, rating: { volts, kind, stated } });
  });

  it.each(['310V rms', '310 Vpk', '310A AC', 'AC', 'high', '0V AC', '-5V DC'])('refuses %j', (text) => {
    expect(parseVoltageRating(text).ok).toBe(false);
  });

  it('prints the kind where it was stated or is AC, and a bare DC rating as written', () => {
    const text = (t: string) => {
      const r = parseVoltageRating(t);
      return r.ok ? formatVoltageRating(r.rating) : r.message;
    };
    expect(text('310V AC')).toBe('310 V AC');
    expect(text('250 V~')).toBe('250 V AC');
    expect(text('400V DC')).toBe('400 V DC');
    expect(text('16V')).toBe('16 V');
  });
});

describe('a part\'s voltage field', () => {
  it('a bare 16V on an ordinary capacitor stays a DC rating, with no message', () => {
    const { part, messages } = read(CAP + 'voltage: 16V\n');
    expect(messages).toEqual([]);
    expect(part!.voltageV).toBe(16);
    expect(part!.voltageAcV).toBeUndefined();
  });

  it('an AC rating is not a DC rating: voltageV stays empty', () => {
    const { part, messages } = read(CAP + 'voltage: 310V AC\n');
    expect(messages).toEqual([]);
    expect(part!.voltageV).toBeUndefined();
    expect(part!.voltageAcV).toBe(310);
  });

  it('takes both kinds as a list', () => {
    const { part, messages } = read(CAP + 'voltage: [310V AC, 630V DC]\nsafety: X2\n');
    expect(messages).toEqual([]);
    expect(part!.voltageAcV).toBe(310);
    expect(part!.voltageV).toBe(630);
    expect(part!.voltageRatings.map(formatVoltageRating)).toEqual(['310 V AC', '630 V DC']);
  });

  it('refuses two ratings of one kind, an empty list and a value of the wrong unit, each where it is written', () => {
    expect(read(CAP + 'voltage: [310V AC, 275V AC]\n').messages).toEqual([
      'parts/under-test.yaml:4:20: voltage: a second AC rating; give at most one AC and one DC rating',
    ]);
    expect(read(CAP + 'voltage: []\n').messages).toEqual([
      'parts/under-test.yaml:4:10: voltage: expected a voltage rating such as 16V, 400V DC or 310V AC, or a list of them such as [310V AC, 630V DC], found an empty list',
    ]);
    expect(read(CAP + 'voltage: 16A DC\n').messages).toEqual(['parts/under-test.yaml:4:10: voltage: expected a voltage rating such as 16V, 400V DC or 310V AC, found "16A DC" (a current, in A)']);
    expect(read(CAP + 'voltage: 16A\n').messages).toEqual(['parts/under-test.yaml:4:10: voltage: expected a voltage in V (e.g. 16V), found "16A" (a current, in A)']);
  });
});

describe('a safety-class part must say AC or DC (IEC 60384-14)', () => {
  it('a bare 310V on an X2 part is a located error that suggests the AC form', () => {
    const { part, messages } = read(CAP + 'voltage: 310V\nsafety: X2\n');
    expect(part).toBeUndefined();
    expect(messages).toEqual([
      'parts/under-test.yaml:4:10: voltage: a class X2 capacitor (IEC 60384-14) is a mains part: say whether its rating is AC or DC, e.g. "310V AC" for the r.m.s. mains rating; found "310V"',
    ]);
  });

  it('a bare rating in a list is refused too', () => {
    expect(read(CAP + 'voltage: [300V AC, 1000V]\nsafety: Y2\n').messages).toHaveLength(1);
  });

  it('a safety class without any voltage rating is a located error', () => {
    expect(read(CAP + 'safety: Y2\n').messages).toEqual([
      'parts/under-test.yaml:4:9: safety: a class Y2 capacitor (IEC 60384-14) needs its voltage rating with its kind, e.g. voltage: 310V AC',
    ]);
  });

  it('accepts the rating with its kind', () => {
    expect(read(CAP + 'voltage: 310V AC\nsafety: X2\n').messages).toEqual([]);
    expect(read(CAP + 'voltage: 400V DC\nsafety: X2\n').messages).toEqual([]);
  });
});
