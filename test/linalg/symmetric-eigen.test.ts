/**
 * The symmetric eigensolver: A·V = V·D and VᵀV = I on random and special
 * matrices, closed-form spectra, and a cross-check against the registry
 * library numeric 1.2.6 (numeric.eig, an unsymmetric QR solver).
 */
import fc from 'fast-check';
import numeric from 'numeric';
import { describe, expect, it } from 'vitest';
import { EigenConvergenceError, symmetricEigen } from '../../src/linalg/symmetric-eigen.js';
import { tridiagonalQL } from '../../src/linalg/tridiagonal-ql.js';
import { createRandom } from '../helpers/random.js';

function randomSymmetric(n: number, seed: number): Float64Array {
  const r = createRandom(seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const v = r.uniform(-1, 1);
      a[i * n + j] = v;
      a[j * n + i] = v;
    }
  }
  return a;
}

/** Q diag(values) Qᵀ for a random orthogonal Q (product of Householder reflections): a matrix with a chosen spectrum. */
function withSpectrum(values: readonly number[], seed: number): Float64Array {
  const n = values.length;
  const r = createRandom(seed);
  const q = new Float64Array(n * n);
  for (let i = 0; i < n; i++) q[i * n + i] = 1;
  for (let h = 0; h < 3; h++) {
    const v = Array.from({ length: n }, () => r.uniform(-1, 1));
    const vv = v.reduce((s, x) => s + x * x, 0);
    for (let i = 0; i < n; i++) {
      let dot = 0;
      for (let j = 0; j < n; j++) dot += q[i * n + j] * v[j];
      for (let j = 0; j < n; j++) q[i * n + j] -= (2 * dot * v[j]) / vv;
    }
  }
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += q[i * n + k] * values[k] * q[j * n + k];
      a[i * n + j] = s;
    }
  }
  return a;
}

/** Largest |A v_i − λ_i v_i| over ‖A‖_max·n, and largest |VᵀV − I|. */
function residuals(
  a: Float64Array,
  n: number,
  method: 'inverse-iteration' | 'ql' = 'inverse-iteration',
): { residual: number; orthogonality: number; values: Float64Array } {
  const { values, vectors } = symmetricEigen(a, n, { method });
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a[i]));
  scale = Math.max(scale, Number.MIN_VALUE) * n;
  let residual = 0;
  let orthogonality = 0;
  for (let i = 0; i < n; i++) {
    for (let r = 0; r < n; r++) {
      let av = 0;
      for (let c = 0; c < n; c++) av += a[r * n + c] * vectors[i * n + c];
      residual = Math.max(residual, Math.abs(av - values[i] * vectors[i * n + r]) / scale);
    }
    for (let j = i; j < n; j++) {
      let dot = 0;
      for (let c = 0; c < n; c++) dot += vectors[i * n + c] * vectors[j * n + c];
      orthogonality = Math.max(orthogonality, Math.abs(dot - (i === j ? 1 : 0)));
    }
  }
  return { residual, orthogonality, values };
}

function ascending(v: Float64Array): boolean {
  for (let i = 1; i < v.length; i++) if (v[i] < v[i - 1]) return false;
  return true;
}

