/**
 * The formulas of src/params/formulas.ts (Rappé et al., J. Am. Chem. Soc.
 * 114 (1992) 10024; equations and Table 1 values from memory), checked
 * against hand arithmetic written out beside each value, and the mapping of
 * the paper's torsion onto our periodic-dihedral.
 */
import { describe, expect, it } from 'vitest';
import { tableFromRecords } from '../../src/model/compile.js';
import {
  angleForceConstant,
  bondForceConstant,
  naturalBondLength,
  periodicDihedralFor,
  pyramidalInversionConstant,
  torsionRule,
  type TorsionCentre,
} from '../../src/params/formulas.js';
import { GENERIC_ATOM_TYPES as T } from '../../src/params/generic-atoms.js';
import { accumulatePeriodicDihedrals } from '../../src/terms/torsion.js';
import { accumulateInversions } from '../../src/terms/inversion.js';
import { chain, rad } from '../helpers/geometry.js';

describe('natural bond length r_IJ = r_I + r_J + r_BO − r_EN', () => {
  it('C_3–C_3: 0.757 + 0.757 = 1.514 (n = 1: r_BO = 0; equal χ: r_EN = 0)', () => {
    expect(naturalBondLength(T.C_3, T.C_3, 1)).toBeCloseTo(1.514, 12);
  });
  it('C_3–H_: 1.111 − r_EN, r_EN = 0.757·0.354·(√5.343 − √4.528)² / (5.343·0.757 + 4.528·0.354) = 0.267978·0.033707/5.647563 = 0.0015993 → 1.1094', () => {
    expect(naturalBondLength(T.C_3, T.H_, 1)).toBeCloseTo(1.109401, 5);
  });
  it('C_2=C_2: 1.464 − 0.1332·1.464·ln 2 = 1.464 − 0.135167 = 1.328833', () => {
    expect(naturalBondLength(T.C_2, T.C_2, 2)).toBeCloseTo(1.328833, 5);
  });
  it('C_R–C_R aromatic (n = 1.5): 1.458 − 0.1332·1.458·ln 1.5 = 1.458 − 0.078744 = 1.379256', () => {
    expect(naturalBondLength(T.C_R, T.C_R, 1.5)).toBeCloseTo(1.379256, 5);
  });
  it('C_2=O_2: 1.366 − 0.1332·1.366·ln 2 − 0.732·0.634·(√5.343 − √8.741)²/(5.343·0.732 + 8.741·0.634) = 1.366 − 0.126119 − 0.020426 = 1.219455', () => {
    expect(naturalBondLength(T.C_2, T.O_2, 2)).toBeCloseTo(1.219455, 5);
  });
  it('is symmetric in its two atoms', () => {
    for (const [a, b] of [[T.C_3, T.O_3], [T.N_R, T.C_R], [T.Cl, T.C_3], [T['S_3+2'], T.H_]]) {
      expect(naturalBondLength(a, b, 1)).toBeCloseTo(naturalBondLength(b, a, 1), 14);
    }
  });
});

describe('force constants', () => {
  it('C_3–C_3 bond: k = 664.12·1.912²/1.514³ = 699.5918 kcal/mol/Å² (the value published implementations of the paper test against, from memory)', () => {
    expect(bondForceConstant(T.C_3, T.C_3, 1.514)).toBeCloseTo(699.5918, 3);
  });
  it('H–C_3–H angle at θ0 = 109.47°: r = 1.109401, r_IK² = 2r²(1 − cos θ0) = 3.282004, K = 664.12·0.712²/r_IK⁵ · [3r²(1 − cos²θ0) − r_IK² cos θ0] = 75.4988 kcal/mol/rad²', () => {
    const r = naturalBondLength(T.C_3, T.H_, 1);
    expect(angleForceConstant(0.712, 0.712, r, r, 109.47)).toBeCloseTo(75.4988, 3);
  });
  it('at θ0 = 180° the angle constant is 664.12 Z_I Z_K / r_IK³ (cos θ0 = −1, r_IK = r_IJ + r_JK)', () => {
    const [a, b] = [1.2054, 1.0584];
    expect(angleForceConstant(1.912, 0.712, a, b, 180)).toBeCloseTo((664.12 * 1.912 * 0.712) / (a + b) ** 3, 10);
  });
});

