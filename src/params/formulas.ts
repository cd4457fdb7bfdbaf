/**
 * The formulas of the generic force field of Rappé et al. (J. Am. Chem.
 * Soc. 114 (1992) 10024) that turn atomic parameters into bond, angle and
 * torsion parameters. The equations are as the paper gives them, from
 * memory (docs/generic-parameters.md lists them). Lengths Å, energies
 * kcal/mol, angles degrees.
 * @module
 */
import { BOND_ORDER_LAMBDA, FORCE_CONSTANT_SCALE, GROUP16_TORSION, type GenericAtomParameters } from './generic-atoms.js';

const RAD = Math.PI / 180;

/**
 * Natural bond length r_IJ = r_I + r_J + r_BO − r_EN (Å), with
 * r_BO = −λ (r_I + r_J) ln n and
 * r_EN = r_I r_J (√χ_I − √χ_J)² / (χ_I r_I + χ_J r_J).
 * @param order bond order n > 0 (1, 1.41 amide, 1.5 aromatic, 2, 3).
 */
export function naturalBondLength(a: GenericAtomParameters, b: GenericAtomParameters, order: number): number {
  const sum = a.radius + b.radius;
  const rBO = -BOND_ORDER_LAMBDA * sum * Math.log(order);
  const d = Math.sqrt(a.electronegativity) - Math.sqrt(b.electronegativity);
  const rEN = (a.radius * b.radius * d * d) / (a.electronegativity * a.radius + b.electronegativity * b.radius);
  return sum + rBO - rEN;
}

/**
 * Bond force constant k_IJ = 664.12 Z*_I Z*_J / r_IJ³ (kcal/mol/Å²), for
 * E = ½ k (r − r_IJ)² — the paper's convention and ours (`harmonic-bond`).
 */
export function bondForceConstant(a: GenericAtomParameters, b: GenericAtomParameters, length: number): number {
  return (FORCE_CONSTANT_SCALE * a.effectiveCharge * b.effectiveCharge) / (length * length * length);
}

/**
 * Angle force constant at vertex J of I–J–K (kcal/mol/rad²):
 * K = 664.12 / (r_IJ r_JK) · Z*_I Z*_K / r_IK⁵ · r_IJ r_JK [3 r_IJ r_JK (1 − cos²θ0) − r_IK² cos θ0],
 * r_IK² = r_IJ² + r_JK² − 2 r_IJ r_JK cos θ0 — the curvature of the angle
 * energy at θ0.
 * @param theta0 the vertex's natural angle, degrees.
 */
export function angleForceConstant(
  zI: number,
  zK: number,
  rIJ: number,
  rJK: number,
  theta0: number,
): number {
  const c = theta0 === 180 ? -1 : theta0 === 90 ? 0 : Math.cos(theta0 * RAD);
  const rIK2 = rIJ * rIJ + rJK * rJK - 2 * rIJ * rJK * c;
  const rIK5 = rIK2 * rIK2 * Math.sqrt(rIK2);
  return ((FORCE_CONSTANT_SCALE * zI * zK) / rIK5) * (3 * rIJ * rJK * (1 - c * c) - rIK2 * c);
}

/** A torsion barrier about one bond: E = ½ V [1 − cos(n φ0) cos(n φ)] for the whole bond. */
export interface TorsionRule {
  /** The barrier V for the bond (kcal/mol), before division by the number of torsions. */
  readonly barrier: number;
  /** Periodicity. */
  readonly n: number;
  /** φ0, degrees (a multiple of 90°/n here, so cos(n φ0) = ±1). */
  readonly phi0: number;
  /** Which of the paper's cases applies (for the model's metadata and the tests). */
  readonly rule: string;
}

/** What the torsion rule needs to know of a central atom. */
export interface TorsionCentre {
  readonly element: string;
  readonly geometry: 'terminal' | 'linear' | 'trigonal' | 'tetrahedral';
  readonly parameters: GenericAtomParameters;
  /** Whether this (trigonal) atom has a trigonal neighbour other than the other central atom. */
  readonly trigonalNeighbour: boolean;
}

const GROUP_16 = new Set(['O', 'S']);

