import { describe, expect, it } from 'vitest';
import { convertModelUnits } from '../../src/model/convert.js';
import type { ModelFile, TermRecord } from '../../src/model/schema.js';
import { readModelFile } from '../../src/model/validate.js';
import type { Units } from '../../src/units.js';
import { allKindsAngstrom, allKindsNanometer } from './fixtures.js';

const A_KCAL: Units = { length: 'angstrom', energy: 'kcal/mol' };
const NM_KJ: Units = { length: 'nanometer', energy: 'kJ/mol' };
const NM_KCAL: Units = { length: 'nanometer', energy: 'kcal/mol' };
const A_KJ: Units = { length: 'angstrom', energy: 'kJ/mol' };

/** Assert |a − b| ≤ tol·|b| (or ≤ tol when b is 0). */
function expectRelative(a: number, b: number, tol = 1e-12): void {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(Math.abs(b), 1e-300) + (b === 0 ? tol : 0));
}

/** Every number in `a` equals the one at the same place in `b` to `tol` relative; everything else is equal. */
function expectSameNumbers(a: unknown, b: unknown, tol = 1e-12, path = ''): void {
  if (typeof a === 'number' && typeof b === 'number') {
    expect(Math.abs(a - b), path).toBeLessThanOrEqual(tol * Math.abs(b));
  } else if (Array.isArray(a) && Array.isArray(b)) {
    expect(a.length, path).toBe(b.length);
    a.forEach((x, i) => expectSameNumbers(x, b[i], tol, `${path}[${i}]`));
  } else if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') {
    expect(Object.keys(a), path).toEqual(Object.keys(b));
    for (const k of Object.keys(a)) expectSameNumbers((a as never)[k], (b as never)[k], tol, `${path}.${k}`);
  } else {
    expect(a, path).toEqual(b);
  }
}

function term<K extends TermRecord['kind']>(file: ModelFile, kind: K, nth = 0): Extract<TermRecord, { kind: K }> {
  return file.terms.filter((t): t is Extract<TermRecord, { kind: K }> => t.kind === kind)[nth];
}

