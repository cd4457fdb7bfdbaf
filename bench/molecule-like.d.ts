/** What {@link moleculeLikeModel} builds. */
export interface MoleculeLikeSpec {
  /** Carbon atoms (the model has about three times as many atoms in all). */
  carbons: number;
  /** Seed of the generator: the same spec gives the same model. */
  seed: number;
  /** Chance that a carbon gets a second carbon child (default 0.25). */
  branching?: number;
  /** Largest random displacement per coordinate, Å (default 0.15). */
  shake?: number;
  /** Restrain every pair ≥ 3 bonds apart (default: when ≤ 400 atoms); else only pairs within 7 Å at the start. */
  allPairs?: boolean;
  /** Lennard-Jones pairs (10 Å cutoff) instead of the repulsive restraints. */
  lennardJones?: boolean;
}
/** A model-file object (kcal/mol, Å) of a branched hydrocarbon-like test molecule. */
export function moleculeLikeModel(spec: MoleculeLikeSpec): {
  format: 'strainwise-model';
  version: 1;
  title: string;
  units: { length: 'angstrom'; energy: 'kcal/mol' };
  atoms: { element: string }[];
  coordinates: [number, number, number][];
  terms: Record<string, unknown>[];
  bonds?: [number, number][];
  nonbonded?: Record<string, unknown>;
};
