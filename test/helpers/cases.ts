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
import { cosineSeriesCoefficients } from '../../src/model/compile.js';
import { outOfPlaneAngle } from '../../src/terms/measure.js';
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

/** k C0, k C1, k C2 of a series with its minimum at `degrees`, or (one time in five) arbitrary coefficients. */
function seriesParams(rng: Random, lo: number, hi: number): number[] {
  if (rng.next() < 0.2) return [rng.uniform(-50, 50), rng.uniform(-50, 50), rng.uniform(-50, 50)];
  const k = rng.uniform(10, 300);
  return cosineSeriesCoefficients(rng.uniform(lo, hi)).map((c) => k * c);
}
const cosineSeriesParams: ParamGenerator = (rng) => seriesParams(rng, 30, 170);
const periodicAngleParams: ParamGenerator = (rng) => {
  const n = rng.int(1, 6);
  return [rng.uniform(10, 300) / (n * n), n, rng.sign()];
};
const inversionParams: ParamGenerator = (rng) => {
  if (rng.next() < 0.4) {
    const k = rng.uniform(1, 60);
    return [k, -k, 0]; // the planar form, ω0 = 0
  }
  return seriesParams(rng, 5, 85);
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
  'cosine-series-angle': cosineSeriesParams,
  'periodic-angle': periodicAngleParams,
  inversion: inversionParams,
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

/**
 * A centre (atom 0) and three neighbours 0.9–2 Å away at azimuths near 0°,
 * 120° and 240° (±35°) and elevations in [−60°, 60°], randomly placed; drawn
 * again until every angle neighbour–centre–neighbour is 25°–165° and every
 * out-of-plane angle |ω| of the three choices is below 80°, so the stencil
 * stays away from the cone-shaped points at |ω| = 90° and from undefined planes.
 */
export function randomCentre(rng: Random): Float64Array {
  for (;;) {
    const x = new Float64Array(12);
    for (let m = 1; m <= 3; m++) {
      const r = rng.uniform(0.9, 2);
      const azimuth = rad(120 * (m - 1) + rng.uniform(-35, 35));
      const elevation = rad(rng.uniform(-60, 60));
      x[3 * m] = r * Math.cos(elevation) * Math.cos(azimuth);
      x[3 * m + 1] = r * Math.cos(elevation) * Math.sin(azimuth);
      x[3 * m + 2] = r * Math.sin(elevation);
    }
    const angles = [angleAt(x, 1, 2), angleAt(x, 2, 3), angleAt(x, 3, 1)];
    const omegas = [outOfPlaneAngle(x, 0, 1, 2, 3), outOfPlaneAngle(x, 0, 2, 3, 1), outOfPlaneAngle(x, 0, 3, 1, 2)];
    if (angles.every((a) => a > rad(25) && a < rad(165)) && omegas.every((w) => Math.abs(w) < rad(80))) {
      return applyMotion(x, randomRigidMotion(rng));
    }
  }
}

/** Angle a–0–b at the origin atom 0 (radians). */
function angleAt(x: Float64Array, a: number, b: number): number {
  const dot = x[3 * a] * x[3 * b] + x[3 * a + 1] * x[3 * b + 1] + x[3 * a + 2] * x[3 * b + 2];
  const ra = Math.hypot(x[3 * a], x[3 * a + 1], x[3 * a + 2]);
  const rb = Math.hypot(x[3 * b], x[3 * b + 1], x[3 * b + 2]);
  return Math.acos(dot / (ra * rb));
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
  'cosine-series-angle': (rng) => {
    const params = cosineSeriesParams(rng);
    const x = triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), rad(rng.uniform(5, 175)));
    return { params, x: applyMotion(x, randomRigidMotion(rng)) };
  },
  'periodic-angle': (rng) => {
    const params = periodicAngleParams(rng);
    const x = triangle(rng.uniform(0.8, 2), rng.uniform(0.8, 2), rad(rng.uniform(5, 175)));
    return { params, x: applyMotion(x, randomRigidMotion(rng)) };
  },
  inversion: (rng) => ({ params: inversionParams(rng), x: randomCentre(rng) }),
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