describe('symmetricEigen: A·V = V·D, VᵀV = I (true by definition of an eigen-decomposition)', () => {
  for (const n of [2, 3, 7, 20, 64, 150]) {
    it(`random symmetric ${n}×${n}`, () => {
      const { residual, orthogonality, values } = residuals(randomSymmetric(n, n), n);
      expect(residual).toBeLessThan(1e-13);
      expect(orthogonality).toBeLessThan(1e-12);
      expect(ascending(values)).toBe(true);
    });
  }

  it('property: random sizes and entries (fast-check)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 24 }), fc.integer(), (n, seed) => {
        const { residual, orthogonality, values } = residuals(randomSymmetric(n, seed), n);
        return residual < 1e-13 && orthogonality < 1e-12 && ascending(values);
      }),
      { numRuns: 60 },
    );
  });

  it('degenerate eigenvalues (a triple and a pair) come out orthonormal, and the spectrum is the one built in', () => {
    const spectrum = [-2, 1, 1, 1, 3, 3, 5, 0, 0.5, 1];
    const a = withSpectrum(spectrum, 7);
    const { residual, orthogonality, values } = residuals(a, spectrum.length);
    expect(residual).toBeLessThan(1e-13);
    expect(orthogonality).toBeLessThan(1e-12);
    const sorted = [...spectrum].sort((p, q) => p - q);
    sorted.forEach((v, i) => expect(Math.abs(values[i] - v)).toBeLessThan(1e-13));
  });

  it('a diagonal matrix: its diagonal sorted, unit vectors', () => {
    const diag = [4, -1, 2.5, 0, 9, -7];
    const n = diag.length;
    const a = new Float64Array(n * n);
    diag.forEach((v, i) => (a[i * n + i] = v));
    const { values, vectors } = symmetricEigen(a);
    expect(Array.from(values)).toEqual([...diag].sort((p, q) => p - q));
    for (let i = 0; i < n; i++) {
      const where = diag.indexOf(values[i]);
      expect(Math.abs(vectors[i * n + where])).toBe(1);
    }
  });

  it('the zero matrix: eigenvalues 0, vectors orthonormal', () => {
    const { residual, orthogonality, values } = residuals(new Float64Array(25), 5);
    expect(Array.from(values)).toEqual([0, 0, 0, 0, 0]);
    expect(residual).toBe(0);
    expect(orthogonality).toBeLessThan(1e-15);
  });

  it('1×1 and 0×0', () => {
    const one = symmetricEigen(Float64Array.of(-3.5));
    expect(Array.from(one.values)).toEqual([-3.5]);
    expect(Array.from(one.vectors)).toEqual([1]);
    const none = symmetricEigen(new Float64Array(0));
    expect(none.values.length).toBe(0);
  });

  it('an already tridiagonal matrix, and widely scaled entries', () => {
    const n = 30;
    const r = createRandom(3);
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      a[i * n + i] = r.uniform(-5, 5);
      if (i + 1 < n) a[i * n + i + 1] = a[(i + 1) * n + i] = r.uniform(-1, 1);
    }
    const t = residuals(a, n);
    expect(t.residual).toBeLessThan(1e-13);
    expect(t.orthogonality).toBeLessThan(1e-12);
    const scaled = randomSymmetric(12, 5).map((v, i) => v * 10 ** ((i % 7) - 3));
    for (let i = 0; i < 12; i++) for (let j = 0; j < i; j++) scaled[i * 12 + j] = scaled[j * 12 + i];
    const s = residuals(scaled, 12);
    expect(s.residual).toBeLessThan(1e-13);
    expect(s.orthogonality).toBeLessThan(1e-12);
  });

  it('reads only the upper triangle and leaves the input as it was', () => {
    const a = randomSymmetric(9, 11);
    const before = Float64Array.from(a);
    const full = symmetricEigen(a);
    expect(a).toEqual(before);
    const upper = Float64Array.from(a);
    for (let i = 0; i < 9; i++) for (let j = 0; j < i; j++) upper[i * 9 + j] = 1e6;
    expect(symmetricEigen(upper).values).toEqual(full.values);
  });

  it('values only: the same eigenvalues, no vectors', () => {
    const a = randomSymmetric(40, 2);
    const both = symmetricEigen(a);
    const only = symmetricEigen(a, 40, { vectors: false });
    expect(only.vectors.length).toBe(0);
    for (let i = 0; i < 40; i++) expect(Math.abs(only.values[i] - both.values[i])).toBeLessThan(1e-13);
  });
});

describe('symmetricEigen: closed-form spectra', () => {
  // Tridiagonal Toeplitz matrix (a on the diagonal, b beside it): eigenvalues
  // a + 2b cos(kπ/(n+1)), k = 1 … n, eigenvectors sin(jkπ/(n+1))
  // (standard result; e.g. Golub & Van Loan, Matrix Computations, 4th ed. 2013, and common practice).
  for (const [n, a, b] of [
    [10, 2, -1],
    [101, 0.5, 3],
  ] as const) {
    it(`tridiagonal Toeplitz n = ${n}, a = ${a}, b = ${b}`, () => {
      const m = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        m[i * n + i] = a;
        if (i + 1 < n) m[i * n + i + 1] = m[(i + 1) * n + i] = b;
      }
      const { values, vectors } = symmetricEigen(m);
      const expected = Array.from({ length: n }, (_, k) => a + 2 * b * Math.cos(((k + 1) * Math.PI) / (n + 1))).sort((p, q) => p - q);
      expected.forEach((v, i) => expect(Math.abs(values[i] - v)).toBeLessThan(1e-13 * (Math.abs(a) + 2 * Math.abs(b))));
      // The eigenvector of the largest eigenvalue (for b < 0 it is k = n; b > 0, k = 1), normalized, up to sign.
      const k = b < 0 ? n : 1;
      const norm = Math.sqrt((n + 1) / 2);
      const last = n - 1;
      const sign = Math.sign(vectors[last * n] * Math.sin((k * Math.PI) / (n + 1)));
      for (let j = 0; j < n; j++) {
        expect(Math.abs(sign * vectors[last * n + j] - Math.sin(((j + 1) * k * Math.PI) / (n + 1)) / norm)).toBeLessThan(1e-12);
      }
    });
  }

  it('the 2×2 [[a, b], [b, c]]: (a + c)/2 ± √(((a − c)/2)² + b²) (common practice)', () => {
    const [a, b, c] = [3, 1.5, -1];
    const { values } = symmetricEigen(Float64Array.of(a, b, b, c));
    const mid = (a + c) / 2;
    const rad = Math.hypot((a - c) / 2, b);
    expect(values[0]).toBeCloseTo(mid - rad, 14);
    expect(values[1]).toBeCloseTo(mid + rad, 14);
  });
});

