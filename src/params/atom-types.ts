/**
 * Generic atom typing: each atom of a perceived {@link Topology} gets the
 * label of its row in {@link GENERIC_ATOM_TYPES} (the notation of Rappé et
 * al., J. Am. Chem. Soc. 114 (1992) 10024: `C_3`, `C_R`, `N_2`, `S_3+2`, …)
 * from its element, hybridization, aromaticity and neighbour count.
 * @module
 */
import { ModelError } from '../errors.js';
import type { Topology } from '../perceive/types.js';
import { GENERIC_ELEMENTS } from './generic-atoms.js';

/** The shape of a type as a vertex: how its angle and torsion terms are chosen. */
export type TypeGeometry = 'terminal' | 'linear' | 'trigonal' | 'tetrahedral';

/**
 * The geometry class of a generic type label: `1` linear (sp), `2` and `R`
 * trigonal (sp2, resonant), `3` tetrahedral (sp3, including `S_3+2`,
 * `P_3+3`, `Si3`); H and the halogens are terminal.
 */
export function typeGeometry(label: string): TypeGeometry {
  const code = label.length >= 3 ? label[2] : label[1];
  if (code === '1') return 'linear';
  if (code === '2' || code === 'R') return 'trigonal';
  if (code === '3') return 'tetrahedral';
  return 'terminal';
}

/** Number of neighbours of atom `a`. */
export function neighbourCount(topology: Topology, a: number): number {
  return topology.neighbourStart[a + 1] - topology.neighbourStart[a];
}

/**
 * Whether atom `n` (a nitrogen) is an amide nitrogen: bonded to a carbon
 * that has a double bond to an oxygen. Its C–N bond then has the paper's
 * amide bond order 1.41 and the nitrogen the resonant type N_R.
 */
export function isAmideNitrogen(topology: Topology, n: number): boolean {
  if (topology.elements[n] !== 'N' || topology.aromaticAtoms[n] === 1) return false;
  for (let p = topology.neighbourStart[n]; p < topology.neighbourStart[n + 1]; p++) {
    if (isCarbonylCarbon(topology, topology.neighbours[p])) return true;
  }
  return false;
}

/** Whether atom `c` is a carbon with a (non-aromatic) double bond to an oxygen. */
export function isCarbonylCarbon(topology: Topology, c: number): boolean {
  if (topology.elements[c] !== 'C') return false;
  for (let p = topology.neighbourStart[c]; p < topology.neighbourStart[c + 1]; p++) {
    const o = topology.neighbours[p];
    if (topology.elements[o] === 'O' && bondOrderBetween(topology, c, o) === 2) return true;
  }
  return false;
}

/** The bond order of the bond i–j as the topology gives it (0 if they are not bonded). */
export function bondOrderBetween(topology: Topology, i: number, j: number): number {
  const b = bondIndex(topology, i, j);
  return b < 0 ? 0 : topology.bondOrders[b];
}

/** Index of the bond i–j in `topology.bonds`, or −1 (binary search: bonds are sorted, smaller index first). */
export function bondIndex(topology: Topology, i: number, j: number): number {
  const a = Math.min(i, j);
  const c = Math.max(i, j);
  let lo = 0;
  let hi = topology.bondOrders.length - 1;
  const bonds = topology.bonds;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const d = bonds[2 * mid] - a || bonds[2 * mid + 1] - c;
    if (d === 0) return mid;
    if (d < 0) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}

/** The highest bond order at atom `a`. */
function highestBondOrder(topology: Topology, a: number): number {
  let best = 0;
  for (let p = topology.neighbourStart[a]; p < topology.neighbourStart[a + 1]; p++) {
    best = Math.max(best, bondOrderBetween(topology, a, topology.neighbours[p]));
  }
  return best;
}