/**
 * The torsion rule about the bond j–k (from memory of Rappé et al. 1992):
 * - either atom linear (or terminal): none (`null`);
 * - sp3–sp3: V = √(V_j V_k), n = 3, φ0 = 180°; both group 16 (O, S):
 *   V = √(V_j V_k) with V = 2 for O and 6.8 for S, n = 2, φ0 = 90°;
 * - sp2–sp2: V = 5 √(U_j U_k) (1 + 4.18 ln n_jk), n = 2, φ0 = 180°;
 * - sp3–sp2: V = 1, n = 6, φ0 = 0°; when the sp3 atom is in group 16:
 *   the sp2–sp2 V, n = 2, φ0 = 90°; else when the sp2 atom has another sp2
 *   neighbour (propene): V = 2, n = 3, φ0 = 180°.
 * Returns `null` also when V is 0.
 */
export function torsionRule(j: TorsionCentre, k: TorsionCentre, bondOrder: number): TorsionRule | null {
  const linear = (c: TorsionCentre) => c.geometry === 'linear' || c.geometry === 'terminal';
  if (linear(j) || linear(k)) return null;
  const sp2sp2 = () => 5 * Math.sqrt(j.parameters.torsionSp2 * k.parameters.torsionSp2) * (1 + 4.18 * Math.log(bondOrder));
  let rule: TorsionRule;
  if (j.geometry === 'tetrahedral' && k.geometry === 'tetrahedral') {
    if (GROUP_16.has(j.element) && GROUP_16.has(k.element)) {
      const v = Math.sqrt(GROUP16_TORSION[j.element] * GROUP16_TORSION[k.element]);
      rule = { barrier: v, n: 2, phi0: 90, rule: 'sp3-sp3 group 16' };
    } else {
      rule = { barrier: Math.sqrt(j.parameters.torsionSp3 * k.parameters.torsionSp3), n: 3, phi0: 180, rule: 'sp3-sp3' };
    }
  } else if (j.geometry === 'trigonal' && k.geometry === 'trigonal') {
    rule = { barrier: sp2sp2(), n: 2, phi0: 180, rule: 'sp2-sp2' };
  } else {
    const sp3 = j.geometry === 'tetrahedral' ? j : k;
    const sp2 = j.geometry === 'tetrahedral' ? k : j;
    if (GROUP_16.has(sp3.element)) rule = { barrier: sp2sp2(), n: 2, phi0: 90, rule: 'sp3-sp2 group 16' };
    else if (sp2.trigonalNeighbour) rule = { barrier: 2, n: 3, phi0: 180, rule: 'sp3-sp2 next to sp2' };
    else rule = { barrier: 1, n: 6, phi0: 0, rule: 'sp3-sp2' };
  }
  return rule.barrier > 0 ? rule : null;
}

/**
 * ½ V [1 − cos(n φ0) cos(n φ)] written as a `periodic-dihedral`
 * k [1 + cos(n φ − phase)]: k = ½ V and, since cos(n φ0) = ±1,
 * −cos(n φ0) cos(n φ) = cos(n φ − phase) with phase = 0° when cos(n φ0) = −1
 * and phase = 180° when cos(n φ0) = +1.
 * @param share the barrier's share (V divided by the number of torsions about the bond).
 * @returns k (kcal/mol), n and phase (degrees).
 */
export function periodicDihedralFor(share: number, n: number, phi0: number): { k: number; n: number; phase: number } {
  const steps = Math.round((n * phi0) / 180); // n φ0 = steps · 180°
  const cosNPhi0 = steps % 2 === 0 ? 1 : -1;
  return { k: share / 2, n, phase: cosNPhi0 === -1 ? 0 : 180 };
}

/**
 * The inversion constant k of our `inversion` kind for a pyramidal centre
 * with natural out-of-plane angle ω0 (degrees) whose planar form lies
 * `barrier` above the minimum: E(0) = k/(2 sin²ω0) (1 − cos ω0)² = barrier.
 */
export function pyramidalInversionConstant(omega0: number, barrier: number): number {
  const s = Math.sin(omega0 * RAD);
  const c = Math.cos(omega0 * RAD);
  return (2 * s * s * barrier) / ((1 - c) * (1 - c));
}