describe('symmetricEigen against numeric 1.2.6 (registry library, numeric.eig)', () => {
  it('the same eigenvalues on random 12×12 matrices', () => {
    for (const seed of [1, 2, 3]) {
      const n = 12;
      const a = randomSymmetric(n, 100 + seed);
      const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, (i + 1) * n)));
      const theirs = (numeric.eig(rows).lambda.x as number[]).slice().sort((p, q) => p - q);
      const ours = symmetricEigen(a).values;
      theirs.forEach((v, i) => expect(Math.abs(ours[i] - v)).toBeLessThan(1e-10));
    }
  });
});

describe('symmetricEigen: boundary checks', () => {
  it('a length that is not n² is refused', () => {
    expect(() => symmetricEigen(new Float64Array(5))).toThrow(RangeError);
    expect(() => symmetricEigen(new Float64Array(9), 2)).toThrow('symmetricEigen: matrix: expected n² = 4 numbers for n = 2, got 9');
  });

  it('a non-finite entry is named', () => {
    const a = new Float64Array(9);
    a[5] = NaN;
    expect(() => symmetricEigen(a)).toThrow('symmetricEigen: matrix[1][2] is NaN, expected a finite number');
  });

  it('the QL sweep cap reports the eigenvalue (driven directly with a NaN that the boundary would refuse)', () => {
    const d = Float64Array.of(1, NaN, 2);
    const e = Float64Array.of(1, 1, 0);
    // NaN never passes the negligibility test, so eigenvalue 0 never converges.
    expect(tridiagonalQL(d, e, 3)).toBe(-1);
    expect(new EigenConvergenceError('x').name).toBe('EigenConvergenceError');
  });
});

/** A copy of the n×n `block` c times on the diagonal, turned by a random orthogonal matrix: every eigenvalue exactly c-fold. */
function blockCopies(block: Float64Array, n: number, c: number, seed: number): Float64Array {
  const size = n * c;
  const m = new Float64Array(size * size);
  for (let b = 0; b < c; b++) {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m[(b * n + i) * size + b * n + j] = block[i * n + j];
  }
  // Two Householder similarities H m H, H = I − 2 u uᵀ / uᵀu.
  const r = createRandom(seed);
  for (let h = 0; h < 2; h++) {
    const u = Float64Array.from({ length: size }, () => r.uniform(-1, 1));
    const uu = u.reduce((s, x) => s + x * x, 0);
    const mu = new Float64Array(size);
    for (let i = 0; i < size; i++) for (let j = 0; j < size; j++) mu[i] += m[i * size + j] * u[j];
    let umu = 0;
    for (let i = 0; i < size; i++) umu += u[i] * mu[i];
    // H m H = m − (2/uu)(mu uᵀ + u muᵀ) + (4 umu/uu²) u uᵀ
    for (let i = 0; i < size; i++) {
      for (let j = 0; j < size; j++) {
        m[i * size + j] += (-2 / uu) * (mu[i] * u[j] + u[i] * mu[j]) + ((4 * umu) / (uu * uu)) * u[i] * u[j];
      }
    }
  }
  return m;
}

/**
 * The mass-weighted Hessian of a 4×4×4 cubic lattice of point masses joined
 * by harmonic springs (k = 1) along the cube edges and face diagonals, at
 * rest: the block of a spring i–j with unit direction u is k u uᵀ on the
 * diagonal and −k u uᵀ off it (common practice); the masses (12 inside,
 * 16 on the surface) keep the full cubic symmetry, so the spectrum has
 * exactly two- and three-fold degenerate eigenvalues (the irreducible
 * representations of the cube's symmetry group have dimensions 1, 2 and 3;
 * common practice).
 */
