/**
 * Converting a model file from one unit system to another.
 * @module
 */

import { type Units, unitFactor } from '../units.js';
import { copyJsonValue, type JsonValue } from './json.js';
import type { ModelFile, TermRecord } from './schema.js';

/** Factors from one unit system to another, by dimension. */
interface Factors {
  /** A length (coordinates, r0, s0, lower, upper, flat, x0, rmin, cutoff, constraint length). */
  readonly length: number;
  /** An energy (Morse D, torsion k, Ryckaert–Bellemans c, epsilon, cosine-angle k; angle, inversion k per radian²). */
  readonly energy: number;
  /** Energy per length squared (harmonic-bond, Urey–Bradley and restraint k). */
  readonly stiffness: number;
  /** Per length (Morse a). */
  readonly inverseLength: number;
}

/**
 * A copy of `file` with every quantity converted to the units `to`, and
 * `units` set to `to` (the input is not changed).
 *
 * Lengths: coordinates, `r0`, `s0`, `lower`, `upper`, `flat`, `x0`, `rmin`,
 * `cutoff`, constraint `length`. Energies: Morse `D`, `periodic-dihedral`
 * `k`, Ryckaert–Bellemans `c`, `epsilon`, `cosine-angle` `k`, and the `k` of
 * `harmonic-angle`, `harmonic-improper`, `cosine-series-angle`,
 * `periodic-angle` and `inversion` (energy per radian²). Unchanged too:
 * `omega0` (degrees). Energy per
 * length²: the `k` of `harmonic-bond`, `urey-bradley`, `position-restraint`
 * and `distance-restraint`. Per length: Morse `a`. Unchanged: angles
 * (`theta0`, `phase`, `xi0`, always degrees), `n`, masses, charges, the
 * dielectric and the 1-4 scale factors, `title` and `metadata`.
 *
 * @param file a validated model file (from `readModelFile`).
 * @param to the units wanted.
 * @returns the converted copy. Never throws.
 */
export function convertModelUnits(file: ModelFile, to: Units): ModelFile {
  const out = copyJsonValue(file as unknown as JsonValue) as unknown as ModelFile;
  const from = file.units;
  const f: Factors = {
    length: unitFactor(from, to, 0, 1),
    energy: unitFactor(from, to, 1, 0),
    stiffness: unitFactor(from, to, 1, -2),
    inverseLength: unitFactor(from, to, 0, -1),
  };
  out.units = { length: to.length, energy: to.energy };
  out.coordinates = out.coordinates.map(([x, y, z]) => [x * f.length, y * f.length, z * f.length]);
  out.terms = out.terms.map((term) => convertTerm(term, f));
  const nonbonded = out.nonbonded;
  if (nonbonded?.lennardJones !== undefined) {
    nonbonded.lennardJones.rmin = nonbonded.lennardJones.rmin.map((r) => r * f.length);
    nonbonded.lennardJones.epsilon = nonbonded.lennardJones.epsilon.map((e) => e * f.energy);
  }
  if (nonbonded?.cutoff !== undefined && nonbonded.cutoff !== null) nonbonded.cutoff *= f.length;
  for (const constraint of out.constraints ?? []) {
    if (constraint.length !== undefined) constraint.length *= f.length;
  }
  return out;
}

/** Convert one term's parameters in place and return it. */
function convertTerm(term: TermRecord, f: Factors): TermRecord {
  switch (term.kind) {
    case 'harmonic-bond':
      term.k *= f.stiffness;
      term.r0 *= f.length;
      break;
    case 'morse-bond':
      term.D *= f.energy;
      term.a *= f.inverseLength;
      term.r0 *= f.length;
      break;
    case 'harmonic-angle':
    case 'cosine-angle':
    case 'cosine-series-angle':
    case 'periodic-angle':
    case 'inversion':
    case 'harmonic-improper':
    case 'periodic-dihedral':
      term.k *= f.energy;
      break;
    case 'urey-bradley':
      term.k *= f.stiffness;
      term.s0 *= f.length;
      break;
    case 'ryckaert-bellemans':
      term.c = [
        term.c[0] * f.energy,
        term.c[1] * f.energy,
        term.c[2] * f.energy,
        term.c[3] * f.energy,
        term.c[4] * f.energy,
        term.c[5] * f.energy,
      ];
      break;
    case 'position-restraint':
      term.k *= f.stiffness;
      term.x0 = [term.x0[0] * f.length, term.x0[1] * f.length, term.x0[2] * f.length];
      if (term.flat !== undefined) term.flat *= f.length;
      break;
    case 'distance-restraint':
      term.k *= f.stiffness;
      term.lower *= f.length;
      term.upper *= f.length;
      break;
    default: {
      const unreachable: never = term;
      return unreachable;
    }
  }
  return term;
}
