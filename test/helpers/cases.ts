/**
 * Random, realistic cases of every term kind: parameters in the ranges a
 * force field uses and geometries placed by a random rigid motion. Each
 * generator keeps its geometry at least 0.02 (length or radian) away from a
 * kink of the energy (the edges of a flat-bottomed restraint) and from the
 * jump of a harmonic improper (Δ = ±π), so central differences with the
 * default step are valid there.
 */
import type { TermKind } from '../../src/terms/table.js';
import { applyMotion, chain, randomRigidMotion, rad, triangle } from './geometry.js';
import type { Random } from './random.js';
import { periodicDihedralParams } from './terms.js';

/** Coordinates of atoms 0 … arity − 1 and the internal parameters of one term. */
export interface RandomCase {
  readonly x: Float64Array;
  readonly params: number[];
}

/** Random internal parameters of a kind (no geometry). */
export type ParamGenerator = (rng: Random) => number[];
/** A random case: parameters and a geometry that suits them. */
export type CaseGenerator = (rng: Random) => RandomCase;

/** Keep the central-difference stencil this far from a kink or a jump. */
const MARGIN = 0.02;

const bondParams: ParamGenerator = (rng) => [rng.uniform(10, 1500), rng.next() < 0.1 ? 0 : rng.uniform(0.8, 2.5)];
const morseParams: ParamGenerator = (rng) => [rng.uniform(10, 150), rng.uniform(0.8, 3), rng.uniform(0.8, 2.5)];
const ureyBradleyParams: ParamGenerator = (rng) => [rng.uniform(5, 100), rng.uniform(1.5, 3)];
const angleParams: ParamGenerator = (rng) => [rng.uniform(10, 300), rng.next() < 0.1 ? Math.PI : rad(rng.uniform(60, 180))];
const cosineParams: ParamGenerator = (rng) => [rng.uniform(10, 300), Math.cos(rad(rng.uniform(0, 180)))];
const periodicParams: ParamGenerator = (rng) =>
  periodicDihedralParams(
    rng.sign() * rng.uniform(0.1, 10),
    rng.int(1, 6),
    rng.next() < 0.3 ? rng.pick([0, Math.PI]) : rng.uniform(-Math.PI, Math.PI),
  );
const rbParams: ParamGenerator = (rng) => Array.from({ length: 6 }, () => rng.uniform(-40, 40));
const improperParams: ParamGenerator = (rng) => [rng.uniform(10, 200), rng.uniform(-Math.PI, Math.PI)];
const positionParams: ParamGenerator = (rng) => [
  rng.uniform(1, 100),
  rng.uniform(-3, 3),
  rng.uniform(-3, 3),
  rng.uniform(-3, 3),
  rng.next() < 0.3 ? 0 : rng.uniform(0.1, 1),
];
const distanceParams: ParamGenerator = (rng) => {
  const lower = rng.uniform(0.5, 3);
  return [rng.uniform(1, 100), lower, lower + (rng.next() < 0.2 ? 0 : rng.uniform(0, 2))];
};

/** Random parameters of every kind, in its internal layout. */
export const PARAMS: Readonly<Record<TermKind, ParamGenerator>> = {
  'harmonic-bond': bondParams,
  'morse-bond': morseParams,
  'harmonic-angle': angleParams,
  'cosine-angle': cosineParams,
  'urey-bradley': ureyBradleyParams,
  'periodic-dihedral': periodicParams,
  'ryckaert-bellemans': rbParams,
  'harmonic-improper': improperParams,
  'position-restraint': positionParams,
  'distance-restraint': distanceParams,
};

/** Two atoms at distance r, randomly placed. */
function pair(rng: Random, r: number): Float64Array {
  return applyMotion(new Float64Array([0, 0, 0, r, 0, 0]), randomRigidMotion(rng));
}

/** A random four-atom chain: bonds 1–2 Å, bond angles 20°–165°, torsion phi. */
function randomChain(rng: Random, phi: number): Float64Array {
  const x = chain(
    rng.uniform(1, 2),
    rng.uniform(1, 2),
    rng.uniform(1, 2),
    rad(rng.uniform(20, 165)),
    rad(rng.uniform(20, 165)),
    phi,
  );
  return applyMotion(x, randomRigidMotion(rng));
}

/** A distance in [lo, hi], or in one of several such ranges picked at random. */
function pickRange(rng: Random, ranges: readonly (readonly [number, number])[]): number {
  const usable = ranges.filter(([lo, hi]) => hi > lo);
  const [lo, hi] = rng.pick(usable);
  return rng.uniform(lo, hi);
}

/** A random case of every kind. */
export const CASES: Readonly<Record<TermKind, CaseGenerator>> = {
  'harmonic-bond': (rng) => {
    const params = bondParams(rng);
    return { params, x: pair(rng, rng.uniform(0.3, 3.5)) };
  },
  'morse-bond': (rng) => {
    const params = morseParams(rng);
    return { params, x: pair(rng, params[2] + rng.uniform(-0.4, 2.5)) };
  },
  'urey-bradley': (rng) => {
    const params = ureyBradleyParams(rng);
    const x = triangle(rng.uniform(0.9, 1.6), rng.uniform(0.9, 1.6), rad(rng.uniform(60, 150)));
    return { params, x: applyMotion(x, randomRigidMotion(rng)) };
  },
  'harmonic-angle': (rng) => {
    const params = angleParams(rng);
    const x = triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), rad(rng.uniform(10, 170)));
    return { params, x: applyMotion(x, randomRigidMotion(rng)) };
  },
  'cosine-angle': (rng) => {
    const params = cosineParams(rng);
    const x = triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), rad(rng.uniform(5, 175)));
    return { params, x: applyMotion(x, randomRigidMotion(rng)) };
  },
  'periodic-dihedral': (rng) => {
    const params = periodicParams(rng);
    return { params, x: randomChain(rng, rng.uniform(-Math.PI, Math.PI)) };
  },
  'ryckaert-bellemans': (rng) => {
    const params = rbParams(rng);
    return { params, x: randomChain(rng, rng.uniform(-Math.PI, Math.PI)) };
  },
  'harmonic-improper': (rng) => {
    const params = improperParams(rng);
    // Δ = φ − ξ0 stays at least MARGIN inside (−π, π): away from the jump.
    const delta = rng.uniform(-Math.PI + MARGIN, Math.PI - MARGIN);
    return { params, x: randomChain(rng, params[1] + delta) };
  },
  'position-restraint': (rng) => {
    const params = positionParams(rng);
    const flat = params[4];
    const r =
      flat === 0
        ? rng.uniform(0, 2)
        : pickRange(rng, [
            [0, flat - MARGIN],
            [flat + MARGIN, flat + 2],
          ]);
    const [ux, uy, uz] = rng.unitVector();
    return { params, x: new Float64Array([params[1] + r * ux, params[2] + r * uy, params[3] + r * uz]) };
  },
  'distance-restraint': (rng) => {
    const params = distanceParams(rng);
    const [, lower, upper] = params;
    const r = pickRange(rng, [
      [0.2, lower - MARGIN],
      [lower + MARGIN, upper - MARGIN],
      [upper + MARGIN, upper + 3],
    ]);
    return { params, x: pair(rng, r) };
  },
};
