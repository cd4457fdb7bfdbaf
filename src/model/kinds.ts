/**
 * The names energies are reported under: the bonded term kinds and the two
 * nonbonded pair kinds.
 * @module
 */
import type { TermKind } from '../terms/table.js';

/** The nonbonded pair kinds, as `byKind` reports them (model-file spec). */
export type NonbondedKind = 'lennard-jones' | 'coulomb';

/** The nonbonded kinds in the order they are summed and reported (after every term kind). */
export const NONBONDED_KINDS: readonly NonbondedKind[] = ['lennard-jones', 'coulomb'];

/** Every name an energy can be reported under: a term kind or a nonbonded kind. */
export type EnergyKind = TermKind | NonbondedKind;

/** Whether `kind` is one of the {@link NONBONDED_KINDS}. */
export function isNonbondedKind(kind: EnergyKind): kind is NonbondedKind {
  return kind === 'lennard-jones' || kind === 'coulomb';
}
