/**
 * Householder reduction of a real symmetric matrix to tridiagonal form,
 * A = Q T Qᵀ, working on rows of a row-major array.
 *
 * Method: Householder similarity transforms (Golub & Van Loan, Matrix
 * Computations, 4th ed. 2013, §8.3.1). Step k reflects row k beyond the
 * diagonal onto its first entry with H_k = I − β v vᵀ and updates the
 * trailing block as A ← H A H = A − v wᵀ − w vᵀ, where p = β A v and
 * w = p − (β pᵀv / 2) v. Only the upper triangle (column ≥ row) is read and
 * written, so every inner loop runs along a row.
 * @module
 */

/**
 * Reduce the symmetric `n`×`n` matrix held in the upper triangle of `a`
 * (row-major, entry (i, j) at `a[i * n + j]`, j ≥ i read; the lower
 * triangle is neither read nor kept) to tridiagonal form.
 *
 * The rank-2 update of step k is applied to each row of the trailing block
 * in the same pass that accumulates the product A v of step k + 1 (row
 * k + 1 is updated first, to form the reflector of step k + 1), so the
 * trailing triangle is read and written once per step.
 *
 * Writes: `diagonal[i]` = T(i, i) (length n), `offDiagonal[i]` = T(i, i + 1)
 * for i < n − 1 (length n, the last entry set to 0), `beta[k]` the
 * reflector scale of step k (length n), and overwrites `a`: row k, columns
 * k + 1 … n − 1, holds the reflector vector v of step k (all zero when
 * `beta[k]` is 0); the rest of `a` is scratch. `scratch` must have length
 * ≥ 2n. Never allocates, never throws.
 */
