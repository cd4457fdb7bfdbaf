/**
 * The initial inverse Hessian H0 of the L-BFGS two-loop recursion, learned
 * from the same correction pairs (s, y) the recursion stores.
 *
 * Three forms, from cheapest to most adaptive:
 * - `scalar`: γ I with γ = sᵀy / yᵀy from the latest pair (the classic
 *   choice; J. Nocedal and S. J. Wright, Numerical Optimization, 2nd ed.
 *   (2006), eq. 7.20).
 * - `diagonal`: B0 = diag(b) updated with every pair by the diagonal of the
 *   BFGS update of diag(b) (J. C. Gilbert and C. Lemaréchal, Math.
 *   Programming 45 (1989) 407).
 * - `block`: the same idea with one symmetric 3 × 3 block per atom (each
 *   consecutive coordinate triple): the atom blocks of the BFGS update of a
 *   block-diagonal B0,
 *   B_a ← B_a + y_a y_aᵀ / sᵀy − (B_a s_a)(B_a s_a)ᵀ / sᵀB0 s.
 *   A stiff bond seldom lies along a coordinate axis, so a diagonal cannot
 *   hold "stiff along the bond, soft across it"; a 3 × 3 block can. Each block
 *   stays positive definite: B_a − (B_a s_a)(B_a s_a)ᵀ / sᵀB0 s is positive
 *   semidefinite because s_aᵀ B_a s_a ≤ sᵀ B0 s, and sᵀy > 0 is required of
 *   every stored pair.
 *
 * After each update the diagonal and block forms are scaled so that
 * yᵀ H0 y = sᵀ y for the latest pair, the condition that gives γ in the
 * scalar case. Everything is allocated once; `apply` never allocates.
 * @module
 */
import { jsKernels, type VectorKernels } from '../linalg/vector-kernels.js';

/** How H0 is formed; see the module documentation. */
export type InitialMatrixForm = 'scalar' | 'diagonal' | 'block';

/** A learned initial inverse Hessian. */
export interface InitialMatrix {
  /** Forget every pair (the next {@link update} starts afresh). */
  reset(): void;
  /**
   * Take the pair (s, y) with `sy` = sᵀy > 0 and `yy` = yᵀy > 0 (the caller
   * has checked both).
   */
  update(s: Float64Array, y: Float64Array, sy: number, yy: number): void;
  /** Overwrite `v` with H0 v. Requires at least one {@link update} since the last reset. */
  apply(v: Float64Array): void;
}

/**
 * Make an initial matrix of the given form for vectors of length `n`.
 * `'block'` needs n to be a multiple of 3; for other lengths it falls back
 * to `'diagonal'`.
 *
 * `workspace` (optional): the vector workspace the minimizer's vectors come
 * from, with two spare vectors of length n; the scalar and diagonal forms
 * then run on its kernels (every vector later handed to `update` and `apply`
 * must come from the same workspace).
 */
export function createInitialMatrix(
  form: InitialMatrixForm,
  n: number,
  workspace?: { kernels: VectorKernels; b: Float64Array; h: Float64Array },
): InitialMatrix {
  if (form === 'block' && n % 3 === 0) return blockMatrix(n);
  const kernels = workspace?.kernels ?? jsKernels;
  if (form === 'scalar') return scalarMatrix(kernels);
  return diagonalMatrix(kernels, workspace?.b ?? new Float64Array(n), workspace?.h ?? new Float64Array(n));
}

function scalarMatrix(kernels: VectorKernels): InitialMatrix {
  let gamma = 1;
  return {
    reset() {
      gamma = 1;
    },
    update(_s, _y, sy, yy) {
      gamma = sy / yy;
    },
    apply(v) {
      kernels.scale(v, gamma);
    },
  };
}

function diagonalMatrix(kernels: VectorKernels, b: Float64Array, h: Float64Array): InitialMatrix {
  // B0 = c·diag(b), H0 = diag(h)/c with h = 1/b: the scaling is kept apart so
  // that an update is two passes over the vectors
  let fresh = true;
  let c = 1;
  return {
    reset() {
      fresh = true;
    },
    update(s, y, sy, yy) {
      const base = yy / sy;
      if (fresh) {
        b.fill(base);
        c = 1;
        fresh = false;
      }
      // bᵢ ← bᵢ + yᵢ²/sᵀy − (bᵢsᵢ)²/sᵀBs (on the scaled diagonal), kept > 1e-12 base and finite
      const sBs = c * kernels.weightedDot(b, s, s);
      const yHy = kernels.diagonalUpdate(b, h, s, y, c, 1 / sy, 1 / sBs, 1e-12 * base, base);
      // then scaled so that yᵀ H0 y = sᵀ y
      c = yHy / sy;
    },
    apply(v) {
      kernels.multiplyScaled(v, h, 1 / c);
    },
  };
}

