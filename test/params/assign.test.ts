/**
 * Whole-molecule generic parameters (src/params/assign.ts): the model file
 * is complete and valid, its gradient is right, its terms are the ones the
 * rules call for, and bad input is refused with the place named.
 */
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/model.js';
import type { ModelFile, TermRecord } from '../../src/model/schema.js';
import { convertModelUnits } from '../../src/model/convert.js';
import { assignGenericParameters, effectiveBondOrders, GENERIC_CAUTION } from '../../src/params/assign.js';
import { naturalBondLength } from '../../src/params/formulas.js';
import { GENERIC_ATOM_TYPES as T } from '../../src/params/generic-atoms.js';
import { checkGradient } from '../../src/testing/index.js';
import { expectModelError } from '../model/fixtures.js';
import { REFERENCE_MOLECULES } from '../reference/generic-geometries.js';
import { formamide, hydrogenPeroxide, reference, type TestMolecule } from './molecules.js';
import { buildTopology } from './topology-fixture.js';

function assign(m: TestMolecule): ModelFile {
  return assignGenericParameters(m.topology, m.x);
}
function ofKind<K extends TermRecord['kind']>(file: ModelFile, kind: K): Extract<TermRecord, { kind: K }>[] {
  return file.terms.filter((t): t is Extract<TermRecord, { kind: K }> => t.kind === kind);
}

describe('assignGenericParameters: every reference molecule', () => {
  for (const { name } of REFERENCE_MOLECULES) {
    it(`${name}: a model parseModel accepts, with an exact gradient at the start and a perturbed geometry`, () => {
      const m = reference(name);
      const file = assign(m);
      const model = parseModel(JSON.stringify(file));
      expect(model.atomCount).toBe(m.topology.atomCount);
      expect(model.toJSON()).toEqual(file);
      const check = checkGradient((y, g) => model.energy(y, g), m.x);
      expect(check.maxRelError, name).toBeLessThanOrEqual(1e-7);
      const moved = m.x.map((v, i) => v + 0.05 * Math.sin(7 * i + 1));
      expect(checkGradient((y, g) => model.energy(y, g), moved).maxRelError, name).toBeLessThanOrEqual(1e-7);
    });
  }
});

describe('the model file', () => {
  const water = assign(reference('water'));
  it('is in Å and kcal/mol with title, typed atoms with charge 0, the topology’s bonds and the caution in metadata', () => {
    expect(water.units).toEqual({ length: 'angstrom', energy: 'kcal/mol' });
    expect(water.title).toBe('generic parameters');
    expect(water.atoms).toEqual([
      { element: 'O', type: 'O_3', charge: 0 },
      { element: 'H', type: 'H_', charge: 0 },
      { element: 'H', type: 'H_', charge: 0 },
    ]);
    expect(water.bonds).toEqual([[0, 1], [0, 2]]);
    expect(water.metadata?.generator).toBe('strainwise generic parameters');
    expect(water.metadata?.caution).toBe('generic parameters: for clean-up and rough geometry, not quantitative energies');
    expect(GENERIC_CAUTION).toBe(water.metadata?.caution);
  });
  it('takes a title and atom names', () => {
    const m = reference('water');
    const file = assignGenericParameters(m.topology, m.x, { title: 'water', names: ['O1', 'H1', 'H2'] });
    expect(file.title).toBe('water');
    expect(file.atoms.map((a) => a.name)).toEqual(['O1', 'H1', 'H2']);
  });
  it('nonbonded: Lennard-Jones with rmin = x_I and ε = D_I, geometric, 1-2 and 1-3 excluded, 1-4 unscaled, no cutoff, no Coulomb', () => {
    // x_I and D_I: O_3 3.500, 0.060; H_ 2.886, 0.044 (from memory of Rappé et al. 1992, Table 1)
    expect(water.nonbonded).toEqual({
      lennardJones: { rmin: [3.5, 2.886, 2.886], epsilon: [0.06, 0.044, 0.044], combination: 'geometric' },
      exclusions: { bondSeparation: 2, scale14: { lennardJones: 1, coulomb: 1 } },
      cutoff: null,
    });
  });
  it('water: two bonds at the natural O_3–H_ length and one cosine-series angle at θ0 104.51°, nothing else', () => {
    expect(water.terms.map((t) => t.kind)).toEqual(['harmonic-bond', 'harmonic-bond', 'cosine-series-angle']);
    const [bond] = ofKind(water, 'harmonic-bond');
    expect(bond.r0).toBeCloseTo(naturalBondLength(T.O_3, T.H_, 1), 7);
    expect(ofKind(water, 'cosine-series-angle')[0].theta0).toBe(104.51);
  });
  it('converts to nm and kJ/mol like any model (the same energy, ×4.184)', () => {
    const m = reference('ethane');
    const file = assign(m);
    const a = parseModel(file);
    const b = parseModel(convertModelUnits(file, { length: 'nanometer', energy: 'kJ/mol' }));
    expect(b.energy(b.coordinates) / 4.184).toBeCloseTo(a.energy(a.coordinates), 9);
  });
});

