// A rail plan in words, for the fixture library's invented rails. The target Z_t = V·ripple/ΔI (L. D. Smith
// et al., IEEE Trans. Advanced Packaging 22(3), 1999): VDD_TEST's 1.0 V × 5% / 2 A = 25 mΩ, worked by hand.

import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analysePlan, type PlanFigures } from '../../src/analysis/plan-figures.js';
import { loadLibrary } from '../../src/model/library.js';
import {
  atRailText,
  biasLine,
  biasNote,
  biasSourceText,
  mountingSourceText,
  planBandText,
  planResultLine,
  planTargetText,
  planVerdict,
  planeText,
  regulatorText,
} from '../../src/present/plan-words.js';

const { library } = loadLibrary(fileURLToPath(new URL('../fixtures/rail-library', import.meta.url)));
const figures = (rail: string) => analysePlan(library!.plans.find((p) => p.rail === rail)!, 50);

describe('target and verdict', () => {
  const f = figures('VDD_TEST');
  it('give the target and how it was found', () => {
    expect(planTargetText(f)).toBe('25 mΩ = 1 V × 5% / 2 A');
    expect(planTargetText({ ...f, target: { kind: 'explicit', ohms: 0.01 }, targetOhm: 0.01 })).toBe('10 mΩ as given');
  });

  it('rest the verdict on the worst margin, and say PASS or FAIL on the command line', () => {
    expect(planVerdict(f)).toMatch(/^worst margin [+−]\d+\.\d\d dB at [\d.]+ [kMG]?Hz \(\|Z\| [\d.]+ mΩ\)$/);
    expect(planResultLine(f)).toBe(`${f.pass ? 'PASS' : 'FAIL'}  ${planVerdict(f)}`);
    const empty: PlanFigures = { ...f, branches: [], pass: true };
    expect(planVerdict(empty)).toBe('nothing is on the rail yet');
    expect(planResultLine(empty)).toBe('FAIL  nothing is on the rail yet');
  });

  it('name the band, the regulator and the plane as the plan file gives them', () => {
    expect(planBandText(f)).toBe('100 kHz to 100 MHz');
    expect(regulatorText(f.regulator!)).toBe('3 mΩ + 5 nH');
    expect(regulatorText({ rOhm: null, lH: 5e-9 })).toBe('5 nH');
    expect(planeText(f.plane!)).toBe('10 nF + 3 mΩ');
    expect(planeText({ cF: 1e-8, rOhm: null })).toBe('10 nF');
  });
});

describe('placements', () => {
  const f = figures('VDD_TEST');
  const byId = (id: string) => f.placements.find((p) => p.partId === id)!;

  it('say where each mounting comes from', () => {
    expect(mountingSourceText(byId('RT-C-100N'))).toBe('plan entry');
    expect(mountingSourceText(byId('RT-C-1U'))).toBe('rail default');
    expect(mountingSourceText({ mountingFrom: 'package', package: '0402' })).toBe('package 0402');
    expect(mountingSourceText({ mountingFrom: 'part', package: null })).toBe('part file');
  });

  it('give the capacitance at the rail: RT-C-22U keeps 90% at 1 V (its table), RT-C-1U counts at nominal', () => {
    const bulk = byId('RT-C-22U');
    expect(atRailText(bulk)).toBe('19.8 µF (90%)');
    expect(biasSourceText(bulk)).toBe('DC-bias table');
    expect(biasLine(bulk, 1)).toBe('19.8 µF at 1 V (90% of 22 µF, DC-bias table)');
    const plain = byId('RT-C-1U');
    expect(atRailText(plain)).toBe('1 µF');
    expect(biasSourceText(plain)).toBe('no DC-bias table: nominal');
    expect(biasLine(plain, 1)).toBe('1 µF (no DC-bias table: nominal)');
    expect(biasNote(f)).toBe('Capacitances at 1 V come from the DC-bias tables of RT-C-22U, RT-C-4U7 (linear between points, from 100% at 0 V unless the table gives 0 V); other parts count at nominal.');
    expect(biasNote({ ...f, biasDerated: [] })).toBe('No placed part has a DC-bias table: every capacitance counts at nominal.');
  });
});
