import { describe, expect, it } from 'vitest';
import { cautionsFor, groupedCautions, GENERAL_CAUTION, RATINGS_CAUTION } from '../../src/present/cautions.js';
import type { Part } from '../../src/model/part.js';
import { loadLibrary } from '../../src/model/library.js';
import { REPO } from '../site-helpers.js';

// The demo library's parts (invented): several capacitors rated 4 V to 16 V DC, of X5R, X6S and X7R.
const library = loadLibrary(REPO).library!;
const part = (id: string): Part => library.partsById.get(id)!;

describe('grouped cautions of a review pack', () => {
  const ids = ['ORV-C-0402-100N-X7R', 'ORV-C-0402-2U2-X6S', 'ORV-C-0603-100N-X7R', 'ORV-C-POLY-220U-6V3'];
  const grouped = groupedCautions(ids.map(part));

  it('say each caution once and name every part that carries it', () => {
    for (const id of ids) {
      for (const c of cautionsFor(part(id))) {
        if (c === GENERAL_CAUTION || c === RATINGS_CAUTION) continue;
        const holders = grouped.filter((g) => g.parts.some((p) => p.id === id));
        // Either the caution itself, or the one DC-rating caution that stands for every rated part.
        expect(holders.some((g) => g.text === c || (/^Do not exceed the rated/.test(c) && /^Do not exceed a capacitor's rated DC voltage/.test(g.text))), `${id}: ${c}`).toBe(true);
      }
    }
    expect(new Set(grouped.map((g) => g.text)).size).toBe(grouped.length);
  });

  it('put the DC ratings in one caution with each part\'s rating beside it', () => {
    const rating = grouped.filter((g) => /rated/.test(g.text) && /ripple peaks/.test(g.text));
    expect(rating).toHaveLength(1);
    expect(rating[0].parts.map((p) => p.id)).toEqual(ids);
    expect(rating[0].parts.find((p) => p.id === 'ORV-C-0402-2U2-X6S')!.detail).toBe('4 V');
    expect(rating[0].parts.find((p) => p.id === 'ORV-C-0402-100N-X7R')!.detail).toBe('16 V');
  });

  it('name the X7R parts under the X7R caution and only them', () => {
    const x7r = grouped.find((g) => g.text.startsWith('X7R is a class 2 ceramic'))!;
    expect(x7r.parts.map((p) => p.id)).toEqual(['ORV-C-0402-100N-X7R', 'ORV-C-0603-100N-X7R']);
  });

  it('end with the general cautions, which apply to every part', () => {
    expect(grouped.slice(-2)).toEqual([
      { text: GENERAL_CAUTION, parts: [] },
      { text: RATINGS_CAUTION, parts: [] },
    ]);
  });
});