/**
 * The generic type label of every atom of `topology`.
 *
 * Rules: H `H_`; F `F_`, Cl `Cl`, Br `Br`, I `I_` (at most one neighbour
 * each); C and N by hybridization (sp3 `_3`, sp2 `_2`, aromatic (or flagged
 * aromatic) `_R`, sp
 * `_1`), an amide nitrogen (see {@link isAmideNitrogen}) `N_R`; O likewise
 * (`O_3`, `O_2`, `O_R`, `O_1`); S aromatic `S_R`, one neighbour with a
 * double bond `S_2`, else by neighbour count `S_3+2` (≤ 2), `S_3+4` (3),
 * `S_3+6` (4); P `P_3+3` (≤ 3 neighbours) or `P_3+5` (4); Si `Si3`; B `B_3`
 * with 4 neighbours or sp3, else `B_2`. Formal charges are not used.
 *
 * @returns one label per atom, keys of {@link GENERIC_ATOM_TYPES}.
 * @throws {ModelError} with place `atoms[i]` for the first atom without
 *   parameters: an element outside the table
 *   (`atoms[7]: no generic parameters for element Se (the table covers H, B, C, …)`),
 *   too many neighbours for its type (`atoms[3]: no generic parameters for C_3 with 5 neighbours (at most 4)`),
 *   or a hybridization that does not fit (`atoms[2]: no generic parameters for N with hybridization none`).
 */
export function genericAtomTypes(topology: Topology): string[] {
  const types: string[] = [];
  for (let a = 0; a < topology.atomCount; a++) types.push(typeOf(topology, a));
  return types;
}

/** Largest neighbour count of each type. */
const MAX_NEIGHBOURS: Readonly<Record<string, number>> = {
  H_: 1, F_: 1, Cl: 1, Br: 1, I_: 1,
  C_3: 4, C_2: 3, C_R: 3, C_1: 2,
  N_3: 4, N_2: 3, N_R: 3, N_1: 2,
  O_3: 2, O_2: 2, O_R: 2, O_1: 1,
  B_3: 4, B_2: 3, Si3: 4, 'P_3+3': 3, 'P_3+5': 4,
  'S_3+2': 2, 'S_3+4': 3, 'S_3+6': 4, S_R: 2, S_2: 1,
};

function typeOf(topology: Topology, a: number): string {
  const element = topology.elements[a];
  const hybridization = topology.hybridization[a];
  const degree = neighbourCount(topology, a);
  const place = `atoms[${a}]`;
  let label: string;
  switch (element) {
    case 'H':
      label = 'H_';
      break;
    case 'F':
    case 'I':
      label = `${element}_`;
      break;
    case 'Cl':
    case 'Br':
      label = element;
      break;
    case 'C':
    case 'N':
    case 'O': {
      if (element === 'N' && isAmideNitrogen(topology, a)) {
        label = 'N_R';
        break;
      }
      const code = topology.aromaticAtoms[a] === 1 ? 'R' : { sp3: '3', sp2: '2', aromatic: 'R', sp: '1', none: '' }[hybridization];
      if (code === '') throw new ModelError(place, `no generic parameters for ${element} with hybridization none`);
      label = `${element}_${code}`;
      break;
    }
    case 'S':
      if (topology.aromaticAtoms[a] === 1 || hybridization === 'aromatic') label = 'S_R';
      else if (degree === 1 && highestBondOrder(topology, a) >= 2) label = 'S_2';
      else label = degree <= 2 ? 'S_3+2' : degree === 3 ? 'S_3+4' : 'S_3+6';
      break;
    case 'P':
      if (topology.aromaticAtoms[a] === 1) throw new ModelError(place, 'no generic parameters for an aromatic P');
      label = degree <= 3 ? 'P_3+3' : 'P_3+5';
      break;
    case 'Si':
      if (topology.aromaticAtoms[a] === 1) throw new ModelError(place, 'no generic parameters for an aromatic Si');
      label = 'Si3';
      break;
    case 'B':
      label = degree === 4 || hybridization === 'sp3' ? 'B_3' : 'B_2';
      break;
    default:
      throw new ModelError(place, `no generic parameters for element ${element} (the table covers ${GENERIC_ELEMENTS.join(', ')})`);
  }
  const max = MAX_NEIGHBOURS[label];
  if (degree > max) {
    throw new ModelError(place, `no generic parameters for ${label} with ${degree} neighbours (at most ${max})`);
  }
  return label;
}
