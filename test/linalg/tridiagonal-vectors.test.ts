/**
 * Eigenvectors of a symmetric tridiagonal T by inverse iteration: T z = λ z
 * and ZᵀZ = I (true by definition of an eigen-decomposition), on matrices
 * chosen to have exactly equal, nearly equal and clustered eigenvalues.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { symmetricEigen } from '../../src/linalg/symmetric-eigen.js';
import { tridiagonalEigenvectors } from '../../src/linalg/tridiagonal-vectors.js';
import { createRandom } from '../helpers/random.js';

interface Check {
  ok: boolean;
  values: Float64Array;
  residual: number;
  orthogonality: number;
}

/** Run the solver; largest |T z − λ z| / ‖T‖₁ and largest |ZᵀZ − I|. */
function check(d: Float64Array, e: Float64Array): Check {
  const n = d.length;
  const values = new Float64Array(n);
  const rows = new Float64Array(n * n);
  const ok = tridiagonalEigenvectors(d, e, n, values, rows) >= 0;
  let norm = Number.MIN_VALUE;
  for (let i = 0; i < n; i++) {
    norm = Math.max(norm, Math.abs(d[i]) + (i > 0 ? Math.abs(e[i - 1]) : 0) + (i < n - 1 ? Math.abs(e[i]) : 0));
  }
  let residual = 0;
  let orthogonality = 0;
  for (let r = 0; r < n; r++) {
    const z = rows.subarray(r * n, (r + 1) * n);
    for (let i = 0; i < n; i++) {
      let tz = d[i] * z[i];
      if (i > 0) tz += e[i - 1] * z[i - 1];
      if (i < n - 1) tz += e[i] * z[i + 1];
      residual = Math.max(residual, Math.abs(tz - values[r] * z[i]) / norm);
    }
    for (let q = r; q < n; q++) {
      let dot = 0;
      for (let i = 0; i < n; i++) dot += z[i] * rows[q * n + i];
      orthogonality = Math.max(orthogonality, Math.abs(dot - (q === r ? 1 : 0)));
    }
  }
  return { ok, values, residual, orthogonality };
}

function sorted(v: Float64Array): number[] {
  return Array.from(v).sort((p, q) => p - q);
}

