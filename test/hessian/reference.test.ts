/**
 * The Hessian of a model at its minimum against the textbook construction
 * H_cart = Bᵀ F B (Wilson, Decius & Cross, Molecular Vibrations,
 * McGraw-Hill 1955, ch. 4): at a minimum every first derivative E′ of the
 * internal coordinates vanishes, so only E″ ∇q ∇qᵀ remains, and the rows of
 * B are Wilson's s-vectors, computed here independently of the kernels.
 */
import { describe, expect, it } from 'vitest';
import { modelHessian } from '../../src/hessian/model.js';
import { parseModel } from '../../src/model/model.js';
import type { ModelFile } from '../../src/model/schema.js';
import { SPEC_WATER } from '../fixtures/models.js';
import { applyMotion, randomRigidMotion, rad } from '../helpers/geometry.js';
import { createRandom } from '../helpers/random.js';
import { scaledError, symmetricEigenvalues } from './support.js';

type Vec = [number, number, number];
const sub = (x: Float64Array, a: number, b: number): Vec => [x[3 * b] - x[3 * a], x[3 * b + 1] - x[3 * a + 1], x[3 * b + 2] - x[3 * a + 2]];
const norm = (v: Vec): number => Math.hypot(v[0], v[1], v[2]);
const scale = (v: Vec, s: number): Vec => [v[0] * s, v[1] * s, v[2] * s];

/** s-vector of the stretch a–b over all atoms: −e on a, +e on b (e the unit vector a → b). */
function stretchRow(x: Float64Array, a: number, b: number): Float64Array {
  const d = sub(x, a, b);
  const e = scale(d, 1 / norm(d));
  const row = new Float64Array(x.length);
  for (let c = 0; c < 3; c++) {
    row[3 * a + c] = -e[c];
    row[3 * b + c] = e[c];
  }
  return row;
}

/**
 * s-vector of the bend 1–3–2 with apex 3 (WDC §4-1, from memory):
 * s1 = (cos φ e31 − e32)/(r31 sin φ), s2 = (cos φ e32 − e31)/(r32 sin φ),
 * s3 = −s1 − s2, e3a the unit vector from the apex to atom a.
 */
function bendRow(x: Float64Array, one: number, apex: number, two: number): Float64Array {
  const d1 = sub(x, apex, one);
  const d2 = sub(x, apex, two);
  const r1 = norm(d1);
  const r2 = norm(d2);
  const e1 = scale(d1, 1 / r1);
  const e2 = scale(d2, 1 / r2);
  const cos = e1[0] * e2[0] + e1[1] * e2[1] + e1[2] * e2[2];
  const sin = Math.sqrt(1 - cos * cos);
  const row = new Float64Array(x.length);
  for (let c = 0; c < 3; c++) {
    const s1 = (cos * e1[c] - e2[c]) / (r1 * sin);
    const s2 = (cos * e2[c] - e1[c]) / (r2 * sin);
    row[3 * one + c] = s1;
    row[3 * two + c] = s2;
    row[3 * apex + c] = -s1 - s2;
  }
  return row;
}

/** Bᵀ F B for rows B and diagonal F. */
function wilsonHessian(rows: Float64Array[], constants: number[]): Float64Array {
  const n = rows[0].length;
  const h = new Float64Array(n * n);
  rows.forEach((s, m) => {
    for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) h[r * n + c] += constants[m] * s[r] * s[c];
  });
  return h;
}

describe('water at its minimum: H = Bᵀ F B', () => {
  const r0 = 0.9572;
  const theta0 = rad(104.52);
  const kBond = 1100;
  const kAngle = 100;

  it('modelHessian equals Bᵀ diag(k_b, k_b, k_θ) B at 20 random orientations of the rest geometry', () => {
    const rng = createRandom(12);
    for (let c = 0; c < 20; c++) {
      const rest = new Float64Array([0, 0, 0, r0, 0, 0, r0 * Math.cos(theta0), r0 * Math.sin(theta0), 0]);
      const x = applyMotion(rest, randomRigidMotion(rng));
      const file: ModelFile = { ...SPEC_WATER, coordinates: [[x[0], x[1], x[2]], [x[3], x[4], x[5]], [x[6], x[7], x[8]]] };
      const model = parseModel(file);
      const h = modelHessian(model, x);
      const expected = wilsonHessian([stretchRow(x, 0, 1), stretchRow(x, 0, 2), bendRow(x, 1, 0, 2)], [kBond, kBond, kAngle]);
      expect(scaledError(expected, h), `case ${c}`).toBeLessThanOrEqual(1e-12);
    }
  });

  it('has six zero eigenvalues (three translations, three rotations) and three positive ones', () => {
    const x = new Float64Array([0, 0, 0, r0, 0, 0, r0 * Math.cos(theta0), r0 * Math.sin(theta0), 0]);
    const model = parseModel({ ...SPEC_WATER, coordinates: [[0, 0, 0], [x[3], x[4], x[5]], [x[6], x[7], x[8]]] });
    const values = symmetricEigenvalues(modelHessian(model, x), 9);
    for (let n = 0; n < 6; n++) expect(Math.abs(values[n])).toBeLessThan(1e-9 * values[8]);
    for (let n = 6; n < 9; n++) expect(values[n]).toBeGreaterThan(1);
  });
});
