/**
 * From a structure file to a complete model: bonds (read, or perceived from
 * coordinates), bond orders (read, or perceived), topology, generic
 * parameters. The path `strainwise parametrize` and `strainwise minimize
 * molecule.sdf` take.
 * @module
 */
import type { StructureBase } from '../io/structure.js';
import { newStructure, type XyzStructure } from '../io/structure.js';
import type { Model } from '../model/model.js';
import { nonbondedConnectivity } from '../model/nonbonded.js';
import type { ModelFile } from '../model/schema.js';
import { perceiveBonds } from '../perceive/bonds.js';
import { perceiveTopology } from '../perceive/topology.js';
import type { Topology } from '../perceive/types.js';
import { assignGenericParameters } from './assign.js';

/** Options of {@link modelFromStructure}. */
export interface StructureModelOptions {
  /** Bond perception tolerance in Å over the sum of covalent radii (default: perception's, 0.45). */
  readonly tolerance?: number;
}

/** A structure turned into a model, with what was read and what was perceived. */
export interface StructureModel {
  /** The model file (kcal/mol, Å), every term and parameter assigned. */
  readonly file: ModelFile;
  /** The perceived topology the parameters were assigned from. */
  readonly topology: Topology;
  /** Whether the bonds were perceived from coordinates (the file gave none). */
  readonly perceivedBonds: boolean;
  /** Whether the bond orders were perceived (the file gave none). */
  readonly perceivedOrders: boolean;
}

/**
 * Perceive and parametrize one structure (coordinates in Å).
 * @throws {@link ModelError} naming the atom or bond when perception or
 *   parameter assignment refuses the molecule (an element without a covalent
 *   radius or without generic parameters, an impossible environment).
 */
export function modelFromStructure(structure: StructureBase, options: StructureModelOptions = {}): StructureModel {
  const { elements, coordinates } = structure;
  const perceivedBonds = structure.bonds === null;
  const bonds =
    structure.bonds ??
    perceiveBonds(elements, coordinates, options.tolerance === undefined ? {} : { tolerance: options.tolerance });
  const orders = perceivedBonds ? null : structure.bondOrders;
  const topology = perceiveTopology({
    elements,
    bonds,
    bondOrders: orders,
    formalCharges: structure.formalCharges,
    coordinates,
  });
  const names = structure.names.some((n) => n !== '') ? structure.names : undefined;
  const file = assignGenericParameters(topology, coordinates, {
    title: structure.title === '' ? 'generic parameters' : structure.title,
    ...(names === undefined ? {} : { names }),
  });
  return { file, topology, perceivedBonds, perceivedOrders: orders === null };
}

/**
 * A structure of a model, for writing it as PDB, XYZ or SDF: its elements,
 * atom names, formal charges 0, connectivity (the file's `bonds`, else its
 * bond terms and fixed distances) and coordinates `x` (default the model's),
 * converted to Å when the model is in nanometres.
 */
export function structureOfModel(model: Model, x: Float64Array = model.coordinates): XyzStructure {
  const file = model.toJSON();
  const all = nonbondedConnectivity(file);
  const seen = new Set<number>();
  const pairs: number[] = [];
  for (let b = 0; 2 * b + 1 < all.length; b++) {
    const i = Math.min(all[2 * b], all[2 * b + 1]);
    const j = Math.max(all[2 * b], all[2 * b + 1]);
    if (seen.has(i * model.atomCount + j)) continue;
    seen.add(i * model.atomCount + j);
    pairs.push(i, j);
  }
  const bonds = Int32Array.from(pairs);
  const scale = model.units.length === 'nanometer' ? 10 : 1;
  const xyz = scale === 1 ? Float64Array.from(x) : Float64Array.from(x, (v) => v * scale);
  return newStructure(
    model.atoms.map((a) => a.element),
    xyz,
    { title: model.title, names: model.atoms.map((a) => a.name), bonds: bonds.length > 0 ? bonds : null },
  );
}