export function tridiagonalize(
  a: Float64Array,
  n: number,
  diagonal: Float64Array,
  offDiagonal: Float64Array,
  beta: Float64Array,
  scratch: Float64Array,
): void {
  let p = scratch.subarray(0, n); // A v of this step, then w
  let w = scratch.subarray(n, 2 * n); // w of the previous step, still to be applied
  let pending = false; // rows > k still lack the previous step's update (v in row k − 1, w)
  for (let k = 0; k < n - 1; k++) {
    const row = k * n;
    const start = k + 1;
    if (pending) {
      const prev = row - n;
      const vk = a[prev + k];
      const wk = w[k];
      for (let j = k; j < n; j++) a[row + j] -= vk * w[j] + wk * a[prev + j];
    }
    diagonal[k] = a[row + k];
    // x = a[k, k+1 .. n-1]; reflect it onto alpha e1.
    let tail = 0;
    for (let j = start + 1; j < n; j++) tail += a[row + j] * a[row + j];
    const x0 = a[row + start];
    if (tail === 0) {
      // Already tridiagonal in this row: no reflection.
      offDiagonal[k] = x0;
      beta[k] = 0;
      a[row + start] = 0;
      if (pending) {
        const prev = row - n;
        for (let i = start; i < n; i++) {
          const ri = i * n;
          const vi = a[prev + i];
          const wi = w[i];
          for (let j = i; j < n; j++) a[ri + j] -= vi * w[j] + wi * a[prev + j];
        }
      }
      pending = false;
      continue;
    }
    const norm = Math.sqrt(x0 * x0 + tail);
    const alpha = x0 > 0 ? -norm : norm;
    const b = 1 / (alpha * (alpha - x0)); // 2 / vᵀv, with v = x − alpha e1
    a[row + start] = x0 - alpha;
    offDiagonal[k] = alpha;
    beta[k] = b;
    // p = b A22 v, from the upper triangle of the trailing block (updated on the way when pending).
    for (let i = start; i < n; i++) p[i] = 0;
    if (pending) {
      // Two rows per pass: the vectors' entries are loaded once for both.
      const prev = row - n;
      let i = start;
      for (; i + 1 < n; i += 2) {
        const ri = i * n;
        const rk = ri + n;
        const i1 = i + 1;
        const ui = a[prev + i];
        const wi = w[i];
        const vi = a[row + i];
        const uk = a[prev + i1];
        const wk = w[i1];
        const vk = a[row + i1];
        const aii = a[ri + i] - 2 * ui * wi;
        a[ri + i] = aii;
        const aik = a[ri + i1] - (ui * wk + wi * uk);
        a[ri + i1] = aik;
        const akk = a[rk + i1] - 2 * uk * wk;
        a[rk + i1] = akk;
        let si = aii * vi + aik * vk;
        let sk = aik * vi + akk * vk;
        for (let j = i + 2; j < n; j++) {
          const uj = a[prev + j];
          const wj = w[j];
          const vj = a[row + j];
          const x = a[ri + j] - (ui * wj + wi * uj);
          const y = a[rk + j] - (uk * wj + wk * uj);
          a[ri + j] = x;
          a[rk + j] = y;
          si += x * vj;
          sk += y * vj;
          p[j] += x * vi + y * vk;
        }
        p[i] += si;
        p[i1] += sk;
      }
      if (i < n) {
        // The last row alone: only its diagonal entry.
        const ri = i * n;
        const aii = a[ri + i] - 2 * a[prev + i] * w[i];
        a[ri + i] = aii;
        p[i] += aii * a[row + i];
      }
    } else {
      for (let i = start; i < n; i++) {
        const ri = i * n;
        const vi = a[row + i];
        let s = a[ri + i] * vi;
        for (let j = i + 1; j < n; j++) {
          const aij = a[ri + j];
          s += aij * a[row + j];
          p[j] += aij * vi;
        }
        p[i] += s;
      }
    }
    let pv = 0;
    for (let i = start; i < n; i++) {
      p[i] *= b;
      pv += p[i] * a[row + i];
    }
    const half = 0.5 * b * pv;
    for (let i = start; i < n; i++) p[i] -= half * a[row + i]; // p is now w
    const t = w;
    w = p;
    p = t;
    pending = true;
  }
  if (n > 0) {
    if (pending) {
      // Only the last diagonal entry is left to update.
      const prev = (n - 2) * n;
      const last = n - 1;
      a[last * n + last] -= 2 * a[prev + last] * w[last];
    }
    diagonal[n - 1] = a[(n - 1) * n + n - 1];
    offDiagonal[n - 1] = 0;
    beta[n - 1] = 0;
  }
}

/**
 * Form Qᵀ = H_{n−2} ⋯ H_1 H_0 from the reflectors {@link tridiagonalize}
 * left in `a` and `beta`, into `out` (row-major n×n; row i of `out` is
 * column i of Q). Accumulated from the right, M ← M H_k for k descending,
 * so that only the trailing block is touched and every loop runs along a
 * row. `scratch` length ≥ n. Never allocates, never throws.
 */
export function reflectorsTransposed(a: Float64Array, n: number, beta: Float64Array, out: Float64Array, scratch: Float64Array): void {
  out.fill(0);
  for (let i = 0; i < n; i++) out[i * n + i] = 1;
  const u = scratch;
  for (let k = n - 2; k >= 0; k--) {
    const b = beta[k];
    if (b === 0) continue;
    const row = k * n;
    const start = k + 1;
    // u = M v over the trailing block (rows and columns ≥ start).
    for (let i = start; i < n; i++) {
      const ri = i * n;
      let s = 0;
      for (let j = start; j < n; j++) s += out[ri + j] * a[row + j];
      u[i] = b * s;
    }
    for (let i = start; i < n; i++) {
      const ri = i * n;
      const ui = u[i];
      if (ui === 0) continue;
      for (let j = start; j < n; j++) out[ri + j] -= ui * a[row + j];
    }
  }
}

