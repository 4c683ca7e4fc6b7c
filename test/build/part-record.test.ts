// What a rebuild takes of a part carried over: its listed data read from the record's text only when a field
// other than its id is asked for, and then the very data recorded.

import { describe, expect, it } from 'vitest';
import { carriedPart, partData } from '../../src/build/part-record.js';
import { listedPart, type ListedPart } from '../../src/pages/listed-part.js';

const listed: ListedPart = {
  id: 'CAP-1',
  kind: 'capacitor',
  title: 'Test capacitor (invented)',
  package: '0402',
  ratingText: '16 V DC',
  tagsText: 'test',
  searchText: 'cap-1 test capacitor',
  text: { kindLabel: 'Capacitor', nominalText: '100 nF', srfText: '50 MHz', bandText: 'to 20 MHz' },
  sort: { nominal: 1e-7, rating: 16, srf: 5e7, band: 2e7 },
  srfImpedanceText: '5 mΩ',
  sourceFile: 'parts/c1.yaml',
  sourceHash: '0123456789abcdef',
};

describe('a carried part', () => {
  it('reads its recorded text only when a field beyond its id is read, and gives back what was recorded', () => {
    const text = JSON.stringify(partData(listed, false, undefined));
    const carried = carriedPart('CAP-1', { key: 'k', stamp: [1], text });
    expect(carried.listed!.id).toBe('CAP-1');
    expect(listedPart(carried.listed!)).toEqual(listed);
    expect(JSON.parse(JSON.stringify(carried.listed))).toEqual(listed);
    expect(carried.page).toBeUndefined();

    // Text that does not parse: the id is still known (nothing was read), the first other field throws.
    const broken = carriedPart('CAP-1', { key: 'k', stamp: [1], text: '{"listed":{"id": no' });
    expect(broken.listed!.id).toBe('CAP-1');
    expect(() => broken.listed!.title).toThrow(SyntaxError);
  });

  it('has no listed data when the record has none', () => {
    expect(carriedPart('CAP-1', { key: 'k', stamp: [1] }).listed).toBeUndefined();
    expect(carriedPart('CAP-1', undefined).listed).toBeUndefined();
    expect(carriedPart('CAP-1', { key: 'k', stamp: [1], text: '{"page":{}}' }).listed).toBeUndefined();
  });
});
