/**
 * Hessians of the bend kinds: harmonic angle (a function of θ) and the
 * cosine, cosine-series and periodic angles (functions of cos θ). The vertex is the middle atom j; u = x_i − x_j,
 * v = x_k − x_j, U = |u|, V = |v|, û = u/U, v̂ = v/V, c = u × v, n̂ = c/|c|.
 * Both are first written over (u, v) and then spread over the atoms
 * (x_i ↦ u, x_k ↦ v, x_j ↦ −u − v).
 *
 * **θ.** With p_u = −n̂ × û and p_v = n̂ × v̂ (unit vectors in the plane,
 * perpendicular to u and to v), the gradient the kernel uses is
 * ∇_u θ = p_u / U, ∇_v θ = p_v / V, and the second derivatives are
 *
 *   ∇²_uu θ = [−(p_u ûᵀ + û p_uᵀ) + cot θ n̂ n̂ᵀ] / U²
 *   ∇²_vv θ = [−(p_v v̂ᵀ + v̂ p_vᵀ) + cot θ n̂ n̂ᵀ] / V²
 *   ∇²_uv θ = −n̂ n̂ᵀ / (U V sin θ)  =  −c cᵀ / |c|³
 *
 * (the angle between two directions has no curvature in the plane of the
 * two vectors and cot θ, −1/sin θ out of it; the same expressions as
 * Bakken & Helgaker, J. Chem. Phys. 117 (2002) 9160, written with
 * p_u, p_v). H = E''(θ) ∇θ ∇θᵀ + E'(θ) ∇²θ.
 *
 * **Near and at 0° and 180°.** The out-of-plane terms grow like 1/sin θ: the
 * energy ½ k (θ − θ0)² with θ0 ≠ 180° really has a cusp at the line (θ is
 * |angle|-like there), and its Hessian diverges like k (π − θ0)/sin θ as the
 * line is approached; it is returned as computed (|c| carries a relative
 * rounding error ~ε/sin θ, so about 16 + log10 sin θ digits are kept). At
 * EXACTLY 0° or 180° (|c| = 0) n̂ is undefined; the kernel returns the finite
 * limit of the E'' part, E''(θ) P ⊗ [[1/U², σ/(UV)], [σ/(UV), 1/V²]] with
 * P = I − ûûᵀ and σ = +1 at 180°, −1 at 0°, and drops E'·∇²θ. This is the
 * true Hessian when E' = 0 there (θ0 = 180°, the common linear case, or
 * θ0 = 0) — then E = ½ k |δu⊥/U ± δv⊥/V|² to second order, smooth — and a
 * finite stand-in for +∞ otherwise. Coincident atoms (U or V zero) give
 * zero blocks.
 *
 * **cos θ.** ∇_u cos θ = v/(UV) − cos θ u/U², and
 *   ∇²_uu cos θ = −(u vᵀ + v uᵀ)/(U³V) + 3 cos θ u uᵀ/U⁴ − cos θ I/U²
 *   ∇²_uv cos θ = I/(UV) − v vᵀ/(U V³) − u uᵀ/(U³ V) + cos θ u vᵀ/(U² V²)
 * (row index on u, column on v), ∇²_vv by exchanging u and v: smooth
 * everywhere but at coincident atoms, and H = E''(c) ∇c ∇cᵀ + E'(c) ∇²c:
 * cosine angle E' = k (c − c0), E'' = k; cosine series E' = c1 + 4 c2 c,
 * E'' = 4 c2; periodic E' = −a·sign·n U_{n−1}(c), E'' = −a·sign·n U′_{n−1}(c)
 * (Chebyshev polynomials of the second kind, T′_n = n U_{n−1}). None has a
 * 1/sin θ: the three are smooth through 0° and 180°.
 * @module
 */
import type { TermTable } from '../terms/table.js';
import { emitLocal, expandToAtoms, spreadOf } from './local.js';
import type { HessianKernel, HessianSink } from './sink.js';

const SLOTS: readonly number[] = [0, 1, 2];
/** x_i ↦ u, x_j ↦ −u − v, x_k ↦ v (rows: atoms i, j, k; columns: u, v). */
const COEFFICIENTS: readonly number[] = [1, 0, -1, -1, 0, 1];
const SPREAD = spreadOf(COEFFICIENTS, 3, 2);