/**
 * Back-transformation: replace every row z of `rows` (row-major, `count`
 * rows of length n) by Q z, where A = Q T Qᵀ and Q = H_0 H_1 ⋯ H_{n−2} is
 * held as reflectors in `a` and `beta` by {@link tridiagonalize}; an
 * eigenvector of T becomes one of A. The reflectors are applied
 * H_{n−2} first, each as z ← z − β (vᵀz) v along contiguous rows: four
 * reflectors and three rows per pass (the products of the later reflectors
 * corrected by the couplings v_mᵀ v_l, computed once per four; the last
 * one to three reflectors in pairs), over a tile of rows at a time so that
 * the tile stays in cache while the reflectors stream past it (about
 * 2 n² · count operations). Never allocates, never throws.
 */
export function applyReflectorsToRows(a: Float64Array, n: number, beta: Float64Array, rows: Float64Array, count: number): void {
  // A multiple of three rows, at most 96 and about 1 MB (tile sizes from 36 to 96 rows measured alike at n = 1000 and 3000).
  const tile = 3 * Math.max(1, Math.min(32, Math.floor(40000 / Math.max(n, 1))));
  for (let first = 0; first < count; first += tile) {
    const last = Math.min(count, first + tile);
    let k = n - 2;
    for (; k >= 3; k -= 4) reflectorQuad(a, n, beta, rows, first, last, k);
    for (; k >= 1; k -= 2) reflectorPair(a, n, beta, rows, first, last, k);
    if (k === 0) reflectorPair(a, n, beta, rows, first, last, 1, true);
  }
}

/**
 * z ← H_{k−3} H_{k−2} H_{k−1} H_k z for rows first … last − 1 (k ≥ 3), each
 * row read and written once for the four reflectors: the four products
 * v_m · z are taken with the row as it was, then corrected by the
 * couplings v_m · v_l (computed once; in compact-WY terms, the triangular
 * factor of the block), so that z ← z − Σ s_m v_m in one pass. Three rows
 * at a time, then two, then one. v_m lives in a[m n + j], j > m.
 */
