/**
 * The atomic table of src/params/generic-atoms.ts: complete for the
 * elements it claims, internally consistent, and holding the values the
 * project brief recalls (all from memory of Rappé et al., J. Am. Chem. Soc.
 * 114 (1992) 10024, Table 1 — two recollections agreeing, not a check
 * against the paper).
 */
import { describe, expect, it } from 'vitest';
import { GENERIC_ATOM_TYPES, GENERIC_ELEMENTS } from '../../src/params/generic-atoms.js';

describe('GENERIC_ATOM_TYPES', () => {
  it('covers every element it claims, and each label starts with its element', () => {
    const elements = new Set(Object.values(GENERIC_ATOM_TYPES).map((p) => p.element));
    expect([...elements].sort()).toEqual([...GENERIC_ELEMENTS].sort());
    for (const [label, p] of Object.entries(GENERIC_ATOM_TYPES)) expect(label.startsWith(p.element), label).toBe(true);
  });

  it('has positive radii, distances, charges and electronegativities, θ0 in (90°, 180°] except S and P (92°–94°), non-negative barriers', () => {
    for (const [label, p] of Object.entries(GENERIC_ATOM_TYPES)) {
      for (const v of [p.radius, p.vdwDistance, p.vdwEnergy, p.zeta, p.effectiveCharge, p.electronegativity]) expect(v, label).toBeGreaterThan(0);
      expect(p.theta0, label).toBeGreaterThan(90);
      expect(p.theta0, label).toBeLessThanOrEqual(180);
      expect(p.torsionSp3, label).toBeGreaterThanOrEqual(0);
      expect(p.torsionSp2, label).toBeGreaterThanOrEqual(0);
    }
  });

  it('types of one element share the nonbonded and charge parameters; only r and θ0 (and V) differ', () => {
    const byElement = new Map<string, (typeof GENERIC_ATOM_TYPES)[string][]>();
    for (const p of Object.values(GENERIC_ATOM_TYPES)) byElement.set(p.element, [...(byElement.get(p.element) ?? []), p]);
    for (const [element, list] of byElement) {
      for (const p of list) {
        expect([p.vdwDistance, p.vdwEnergy, p.zeta, p.effectiveCharge, p.electronegativity], element).toEqual([
          list[0].vdwDistance, list[0].vdwEnergy, list[0].zeta, list[0].effectiveCharge, list[0].electronegativity,
        ]);
      }
    }
  });

  it('holds the values the brief recalls (from memory): C_3, C_R, C_2, C_1, H_, O_3, O_2, N_3, N_R, N_2, N_1 and the GMP χ of H, C, N, O', () => {
    const T = GENERIC_ATOM_TYPES;
    expect([T.C_3.radius, T.C_3.theta0, T.C_3.vdwDistance, T.C_3.vdwEnergy, T.C_3.zeta, T.C_3.effectiveCharge]).toEqual([0.757, 109.47, 3.851, 0.105, 12.73, 1.912]);
    expect([T.C_3.torsionSp3, T.C_3.torsionSp2]).toEqual([2.119, 2]);
    expect([T.C_R.radius, T.C_R.theta0, T.C_2.radius, T.C_2.theta0, T.C_1.radius, T.C_1.theta0]).toEqual([0.729, 120, 0.732, 120, 0.706, 180]);
    expect([T.H_.radius, T.H_.theta0, T.H_.vdwDistance, T.H_.vdwEnergy, T.H_.effectiveCharge]).toEqual([0.354, 180, 2.886, 0.044, 0.712]);
    expect([T.O_3.radius, T.O_3.theta0, T.O_2.radius, T.O_2.theta0]).toEqual([0.658, 104.51, 0.634, 120]);
    expect([T.N_3.radius, T.N_3.theta0, T.N_R.radius, T.N_R.theta0, T.N_2.radius, T.N_2.theta0, T.N_1.radius, T.N_1.theta0]).toEqual([
      0.7, 106.7, 0.699, 120, 0.685, 111.2, 0.656, 180,
    ]);
    expect([T.H_.electronegativity, T.C_3.electronegativity, T.N_3.electronegativity, T.O_3.electronegativity]).toEqual([4.528, 5.343, 6.899, 8.741]);
  });
});