/** Hessian over (u, v), 6×6 row-major. */
const inner = new Float64Array(36);
/** Hessian over atoms (i, j, k), 9×9 row-major. */
const local = new Float64Array(81);
const U_HAT = new Float64Array(3);
const V_HAT = new Float64Array(3);
const P_U = new Float64Array(3);
const P_V = new Float64Array(3);
const N_HAT = new Float64Array(3);
/** Inputs of {@link thetaInner}: u, v, c (3 each), |c|, u · v, E', E''. */
const ARGS = new Float64Array(13);

/** Which energy of c = cos θ {@link cosinePolynomialHessian} differentiates. */
const enum Cosine {
  /** ½ k (c − c0)², params [k, c0]. */
  Square,
  /** c0 + c1 c + c2 (2c² − 1), params [c0, c1, c2]. */
  Series,
  /** a [1 − sign · T_n(c)], params [a, n, sign]. */
  Periodic,
}

/** Spreads {@link inner} over the three atoms and hands it to the sink. */
function emit(sink: HessianSink, atoms: Int32Array, base: number): void {
  expandToAtoms(inner, SPREAD, local);
  emitLocal(sink, local, atoms, base, SLOTS);
}

/**
 * Fills {@link inner} with the Hessian over (u, v) of an energy of θ, from
 * u, v, c = u × v, |c|, u · v, E'(θ), E''(θ) in {@link ARGS} (passed through
 * an array so that no floating-point argument is boxed; see the module
 * comment for every case).
 */
function thetaInner(): void {
  const ux = ARGS[0];
  const uy = ARGS[1];
  const uz = ARGS[2];
  const vx = ARGS[3];
  const vy = ARGS[4];
  const vz = ARGS[5];
  const cx = ARGS[6];
  const cy = ARGS[7];
  const cz = ARGS[8];
  const cn = ARGS[9];
  const dot = ARGS[10];
  const d1 = ARGS[11];
  const d2 = ARGS[12];
  const U2 = ux * ux + uy * uy + uz * uz;
  const V2 = vx * vx + vy * vy + vz * vz;
  const U = Math.sqrt(U2);
  const V = Math.sqrt(V2);
  if (!(U > 0) || !(V > 0)) {
    inner.fill(0);
    return;
  }
  U_HAT[0] = ux / U;
  U_HAT[1] = uy / U;
  U_HAT[2] = uz / U;
  V_HAT[0] = vx / V;
  V_HAT[1] = vy / V;
  V_HAT[2] = vz / V;
  if (!(cn > 0)) {
    // exactly collinear: the finite E'' part, P = I − ûûᵀ
    const sigma = dot < 0 ? 1 : -1;
    const uu = d2 / U2;
    const vv = d2 / V2;
    const uv = (sigma * d2) / (U * V);
    for (let p = 0; p < 3; p++) {
      for (let q = 0; q < 3; q++) {
        const proj = (p === q ? 1 : 0) - U_HAT[p] * U_HAT[q];
        inner[p * 6 + q] = uu * proj;
        inner[(3 + p) * 6 + 3 + q] = vv * proj;
        inner[p * 6 + 3 + q] = uv * proj;
        inner[(3 + p) * 6 + q] = uv * proj;
      }
    }
    return;
  }
  N_HAT[0] = cx / cn;
  N_HAT[1] = cy / cn;
  N_HAT[2] = cz / cn;
  // p_u = −(c × u)/(|c| U), p_v = (c × v)/(|c| V): unit vectors, as in the gradient kernel
  P_U[0] = -(cy * uz - cz * uy) / (cn * U);
  P_U[1] = -(cz * ux - cx * uz) / (cn * U);
  P_U[2] = -(cx * uy - cy * ux) / (cn * U);
  P_V[0] = (cy * vz - cz * vy) / (cn * V);
  P_V[1] = (cz * vx - cx * vz) / (cn * V);
  P_V[2] = (cx * vy - cy * vx) / (cn * V);
  const cot = dot / cn;
  const uu1 = d1 / U2;
  const vv1 = d1 / V2;
  const uu2 = d2 / U2;
  const vv2 = d2 / V2;
  const uv2 = d2 / (U * V);
  const uvOut = -d1 / (cn * cn * cn); // −E' c cᵀ / |c|³
  for (let p = 0; p < 3; p++) {
    for (let q = 0; q < 3; q++) {
      const nn = N_HAT[p] * N_HAT[q];
      inner[p * 6 + q] = uu2 * P_U[p] * P_U[q] + uu1 * (cot * nn - P_U[p] * U_HAT[q] - U_HAT[p] * P_U[q]);
      inner[(3 + p) * 6 + 3 + q] = vv2 * P_V[p] * P_V[q] + vv1 * (cot * nn - P_V[p] * V_HAT[q] - V_HAT[p] * P_V[q]);
      const cross = uv2 * P_U[p] * P_V[q] + uvOut * (p === 0 ? cx : p === 1 ? cy : cz) * (q === 0 ? cx : q === 1 ? cy : cz);
      inner[p * 6 + 3 + q] = cross;
      inner[(3 + q) * 6 + p] = cross;
    }
  }
}