function reflectorQuad(a: Float64Array, n: number, beta: Float64Array, rows: Float64Array, first: number, last: number, k: number): void {
  const b0 = beta[k];
  const b1 = beta[k - 1];
  const b2 = beta[k - 2];
  const b3 = beta[k - 3];
  if (b0 === 0 && b1 === 0 && b2 === 0 && b3 === 0) return;
  const v0 = k * n;
  const v1 = v0 - n;
  const v2 = v1 - n;
  const v3 = v2 - n;
  const start = k + 1;
  // Couplings v_m · v_l over the common support.
  let c10 = 0;
  let c20 = 0;
  let c30 = 0;
  let c21 = 0;
  let c31 = 0;
  let c32 = 0;
  for (let j = start; j < n; j++) {
    const x0 = a[v0 + j];
    const x1 = a[v1 + j];
    const x2 = a[v2 + j];
    const x3 = a[v3 + j];
    c10 += x1 * x0;
    c20 += x2 * x0;
    c30 += x3 * x0;
    c21 += x2 * x1;
    c31 += x3 * x1;
    c32 += x3 * x2;
  }
  // Head entries: column k (v1, v2, v3), k − 1 (v2, v3), k − 2 (v3).
  const h1k = a[v1 + k];
  const h2k = a[v2 + k];
  const h3k = a[v3 + k];
  const h2l = a[v2 + k - 1];
  const h3l = a[v3 + k - 1];
  const h3m = a[v3 + k - 2];
  c21 += h2k * h1k;
  c31 += h3k * h1k;
  c32 += h3k * h2k + h3l * h2l;
  let r = first;
  for (; r + 2 < last; r += 3) {
    const z0 = r * n;
    const z1 = z0 + n;
    const z2 = z1 + n;
    const ak = rows[z0 + k];
    const al = rows[z0 + k - 1];
    const am = rows[z0 + k - 2];
    const bk = rows[z1 + k];
    const bl = rows[z1 + k - 1];
    const bm = rows[z1 + k - 2];
    const ck = rows[z2 + k];
    const cl = rows[z2 + k - 1];
    const cm = rows[z2 + k - 2];
    let p0 = 0;
    let p1 = ak * h1k;
    let p2 = ak * h2k + al * h2l;
    let p3 = ak * h3k + al * h3l + am * h3m;
    let q0 = 0;
    let q1 = bk * h1k;
    let q2 = bk * h2k + bl * h2l;
    let q3 = bk * h3k + bl * h3l + bm * h3m;
    let g0 = 0;
    let g1 = ck * h1k;
    let g2 = ck * h2k + cl * h2l;
    let g3 = ck * h3k + cl * h3l + cm * h3m;
    for (let j = start; j < n; j++) {
      const w = rows[z0 + j];
      const u = rows[z1 + j];
      const y = rows[z2 + j];
      const x0 = a[v0 + j];
      p0 += w * x0;
      q0 += u * x0;
      g0 += y * x0;
      const x1 = a[v1 + j];
      p1 += w * x1;
      q1 += u * x1;
      g1 += y * x1;
      const x2 = a[v2 + j];
      p2 += w * x2;
      q2 += u * x2;
      g2 += y * x2;
      const x3 = a[v3 + j];
      p3 += w * x3;
      q3 += u * x3;
      g3 += y * x3;
    }
    const s0 = b0 * p0;
    const s1 = b1 * (p1 - s0 * c10);
    const s2 = b2 * (p2 - s0 * c20 - s1 * c21);
    const s3 = b3 * (p3 - s0 * c30 - s1 * c31 - s2 * c32);
    const t0 = b0 * q0;
    const t1 = b1 * (q1 - t0 * c10);
    const t2 = b2 * (q2 - t0 * c20 - t1 * c21);
    const t3 = b3 * (q3 - t0 * c30 - t1 * c31 - t2 * c32);
    const f0 = b0 * g0;
    const f1 = b1 * (g1 - f0 * c10);
    const f2 = b2 * (g2 - f0 * c20 - f1 * c21);
    const f3 = b3 * (g3 - f0 * c30 - f1 * c31 - f2 * c32);
    rows[z0 + k] = ak - (s1 * h1k + s2 * h2k + s3 * h3k);
    rows[z0 + k - 1] = al - (s2 * h2l + s3 * h3l);
    rows[z0 + k - 2] = am - s3 * h3m;
    rows[z1 + k] = bk - (t1 * h1k + t2 * h2k + t3 * h3k);
    rows[z1 + k - 1] = bl - (t2 * h2l + t3 * h3l);
    rows[z1 + k - 2] = bm - t3 * h3m;
    rows[z2 + k] = ck - (f1 * h1k + f2 * h2k + f3 * h3k);
    rows[z2 + k - 1] = cl - (f2 * h2l + f3 * h3l);
    rows[z2 + k - 2] = cm - f3 * h3m;
    for (let j = start; j < n; j++) {
      const x0 = a[v0 + j];
      const x1 = a[v1 + j];
      const x2 = a[v2 + j];
      const x3 = a[v3 + j];
      rows[z0 + j] -= s0 * x0 + s1 * x1 + s2 * x2 + s3 * x3;
      rows[z1 + j] -= t0 * x0 + t1 * x1 + t2 * x2 + t3 * x3;
      rows[z2 + j] -= f0 * x0 + f1 * x1 + f2 * x2 + f3 * x3;
    }
  }
  for (; r + 1 < last; r += 2) {
    const z0 = r * n;
    const z1 = z0 + n;
    const ak = rows[z0 + k];
    const al = rows[z0 + k - 1];
    const am = rows[z0 + k - 2];
    const bk = rows[z1 + k];
    const bl = rows[z1 + k - 1];
    const bm = rows[z1 + k - 2];
    let p0 = 0;
    let p1 = ak * h1k;
    let p2 = ak * h2k + al * h2l;
    let p3 = ak * h3k + al * h3l + am * h3m;
    let q0 = 0;
    let q1 = bk * h1k;
    let q2 = bk * h2k + bl * h2l;
    let q3 = bk * h3k + bl * h3l + bm * h3m;
    for (let j = start; j < n; j++) {
      const w = rows[z0 + j];
      const u = rows[z1 + j];
      const x0 = a[v0 + j];
      p0 += w * x0;
      q0 += u * x0;
      const x1 = a[v1 + j];
      p1 += w * x1;
      q1 += u * x1;
      const x2 = a[v2 + j];
      p2 += w * x2;
      q2 += u * x2;
      const x3 = a[v3 + j];
      p3 += w * x3;
      q3 += u * x3;
    }
    const s0 = b0 * p0;
    const s1 = b1 * (p1 - s0 * c10);
    const s2 = b2 * (p2 - s0 * c20 - s1 * c21);
    const s3 = b3 * (p3 - s0 * c30 - s1 * c31 - s2 * c32);
    const t0 = b0 * q0;
    const t1 = b1 * (q1 - t0 * c10);
    const t2 = b2 * (q2 - t0 * c20 - t1 * c21);
    const t3 = b3 * (q3 - t0 * c30 - t1 * c31 - t2 * c32);
    rows[z0 + k] = ak - (s1 * h1k + s2 * h2k + s3 * h3k);
    rows[z0 + k - 1] = al - (s2 * h2l + s3 * h3l);
    rows[z0 + k - 2] = am - s3 * h3m;
    rows[z1 + k] = bk - (t1 * h1k + t2 * h2k + t3 * h3k);
    rows[z1 + k - 1] = bl - (t2 * h2l + t3 * h3l);
    rows[z1 + k - 2] = bm - t3 * h3m;
    for (let j = start; j < n; j++) {
      const x0 = a[v0 + j];
      const x1 = a[v1 + j];
      const x2 = a[v2 + j];
      const x3 = a[v3 + j];
      rows[z0 + j] -= s0 * x0 + s1 * x1 + s2 * x2 + s3 * x3;
      rows[z1 + j] -= t0 * x0 + t1 * x1 + t2 * x2 + t3 * x3;
    }
  }
  if (r < last) {
    const z0 = r * n;
    const ak = rows[z0 + k];
    const al = rows[z0 + k - 1];
    const am = rows[z0 + k - 2];
    let p0 = 0;
    let p1 = ak * h1k;
    let p2 = ak * h2k + al * h2l;
    let p3 = ak * h3k + al * h3l + am * h3m;
    for (let j = start; j < n; j++) {
      const w = rows[z0 + j];
      p0 += w * a[v0 + j];
      p1 += w * a[v1 + j];
      p2 += w * a[v2 + j];
      p3 += w * a[v3 + j];
    }
    const s0 = b0 * p0;
    const s1 = b1 * (p1 - s0 * c10);
    const s2 = b2 * (p2 - s0 * c20 - s1 * c21);
    const s3 = b3 * (p3 - s0 * c30 - s1 * c31 - s2 * c32);
    rows[z0 + k] = ak - (s1 * h1k + s2 * h2k + s3 * h3k);
    rows[z0 + k - 1] = al - (s2 * h2l + s3 * h3l);
    rows[z0 + k - 2] = am - s3 * h3m;
    for (let j = start; j < n; j++) {
      rows[z0 + j] -= s0 * a[v0 + j] + s1 * a[v1 + j] + s2 * a[v2 + j] + s3 * a[v3 + j];
    }
  }
}

