/**
 * The atomic parameters of the generic force field of Rappé, Casewit,
 * Colwell, Goddard and Skiff (J. Am. Chem. Soc. 114 (1992) 10024–10035), for
 * the types of H, B, C, N, O, F, Si, P, S, Cl, Br and I, keyed by the
 * paper's type labels (its published notation: element, then `_` or a
 * hybridization digit, `R` for resonant, `+n` for an oxidation state).
 *
 * EVERY VALUE BELOW IS FROM MEMORY of Rappé et al. 1992, Table 1; the paper
 * was not at hand when this table was written. They should be checked
 * against the paper before any quantitative use. Values marked "less sure"
 * are the ones recalled with the least confidence.
 * @module
 */

/** One atom type's parameters. */
export interface GenericAtomParameters {
  /** Chemical symbol. */
  readonly element: string;
  /** Bond radius r_I, Å (the single-bond valence radius). */
  readonly radius: number;
  /** Natural angle θ0 at this atom as a vertex, degrees. */
  readonly theta0: number;
  /** Nonbonded distance x_I (the Lennard-Jones minimum distance), Å. */
  readonly vdwDistance: number;
  /** Nonbonded well depth D_I, kcal/mol. */
  readonly vdwEnergy: number;
  /** Nonbonded scale ζ (of the paper's exponential-6 form; not used by the Lennard-Jones form). */
  readonly zeta: number;
  /** Effective charge Z*_I, elementary charges (for bond and angle force constants). */
  readonly effectiveCharge: number;
  /** GMP electronegativity χ_I, eV (for the electronegativity correction of bond lengths). */
  readonly electronegativity: number;
  /** sp3 torsional barrier V_I, kcal/mol. */
  readonly torsionSp3: number;
  /** sp2 torsional barrier constant U_I, kcal/mol. */
  readonly torsionSp2: number;
}

/** A row: r, θ0, x, D, ζ, Z*, χ, V, U. */
type Row = readonly [string, number, number, number, number, number, number, number, number, number];

// From memory of Rappé et al. 1992, Table 1 (all rows). Columns:
//           element  r_I    θ0      x_I    D_I    ζ       Z*_I   χ_I     V_I    U_I
const ROWS: Readonly<Record<string, Row>> = {
  H_: ['H', 0.354, 180, 2.886, 0.044, 12.0, 0.712, 4.528, 0, 0],
  B_3: ['B', 0.838, 109.47, 4.083, 0.18, 12.052, 1.755, 5.11, 0, 0], // less sure
  B_2: ['B', 0.828, 120, 4.083, 0.18, 12.052, 1.755, 5.11, 0, 0], // less sure
  C_3: ['C', 0.757, 109.47, 3.851, 0.105, 12.73, 1.912, 5.343, 2.119, 2],
  C_R: ['C', 0.729, 120, 3.851, 0.105, 12.73, 1.912, 5.343, 0, 2],
  C_2: ['C', 0.732, 120, 3.851, 0.105, 12.73, 1.912, 5.343, 0, 2],
  C_1: ['C', 0.706, 180, 3.851, 0.105, 12.73, 1.912, 5.343, 0, 2],
  N_3: ['N', 0.7, 106.7, 3.66, 0.069, 13.407, 2.544, 6.899, 0.45, 2],
  N_R: ['N', 0.699, 120, 3.66, 0.069, 13.407, 2.544, 6.899, 0, 2],
  N_2: ['N', 0.685, 111.2, 3.66, 0.069, 13.407, 2.544, 6.899, 0, 2],
  N_1: ['N', 0.656, 180, 3.66, 0.069, 13.407, 2.544, 6.899, 0, 2],
  O_3: ['O', 0.658, 104.51, 3.5, 0.06, 14.085, 2.3, 8.741, 0.018, 2],
  O_R: ['O', 0.68, 110, 3.5, 0.06, 14.085, 2.3, 8.741, 0, 2],
  O_2: ['O', 0.634, 120, 3.5, 0.06, 14.085, 2.3, 8.741, 0, 2],
  O_1: ['O', 0.639, 180, 3.5, 0.06, 14.085, 2.3, 8.741, 0, 2], // less sure
  F_: ['F', 0.668, 180, 3.364, 0.05, 14.762, 1.735, 10.874, 0, 2],
  Si3: ['Si', 1.117, 109.47, 4.295, 0.402, 12.175, 2.323, 4.168, 1.225, 1.25],
  'P_3+3': ['P', 1.101, 93.8, 4.147, 0.305, 13.072, 2.863, 5.463, 2.4, 1.25],
  'P_3+5': ['P', 1.056, 109.47, 4.147, 0.305, 13.072, 2.863, 5.463, 2.4, 1.25], // less sure
  'S_3+2': ['S', 1.064, 92.1, 4.035, 0.274, 13.969, 2.703, 6.928, 0.484, 1.25],
  'S_3+4': ['S', 1.049, 103.2, 4.035, 0.274, 13.969, 2.703, 6.928, 0.484, 1.25], // less sure
  'S_3+6': ['S', 1.027, 109.47, 4.035, 0.274, 13.969, 2.703, 6.928, 0.484, 1.25], // less sure
  S_R: ['S', 1.077, 92.2, 4.035, 0.274, 13.969, 2.703, 6.928, 0, 1.25],
  S_2: ['S', 0.854, 120, 4.035, 0.274, 13.969, 2.703, 6.928, 0, 1.25],
  Cl: ['Cl', 1.044, 180, 3.947, 0.227, 14.866, 2.348, 8.564, 0, 1.25],
  Br: ['Br', 1.192, 180, 4.189, 0.251, 15.0, 2.519, 7.79, 0, 0.7],
  I_: ['I', 1.382, 180, 4.5, 0.339, 15.0, 2.65, 6.822, 0, 0.2],
};