describe('which terms', () => {
  it('ethane: 7 bonds, 12 angles, 9 torsions of n 3 with k = ½·2.119/9, phase 0', () => {
    const file = assign(reference('ethane'));
    expect(ofKind(file, 'harmonic-bond')).toHaveLength(7);
    expect(ofKind(file, 'cosine-series-angle')).toHaveLength(12);
    const torsions = ofKind(file, 'periodic-dihedral');
    expect(torsions).toHaveLength(9);
    for (const t of torsions) {
      expect(t.n).toBe(3);
      expect(t.phase).toBe(0);
      expect(t.k).toBeCloseTo(2.119 / 2 / 9, 7);
    }
  });
  it('acetylene and CO2: linear angles are periodic-angle n 1 at 180°; no torsions about a bond to an sp atom', () => {
    for (const name of ['acetylene', 'carbon dioxide', 'acetonitrile']) {
      const file = assign(reference(name));
      const linear = ofKind(file, 'periodic-angle').filter((t) => t.n === 1);
      expect(linear.length, name).toBeGreaterThan(0);
      for (const t of linear) expect(t.theta0).toBe(180);
    }
    expect(ofKind(assign(reference('acetylene')), 'periodic-dihedral')).toHaveLength(0);
  });
  it('benzene: trigonal angles n 3 at 120°, ring torsions n 2 phase 180 with V = 26.9484 over 4 torsions per C–C, inversions k 6 at every carbon', () => {
    const file = assign(reference('benzene'));
    const angles = ofKind(file, 'periodic-angle');
    expect(angles).toHaveLength(18);
    for (const a of angles) expect([a.n, a.theta0]).toEqual([3, 120]);
    const torsions = ofKind(file, 'periodic-dihedral');
    expect(torsions).toHaveLength(24); // 6 C–C bonds × 2 × 2
    for (const t of torsions) {
      expect([t.n, t.phase]).toEqual([2, 180]);
      expect(t.k).toBeCloseTo(26.9484 / 2 / 4, 4);
    }
    const inversions = ofKind(file, 'inversion');
    expect(inversions.map((t) => t.atoms[0])).toEqual([0, 1, 2, 3, 4, 5]);
    for (const t of inversions) expect([t.k, t.omega0]).toEqual([6, 0]);
  });
  it('formaldehyde: the carbonyl carbon’s inversion is 50; ethylene’s carbons 6', () => {
    expect(ofKind(assign(reference('formaldehyde')), 'inversion').map((t) => t.k)).toEqual([50]);
    expect(ofKind(assign(reference('ethylene')), 'inversion').map((t) => t.k)).toEqual([6, 6]);
  });
  it('trimethylphosphine: a pyramidal inversion at P with ω0 84.4339°; ammonia and methylamine have none', () => {
    const inv = ofKind(assign(reference('trimethylphosphine')), 'inversion');
    expect(inv).toHaveLength(1);
    expect(inv[0].atoms[0]).toBe(0);
    expect(inv[0].omega0).toBe(84.4339);
    expect(ofKind(assign(reference('ammonia')), 'inversion')).toHaveLength(0);
    expect(ofKind(assign(reference('methylamine')), 'inversion')).toHaveLength(0);
  });
  it('propene: the CH3–CH= torsions are V 2, n 3 (sp3 next to an sp2 that has an sp2 neighbour), over 6 torsions', () => {
    const file = assign(reference('propene'));
    const about = ofKind(file, 'periodic-dihedral').filter((t) => t.atoms[1] === 1 && t.atoms[2] === 2);
    expect(about).toHaveLength(6);
    for (const t of about) {
      expect([t.n, t.phase]).toEqual([3, 0]);
      expect(t.k).toBeCloseTo(2 / 2 / 6, 7);
    }
  });
  it('hydrogen peroxide: the O–O torsion is the group-16 one, n 2 with its minimum at 90°', () => {
    const [t] = ofKind(assign(hydrogenPeroxide()), 'periodic-dihedral');
    expect([t.n, t.phase, t.k]).toEqual([2, 0, 1]); // V = √(2·2) = 2 over one torsion: k = 1
  });
  it('formamide: the amide C–N has bond order 1.41 and a natural length from it; N is N_R with an inversion of 6', () => {
    const m = formamide();
    const orders = effectiveBondOrders(m.topology);
    expect(Array.from(orders)).toEqual([2, 1.41, 1, 1, 1]); // bonds sorted: 0-1, 0-2, 0-3, 2-4, 2-5
    const file = assign(m);
    const cn = ofKind(file, 'harmonic-bond').find((b) => b.atoms[0] === 0 && b.atoms[1] === 2);
    expect(cn?.r0).toBeCloseTo(naturalBondLength(T.C_2, T.N_R, 1.41), 7);
    expect(ofKind(file, 'inversion').map((t) => [t.atoms[0], t.k])).toEqual([[0, 50], [2, 6]]);
  });
});

describe('refusals', () => {
  it('coordinates of the wrong length or not finite', () => {
    const m = reference('water');
    expectModelError(() => assignGenericParameters(m.topology, new Float64Array(6)), 'coordinates: expected 3N = 9 numbers (3 atoms), got 6');
    const bad = m.x.slice();
    bad[4] = Number.NaN;
    expectModelError(() => assignGenericParameters(m.topology, bad), 'coordinates[1]: expected finite numbers, got NaN');
  });
  it('names of the wrong count', () => {
    const m = reference('water');
    expectModelError(() => assignGenericParameters(m.topology, m.x, { names: ['O'] }), 'names: expected 3 names (one per atom), got 1');
  });
  it('an atom without parameters, by its place', () => {
    const t = buildTopology({ elements: ['Se', 'H', 'H'], bonds: [[0, 1, 1], [0, 2, 1]] });
    expectModelError(() => assignGenericParameters(t, new Float64Array(9)), 'atoms[0]: no generic parameters for element Se (the table covers H, B, C, N, O, F, Si, P, S, Cl, Br, I)');
  });
});
