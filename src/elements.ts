/**
 * The chemical elements: their symbols and standard atomic weights.
 *
 * Source of the weights: IUPAC abridged standard atomic weights, CIAAW 2021
 * table, from memory (recalled, not fetched). H, C, N, O, S and Cl agree with
 * the values the model-file spec lists; the rest should be checked against
 * the published table before their last digit is relied on (Zr in
 * particular: 91.224 here; a later CIAAW revision may give 91.222).
 * Where the full table gives an interval (H, Li, B, C,
 * N, O, Mg, Si, S, Cl, Ar, Br, Tl, Pb) the conventional value is used.
 * Elements without a standard atomic weight (no stable isotope with a
 * characteristic terrestrial composition: Tc, Pm, Po through Ac, and Np
 * onwards) have none here; Th, Pa and U do have one.
 * @module
 */

/** One chemical element. */
export interface ElementEntry {
  /** Atomic number Z (1 for H … 118 for Og). */
  readonly atomicNumber: number;
  /** The symbol as written in the periodic table, case-sensitive (`Cl`, not `CL`). */
  readonly symbol: ElementSymbol;
  /** IUPAC abridged standard atomic weight in dalton, or `null` when the element has none. */
  readonly standardAtomicWeight: number | null;
}

/** The 118 element symbols, in order of atomic number (index = Z − 1). */
export const ELEMENT_SYMBOLS = [
  'H', 'He',
  'Li', 'Be', 'B', 'C', 'N', 'O', 'F', 'Ne',
  'Na', 'Mg', 'Al', 'Si', 'P', 'S', 'Cl', 'Ar',
  'K', 'Ca', 'Sc', 'Ti', 'V', 'Cr', 'Mn', 'Fe', 'Co', 'Ni', 'Cu', 'Zn', 'Ga', 'Ge', 'As', 'Se', 'Br', 'Kr',
  'Rb', 'Sr', 'Y', 'Zr', 'Nb', 'Mo', 'Tc', 'Ru', 'Rh', 'Pd', 'Ag', 'Cd', 'In', 'Sn', 'Sb', 'Te', 'I', 'Xe',
  'Cs', 'Ba', 'La', 'Ce', 'Pr', 'Nd', 'Pm', 'Sm', 'Eu', 'Gd', 'Tb', 'Dy', 'Ho', 'Er', 'Tm', 'Yb', 'Lu',
  'Hf', 'Ta', 'W', 'Re', 'Os', 'Ir', 'Pt', 'Au', 'Hg', 'Tl', 'Pb', 'Bi', 'Po', 'At', 'Rn',
  'Fr', 'Ra', 'Ac', 'Th', 'Pa', 'U', 'Np', 'Pu', 'Am', 'Cm', 'Bk', 'Cf', 'Es', 'Fm', 'Md', 'No', 'Lr',
  'Rf', 'Db', 'Sg', 'Bh', 'Hs', 'Mt', 'Ds', 'Rg', 'Cn', 'Nh', 'Fl', 'Mc', 'Lv', 'Ts', 'Og',
] as const;

/** A chemical element symbol, case-sensitive. */
export type ElementSymbol = (typeof ELEMENT_SYMBOLS)[number];

/**
 * Abridged standard atomic weights (dalton), indexed by Z − 1; `null` where
 * the element has none. Same source as the module comment.
 */
const WEIGHTS: readonly (number | null)[] = [
  1.008, 4.0026,
  6.94, 9.0122, 10.81, 12.011, 14.007, 15.999, 18.998, 20.18,
  22.99, 24.305, 26.982, 28.085, 30.974, 32.06, 35.45, 39.95,
  // K … Kr
  39.098, 40.078, 44.956, 47.867, 50.942, 51.996, 54.938, 55.845, 58.933, 58.693,
  63.546, 65.38, 69.723, 72.63, 74.922, 78.971, 79.904, 83.798,
  // Rb … Xe (Tc has none)
  85.468, 87.62, 88.906, 91.224, 92.906, 95.95, null, 101.07, 102.91, 106.42,
  107.87, 112.41, 114.82, 118.71, 121.76, 127.6, 126.9, 131.29,
  // Cs … Lu (Pm has none)
  132.91, 137.33, 138.91, 140.12, 140.91, 144.24, null, 150.36, 151.96, 157.25,
  158.93, 162.5, 164.93, 167.26, 168.93, 173.05, 174.97,
  // Hf … Rn (Po, At, Rn have none)
  178.49, 180.95, 183.84, 186.21, 190.23, 192.22, 195.08, 196.97, 200.59, 204.38,
  207.2, 208.98, null, null, null,
  // Fr … Lr (Fr, Ra, Ac have none; Th, Pa, U do; Np onwards have none)
  null, null, null, 232.04, 231.04, 238.03, null, null, null, null,
  null, null, null, null, null, null, null,
  // Rf … Og
  null, null, null, null, null, null, null, null, null, null,
  null, null, null, null, null,
];

/** Every element, in order of atomic number (index = Z − 1). */
export const ELEMENTS: readonly ElementEntry[] = ELEMENT_SYMBOLS.map((symbol, i) => ({
  atomicNumber: i + 1,
  symbol,
  standardAtomicWeight: WEIGHTS[i],
}));

const BY_SYMBOL: ReadonlyMap<string, ElementEntry> = new Map(ELEMENTS.map((e) => [e.symbol, e]));

/**
 * Whether `symbol` is a chemical element symbol exactly as written in the
 * periodic table (case-sensitive: `Cl` is, `CL` and `cl` are not). Never throws.
 */
export function isElement(symbol: unknown): symbol is ElementSymbol {
  return typeof symbol === 'string' && BY_SYMBOL.has(symbol);
}

/**
 * The element with this symbol (case-sensitive), or `undefined` when there is
 * no such element. Never throws.
 */
export function findElement(symbol: string): ElementEntry | undefined {
  return BY_SYMBOL.get(symbol);
}

/**
 * The IUPAC abridged standard atomic weight of `symbol` in dalton, or
 * `undefined` when `symbol` is not an element or the element has no standard
 * atomic weight (e.g. Tc). Never throws.
 */
export function standardAtomicWeight(symbol: string): number | undefined {
  return BY_SYMBOL.get(symbol)?.standardAtomicWeight ?? undefined;
}
