// Page folders: one rule for every page (letters, digits, ".", "_" and "-" kept; any other run becomes one
// "-"), from a rail's name and from a review's file name below reviews/.

import { describe, expect, it } from 'vitest';
import { railSlug, reviewSlug } from '../../src/present/slugs.js';

describe('page folders', () => {
  it('of a rail: its name with every other run of characters as one "-"', () => {
    expect(railSlug('VDD_CORE')).toBe('VDD_CORE');
    expect(railSlug('VDD 3V3 / AUX')).toBe('VDD-3V3-AUX');
  });

  it('of a review: its file name below reviews/, without the extension, subfolders joined by "-"', () => {
    expect(reviewSlug({ source: { path: 'reviews/dl3-power-integrity.yaml' } })).toBe('dl3-power-integrity');
    expect(reviewSlug({ source: { path: 'reviews/2026/q1 board.yml' } })).toBe('2026-q1-board');
  });

  it('never "." or "..": such a name keeps a hash of itself', () => {
    expect(railSlug('..')).toMatch(/^\.\.-[0-9a-f]{8}$/);
    expect(railSlug('..')).not.toBe(railSlug('.'));
  });
});
