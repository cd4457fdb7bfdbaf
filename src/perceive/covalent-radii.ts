/**
 * Single-bond covalent radii, used to decide which atoms are bonded and as
 * the single-bond reference length when bond orders are perceived.
 *
 * Source: B. Cordero, V. Gómez, A. E. Platero-Prats, M. Revés, J. Echeverría,
 * E. Cremades, F. Barragán and S. Alvarez, "Covalent radii revisited",
 * Dalton Trans. 2008, 2832–2838 — FROM MEMORY of Cordero et al. 2008 (the
 * paper could not be read while this table was written; values are recalled
 * to two decimals and should be checked against its Table 2 before a last
 * digit is relied on). One value per element: carbon is the sp3 value
 * 0.76 Å (the paper also gives sp2 0.73 and sp 0.69); Mn, Fe and Co are the
 * low-spin values (the paper gives high-spin ones as well). Elements whose
 * value is not recalled with confidence (He, Ne, noble-gas-like and the
 * heavy actinides) are left out and refused with a clear error.
 * @module
 */

/** Covalent radius in Å by element symbol (case-sensitive). */
const RADII: ReadonlyMap<string, number> = new Map<string, number>([
  ['H', 0.31],
  ['Li', 1.28], ['Be', 0.96], ['B', 0.84], ['C', 0.76], ['N', 0.71], ['O', 0.66], ['F', 0.57],
  ['Na', 1.66], ['Mg', 1.41], ['Al', 1.21], ['Si', 1.11], ['P', 1.07], ['S', 1.05], ['Cl', 1.02], ['Ar', 1.06],
  ['K', 2.03], ['Ca', 1.76], ['Sc', 1.7], ['Ti', 1.6], ['V', 1.53], ['Cr', 1.39], ['Mn', 1.39],
  ['Fe', 1.32], ['Co', 1.26], ['Ni', 1.24], ['Cu', 1.32], ['Zn', 1.22], ['Ga', 1.22], ['Ge', 1.2],
  ['As', 1.19], ['Se', 1.2], ['Br', 1.2], ['Kr', 1.16],
  ['Rb', 2.2], ['Sr', 1.95], ['Y', 1.9], ['Zr', 1.75], ['Nb', 1.64], ['Mo', 1.54], ['Tc', 1.47],
  ['Ru', 1.46], ['Rh', 1.42], ['Pd', 1.39], ['Ag', 1.45], ['Cd', 1.44], ['In', 1.42], ['Sn', 1.39],
  ['Sb', 1.39], ['Te', 1.38], ['I', 1.39], ['Xe', 1.4],
  ['Cs', 2.44], ['Ba', 2.15], ['La', 2.07],
  ['Hf', 1.75], ['Ta', 1.7], ['W', 1.62], ['Re', 1.51], ['Os', 1.44], ['Ir', 1.41], ['Pt', 1.36],
  ['Au', 1.36], ['Hg', 1.32], ['Tl', 1.45], ['Pb', 1.46], ['Bi', 1.48],
]);

/**
 * The single-bond covalent radius of `symbol` in Å (Cordero et al. 2008,
 * from memory; see the module comment), or `undefined` when the table has
 * none. Case-sensitive (`Cl`, not `CL`). Never throws.
 */
export function covalentRadius(symbol: string): number | undefined {
  return RADII.get(symbol);
}

/** The element symbols that have a covalent radius here, in table order. */
export const COVALENT_RADIUS_ELEMENTS: readonly string[] = [...RADII.keys()];