function latticeHessian(): { h: Float64Array; n: number } {
  const side = 4;
  const atoms = side ** 3;
  const n = 3 * atoms;
  const at = (x: number, y: number, z: number): number => (x * side + y) * side + z;
  const pos = (i: number): number[] => [Math.floor(i / 16), Math.floor(i / 4) % 4, i % 4];
  const mass = (i: number): number => (pos(i).some((c) => c === 0 || c === side - 1) ? 16 : 12);
  const h = new Float64Array(n * n);
  const spring = (i: number, j: number): void => {
    const p = pos(i);
    const q = pos(j);
    const d = [q[0] - p[0], q[1] - p[1], q[2] - p[2]];
    const len = Math.hypot(d[0], d[1], d[2]);
    const w = 1 / Math.sqrt(mass(i) * mass(j));
    for (let a = 0; a < 3; a++) {
      for (let b = 0; b < 3; b++) {
        const k = (d[a] * d[b]) / (len * len);
        h[(3 * i + a) * n + 3 * i + b] += k / mass(i);
        h[(3 * j + a) * n + 3 * j + b] += k / mass(j);
        h[(3 * i + a) * n + 3 * j + b] -= k * w;
        h[(3 * j + a) * n + 3 * i + b] -= k * w;
      }
    }
  };
  for (let x = 0; x < side; x++) {
    for (let y = 0; y < side; y++) {
      for (let z = 0; z < side; z++) {
        const i = at(x, y, z);
        if (x + 1 < side) spring(i, at(x + 1, y, z));
        if (y + 1 < side) spring(i, at(x, y + 1, z));
        if (z + 1 < side) spring(i, at(x, y, z + 1));
        if (x + 1 < side && y + 1 < side) (spring(i, at(x + 1, y + 1, z)), spring(at(x + 1, y, z), at(x, y + 1, z)));
        if (x + 1 < side && z + 1 < side) (spring(i, at(x + 1, y, z + 1)), spring(at(x + 1, y, z), at(x, y, z + 1)));
        if (y + 1 < side && z + 1 < side) (spring(i, at(x, y + 1, z + 1)), spring(at(x, y + 1, z), at(x, y, z + 1)));
      }
    }
  }
  return { h, n };
}

/** Sizes of the groups of eigenvalues agreeing to `tol` (ascending input). */
function multiplicities(values: Float64Array, tol: number): number[] {
  const out: number[] = [];
  let count = 1;
  for (let i = 1; i <= values.length; i++) {
    if (i < values.length && values[i] - values[i - 1] <= tol) count++;
    else {
      out.push(count);
      count = 1;
    }
  }
  return out;
}

describe('symmetricEigen: degenerate and clustered spectra (both methods)', () => {
  for (const method of ['inverse-iteration', 'ql'] as const) {
    it(`${method}: n = 300, 30 eigenvalues ten-fold each, ten of them split by 1e-11 … 1e-9`, () => {
      const spectrum = Array.from({ length: 300 }, (_, i) => {
        const level = i % 30;
        const copy = Math.floor(i / 30);
        return level - 15 + (level < 10 ? copy * 10 ** (-11 + (level % 3)) : 0);
      });
      const a = withSpectrum(spectrum, 21);
      const { residual, orthogonality, values } = residuals(a, 300, method);
      expect(residual).toBeLessThan(1e-13);
      expect(orthogonality).toBeLessThan(1e-12);
      const sorted = [...spectrum].sort((p, q) => p - q);
      sorted.forEach((v, i) => expect(Math.abs(values[i] - v)).toBeLessThan(1e-12));
    });

    it(`${method}: the mass-weighted Hessian of a cubic lattice (exact two- and three-fold degeneracies)`, () => {
      const { h, n } = latticeHessian();
      const { residual, orthogonality, values } = residuals(h, n, method);
      expect(residual).toBeLessThan(1e-13);
      expect(orthogonality).toBeLessThan(1e-12);
      const groups = multiplicities(values, 1e-12);
      expect(groups.filter((g) => g === 3).length).toBeGreaterThan(5);
      expect(groups.filter((g) => g === 2).length).toBeGreaterThan(2);
      expect(groups[0]).toBeGreaterThanOrEqual(6); // the free body's translations and rotations
    });
  }

  it('both methods give the same eigenvalues on a random 200×200 matrix', () => {
    const a = randomSymmetric(200, 8);
    const fast = symmetricEigen(a, 200);
    const slow = symmetricEigen(a, 200, { method: 'ql' });
    for (let i = 0; i < 200; i++) expect(Math.abs(fast.values[i] - slow.values[i])).toBeLessThan(1e-12);
  });

  it('property: copies of a random block turned by a random rotation: orthonormal, each eigenvalue c-fold (fast-check)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 6 }), fc.integer({ min: 2, max: 6 }), fc.integer(), (n, c, seed) => {
        const a = blockCopies(randomSymmetric(n, seed), n, c, seed + 1);
        const { residual, orthogonality, values } = residuals(a, n * c);
        if (!(residual < 1e-13 && orthogonality < 1e-12 && ascending(values))) return false;
        for (let b = 0; b < n; b++) {
          for (let k = 1; k < c; k++) if (Math.abs(values[b * c + k] - values[b * c]) > 1e-12 * n) return false;
        }
        return true;
      }),
      { numRuns: 60 },
    );
  });
});
