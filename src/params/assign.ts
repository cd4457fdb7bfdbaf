/**
 * Generic parameters for a whole molecule: a perceived {@link Topology} and
 * its coordinates in, a complete model file out, with every bond, angle,
 * torsion and out-of-plane term and the nonbonded block assigned from the
 * generic force field of Rappé et al. (J. Am. Chem. Soc. 114 (1992) 10024).
 * @module
 */
import type { ElementSymbol } from '../elements.js';
import { ModelError } from '../errors.js';
import type { AtomRecord, ModelFile, TermRecord } from '../model/schema.js';
import type { Topology } from '../perceive/types.js';
import {
  bondIndex,
  genericAtomTypes,
  isAmideNitrogen,
  isCarbonylCarbon,
  neighbourCount,
  typeGeometry,
} from './atom-types.js';
import { AMIDE_BOND_ORDER, GENERIC_ATOM_TYPES, INVERSION, type GenericAtomParameters } from './generic-atoms.js';
import {
  angleForceConstant,
  bondForceConstant,
  naturalBondLength,
  periodicDihedralFor,
  pyramidalInversionConstant,
  torsionRule,
  type TorsionCentre,
} from './formulas.js';

/** Options of {@link assignGenericParameters}. */
export interface GenericParameterOptions {
  /** The model's title (default `generic parameters`). */
  readonly title?: string;
  /** Atom names, one per atom (default none). */
  readonly names?: readonly string[];
}

/** What `metadata` of a generated model holds. */
export const GENERATOR = 'strainwise generic parameters';
/** The caution written into every generated model. */
export const GENERIC_CAUTION = 'generic parameters: for clean-up and rough geometry, not quantitative energies';

/**
 * Assign generic parameters to a molecule.
 *
 * Bonds: `harmonic-bond` with r0 the natural bond length and k = 664.12 Z_I Z_J / r0³
 * (bond order 1.5 for aromatic bonds, 1.41 for an amide C–N, else the
 * topology's). Angles: at a vertex with θ0 = 180° a `periodic-angle` n 1, at a
 * trigonal vertex with θ0 = 120° a `periodic-angle` n 3, else a
 * `cosine-series-angle` with the vertex's θ0; k from the paper's angle
 * force constant. Torsions: `periodic-dihedral` by the rules of
 * `torsionRule`, the barrier divided by the number of torsions about the
 * bond. Out-of-plane: one `inversion` per trigonal C, N centre with three
 * neighbours (k 6, or 50 for a carbon bonded to an O_2) and per P_3+3
 * centre (ω0 84.4339°, 22 kcal/mol to planarity). Nonbonded: Lennard-Jones
 * with rmin = x_I, ε = D_I, geometric combination, 1-2 and 1-3 pairs
 * excluded, 1-4 pairs unscaled, no cutoff; no Coulomb term (every charge 0).
 *
 * @param topology the perceived molecule (src/perceive/types.ts).
 * @param coordinates flat `[x0, y0, z0, x1, …]`, Å, length 3N.
 * @returns a model file in Å and kcal/mol that `parseModel` accepts.
 * @throws {ModelError} `coordinates: expected 3N = 9 numbers (3 atoms), got 6`
 *   for a wrong length or a non-finite number, and with place `atoms[i]` for
 *   an atom without parameters (see `genericAtomTypes`).
 */
