/**
 * Smooth test functions with known minima, written as f(x) and ∇f(x) for
 * the minimizer tests. Each names its source beside its definition, start
 * point and minimum.
 */
import type { ObjectiveFunction } from '../../src/optimize/types.js';

/** A test problem: objective, standard start, and the published minimum value(s). */
export interface TestProblem {
  /** Short name used in test titles. */
  name: string;
  /** f(x), writing ∇f(x) into `gradient` when given. */
  fn: ObjectiveFunction;
  /** The standard starting point. */
  start: number[];
  /** The published minimum values f* the problem may be solved to (first: the one usually reached). */
  minima: number[];
  /** The published minimizer, when the problem has one point to compare with. */
  minimizer?: number[];
}

/**
 * A sum of squares f = Σ rᵢ(x)², given a function that writes the residuals
 * r and the dense Jacobian J (row-major, m × n); ∇f = 2 Jᵀ r.
 */
function sumOfSquares(m: number, n: number, residuals: (x: Float64Array, r: Float64Array, J: Float64Array) => void): ObjectiveFunction {
  const r = new Float64Array(m);
  const J = new Float64Array(m * n);
  return (x, gradient) => {
    J.fill(0);
    residuals(x, r, J);
    let f = 0;
    for (let i = 0; i < m; i++) f += r[i] * r[i];
    if (gradient) {
      gradient.fill(0);
      for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) gradient[j] += 2 * J[i * n + j] * r[i];
    }
    return f;
  };
}

/**
 * The chained Rosenbrock function Σᵢ 100(xᵢ₊₁ − xᵢ²)² + (1 − xᵢ)², i = 1…n−1;
 * for n = 2 it is H. H. Rosenbrock, Computer Journal 3 (1960) 175, with
 * the minimum f = 0 at (1, …, 1) (exact by construction: every square vanishes there).
 */
export function rosenbrock(x: Float64Array, gradient?: Float64Array): number {
  let f = 0;
  if (gradient) gradient.fill(0);
  for (let i = 0; i + 1 < x.length; i++) {
    const a = x[i + 1] - x[i] * x[i];
    const b = 1 - x[i];
    f += 100 * a * a + b * b;
    if (gradient) {
      gradient[i] += -400 * a * x[i] - 2 * b;
      gradient[i + 1] += 200 * a;
    }
  }
  return f;
}

/** Rosenbrock, 2-D, start (−1.2, 1) (Rosenbrock 1960; Moré–Garbow–Hillstrom, ACM TOMS 7 (1981) 17, problem 1). */
export const ROSENBROCK_2: TestProblem = { name: 'Rosenbrock 2-D', fn: rosenbrock, start: [-1.2, 1], minima: [0], minimizer: [1, 1] };

/**
 * Chained Rosenbrock in 10 dimensions from (−1.2, 1, −1.2, 1, …) (the start of
 * Moré–Garbow–Hillstrom 1981, problem 21); minimum 0 at (1, …, 1), exact by construction.
 */
export const ROSENBROCK_10: TestProblem = {
  name: 'Rosenbrock 10-D (chained)',
  fn: rosenbrock,
  start: Array.from({ length: 10 }, (_, i) => (i % 2 === 0 ? -1.2 : 1)),
  minima: [0],
  minimizer: Array.from({ length: 10 }, () => 1),
};

/** Extended Rosenbrock, n = 10, Moré–Garbow–Hillstrom 1981 problem 21: f* = 0 at (1, …, 1). */
export const EXTENDED_ROSENBROCK: TestProblem = {
  name: 'extended Rosenbrock (MGH 21, n = 10)',
  fn: sumOfSquares(10, 10, (x, r, J) => {
    for (let i = 0; i < 10; i += 2) {
      r[i] = 10 * (x[i + 1] - x[i] * x[i]);
      J[i * 10 + i] = -20 * x[i];
      J[i * 10 + i + 1] = 10;
      r[i + 1] = 1 - x[i];
      J[(i + 1) * 10 + i] = -1;
    }
  }),
  start: Array.from({ length: 10 }, (_, i) => (i % 2 === 0 ? -1.2 : 1)),
  minima: [0],
  minimizer: Array.from({ length: 10 }, () => 1),
};

/** Freudenstein–Roth, MGH 1981 problem 2: start (0.5, −2); f = 48.9842… (local) or 0 at (5, 4). */
export const FREUDENSTEIN_ROTH: TestProblem = {
  name: 'Freudenstein–Roth (MGH 2)',
  fn: sumOfSquares(2, 2, (x, r, J) => {
    const [x1, x2] = x;
    r[0] = -13 + x1 + ((5 - x2) * x2 - 2) * x2;
    J[0] = 1;
    J[1] = 10 * x2 - 3 * x2 * x2 - 2;
    r[1] = -29 + x1 + ((x2 + 1) * x2 - 14) * x2;
    J[2] = 1;
    J[3] = 3 * x2 * x2 + 2 * x2 - 14;
  }),
  start: [0.5, -2],
  minima: [48.9842, 0],
};

/** Powell badly scaled, MGH 1981 problem 3: start (0, 1); f* = 0 at (1.098…e−5, 9.106…). */
export const POWELL_BADLY_SCALED: TestProblem = {
  name: 'Powell badly scaled (MGH 3)',
  fn: sumOfSquares(2, 2, (x, r, J) => {
    const [x1, x2] = x;
    r[0] = 1e4 * x1 * x2 - 1;
    J[0] = 1e4 * x2;
    J[1] = 1e4 * x1;
    r[1] = Math.exp(-x1) + Math.exp(-x2) - 1.0001;
    J[2] = -Math.exp(-x1);
    J[3] = -Math.exp(-x2);
  }),
  start: [0, 1],
  minima: [0],
};

