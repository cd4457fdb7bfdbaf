/**
 * Which terms hold the most energy, and how far each is from its reference
 * value: the "most strained terms" report.
 * @module
 */
import type { Model } from '../model/model.js';
import { bendAngle, distance, outOfPlaneAngle, torsionAngle } from '../terms/measure.js';
import type { TermKind } from '../terms/table.js';
import { wrapAngle } from '../terms/torsion.js';

const DEG = 180 / Math.PI;

/** One term's energy and geometry. */
export interface StrainedTerm {
  /** The term's kind. */
  readonly kind: TermKind;
  /** Index of the term in the model file's `terms`. */
  readonly term: number;
  /** The term's atoms (0-based). */
  readonly atoms: readonly number[];
  /** The term's energy (model energy unit). */
  readonly energy: number;
  /** What is measured: a length (model unit) or an angle (degrees). */
  readonly quantity: 'distance' | 'angle' | 'torsion' | 'displacement';
  /** Its present value (length, or degrees). */
  readonly value: number;
  /** Its reference value (r0, θ0, ξ0, s0, ω0; the flat width for a position restraint; the nearer bound for a distance restraint), or null where the energy has no single reference (periodic and Ryckaert–Bellemans torsions, periodic angles). For an inversion, value and reference are the mean out-of-plane angle |ω| of its three choices and ω0. */
  readonly reference: number | null;
  /** value − reference (for an improper, wrapped into [−180°, 180°)), or null. */
  readonly deviation: number | null;
}

/**
 * Every term's energy and geometry at `x`, the `limit` highest-energy terms
 * first (ties in file order). Terms with zero energy are left out.
 */
export function mostStrainedTerms(model: Model, x: Float64Array, limit = 10): StrainedTerm[] {
  const all: StrainedTerm[] = [];
  const energies = model.termEnergies(x);
  model.tables.forEach((table, ti) => {
    const source = model.termSource(ti);
    const { atoms, params, arity, width } = table;
    for (let t = 0; t < table.count; t++) {
      const e = energies[ti][t];
      if (!(e !== 0)) continue;
      const at = Array.from(atoms.subarray(t * arity, t * arity + arity));
      const p = params.subarray(t * width, t * width + width);
      all.push({ kind: table.kind, term: source[t], atoms: at, energy: e, ...geometry(table.kind, x, at, p) });
    }
  });
  all.sort((a, b) => b.energy - a.energy || a.term - b.term);
  return all.slice(0, limit);
}

function geometry(
  kind: TermKind,
  x: Float64Array,
  a: number[],
  p: Float64Array,
): Pick<StrainedTerm, 'quantity' | 'value' | 'reference' | 'deviation'> {
  const of = (quantity: StrainedTerm['quantity'], value: number, reference: number | null) => ({
    quantity,
    value,
    reference,
    deviation: reference === null ? null : value - reference,
  });
  switch (kind) {
    case 'harmonic-bond':
      return of('distance', distance(x, a[0], a[1]), p[1]);
    case 'morse-bond':
      return of('distance', distance(x, a[0], a[1]), p[2]);
    case 'urey-bradley':
      return of('distance', distance(x, a[0], a[2]), p[1]);
    case 'harmonic-angle':
      return of('angle', bendAngle(x, a[0], a[1], a[2]) * DEG, p[1] * DEG);
    case 'cosine-angle':
      return of('angle', bendAngle(x, a[0], a[1], a[2]) * DEG, Math.acos(p[1]) * DEG);
    case 'periodic-dihedral':
    case 'ryckaert-bellemans':
      return of('torsion', torsionAngle(x, a[0], a[1], a[2], a[3]) * DEG, null);
    case 'harmonic-improper': {
      const phi = torsionAngle(x, a[0], a[1], a[2], a[3]);
      return {
        quantity: 'torsion',
        value: phi * DEG,
        reference: p[1] * DEG,
        deviation: wrapAngle(phi - p[1]) * DEG,
      };
    }
    case 'position-restraint': {
      const i = 3 * a[0];
      const r = Math.hypot(x[i] - p[1], x[i + 1] - p[2], x[i + 2] - p[3]);
      return of('displacement', r, p[4]);
    }
    case 'distance-restraint': {
      const r = distance(x, a[0], a[1]);
      return of('distance', r, r < p[1] ? p[1] : p[2]);
    }
    case 'cosine-series-angle':
      // minimum of c0 + c1 cos θ + c2 cos 2θ at cos θ0 = −c1/(4 c2)
      return of('angle', bendAngle(x, a[0], a[1], a[2]) * DEG, p[2] > 0 ? Math.acos(clampUnit(-p[1] / (4 * p[2]))) * DEG : null);
    case 'periodic-angle':
      return of('angle', bendAngle(x, a[0], a[1], a[2]) * DEG, null);
    case 'inversion': {
      // the mean |ω| over the three choices of the out-of-plane neighbour
      const w =
        (Math.abs(outOfPlaneAngle(x, a[0], a[1], a[2], a[3])) +
          Math.abs(outOfPlaneAngle(x, a[0], a[2], a[3], a[1])) +
          Math.abs(outOfPlaneAngle(x, a[0], a[3], a[1], a[2]))) /
        3;
      const reference = p[2] > 0 ? Math.acos(clampUnit(-p[1] / (4 * p[2]))) * DEG : 0;
      return of('angle', w * DEG, reference);
    }
  }
}

function clampUnit(c: number): number {
  return c > 1 ? 1 : c < -1 ? -1 : c;
}