/**
 * The parameters of every generic atom type, by the paper's label
 * (`C_3`, `C_R`, `N_2`, `S_3+2`, `Cl`, …). From memory of Rappé et al.
 * 1992, Table 1: check against the paper before quantitative use.
 */
export const GENERIC_ATOM_TYPES: Readonly<Record<string, GenericAtomParameters>> = Object.fromEntries(
  Object.entries(ROWS).map(([label, [element, radius, theta0, vdwDistance, vdwEnergy, zeta, effectiveCharge, electronegativity, torsionSp3, torsionSp2]]) => [
    label,
    Object.freeze({ element, radius, theta0, vdwDistance, vdwEnergy, zeta, effectiveCharge, electronegativity, torsionSp3, torsionSp2 }),
  ]),
);

/** The elements the table covers. */
export const GENERIC_ELEMENTS: readonly string[] = ['H', 'B', 'C', 'N', 'O', 'F', 'Si', 'P', 'S', 'Cl', 'Br', 'I'];

/** λ of the bond-order correction r_BO = −λ (r_I + r_J) ln n (from memory of Rappé et al. 1992). */
export const BOND_ORDER_LAMBDA = 0.1332;

/**
 * 664.12 kcal/mol·Å per (elementary charge)², the constant of the bond and
 * angle force constants (2 × 332.06, from memory of Rappé et al. 1992).
 */
export const FORCE_CONSTANT_SCALE = 664.12;

/** Bond order of an amide C–N bond (from memory of Rappé et al. 1992). */
export const AMIDE_BOND_ORDER = 1.41;

/**
 * Inversion constants (from memory of Rappé et al. 1992): a planar C_2 or
 * C_R centre 6 kcal/mol, or 50 when it is bonded to an O_2 (a carbonyl
 * carbon); N_2, N_R 6; the pyramidal group-15 centre P: ω0 = 84.4339° with a
 * barrier to planarity of 22 kcal/mol.
 */
export const INVERSION = {
  planar: 6,
  carbonylCarbon: 50,
  phosphorusOmega0: 84.4339,
  group15Barrier: 22,
} as const;

/**
 * sp3 torsional barriers of the group-16 atoms in a bond between two of
 * them (O–O, O–S, S–S: n = 2, φ0 = 90°), kcal/mol: O 2, S 6.8 (from memory
 * of Rappé et al. 1992).
 */
export const GROUP16_TORSION: Readonly<Record<string, number>> = { O: 2, S: 6.8 };