/** Symmetric 3 × 3 blocks stored as 6 numbers [xx, xy, xz, yy, yz, zz]. */
function blockMatrix(n: number): InitialMatrix {
  const atoms = n / 3;
  const b = new Float64Array(6 * atoms);
  const h = new Float64Array(6 * atoms);
  let fresh = true;

  /** Invert block `a` of `b` into `h`; false when it is not safely positive definite. */
  const invert = (a: number, scale: number): boolean => {
    const o = 6 * a;
    const xx = b[o], xy = b[o + 1], xz = b[o + 2], yy = b[o + 3], yz = b[o + 4], zz = b[o + 5];
    // cofactors
    const cxx = yy * zz - yz * yz;
    const cxy = xz * yz - xy * zz;
    const cxz = xy * yz - xz * yy;
    const det = xx * cxx + xy * cxy + xz * cxz;
    // Sylvester: leading minors positive, and det not lost to rounding
    const tiny = 1e-12 * scale;
    if (!(xx > tiny && xx * yy - xy * xy > tiny * tiny && det > tiny * tiny * tiny) || !Number.isFinite(det)) return false;
    const r = 1 / det;
    h[o] = cxx * r;
    h[o + 1] = cxy * r;
    h[o + 2] = cxz * r;
    h[o + 3] = (xx * zz - xz * xz) * r;
    h[o + 4] = (xy * xz - xx * yz) * r;
    h[o + 5] = (xx * yy - xy * xy) * r;
    return true;
  };

  return {
    reset() {
      fresh = true;
    },
    update(s, y, sy, yy) {
      const base = yy / sy;
      if (fresh) {
        b.fill(0);
        for (let a = 0; a < atoms; a++) {
          b[6 * a] = base;
          b[6 * a + 3] = base;
          b[6 * a + 5] = base;
        }
        fresh = false;
      }
      let sBs = 0;
      for (let a = 0; a < atoms; a++) {
        const o = 6 * a;
        const sx = s[3 * a], sY = s[3 * a + 1], sz = s[3 * a + 2];
        sBs +=
          b[o] * sx * sx + b[o + 3] * sY * sY + b[o + 5] * sz * sz +
          2 * (b[o + 1] * sx * sY + b[o + 2] * sx * sz + b[o + 4] * sY * sz);
      }
      let yHy = 0;
      for (let a = 0; a < atoms; a++) {
        const o = 6 * a;
        const sx = s[3 * a], sY = s[3 * a + 1], sz = s[3 * a + 2];
        const yx = y[3 * a], yY = y[3 * a + 1], yz = y[3 * a + 2];
        const px = b[o] * sx + b[o + 1] * sY + b[o + 2] * sz;
        const py = b[o + 1] * sx + b[o + 3] * sY + b[o + 4] * sz;
        const pz = b[o + 2] * sx + b[o + 4] * sY + b[o + 5] * sz;
        b[o] += (yx * yx) / sy - (px * px) / sBs;
        b[o + 1] += (yx * yY) / sy - (px * py) / sBs;
        b[o + 2] += (yx * yz) / sy - (px * pz) / sBs;
        b[o + 3] += (yY * yY) / sy - (py * py) / sBs;
        b[o + 4] += (yY * yz) / sy - (py * pz) / sBs;
        b[o + 5] += (yz * yz) / sy - (pz * pz) / sBs;
        if (!invert(a, base)) {
          b[o] = base;
          b[o + 1] = 0;
          b[o + 2] = 0;
          b[o + 3] = base;
          b[o + 4] = 0;
          b[o + 5] = base;
          invert(a, base);
        }
        yHy +=
          h[o] * yx * yx + h[o + 3] * yY * yY + h[o + 5] * yz * yz +
          2 * (h[o + 1] * yx * yY + h[o + 2] * yx * yz + h[o + 4] * yY * yz);
      }
      // Scale B0 by c (H0 by 1/c) so that yᵀ H0 y = sᵀ y.
      const c = yHy / sy;
      const inv = 1 / c;
      for (let i = 0; i < 6 * atoms; i++) {
        b[i] *= c;
        h[i] *= inv;
      }
    },
    apply(v) {
      for (let a = 0; a < atoms; a++) {
        const o = 6 * a;
        const vx = v[3 * a], vy = v[3 * a + 1], vz = v[3 * a + 2];
        v[3 * a] = h[o] * vx + h[o + 1] * vy + h[o + 2] * vz;
        v[3 * a + 1] = h[o + 1] * vx + h[o + 3] * vy + h[o + 4] * vz;
        v[3 * a + 2] = h[o + 2] * vx + h[o + 4] * vy + h[o + 5] * vz;
      }
    },
  };
}