export function assignGenericParameters(
  topology: Topology,
  coordinates: Float64Array,
  options: GenericParameterOptions = {},
): ModelFile {
  const n = topology.atomCount;
  if (coordinates.length !== 3 * n) {
    throw new ModelError('coordinates', `expected 3N = ${3 * n} numbers (${n} atom${n === 1 ? '' : 's'}), got ${coordinates.length}`);
  }
  for (let c = 0; c < coordinates.length; c++) {
    if (!Number.isFinite(coordinates[c])) {
      throw new ModelError(`coordinates[${Math.floor(c / 3)}]`, `expected finite numbers, got ${coordinates[c]}`);
    }
  }
  if (options.names !== undefined && options.names.length !== n) {
    throw new ModelError('names', `expected ${n} names (one per atom), got ${options.names.length}`);
  }
  const types = genericAtomTypes(topology);
  const params = types.map((t) => GENERIC_ATOM_TYPES[t]);
  const orders = effectiveBondOrders(topology);
  const bondCount = orders.length;
  const lengths = new Float64Array(bondCount);
  const terms: TermRecord[] = [];

  for (let b = 0; b < bondCount; b++) {
    const i = topology.bonds[2 * b];
    const j = topology.bonds[2 * b + 1];
    const r0 = naturalBondLength(params[i], params[j], orders[b]);
    lengths[b] = r0;
    terms.push({ kind: 'harmonic-bond', atoms: [i, j], k: round(bondForceConstant(params[i], params[j], r0)), r0: round(r0) });
  }

  const lengthOf = (i: number, j: number) => lengths[bondIndex(topology, i, j)];
  for (let a = 0; a < topology.angles.length / 3; a++) {
    const i = topology.angles[3 * a];
    const j = topology.angles[3 * a + 1];
    const k = topology.angles[3 * a + 2];
    terms.push(angleTerm(i, j, k, types[j], params, lengthOf(i, j), lengthOf(j, k)));
  }

  terms.push(...torsionTerms(topology, types, params, orders));
  terms.push(...inversionTerms(topology, types));

  const atoms: AtomRecord[] = topology.elements.map((element, a) => ({
    element: element as ElementSymbol,
    ...(options.names === undefined ? {} : { name: options.names[a] }),
    type: types[a],
    charge: 0,
  }));
  const xyz: [number, number, number][] = [];
  for (let a = 0; a < n; a++) xyz.push([coordinates[3 * a], coordinates[3 * a + 1], coordinates[3 * a + 2]]);
  const bonds: [number, number][] = [];
  for (let b = 0; b < bondCount; b++) bonds.push([topology.bonds[2 * b], topology.bonds[2 * b + 1]]);

  return {
    format: 'strainwise-model',
    version: 1,
    title: options.title ?? 'generic parameters',
    units: { length: 'angstrom', energy: 'kcal/mol' },
    atoms,
    coordinates: xyz,
    bonds,
    terms,
    nonbonded: {
      lennardJones: {
        rmin: params.map((p) => p.vdwDistance),
        epsilon: params.map((p) => p.vdwEnergy),
        combination: 'geometric',
      },
      exclusions: { bondSeparation: 2, scale14: { lennardJones: 1, coulomb: 1 } },
      cutoff: null,
    },
    metadata: {
      generator: GENERATOR,
      caution: GENERIC_CAUTION,
      source:
        'Rappé, Casewit, Colwell, Goddard, Skiff, J. Am. Chem. Soc. 114 (1992) 10024; atomic parameters from memory of its Table 1, to be checked against the paper',
      charges: 'none: every charge is 0 and there is no Coulomb term',
      bondOrders: Array.from(orders, (o) => o),
    },
  };
}

/** Bond orders as the formulas use them: 1.5 for aromatic bonds, 1.41 for an amide C–N, else the topology's. */
export function effectiveBondOrders(topology: Topology): Float64Array {
  const orders = Float64Array.from(topology.bondOrders);
  for (let b = 0; b < orders.length; b++) {
    const i = topology.bonds[2 * b];
    const j = topology.bonds[2 * b + 1];
    if (topology.aromaticBonds[b] === 1) orders[b] = 1.5;
    else if (orders[b] === 1 && isAmideBond(topology, i, j)) orders[b] = AMIDE_BOND_ORDER;
  }
  return orders;
}

function isAmideBond(topology: Topology, i: number, j: number): boolean {
  const [c, nn] = topology.elements[i] === 'C' ? [i, j] : [j, i];
  return topology.elements[nn] === 'N' && isCarbonylCarbon(topology, c) && isAmideNitrogen(topology, nn);
}