/**
 * Harmonic angle, E = ½ k (θ − θ0)², params [k, theta0 (rad)]:
 * E' = k (θ − θ0), E'' = k, θ = atan2(|u × v|, u · v) as in the energy kernel.
 * See {@link HessianKernel} and the module comment (behaviour at 0° and 180°).
 */
export const harmonicAngleHessian: HessianKernel = {
  slots: SLOTS,
  accumulate(x: Float64Array, table: TermTable, sink: HessianSink): void {
    const { atoms, params, count } = table;
    for (let t = 0; t < count; t++) {
      const i = 3 * atoms[3 * t];
      const j = 3 * atoms[3 * t + 1];
      const k3 = 3 * atoms[3 * t + 2];
      const kf = params[2 * t];
      const theta0 = params[2 * t + 1];
      const ux = x[i] - x[j];
      const uy = x[i + 1] - x[j + 1];
      const uz = x[i + 2] - x[j + 2];
      const vx = x[k3] - x[j];
      const vy = x[k3 + 1] - x[j + 1];
      const vz = x[k3 + 2] - x[j + 2];
      const cx = uy * vz - uz * vy;
      const cy = uz * vx - ux * vz;
      const cz = ux * vy - uy * vx;
      const cn = Math.sqrt(cx * cx + cy * cy + cz * cz);
      const dot = ux * vx + uy * vy + uz * vz;
      const theta = Math.atan2(cn, dot);
      ARGS[0] = ux;
      ARGS[1] = uy;
      ARGS[2] = uz;
      ARGS[3] = vx;
      ARGS[4] = vy;
      ARGS[5] = vz;
      ARGS[6] = cx;
      ARGS[7] = cy;
      ARGS[8] = cz;
      ARGS[9] = cn;
      ARGS[10] = dot;
      ARGS[11] = kf * (theta - theta0);
      ARGS[12] = kf;
      thetaInner();
      emit(sink, atoms, 3 * t);
    }
  },
};

/**
 * Cosine angle, E = ½ k (cos θ − cos θ0)², params [k, cosTheta0]:
 * H = k ∇cos θ ∇cos θᵀ + k (cos θ − cos θ0) ∇²cos θ (module comment), with
 * cos θ clamped to [−1, 1] as in the energy kernel. Coincident atoms give
 * zero blocks.
 */
export const cosineAngleHessian: HessianKernel = {
  slots: SLOTS,
  accumulate(x: Float64Array, table: TermTable, sink: HessianSink): void {
    cosinePolynomialHessian(x, table, sink, Cosine.Square);
  },
};

/**
 * Cosine-series angle, E = c0 + c1 cos θ + c2 cos 2θ, params [c0, c1, c2]:
 * with c = cos θ, E'(c) = c1 + 4 c2 c and E''(c) = 4 c2, so
 * H = 4 c2 ∇c ∇cᵀ + (c1 + 4 c2 c) ∇²c (module comment). Smooth through 0°
 * and 180°; coincident atoms give zero blocks.
 */
export const cosineSeriesAngleHessian: HessianKernel = {
  slots: SLOTS,
  accumulate(x: Float64Array, table: TermTable, sink: HessianSink): void {
    cosinePolynomialHessian(x, table, sink, Cosine.Series);
  },
};

/**
 * Periodic angle, E = a [1 − sign · T_n(cos θ)], params [a, n, sign]: with
 * c = cos θ, E'(c) = −a · sign · n U_{n−1}(c) and E''(c) = −a · sign · n U′_{n−1}(c),
 * U′ from the differentiated recurrence U′_{m+1} = 2 U_m + 2c U′_m − U′_{m−1}
 * (U′_0 = 0) beside the gradient kernel's T and U recurrences. A
 * polynomial in cos θ: smooth through 0° and 180°, no 1/sin θ; coincident
 * atoms give zero blocks.
 */
export const periodicAngleHessian: HessianKernel = {
  slots: SLOTS,
  accumulate(x: Float64Array, table: TermTable, sink: HessianSink): void {
    cosinePolynomialHessian(x, table, sink, Cosine.Periodic);
  },
};

/**
 * The loop of the bends that are functions of c = cos θ:
 * H = E''(c) ∇c ∇cᵀ + E'(c) ∇²c over (u, v), spread over the atoms, with
 * c clamped to [−1, 1] as in the energy kernels.
 */