describe('tridiagonalEigenvectors', () => {
  it("Wilkinson's W21+: the close pairs get orthonormal vectors and the eigenvalues of numpy", () => {
    // W21+ = tridiag(1, |10 − i|, 1), i = 0 … 20 (Wilkinson, The Algebraic
    // Eigenvalue Problem, 1965, ch. 5); its largest eigenvalues come in pairs
    // agreeing to about 1e-13. Values from numpy 2.4.6 numpy.linalg.eigvalsh
    // (LAPACK), computed once for this test.
    const d = Float64Array.from({ length: 21 }, (_, i) => Math.abs(10 - i));
    const e = new Float64Array(21).fill(1);
    const t = check(d, e);
    expect(t.ok).toBe(true);
    expect(t.residual).toBeLessThan(1e-14);
    expect(t.orthogonality).toBeLessThan(1e-13);
    const top = sorted(t.values).slice(-4);
    [9.210678647304919, 9.210678647361332, 10.746194182903322, 10.746194182903393].forEach((v, i) =>
      expect(Math.abs(top[i] - v)).toBeLessThan(1e-13),
    );
  });

  it('W21+ scaled by 1e-200 and by 1e200: the same accuracy relative to ‖T‖ (the blocks are scaled inside)', () => {
    for (const f of [1e-200, 1e200]) {
      const d = Float64Array.from({ length: 21 }, (_, i) => f * Math.abs(10 - i));
      const e = new Float64Array(21).fill(f);
      const t = check(d, e);
      expect(t.ok).toBe(true);
      expect(t.residual).toBeLessThan(1e-14);
      expect(t.orthogonality).toBeLessThan(1e-13);
      expect(Math.abs(sorted(t.values)[20] / f - 10.746194182903393)).toBeLessThan(1e-13); // numpy, as above
    }
  });

  it('a matrix that splits into identical blocks (exactly equal eigenvalues in different blocks)', () => {
    // Three copies of tridiag(1, 2, 1) of order 7 joined by zero off-diagonals.
    const n = 21;
    const d = new Float64Array(n).fill(2);
    const e = Float64Array.from({ length: n }, (_, i) => ((i + 1) % 7 === 0 ? 0 : 1));
    const t = check(d, e);
    expect(t.ok).toBe(true);
    expect(t.residual).toBeLessThan(1e-14);
    expect(t.orthogonality).toBeLessThan(1e-14);
    // 2 + 2 cos(kπ/8), k = 1 … 7, each three times (tridiagonal Toeplitz spectrum, common practice).
    const expected = Array.from({ length: 7 }, (_, k) => 2 + 2 * Math.cos(((k + 1) * Math.PI) / 8))
      .flatMap((v) => [v, v, v])
      .sort((p, q) => p - q);
    sorted(t.values).forEach((v, i) => expect(Math.abs(v - expected[i])).toBeLessThan(1e-14));
  });

  it('blocks joined by off-diagonals too small to split: nearly equal eigenvalues, one cluster', () => {
    const n = 40;
    const d = new Float64Array(n).fill(1);
    const e = Float64Array.from({ length: n }, (_, i) => ((i + 1) % 8 === 0 ? 1e-9 : 0.5));
    const t = check(d, e);
    expect(t.ok).toBe(true);
    expect(t.residual).toBeLessThan(1e-14);
    expect(t.orthogonality).toBeLessThan(1e-13);
  });

  it('a diagonal matrix with repeated entries, and the zero matrix: unit vectors', () => {
    const d = Float64Array.of(3, 1, 3, 3, 0, 1);
    const t = check(d, new Float64Array(6));
    expect(t.ok).toBe(true);
    expect(t.residual).toBe(0);
    expect(t.orthogonality).toBe(0);
    const z = check(new Float64Array(5), new Float64Array(5));
    expect(z.ok && z.residual === 0 && z.orthogonality === 0).toBe(true);
  });

  it('n = 400 with a dense spectrum (random entries) and with a glued cluster of 100 near-copies', () => {
    const r = createRandom(4);
    const n = 400;
    const d = Float64Array.from({ length: n }, () => r.uniform(-1, 1));
    const e = Float64Array.from({ length: n }, () => r.uniform(-1, 1));
    const t = check(d, e);
    expect(t.ok).toBe(true);
    expect(t.residual).toBeLessThan(1e-14);
    expect(t.orthogonality).toBeLessThan(1e-12);
    // 100 copies of the 4×4 tridiag(1, 0, 1) glued by 1e-12: eigenvalues ±1.618…, ±0.618…, each ~100-fold.
    const dc = new Float64Array(n);
    const ec = Float64Array.from({ length: n }, (_, i) => ((i + 1) % 4 === 0 ? 1e-12 : 1));
    const c = check(dc, ec);
    expect(c.ok).toBe(true);
    // The 100 eigenvalues of each group lie within about 1e-12 of each other, closer than the
    // shifts can tell apart (they step by 10 ε |λ| when two coincide), so a vector is exact only
    // up to the group's span: its residual is bounded by the group's width, not by ε‖T‖.
    expect(c.residual).toBeLessThan(1e-12);
    expect(c.orthogonality).toBeLessThan(1e-12);
  });

  it('property: entries from a small set (splits, exact and near degeneracies) (fast-check)', () => {
    const entry = fc.constantFrom(-1, 0, 1, 2, 1e-9, -1e-13);
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }).chain((n) => fc.tuple(fc.array(entry, { minLength: n, maxLength: n }), fc.array(entry, { minLength: n, maxLength: n }))),
        ([ds, es]) => {
          // Either accurate vectors, or an honest failure (−1) that sends symmetricEigen to QL:
          // never inaccurate vectors reported as found.
          const t = check(Float64Array.from(ds), Float64Array.from(es));
          return !t.ok || (t.residual < 1e-14 && t.orthogonality < 1e-12);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('reports failure instead of inaccurate vectors on the matrices the property test found, and symmetricEigen is exact on them', () => {
    // Found by fast-check (seeds -891709601 and 535754374 of the property above): inverse
    // iteration "converged" to vectors with residual 0.4–0.5; the a posteriori check now refuses
    // them and symmetricEigen falls back to QL with vectors.
    const cases: [number[], number[]][] = [
      [[0, 1e-9, 1e-9, -1, 2, 0], [1e-9, -1, 1e-9, -1e-13, 1e-9, -1]],
      [
        [0, 0, 2, 2, -1e-13, 0, 0, -1e-13, 1, -1, 1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1],
        [1e-9, 1e-9, 2, 1e-9, 1, -1e-13, -1e-13, 2, 1e-9, -1, 0, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1, -1],
      ],
    ];
    for (const [ds, es] of cases) {
      const t = check(Float64Array.from(ds), Float64Array.from(es));
      expect(!t.ok || (t.residual < 1e-14 && t.orthogonality < 1e-12)).toBe(true);
      const n = ds.length;
      const a = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        a[i * n + i] = ds[i];
        if (i < n - 1) a[i * n + i + 1] = a[(i + 1) * n + i] = es[i];
      }
      const eig = symmetricEigen(a, n);
      let residual = 0;
      let orthogonality = 0;
      for (let r = 0; r < n; r++) {
        for (let i = 0; i < n; i++) {
          let s = 0;
          for (let c = 0; c < n; c++) s += a[i * n + c] * eig.vectors[r * n + c];
          residual = Math.max(residual, Math.abs(s - eig.values[r] * eig.vectors[r * n + i]));
        }
        for (let q = r; q < n; q++) {
          let dot = 0;
          for (let i = 0; i < n; i++) dot += eig.vectors[r * n + i] * eig.vectors[q * n + i];
          orthogonality = Math.max(orthogonality, Math.abs(dot - (q === r ? 1 : 0)));
        }
      }
      expect(residual).toBeLessThan(1e-13);
      expect(orthogonality).toBeLessThan(1e-12);
    }
  });
});
