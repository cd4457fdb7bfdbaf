/**
 * Hessian of the inversion (out-of-plane) kind, atoms [I, A, B, C]: the mean
 * over the three choices of the out-of-plane neighbour L (the others J, K)
 * of E(ω) = ⅓ [c0 + c1 cos ω + c2 cos 2ω], with the gradient kernel's
 * a = x_J − x_I, b = x_K − x_I, d = x_L − x_I, n = a × b, q = n × d,
 * ω = atan2(n · d, |q|) (src/terms/inversion.ts).
 *
 * **Through s = sin ω.** s = n · d / (|n| |d|) is the cosine of the angle
 * between n and d, so its derivatives over (n, d) are those of the cosine
 * angle (src/hessian/angle.ts) with u = n, v = d, and n = a × b is bilinear:
 * with S(w) the cross-product matrix (S(w) y = w × y), ∂n/∂a = −S(b),
 * ∂n/∂b = S(a), and ∂²(g · n)/∂a∂b = −S(g) for a fixed g. Over (a, b, d):
 *
 *   ∇_a s = b × g_n,   ∇_b s = g_n × a,   ∇_d s = g_d    (g = ∇s over n, d)
 *   ∇²_aa s = −S(b) H_nn S(b)          ∇²_bb s = −S(a) H_nn S(a)
 *   ∇²_ab s = S(b) H_nn S(a) − S(g_n)  ∇²_dd s = H_dd
 *   ∇²_ad s = S(b) H_nd                ∇²_bd s = −S(a) H_nd
 *
 * (the first-order forms are the gradient kernel's dω/dx_J = b × dω/dn,
 * dω/dx_K = dω/dn × a, times cos ω). With ω = asin s, so ω' = 1/cos ω and
 * ω'' = sin ω / cos³ω:
 *
 *   H = E_ss ∇s ∇sᵀ + E_s ∇²s,   E_s = E'(ω)/cos ω,
 *   E_ss = [E''(ω) + E'(ω) sin ω / cos ω] / cos² ω,
 *   E'(ω) = −⅓ sin ω (c1 + 4 c2 cos ω),  E''(ω) = −⅓ [c1 cos ω + 4 c2 cos 2ω],
 *
 * cos ω = |q|/(|n||d|) and sin ω = n·d/(|n||d|) as the kernel computes them.
 * Every choice's (a, b, d) Hessian is spread over the four atoms
 * (x_I ↦ −a − b − d) and the three are summed; the 12×12 result is made
 * exactly symmetric by copying its upper triangle to the lower one.
 *
 * **Where the gradient kernel returns zero, so does this one** (for that
 * choice): a plane that is undefined (|n|² ≤ 1e-30 |a|²|b|², I, J, K
 * collinear to rounding), L on I (d = 0), and ω = ±90° exactly (|q| = 0,
 * the tip of the cone cos ω = |…| makes when c1 ≠ 0). Near ±90° the true
 * Hessian grows like c1/cos ω and the formula follows it; ∇s has size
 * ~cos ω and carries a relative rounding error ~ε/cos ω there, as a bend's
 * gradient does near a line. At ω = 0 (a planar centre, the usual minimum)
 * everything is smooth.
 * @module
 */
import type { TermTable } from '../terms/table.js';
import { emitLocal } from './local.js';
import type { HessianKernel, HessianSink } from './sink.js';

/** Squared sine of the angle J–I–K below which the plane counts as undefined (as in the gradient kernel). */
const COLLINEAR_SIN2 = 1e-30;
const THIRD = 1 / 3;
const SLOTS: readonly number[] = [0, 1, 2, 3];

/** The term's Hessian over atoms I, A, B, C: 12×12 row-major. */
const local = new Float64Array(144);
/** One choice's Hessian over (a, b, d): 9×9 row-major. */
const inner = new Float64Array(81);
/** ∇s over (a, b, d). */
const grad = new Float64Array(9);
/** Cosine-angle second derivatives of s over n and d (3×3 row-major each). */
const hnn = new Float64Array(9);
const hnd = new Float64Array(9);
const hdd = new Float64Array(9);
/** Cross-product matrices S(a), S(b), S(g_n), and two products. */
const sa = new Float64Array(9);
const sb = new Float64Array(9);
const sg = new Float64Array(9);
const t1 = new Float64Array(9);
const t2 = new Float64Array(9);
/** Scalars of one choice: E_s, E_ss, sin ω, |n|², |d|², |n||d|. */
const ARGS = new Float64Array(6);
/** Vectors a, b, d, n, g_n, g_d (3 each). */
const vec = new Float64Array(18);
const VA = 0;
const VB = 3;
const VD = 6;
const VN = 9;
const VGN = 12;
const VGD = 15;