function cosinePolynomialHessian(x: Float64Array, table: TermTable, sink: HessianSink, form: Cosine): void {
  const { atoms, params, count, width } = table;
  for (let t = 0; t < count; t++) {
    const i = 3 * atoms[3 * t];
    const j = 3 * atoms[3 * t + 1];
    const k3 = 3 * atoms[3 * t + 2];
    const ux = x[i] - x[j];
    const uy = x[i + 1] - x[j + 1];
    const uz = x[i + 2] - x[j + 2];
    const vx = x[k3] - x[j];
    const vy = x[k3 + 1] - x[j + 1];
    const vz = x[k3 + 2] - x[j + 2];
    const U2 = ux * ux + uy * uy + uz * uz;
    const V2 = vx * vx + vy * vy + vz * vz;
    const uv = Math.sqrt(U2 * V2);
    if (!(uv > 0)) {
      inner.fill(0);
      emit(sink, atoms, 3 * t);
      continue;
    }
    let c = (ux * vx + uy * vy + uz * vz) / uv;
    if (c > 1) c = 1;
    else if (c < -1) c = -1;
    const p0 = params[width * t];
    const p1 = params[width * t + 1];
    // f = E'(c), kf = E''(c)
    let f: number;
    let kf: number;
    if (form === Cosine.Square) {
      f = p0 * (c - p1);
      kf = p0;
    } else if (form === Cosine.Series) {
      const p2 = params[width * t + 2];
      f = p1 + 4 * p2 * c;
      kf = 4 * p2;
    } else {
      const p2 = params[width * t + 2];
      // U_{n−1}(c) and U′_{n−1}(c): U_{m+1} = 2c U_m − U_{m−1}, differentiated
      let uPrev = 0;
      let un = 1;
      let dPrev = 0;
      let dn = 0;
      for (let m = 1; m < p1; m++) {
        const uNext = 2 * c * un - uPrev;
        const dNext = 2 * un + 2 * c * dn - dPrev;
        uPrev = un;
        un = uNext;
        dPrev = dn;
        dn = dNext;
      }
      f = -p0 * p2 * p1 * un;
      kf = -p0 * p2 * p1 * dn;
    }
    // ∇_u c = a v − bu u, ∇_v c = a u − bv v
    const a = 1 / uv;
    const bu = c / U2;
    const bv = c / V2;
    const gu0 = a * vx - bu * ux;
    const gu1 = a * vy - bu * uy;
    const gu2 = a * vz - bu * uz;
    const gv0 = a * ux - bv * vx;
    const gv1 = a * uy - bv * vy;
    const gv2 = a * uz - bv * vz;
    const uu3 = 1 / (U2 * uv); // 1/(U³V)
    const vv3 = 1 / (V2 * uv); // 1/(UV³)
    const cu4 = (3 * c) / (U2 * U2);
    const cv4 = (3 * c) / (V2 * V2);
    const cuv = c / (U2 * V2);
    for (let p = 0; p < 3; p++) {
      const up = p === 0 ? ux : p === 1 ? uy : uz;
      const vp = p === 0 ? vx : p === 1 ? vy : vz;
      const gup = p === 0 ? gu0 : p === 1 ? gu1 : gu2;
      const gvp = p === 0 ? gv0 : p === 1 ? gv1 : gv2;
      for (let q = 0; q < 3; q++) {
        const uq = q === 0 ? ux : q === 1 ? uy : uz;
        const vq = q === 0 ? vx : q === 1 ? vy : vz;
        const guq = q === 0 ? gu0 : q === 1 ? gu1 : gu2;
        const gvq = q === 0 ? gv0 : q === 1 ? gv1 : gv2;
        const id = p === q ? 1 : 0;
        const huu = -(up * vq + vp * uq) * uu3 + cu4 * up * uq - (c * id) / U2;
        const hvv = -(vp * uq + up * vq) * vv3 + cv4 * vp * vq - (c * id) / V2;
        const huv = id * a - vp * vq * vv3 - up * uq * uu3 + cuv * up * vq;
        inner[p * 6 + q] = kf * gup * guq + f * huu;
        inner[(3 + p) * 6 + 3 + q] = kf * gvp * gvq + f * hvv;
        inner[p * 6 + 3 + q] = kf * gup * gvq + f * huv;
        inner[(3 + q) * 6 + p] = kf * gup * gvq + f * huv;
      }
    }
    emit(sink, atoms, 3 * t);
  }
}