/**
 * z ← H_{k−1} H_k z for rows first … last − 1 (or, with `onlyLower`, just
 * H_{k−1}). v_k lives in a[k n + j], j > k; v_{k−1} in a[(k − 1) n + j], j ≥ k.
 */
function reflectorPair(
  a: Float64Array,
  n: number,
  beta: Float64Array,
  rows: Float64Array,
  first: number,
  last: number,
  k: number,
  onlyLower = false,
): void {
  const bk = onlyLower ? 0 : beta[k];
  const bl = beta[k - 1];
  if (bk === 0 && bl === 0) return;
  const vk = k * n;
  const vl = vk - n;
  const start = k + 1;
  let cross = 0; // v_{k−1} · v_k
  if (bk !== 0) for (let j = start; j < n; j++) cross += a[vl + j] * a[vk + j];
  const head = a[vl + k];
  let r = first;
  if (bk !== 0) {
    for (; r + 3 < last; r += 4) {
      const z0 = r * n;
      const z1 = z0 + n;
      const z2 = z1 + n;
      const z3 = z2 + n;
      let p0 = 0;
      let p1 = 0;
      let p2 = 0;
      let p3 = 0;
      let q0 = rows[z0 + k] * head;
      let q1 = rows[z1 + k] * head;
      let q2 = rows[z2 + k] * head;
      let q3 = rows[z3 + k] * head;
      for (let j = start; j < n; j++) {
        const x = a[vk + j];
        const y = a[vl + j];
        const w0 = rows[z0 + j];
        const w1 = rows[z1 + j];
        const w2 = rows[z2 + j];
        const w3 = rows[z3 + j];
        p0 += w0 * x;
        q0 += w0 * y;
        p1 += w1 * x;
        q1 += w1 * y;
        p2 += w2 * x;
        q2 += w2 * y;
        p3 += w3 * x;
        q3 += w3 * y;
      }
      const s0 = bk * p0;
      const s1 = bk * p1;
      const s2 = bk * p2;
      const s3 = bk * p3;
      const t0 = bl * (q0 - s0 * cross);
      const t1 = bl * (q1 - s1 * cross);
      const t2 = bl * (q2 - s2 * cross);
      const t3 = bl * (q3 - s3 * cross);
      rows[z0 + k] -= t0 * head;
      rows[z1 + k] -= t1 * head;
      rows[z2 + k] -= t2 * head;
      rows[z3 + k] -= t3 * head;
      for (let j = start; j < n; j++) {
        const x = a[vk + j];
        const y = a[vl + j];
        rows[z0 + j] -= s0 * x + t0 * y;
        rows[z1 + j] -= s1 * x + t1 * y;
        rows[z2 + j] -= s2 * x + t2 * y;
        rows[z3 + j] -= s3 * x + t3 * y;
      }
    }
  }
  for (; r + 1 < last; r += 2) {
    const z0 = r * n;
    const z1 = z0 + n;
    let p0 = 0;
    let p1 = 0;
    let q0 = rows[z0 + k] * head;
    let q1 = rows[z1 + k] * head;
    if (bk !== 0) {
      for (let j = start; j < n; j++) {
        const x = a[vk + j];
        const y = a[vl + j];
        const w0 = rows[z0 + j];
        const w1 = rows[z1 + j];
        p0 += w0 * x;
        q0 += w0 * y;
        p1 += w1 * x;
        q1 += w1 * y;
      }
    } else {
      for (let j = start; j < n; j++) {
        const y = a[vl + j];
        q0 += rows[z0 + j] * y;
        q1 += rows[z1 + j] * y;
      }
    }
    const s0 = bk * p0;
    const s1 = bk * p1;
    const t0 = bl * (q0 - s0 * cross);
    const t1 = bl * (q1 - s1 * cross);
    rows[z0 + k] -= t0 * head;
    rows[z1 + k] -= t1 * head;
    for (let j = start; j < n; j++) {
      const x = a[vk + j];
      const y = a[vl + j];
      rows[z0 + j] -= s0 * x + t0 * y;
      rows[z1 + j] -= s1 * x + t1 * y;
    }
  }
  if (r < last) {
    const z0 = r * n;
    let p0 = 0;
    let q0 = rows[z0 + k] * head;
    for (let j = start; j < n; j++) {
      const w0 = rows[z0 + j];
      p0 += w0 * a[vk + j];
      q0 += w0 * a[vl + j];
    }
    const s0 = bk * p0;
    const t0 = bl * (q0 - s0 * cross);
    rows[z0 + k] -= t0 * head;
    for (let j = start; j < n; j++) rows[z0 + j] -= s0 * a[vk + j] + t0 * a[vl + j];
  }
}