/** out = x·y for 3×3 row-major matrices (out distinct from both). */
function mul3(x: Float64Array, y: Float64Array, out: Float64Array): void {
  for (let r = 0; r < 3; r++) {
    for (let c = 0; c < 3; c++) {
      out[3 * r + c] = x[3 * r] * y[c] + x[3 * r + 1] * y[3 + c] + x[3 * r + 2] * y[6 + c];
    }
  }
}

/** Writes S(w) (S(w) y = w × y) for the vector at `vec[at..at+2]` into `out`. */
function crossMatrix(at: number, out: Float64Array): void {
  const wx = vec[at];
  const wy = vec[at + 1];
  const wz = vec[at + 2];
  out[0] = 0;
  out[1] = -wz;
  out[2] = wy;
  out[3] = wz;
  out[4] = 0;
  out[5] = -wx;
  out[6] = -wy;
  out[7] = wx;
  out[8] = 0;
}

/**
 * Writes the 3×3 matrix `m` times `sign` (±1) times E_s (`ARGS[0]`) into
 * block (s, t) of {@link inner}, and its transpose into (t, s).
 */
function putBlock(s: number, t: number, m: Float64Array, sign: number): void {
  const scale = sign * ARGS[0];
  for (let p = 0; p < 3; p++) {
    for (let q = 0; q < 3; q++) {
      const value = scale * m[3 * p + q];
      inner[(3 * s + p) * 9 + 3 * t + q] = value;
      inner[(3 * t + q) * 9 + 3 * s + p] = value;
    }
  }
}

/**
 * Adds {@link inner} (over the vectors a, b, d of one choice) into
 * {@link local}: vector v's atom slot is `1 + (choice + v) % 3`, and the
 * centre (slot 0) enters every vector with −1.
 */
function spreadChoice(choice: number): void {
  for (let s = 0; s < 3; s++) {
    const as = 1 + ((choice + s) % 3);
    for (let t = 0; t < 3; t++) {
      const at = 1 + ((choice + t) % 3);
      for (let p = 0; p < 3; p++) {
        for (let q = 0; q < 3; q++) {
          const value = inner[(3 * s + p) * 9 + 3 * t + q];
          local[(3 * as + p) * 12 + 3 * at + q] += value;
          local[p * 12 + 3 * at + q] -= value;
          local[(3 * as + p) * 12 + q] -= value;
          local[p * 12 + q] += value;
        }
      }
    }
  }
}

/**
 * Fills {@link inner} with the Hessian over (a, b, d) of one choice, from
 * the vectors in {@link vec} (a, b, d, n) and {@link ARGS} (module comment;
 * passed through arrays so that no floating-point argument is boxed).
 */
function choiceInner(): void {
  const ess = ARGS[1];
  const s = ARGS[2];
  const n2 = ARGS[3];
  const d2 = ARGS[4];
  const hyp = ARGS[5];
  const inv = 1 / hyp;
  const n3d = 1 / (n2 * hyp); // 1/(N³D)
  const nd3 = 1 / (d2 * hyp); // 1/(ND³)
  const sn4 = (3 * s) / (n2 * n2);
  const sd4 = (3 * s) / (d2 * d2);
  const snd = s / (n2 * d2);
  for (let p = 0; p < 3; p++) {
    vec[VGN + p] = vec[VD + p] * inv - (s * vec[VN + p]) / n2;
    vec[VGD + p] = vec[VN + p] * inv - (s * vec[VD + p]) / d2;
  }
  for (let p = 0; p < 3; p++) {
    const np = vec[VN + p];
    const dp = vec[VD + p];
    for (let q = 0; q < 3; q++) {
      const nq = vec[VN + q];
      const dq = vec[VD + q];
      const id = p === q ? 1 : 0;
      hnn[3 * p + q] = -(np * dq + dp * nq) * n3d + sn4 * np * nq - (s * id) / n2;
      hdd[3 * p + q] = -(dp * nq + np * dq) * nd3 + sd4 * dp * dq - (s * id) / d2;
      hnd[3 * p + q] = id * inv - dp * dq * nd3 - np * nq * n3d + snd * np * dq;
    }
  }
  // ∇s over (a, b, d): b × g_n, g_n × a, g_d
  const ax = vec[VA];
  const ay = vec[VA + 1];
  const az = vec[VA + 2];
  const bx = vec[VB];
  const by = vec[VB + 1];
  const bz = vec[VB + 2];
  const gx = vec[VGN];
  const gy = vec[VGN + 1];
  const gz = vec[VGN + 2];
  grad[0] = by * gz - bz * gy;
  grad[1] = bz * gx - bx * gz;
  grad[2] = bx * gy - by * gx;
  grad[3] = gy * az - gz * ay;
  grad[4] = gz * ax - gx * az;
  grad[5] = gx * ay - gy * ax;
  grad[6] = vec[VGD];
  grad[7] = vec[VGD + 1];
  grad[8] = vec[VGD + 2];
  crossMatrix(VA, sa);
  crossMatrix(VB, sb);
  crossMatrix(VGN, sg);
  // aa: −S(b) H_nn S(b)
  mul3(sb, hnn, t1);
  mul3(t1, sb, t2);
  putBlock(0, 0, t2, -1);
  // ab: S(b) H_nn S(a) − S(g_n)
  mul3(t1, sa, t2);
  for (let e = 0; e < 9; e++) t2[e] -= sg[e];
  putBlock(0, 1, t2, 1);
  // bb: −S(a) H_nn S(a)
  mul3(sa, hnn, t1);
  mul3(t1, sa, t2);
  putBlock(1, 1, t2, -1);
  // ad: S(b) H_nd; bd: −S(a) H_nd; dd: H_dd
  mul3(sb, hnd, t2);
  putBlock(0, 2, t2, 1);
  mul3(sa, hnd, t2);
  putBlock(1, 2, t2, -1);
  putBlock(2, 2, hdd, 1);
  for (let r = 0; r < 9; r++) {
    for (let c = 0; c < 9; c++) inner[r * 9 + c] += ess * grad[r] * grad[c];
  }
}

