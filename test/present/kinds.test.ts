// The names of part kinds as pages say them, and a network's with what it behaves as.

import { describe, expect, it } from 'vitest';
import { kindLabel, kindPlural } from '../../src/present/kinds.js';

describe('kind names', () => {
  it('label a part by its kind, a network with what it behaves as', () => {
    expect(kindLabel({ kind: 'bead', behavesAs: 'bead' })).toBe('Ferrite bead');
    expect(kindLabel({ kind: 'network', behavesAs: 'capacitor' })).toBe('Network (behaves as capacitor)');
    expect(kindLabel({ kind: 'network', behavesAs: undefined })).toBe('Network');
  });

  it('name a kind in the plural for lists', () => {
    expect(['capacitor', 'inductor', 'resistor', 'bead', 'network'].map((k) => kindPlural(k as 'capacitor'))).toEqual(['capacitors', 'inductors', 'resistors', 'ferrite beads', 'networks']);
  });
});