describe('convertModelUnits', () => {
  // Hand-checked factors, from the definitions 1 kcal = 4.184 kJ and 1 nm = 10 Å (both exact):
  // length ×0.1, energy ×4.184, energy/length² ×418.4, per length ×10.
  const source = readModelFile(allKindsAngstrom());
  const out = convertModelUnits(source, NM_KJ);

  it('converts a bond k of 1 kcal/mol/Å² to 418.4 kJ/mol/nm²', () => {
    const one = readModelFile({
      ...allKindsAngstrom(),
      terms: [{ kind: 'harmonic-bond', atoms: [0, 1], k: 1, r0: 1 }],
    });
    const converted = convertModelUnits(one, NM_KJ);
    const bond = term(converted, 'harmonic-bond');
    expectRelative(bond.k, 418.4);
    expectRelative(bond.r0, 0.1);
  });

  it('replaces the units and converts coordinates as lengths', () => {
    expect(out.units).toEqual(NM_KJ);
    expectSameNumbers(out.coordinates, source.coordinates.map((r) => r.map((x) => x * 0.1)));
  });

  it('converts each parameter by its dimension', () => {
    const b = term(out, 'harmonic-bond');
    expectRelative(b.k, 620 * 418.4);
    expectRelative(b.r0, 0.153);
    const m = term(out, 'morse-bond');
    expectRelative(m.D, 88 * 4.184);
    expectRelative(m.a, 18);
    expectRelative(m.r0, 0.153);
    const ha = term(out, 'harmonic-angle');
    expectRelative(ha.k, 80 * 4.184); // energy per radian²: no length
    expect(ha.theta0).toBe(109.5);
    const ca = term(out, 'cosine-angle');
    expectRelative(ca.k, 60 * 4.184);
    expect(ca.theta0).toBe(111);
    const ub = term(out, 'urey-bradley');
    expectRelative(ub.k, 22 * 418.4);
    expectRelative(ub.s0, 0.25);
    const pd = term(out, 'periodic-dihedral');
    expectRelative(pd.k, -0.2 * 4.184);
    expect(pd.n).toBe(3);
    expect(pd.phase).toBe(180);
    const rb = term(out, 'ryckaert-bellemans');
    expectSameNumbers(rb.c, [2.2, 2.9, -0.7, -4.4, 0, 0].map((c) => c * 4.184));
    const hi = term(out, 'harmonic-improper');
    expectRelative(hi.k, 10 * 4.184);
    expect(hi.xi0).toBe(-35.26);
    const pr = term(out, 'position-restraint');
    expectRelative(pr.k, 5 * 418.4);
    expectSameNumbers(pr.x0, [0.35, 0.14, 0]);
    expectRelative(pr.flat ?? Number.NaN, 0.02);
    expect('flat' in term(out, 'position-restraint', 1)).toBe(false);
    const dr = term(out, 'distance-restraint');
    expectRelative(dr.k, 3 * 418.4);
    expectRelative(dr.lower, 0.3);
    expectRelative(dr.upper, 0.42);
    // extensions (docs/model-file.md): k is an energy per radian², angles stay degrees
    const cs = term(out, 'cosine-series-angle');
    expectRelative(cs.k, 90 * 4.184);
    expect(cs.theta0).toBe(109.47);
    const pa = term(out, 'periodic-angle');
    expectRelative(pa.k, 40 * 4.184);
    expect([pa.n, pa.theta0]).toEqual([3, 120]);
    const inv = term(out, 'inversion');
    expectRelative(inv.k, 6 * 4.184);
    expect(inv.omega0).toBe(0);
  });

  it('converts nonbonded lengths and energies, and the constraint length', () => {
    const lj = out.nonbonded?.lennardJones;
    expectSameNumbers(lj?.rmin, [0.38, 0.38, 0.38, 0.38, 0.26]);
    expectSameNumbers(lj?.epsilon, [0.1, 0.1, 0.1, 0.1, 0.02].map((e) => e * 4.184));
    expect(lj?.combination).toBe('lorentz-berthelot');
    expectRelative(out.nonbonded?.cutoff ?? Number.NaN, 0.9);
    expect(out.nonbonded?.coulomb).toEqual({ dielectric: 4 });
    expect(out.nonbonded?.exclusions).toEqual({ bondSeparation: 2, scale14: { lennardJones: 0.5, coulomb: 0.8333 } });
    expectRelative(out.constraints?.[0].length ?? Number.NaN, 0.5);
  });

  it('keeps what has no unit: atoms, bonds, frozen, title, metadata', () => {
    expect(out.atoms).toEqual(source.atoms);
    expect(out.bonds).toEqual(source.bonds);
    expect(out.frozen).toEqual(source.frozen);
    expect(out.title).toBe(source.title);
    expect(out.metadata).toEqual(source.metadata);
    expect(out.metadata).not.toBe(source.metadata);
  });

  it('leaves its input unchanged and returns a valid model', () => {
    expect(source).toEqual(readModelFile(allKindsAngstrom()));
    expect(readModelFile(out)).toEqual(out);
  });

  it('round-trips Å/kcal → nm/kJ → Å/kcal to 1e-12 relative', () => {
    expectSameNumbers(convertModelUnits(out, A_KCAL), source);
    const nm = readModelFile(allKindsNanometer());
    expectSameNumbers(convertModelUnits(convertModelUnits(nm, A_KCAL), NM_KJ), nm);
  });

  it('round-trips through the mixed unit systems', () => {
    const there = convertModelUnits(convertModelUnits(convertModelUnits(source, NM_KCAL), A_KJ), NM_KJ);
    expectSameNumbers(there, out);
    const bond = term(convertModelUnits(source, A_KJ), 'harmonic-bond');
    expectRelative(bond.k, 620 * 4.184); // energy only
    expectRelative(term(convertModelUnits(source, NM_KCAL), 'harmonic-bond').k, 620 * 100); // length only
  });

  it('is an exact copy when the units are the same', () => {
    const same = convertModelUnits(source, A_KCAL);
    expect(same).toEqual(source);
    expect(same).not.toBe(source);
    expect(same.terms).not.toBe(source.terms);
  });

  it('keeps a null cutoff null and a model without optional parts as it is', () => {
    const nm = readModelFile(allKindsNanometer());
    expect(convertModelUnits(nm, A_KCAL).nonbonded?.cutoff).toBeNull();
    const { nonbonded: _n, constraints: _c, frozen: _f, metadata: _m, ...rest } = allKindsAngstrom();
    const bare = readModelFile(rest);
    const converted = convertModelUnits(bare, NM_KJ);
    expect(Object.keys(converted)).toEqual(Object.keys(bare));
    expectSameNumbers(convertModelUnits(converted, A_KCAL), bare);
  });
});