/** Brown badly scaled, MGH 1981 problem 4: start (1, 1); f* = 0 at (1e6, 2e−6). */
export const BROWN_BADLY_SCALED: TestProblem = {
  name: 'Brown badly scaled (MGH 4)',
  fn: sumOfSquares(3, 2, (x, r, J) => {
    const [x1, x2] = x;
    r[0] = x1 - 1e6;
    J[0] = 1;
    r[1] = x2 - 2e-6;
    J[3] = 1;
    r[2] = x1 * x2 - 2;
    J[4] = x2;
    J[5] = x1;
  }),
  start: [1, 1],
  minima: [0],
  minimizer: [1e6, 2e-6],
};

/** Beale, MGH 1981 problem 5: start (1, 1); f* = 0 at (3, 0.5). */
export const BEALE: TestProblem = {
  name: 'Beale (MGH 5)',
  fn: sumOfSquares(3, 2, (x, r, J) => {
    const [x1, x2] = x;
    const y = [1.5, 2.25, 2.625];
    for (let i = 0; i < 3; i++) {
      const p = x2 ** (i + 1);
      r[i] = y[i] - x1 * (1 - p);
      J[2 * i] = -(1 - p);
      J[2 * i + 1] = x1 * (i + 1) * x2 ** i;
    }
  }),
  start: [1, 1],
  minima: [0],
  minimizer: [3, 0.5],
};

/** Helical valley, MGH 1981 problem 7: start (−1, 0, 0); f* = 0 at (1, 0, 0). θ as defined there (branch by the sign of x1). */
export const HELICAL_VALLEY: TestProblem = {
  name: 'helical valley (MGH 7)',
  fn: sumOfSquares(3, 3, (x, r, J) => {
    const [x1, x2, x3] = x;
    const theta = Math.atan(x2 / x1) / (2 * Math.PI) + (x1 < 0 ? 0.5 : 0);
    const rr = x1 * x1 + x2 * x2;
    const dtheta1 = -x2 / (2 * Math.PI * rr);
    const dtheta2 = x1 / (2 * Math.PI * rr);
    r[0] = 10 * (x3 - 10 * theta);
    J[0] = -100 * dtheta1;
    J[1] = -100 * dtheta2;
    J[2] = 10;
    const rad = Math.sqrt(rr);
    r[1] = 10 * (rad - 1);
    J[3] = (10 * x1) / rad;
    J[4] = (10 * x2) / rad;
    r[2] = x3;
    J[8] = 1;
  }),
  start: [-1, 0, 0],
  minima: [0],
  minimizer: [1, 0, 0],
};

/** Wood, MGH 1981 problem 14: start (−3, −1, −3, −1); f* = 0 at (1, 1, 1, 1). */
export const WOOD: TestProblem = {
  name: 'Wood (MGH 14)',
  fn: sumOfSquares(6, 4, (x, r, J) => {
    const [x1, x2, x3, x4] = x;
    r[0] = 10 * (x2 - x1 * x1);
    J[0] = -20 * x1;
    J[1] = 10;
    r[1] = 1 - x1;
    J[4] = -1;
    r[2] = Math.sqrt(90) * (x4 - x3 * x3);
    J[10] = -2 * Math.sqrt(90) * x3;
    J[11] = Math.sqrt(90);
    r[3] = 1 - x3;
    J[14] = -1;
    r[4] = Math.sqrt(10) * (x2 + x4 - 2);
    J[17] = Math.sqrt(10);
    J[19] = Math.sqrt(10);
    r[5] = (x2 - x4) / Math.sqrt(10);
    J[21] = 1 / Math.sqrt(10);
    J[23] = -1 / Math.sqrt(10);
  }),
  start: [-3, -1, -3, -1],
  minima: [0],
  minimizer: [1, 1, 1, 1],
};

/** Extended Powell singular, MGH 1981 problem 22, n = 8: start (3, −1, 0, 1, …); f* = 0 at the origin. */
export const POWELL_SINGULAR: TestProblem = {
  name: 'extended Powell singular (MGH 22, n = 8)',
  fn: sumOfSquares(8, 8, (x, r, J) => {
    const s5 = Math.sqrt(5);
    const s10 = Math.sqrt(10);
    for (let b = 0; b < 8; b += 4) {
      const [x1, x2, x3, x4] = [x[b], x[b + 1], x[b + 2], x[b + 3]];
      r[b] = x1 + 10 * x2;
      J[b * 8 + b] = 1;
      J[b * 8 + b + 1] = 10;
      r[b + 1] = s5 * (x3 - x4);
      J[(b + 1) * 8 + b + 2] = s5;
      J[(b + 1) * 8 + b + 3] = -s5;
      r[b + 2] = (x2 - 2 * x3) ** 2;
      J[(b + 2) * 8 + b + 1] = 2 * (x2 - 2 * x3);
      J[(b + 2) * 8 + b + 2] = -4 * (x2 - 2 * x3);
      r[b + 3] = s10 * (x1 - x4) ** 2;
      J[(b + 3) * 8 + b] = 2 * s10 * (x1 - x4);
      J[(b + 3) * 8 + b + 3] = -2 * s10 * (x1 - x4);
    }
  }),
  start: [3, -1, 0, 1, 3, -1, 0, 1],
  minima: [0],
  minimizer: [0, 0, 0, 0, 0, 0, 0, 0],
};

/** Every problem above. */
export const PROBLEMS: readonly TestProblem[] = [
  ROSENBROCK_2,
  ROSENBROCK_10,
  EXTENDED_ROSENBROCK,
  FREUDENSTEIN_ROTH,
  POWELL_BADLY_SCALED,
  BROWN_BADLY_SCALED,
  BEALE,
  HELICAL_VALLEY,
  WOOD,
  POWELL_SINGULAR,
];
