import { describe, expect, it } from 'vitest';
import { networkLeafMeaning, parameterMeaning } from '../../src/present/model-words.js';

describe('model words', () => {
  it('name a network element\'s kind and its neighbours in its group', () => {
    expect(networkLeafMeaning('R', 'series', ['L1', 'C1'])).toBe('resistance, in series with L1 and C1');
    expect(networkLeafMeaning('C', 'parallel', ['R2'])).toBe('capacitance, in parallel with R2');
    expect(networkLeafMeaning('L', 'series', ['R1', 'a parallel group', 'C3'])).toBe('inductance, in series with R1, a parallel group and C3');
    expect(networkLeafMeaning('R', 'series', [])).toBe('resistance');
  });

  it('keep the fixed models\' names, a bead\'s core elements included', () => {
    expect(parameterMeaning('ESR', 'capacitor')).toBe('equivalent series resistance');
    expect(parameterMeaning('L', 'bead')).toBe('core inductance');
    expect(parameterMeaning('R1', 'network')).toBe('');
  });
});