/**
 * Inversion, E = ⅓ Σ_{three choices} [c0 + c1 cos ω + c2 cos 2ω], params
 * [c0, c1, c2], atoms [centre, a, b, c]: see the module comment for the
 * formulas and the geometries where a choice contributes zero (as in the
 * gradient kernel). Emits the 16 blocks of the four atoms per term (see
 * {@link HessianKernel}).
 */
export const inversionHessian: HessianKernel = {
  slots: SLOTS,
  accumulate(x: Float64Array, table: TermTable, sink: HessianSink): void {
    const { atoms, params, count } = table;
    for (let t = 0; t < count; t++) {
      const centre = 3 * atoms[4 * t];
      const c1 = params[3 * t + 1];
      const c2 = params[3 * t + 2];
      local.fill(0);
      for (let choice = 0; choice < 3; choice++) {
        const jj = 3 * atoms[4 * t + 1 + choice];
        const kk = 3 * atoms[4 * t + 1 + ((choice + 1) % 3)];
        const ll = 3 * atoms[4 * t + 1 + ((choice + 2) % 3)];
        const ax = x[jj] - x[centre];
        const ay = x[jj + 1] - x[centre + 1];
        const az = x[jj + 2] - x[centre + 2];
        const bx = x[kk] - x[centre];
        const by = x[kk + 1] - x[centre + 1];
        const bz = x[kk + 2] - x[centre + 2];
        const dx = x[ll] - x[centre];
        const dy = x[ll + 1] - x[centre + 1];
        const dz = x[ll + 2] - x[centre + 2];
        const nx = ay * bz - az * by;
        const ny = az * bx - ax * bz;
        const nz = ax * by - ay * bx;
        const qx = ny * dz - nz * dy;
        const qy = nz * dx - nx * dz;
        const qz = nx * dy - ny * dx;
        const n2 = nx * nx + ny * ny + nz * nz;
        const d2 = dx * dx + dy * dy + dz * dz;
        const a2 = ax * ax + ay * ay + az * az;
        const b2 = bx * bx + by * by + bz * bz;
        const defined = n2 > COLLINEAR_SIN2 * a2 * b2 && d2 > 0;
        const q = Math.sqrt(qx * qx + qy * qy + qz * qz);
        const hyp = Math.sqrt(n2 * d2);
        if (!defined || !(q > 0) || !(hyp > 0)) continue;
        const cosw = q / hyp;
        const sinw = (nx * dx + ny * dy + nz * dz) / hyp;
        const e1 = -THIRD * sinw * (c1 + 4 * c2 * cosw); // E'(ω)
        const e2 = -THIRD * (c1 * cosw + 4 * c2 * (cosw * cosw - sinw * sinw)); // E''(ω)
        vec[VA] = ax;
        vec[VA + 1] = ay;
        vec[VA + 2] = az;
        vec[VB] = bx;
        vec[VB + 1] = by;
        vec[VB + 2] = bz;
        vec[VD] = dx;
        vec[VD + 1] = dy;
        vec[VD + 2] = dz;
        vec[VN] = nx;
        vec[VN + 1] = ny;
        vec[VN + 2] = nz;
        ARGS[0] = e1 / cosw; // E_s
        ARGS[1] = (e2 + (e1 * sinw) / cosw) / (cosw * cosw); // E_ss
        ARGS[2] = sinw;
        ARGS[3] = n2;
        ARGS[4] = d2;
        ARGS[5] = hyp;
        choiceInner();
        spreadChoice(choice);
      }
      for (let r = 0; r < 12; r++) {
        for (let c = r + 1; c < 12; c++) local[c * 12 + r] = local[r * 12 + c];
      }
      emitLocal(sink, local, atoms, 4 * t, SLOTS);
    }
  },
};