describe('torsion rules (from memory of Rappé et al. 1992)', () => {
  const centre = (label: string, geometry: TorsionCentre['geometry'], trigonalNeighbour = false): TorsionCentre => ({
    element: T[label].element,
    geometry,
    parameters: T[label],
    trigonalNeighbour,
  });
  it('sp3–sp3 C–C: V = √(2.119·2.119) = 2.119, n 3, φ0 180°', () => {
    expect(torsionRule(centre('C_3', 'tetrahedral'), centre('C_3', 'tetrahedral'), 1)).toMatchObject({ barrier: 2.119, n: 3, phi0: 180 });
  });
  it('sp3–sp3 C–O: V = √(2.119·0.018) = 0.19530', () => {
    expect(torsionRule(centre('C_3', 'tetrahedral'), centre('O_3', 'tetrahedral'), 1)?.barrier).toBeCloseTo(Math.sqrt(2.119 * 0.018), 12);
  });
  it('sp3–sp3 O–O and S–S: group 16, V = 2 and 6.8, n 2, φ0 90°', () => {
    expect(torsionRule(centre('O_3', 'tetrahedral'), centre('O_3', 'tetrahedral'), 1)).toMatchObject({ barrier: 2, n: 2, phi0: 90 });
    expect(torsionRule(centre('S_3+2', 'tetrahedral'), centre('S_3+2', 'tetrahedral'), 1)?.barrier).toBeCloseTo(6.8, 12);
  });
  it('sp2–sp2: V = 5 √(U U) (1 + 4.18 ln n): C=C 10·(1 + 4.18·0.693147) = 38.9739; aromatic 10·(1 + 4.18·0.405465) = 26.9484; n 2, φ0 180°', () => {
    expect(torsionRule(centre('C_2', 'trigonal'), centre('C_2', 'trigonal'), 2)?.barrier).toBeCloseTo(38.9739, 3);
    expect(torsionRule(centre('C_R', 'trigonal'), centre('C_R', 'trigonal'), 1.5)).toMatchObject({ n: 2, phi0: 180 });
    expect(torsionRule(centre('C_R', 'trigonal'), centre('C_R', 'trigonal'), 1.5)?.barrier).toBeCloseTo(26.9484, 3);
  });
  it('sp3–sp2: V 1, n 6, φ0 0°; next to another sp2 atom V 2, n 3, φ0 180°; sp3 atom in group 16: n 2, φ0 90°', () => {
    expect(torsionRule(centre('C_3', 'tetrahedral'), centre('C_2', 'trigonal'), 1)).toMatchObject({ barrier: 1, n: 6, phi0: 0 });
    expect(torsionRule(centre('C_2', 'trigonal', true), centre('C_3', 'tetrahedral'), 1)).toMatchObject({ barrier: 2, n: 3, phi0: 180 });
    expect(torsionRule(centre('C_R', 'trigonal', true), centre('O_3', 'tetrahedral'), 1)).toMatchObject({ barrier: 10, n: 2, phi0: 90 });
  });
  it('nothing about a bond to a linear atom, and nothing with a zero barrier', () => {
    expect(torsionRule(centre('C_1', 'linear'), centre('C_3', 'tetrahedral'), 1)).toBeNull();
    expect(torsionRule(centre('C_3', 'tetrahedral'), centre('C_R', 'trigonal'), 1)).not.toBeNull();
    const noBarrier = { ...centre('C_3', 'tetrahedral'), parameters: { ...T.C_3, torsionSp3: 0 } };
    expect(torsionRule(noBarrier, centre('C_3', 'tetrahedral'), 1)).toBeNull();
  });
});

describe('½ V [1 − cos(n φ0) cos(n φ)] as a periodic-dihedral k [1 + cos(n φ − phase)]', () => {
  // k = ½V; cos(nφ − phase) = cos nφ cos phase + sin nφ sin phase must equal −cos(nφ0) cos nφ for all φ:
  // sin phase = 0 and cos phase = −cos(nφ0). n 3, φ0 180: cos 540° = −1 → phase 0. n 2, φ0 180:
  // cos 360° = 1 → phase 180. n 6, φ0 0: cos 0 = 1 → phase 180. n 2, φ0 90: cos 180° = −1 → phase 0.
  const cases = [
    { n: 3, phi0: 180, phase: 0 },
    { n: 2, phi0: 180, phase: 180 },
    { n: 6, phi0: 0, phase: 180 },
    { n: 2, phi0: 90, phase: 0 },
    { n: 3, phi0: 60, phase: 0 }, // cos 180° = −1
  ];
  for (const { n, phi0, phase } of cases) {
    it(`n ${n}, φ0 ${phi0}°: phase ${phase}°, and the kernel reproduces the paper's form at 73 torsion angles`, () => {
      const V = 3.7;
      const p = periodicDihedralFor(V, n, phi0);
      expect(p).toEqual({ k: V / 2, n, phase });
      const table = tableFromRecords('periodic-dihedral', [{ atoms: [0, 1, 2, 3], ...p }]);
      for (let d = -180; d <= 180; d += 5) {
        const x = chain(1.5, 1.5, 1.5, rad(110), rad(110), rad(d));
        const paper = 0.5 * V * (1 - Math.cos(rad(n * phi0)) * Math.cos(rad(n * d)));
        expect(accumulatePeriodicDihedrals(x, table)).toBeCloseTo(paper, 12);
      }
    });
  }
});

describe('pyramidal inversion constant', () => {
  it('k = 2 sin²ω0 · barrier / (1 − cos ω0)²: a planar P_3+3 centre lies 22 kcal/mol above its minimum', () => {
    const k = pyramidalInversionConstant(84.4339, 22);
    const table = tableFromRecords('inversion', [{ atoms: [0, 1, 2, 3], k, omega0: 84.4339 }]);
    const planar = new Float64Array([0, 0, 0, 1.8, 0, 0, -0.9, 1.56, 0, -0.9, -1.56, 0]);
    expect(accumulateInversions(planar, table)).toBeCloseTo(22, 10);
  });
});
