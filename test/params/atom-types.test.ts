/**
 * Generic atom typing (src/params/atom-types.ts): the labels of Rappé et
 * al., J. Am. Chem. Soc. 114 (1992) 10024 (its notation), and refusals.
 */
import { describe, expect, it } from 'vitest';
import { genericAtomTypes, typeGeometry } from '../../src/params/atom-types.js';
import { GENERIC_ATOM_TYPES } from '../../src/params/generic-atoms.js';
import { expectModelError } from '../model/fixtures.js';
import { formamide, hydrogenPeroxide, molecule, reference } from './molecules.js';
import { buildTopology } from './topology-fixture.js';

describe('genericAtomTypes', () => {
  // Expected labels: the paper's scheme as the brief lists it (element, hybridization digit or R).
  const cases: [string, string[]][] = [
    ['water', ['O_3', 'H_', 'H_']],
    ['methane', ['C_3', 'H_', 'H_', 'H_', 'H_']],
    ['ethane', ['C_3', 'C_3', 'H_', 'H_', 'H_', 'H_', 'H_', 'H_']],
    ['ethylene', ['C_2', 'C_2', 'H_', 'H_', 'H_', 'H_']],
    ['acetylene', ['H_', 'C_1', 'C_1', 'H_']],
    ['benzene', [...Array(6).fill('C_R'), ...Array(6).fill('H_')]],
    ['formaldehyde', ['C_2', 'O_2', 'H_', 'H_']],
    ['methanol', ['C_3', 'O_3', 'H_', 'H_', 'H_', 'H_']],
    ['methylamine', ['C_3', 'N_3', 'H_', 'H_', 'H_', 'H_', 'H_']],
    ['acetonitrile', ['C_3', 'C_1', 'H_', 'H_', 'H_', 'N_1']],
    ['tetrafluoromethane', ['C_3', 'F_', 'F_', 'F_', 'F_']],
    ['chloromethane', ['C_3', 'Cl', 'H_', 'H_', 'H_']],
    ['dimethyl sulfide', ['S_3+2', 'C_3', 'C_3', ...Array(6).fill('H_')]],
    ['trimethylphosphine', ['P_3+3', 'C_3', 'C_3', 'C_3', ...Array(9).fill('H_')]],
    ['boron trifluoride', ['B_2', 'F_', 'F_', 'F_']],
    ['silane', ['Si3', 'H_', 'H_', 'H_', 'H_']],
    ['pyridine', ['N_R', ...Array(5).fill('C_R'), ...Array(5).fill('H_')]],
    ['thiophene', ['S_R', ...Array(4).fill('C_R'), ...Array(4).fill('H_')]],
    ['carbon dioxide', ['O_2', 'C_1', 'O_2']],
  ];
  for (const [name, expected] of cases) {
    it(`${name}: ${[...new Set(expected)].join(', ')}`, () => {
      const types = genericAtomTypes(reference(name).topology);
      expect(types).toEqual(expected);
      for (const t of types) expect(GENERIC_ATOM_TYPES[t], t).toBeDefined();
    });
  }

  it('an amide nitrogen is resonant (N_R), as is its carbon’s partner typed C_2 and O_2', () => {
    expect(genericAtomTypes(formamide().topology)).toEqual(['C_2', 'O_2', 'N_R', 'H_', 'H_', 'H_']);
  });

  it('hydrogen peroxide: O_3 twice', () => {
    expect(genericAtomTypes(hydrogenPeroxide().topology)).toEqual(['O_3', 'O_3', 'H_', 'H_']);
  });

  it('sulfur by neighbour count: S_3+4 with three, S_3+6 with four, S_2 for a terminal double bond', () => {
    const sulfoxide = buildTopology({ elements: ['S', 'O', 'C', 'C'], bonds: [[0, 1, 2], [0, 2, 1], [0, 3, 1]], hybridization: { 0: 'sp3' } });
    expect(genericAtomTypes(sulfoxide)[0]).toBe('S_3+4');
    const sulfone = buildTopology({ elements: ['S', 'O', 'O', 'C', 'C'], bonds: [[0, 1, 2], [0, 2, 2], [0, 3, 1], [0, 4, 1]], hybridization: { 0: 'sp3' } });
    expect(genericAtomTypes(sulfone)[0]).toBe('S_3+6');
    const thioformaldehyde = buildTopology({ elements: ['C', 'S', 'H', 'H'], bonds: [[0, 1, 2], [0, 2, 1], [0, 3, 1]] });
    expect(genericAtomTypes(thioformaldehyde)).toEqual(['C_2', 'S_2', 'H_', 'H_']);
  });

  it('typeGeometry reads the label: 1 linear, 2 and R trigonal, 3 tetrahedral, else terminal', () => {
    expect(['C_1', 'C_2', 'C_R', 'C_3', 'S_3+2', 'Si3', 'P_3+3', 'H_', 'Cl', 'F_'].map(typeGeometry)).toEqual([
      'linear', 'trigonal', 'trigonal', 'tetrahedral', 'tetrahedral', 'tetrahedral', 'tetrahedral', 'terminal', 'terminal', 'terminal',
    ]);
  });
});

describe('refusals: never a silent guess', () => {
  it('an element outside the table', () => {
    const t = buildTopology({ elements: ['C', 'H', 'H', 'H', 'H', 'H', 'H', 'Se', 'H'], bonds: [[0, 1, 1], [0, 2, 1], [0, 3, 1], [0, 7, 1], [7, 8, 1]] });
    expectModelError(() => genericAtomTypes(t), 'atoms[7]: no generic parameters for element Se (the table covers H, B, C, N, O, F, Si, P, S, Cl, Br, I)');
  });
  it('a five-coordinate carbon', () => {
    const t = buildTopology({ elements: ['C', 'H', 'H', 'H', 'H', 'H'], bonds: [[0, 1, 1], [0, 2, 1], [0, 3, 1], [0, 4, 1], [0, 5, 1]] });
    expectModelError(() => genericAtomTypes(t), 'atoms[0]: no generic parameters for C_3 with 5 neighbours (at most 4)');
  });
  it('a bridging hydrogen and a halogen with two bonds', () => {
    const bridged = buildTopology({ elements: ['B', 'H', 'B'], bonds: [[0, 1, 1], [1, 2, 1]] });
    expectModelError(() => genericAtomTypes(bridged), 'atoms[1]: no generic parameters for H_ with 2 neighbours (at most 1)');
    const chloronium = buildTopology({ elements: ['C', 'Cl', 'C'], bonds: [[0, 1, 1], [1, 2, 1]] });
    expectModelError(() => genericAtomTypes(chloronium), 'atoms[1]: no generic parameters for Cl with 2 neighbours (at most 1)');
  });
  it('a carbon or nitrogen whose hybridization is none', () => {
    const t = buildTopology({ elements: ['C', 'N'], bonds: [[0, 1, 3]], hybridization: { 1: 'none' } });
    expectModelError(() => genericAtomTypes(t), 'atoms[1]: no generic parameters for N with hybridization none');
  });
  it('an sp2 carbon with four neighbours', () => {
    const m = molecule([['C'], ['H', 0, 1.1], ['H', 0, 1.1, 1, 109], ['H', 0, 1.1, 1, 109, 2, 120], ['H', 0, 1.1, 1, 109, 2, -120]], [[0, 1, 1], [0, 2, 1], [0, 3, 1], [0, 4, 1]], { hybridization: { 0: 'sp2' } });
    expectModelError(() => genericAtomTypes(m.topology), 'atoms[0]: no generic parameters for C_2 with 4 neighbours (at most 3)');
  });
});