function angleTerm(
  i: number,
  j: number,
  k: number,
  vertexType: string,
  params: readonly GenericAtomParameters[],
  rIJ: number,
  rJK: number,
): TermRecord {
  const theta0 = params[j].theta0;
  const kf = round(angleForceConstant(params[i].effectiveCharge, params[k].effectiveCharge, rIJ, rJK, theta0));
  if (theta0 === 180) return { kind: 'periodic-angle', atoms: [i, j, k], k: kf, n: 1, theta0: 180 };
  if (theta0 === 120 && typeGeometry(vertexType) === 'trigonal') {
    return { kind: 'periodic-angle', atoms: [i, j, k], k: kf, n: 3, theta0: 120 };
  }
  return { kind: 'cosine-series-angle', atoms: [i, j, k], k: kf, theta0 };
}

function torsionTerms(
  topology: Topology,
  types: readonly string[],
  params: readonly GenericAtomParameters[],
  orders: Float64Array,
): TermRecord[] {
  const count = topology.torsions.length / 4;
  // torsions per central bond
  const perBond = new Int32Array(orders.length);
  const central = new Int32Array(count);
  for (let t = 0; t < count; t++) {
    const b = bondIndex(topology, topology.torsions[4 * t + 1], topology.torsions[4 * t + 2]);
    central[t] = b;
    perBond[b]++;
  }
  const centre = (a: number, other: number): TorsionCentre => ({
    element: topology.elements[a],
    geometry: typeGeometry(types[a]),
    parameters: params[a],
    trigonalNeighbour: hasTrigonalNeighbour(topology, types, a, other),
  });
  const terms: TermRecord[] = [];
  for (let t = 0; t < count; t++) {
    const [i, j, k, l] = [0, 1, 2, 3].map((m) => topology.torsions[4 * t + m]);
    const b = central[t];
    const rule = torsionRule(centre(j, k), centre(k, j), orders[b]);
    if (rule === null) continue;
    const { k: kf, n, phase } = periodicDihedralFor(rule.barrier / perBond[b], rule.n, rule.phi0);
    terms.push({ kind: 'periodic-dihedral', atoms: [i, j, k, l], k: round(kf), n, phase });
  }
  return terms;
}

function hasTrigonalNeighbour(topology: Topology, types: readonly string[], a: number, except: number): boolean {
  for (let p = topology.neighbourStart[a]; p < topology.neighbourStart[a + 1]; p++) {
    const b = topology.neighbours[p];
    if (b !== except && typeGeometry(types[b]) === 'trigonal') return true;
  }
  return false;
}

function inversionTerms(topology: Topology, types: readonly string[]): TermRecord[] {
  const terms: TermRecord[] = [];
  for (let c = 0; c < topology.impropers.length / 4; c++) {
    const [centre, a, b, d] = [0, 1, 2, 3].map((m) => topology.impropers[4 * c + m]);
    if (neighbourCount(topology, centre) !== 3) continue;
    const type = types[centre];
    const atoms: [number, number, number, number] = [centre, a, b, d];
    if (type === 'C_2' || type === 'C_R') {
      const carbonyl = [a, b, d].some((x) => types[x] === 'O_2');
      terms.push({ kind: 'inversion', atoms, k: carbonyl ? INVERSION.carbonylCarbon : INVERSION.planar, omega0: 0 });
    } else if (type === 'N_2' || type === 'N_R') {
      terms.push({ kind: 'inversion', atoms, k: INVERSION.planar, omega0: 0 });
    } else if (type === 'P_3+3') {
      const omega0 = INVERSION.phosphorusOmega0;
      terms.push({ kind: 'inversion', atoms, k: round(pyramidalInversionConstant(omega0, INVERSION.group15Barrier)), omega0 });
    }
  }
  return terms;
}

/** Parameters written to 8 significant digits: readable files, far below the accuracy of the parameters. */
function round(value: number): number {
  return Number(value.toPrecision(8));
}
