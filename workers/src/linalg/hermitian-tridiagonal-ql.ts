/**
 * hermitianTridiagonalQl — eigenvalues and (optionally) eigenvectors of a real symmetric
 * tridiagonal matrix T by implicit QL or QR iteration with Wilkinson-type shifts; the last stage
 * of the Hermitian eigensolver (mirrors LAPACK dsteqr with COMPZ = 'V').
 *
 * T has diagonal d[0..n) and off-diagonal e[0..n−1). The matrix splits wherever
 *   |e_m| ≤ ε·√|d_m|·√|d_{m+1}|;
 * each unreduced block is scaled into a safe range, then iterated by QL (chasing from the
 * bottom) when |d_last| ≥ |d_first|, else by QR (from the top), deflating one eigenvalue at a
 * time (|e_m|² ≤ ε²·|d_m|·|d_{m+1}| + safmin) and solving trailing 2×2 blocks directly (dlaev2).
 * The plane rotations of one sweep are saved (as dsteqr does) and then applied to the real n×n
 * matrix Z, Z ← Z·Gᵀ on columns (i, i+1) (dlasr, SIDE = 'R', PIVOT = 'V'), ROW_BLOCK rows at a
 * time: a block of rows stays in cache while the whole sweep passes over it (measured in Node 20
 * at n = 512–1024: no faster than rotating whole columns, so the rotations are compute-bound
 * here; kept for larger n). Start from Z = I to get the eigenvectors of
 * T, or from Z = Q to get those of A = Q·T·Qᵀ. At the end eigenvalues are sorted ascending with
 * their columns (selection sort, as dsteqr).
 *
 * Source: LAPACK 3.x dsteqr, dlaev2, dlartg; Wilkinson & Reinsch, Handbook for Automatic
 * Computation II (1971), contribution II/3 (tql2); Golub & Van Loan, 4th ed., §8.3.5.
 * Cost: about 2 sweeps per eigenvalue; with vectors ≈ 6·n per rotation, ≈ 3·n³ flops in all
 * (≈ 30·n² without vectors). Memory: none beyond d, e, Z; no allocation.
 * Caveats: at most MAX_SWEEPS_PER_VALUE·n sweeps in total; the return value counts the
 * off-diagonal entries that did not converge (0 on success, as dsteqr's INFO). Z must hold
 * n×n doubles column-major (ldz = n); `work` 2n doubles for the saved rotations (allocated
 * when omitted).
 */

const EPS = Number.EPSILON / 2; // dlamch('E'): unit roundoff of round-to-nearest
const EPS2 = EPS * EPS;
const SAFMIN = 2 ** -1022; // dlamch('S')
const SAFMAX = 1 / SAFMIN;
/** Scale a block down when its largest entry exceeds this (dsteqr's ssfmax). */
const SCALE_DOWN_ABOVE = Math.sqrt(SAFMAX) / 3;
/** Scale a block up when its largest entry is below this (dsteqr's ssfmin). */
const SCALE_UP_BELOW = Math.sqrt(SAFMIN) / EPS2;
/** Sweeps allowed per eigenvalue on average (dsteqr's MAXIT). */
export const MAX_SWEEPS_PER_VALUE = 30;
/** Rows of Z per block when a sweep's rotations are applied (2 KiB per column segment). */
export const ROW_BLOCK = 256;

/** Scratch for one 2×2 eigenproblem or one rotation: [rt1, rt2, c, s] / [c, s, r]. */
const tmp = new Float64Array(4);

/**
 * Eigenvalues of [[a, b], [b, c]]: tmp[0] = rt1 (larger |·|), tmp[1] = rt2, and (tmp[2], tmp[3]) =
 * (cs, sn), the unit eigenvector of rt1 (dlaev2).
 */
function eigen2(a: number, b: number, c: number): void {
  const sm = a + c;
  const df = a - c;
  const adf = Math.abs(df);
  const tb = b + b;
  const ab = Math.abs(tb);
  let acmx: number, acmn: number;
  if (Math.abs(a) > Math.abs(c)) { acmx = a; acmn = c; } else { acmx = c; acmn = a; }
  let rt: number;
  if (adf > ab) rt = adf * Math.sqrt(1 + (ab / adf) ** 2);
  else if (adf < ab) rt = ab * Math.sqrt(1 + (adf / ab) ** 2);
  else rt = ab * Math.SQRT2;
  let rt1: number, rt2: number, sgn1: number;
  if (sm < 0) {
    rt1 = 0.5 * (sm - rt); sgn1 = -1;
    rt2 = (acmx / rt1) * acmn - (b / rt1) * b;
  } else if (sm > 0) {
    rt1 = 0.5 * (sm + rt); sgn1 = 1;
    rt2 = (acmx / rt1) * acmn - (b / rt1) * b;
  } else {
    rt1 = 0.5 * rt; rt2 = -0.5 * rt; sgn1 = 1;
  }
  let cs: number, sgn2: number;
  if (df >= 0) { cs = df + rt; sgn2 = 1; } else { cs = df - rt; sgn2 = -1; }
  let cs1: number, sn1: number;
  if (Math.abs(cs) > ab) {
    const ct = -tb / cs;
    sn1 = 1 / Math.sqrt(1 + ct * ct);
    cs1 = ct * sn1;
  } else if (ab === 0) {
    cs1 = 1; sn1 = 0;
  } else {
    const tn = -cs / tb;
    cs1 = 1 / Math.sqrt(1 + tn * tn);
    sn1 = tn * cs1;
  }
  if (sgn1 === sgn2) { const t = cs1; cs1 = -sn1; sn1 = t; }
  tmp[0] = rt1; tmp[1] = rt2; tmp[2] = cs1; tmp[3] = sn1;
}

/** Plane rotation with [c s; −s c]·[f; g] = [r; 0]: tmp[0] = c, tmp[1] = s, tmp[2] = r (dlartg). */
function rotation(f: number, g: number): void {
  if (g === 0) { tmp[0] = 1; tmp[1] = 0; tmp[2] = f; return; }
  if (f === 0) { tmp[0] = 0; tmp[1] = Math.sign(g); tmp[2] = Math.abs(g); return; }
  let d = Math.sqrt(f * f + g * g);
  if (!(d > 1e-150 && d < 1e150)) d = Math.hypot(f, g); // outside the safe range of the squares
  const c = Math.abs(f) / d;
  const r = f >= 0 ? d : -d;
  tmp[0] = c; tmp[1] = g / r; tmp[2] = r;
}

/** Z(:, j+1) ← c·Z(:, j+1) − s·Z(:, j);  Z(:, j) ← s·Z(:, j+1) + c·Z(:, j)  (one dlasr step). */
function rotateColumns(z: Float64Array, n: number, j: number, c: number, s: number): void {
  if (c === 1 && s === 0) return;
  const p = j * n;
  const q = p + n;
  for (let i = 0; i < n; i++) {
    const t = z[q + i];
    const u = z[p + i];
    z[q + i] = c * t - s * u;
    z[p + i] = s * t + c * u;
  }
}

/**
 * Applies the saved rotations j = first..last (columns (j, j+1), cosine c[j], sine s[sOff + j])
 * to Z, in descending j when `backward` (QL sweeps) else ascending (QR sweeps), ROW_BLOCK rows at
 * a time. Consecutive rotations share a column, so they are applied in pairs: three columns are
 * read and written once per pair instead of four reads and writes.
 */
function applySweep(
  z: Float64Array, n: number, first: number, last: number, c: Float64Array, s: Float64Array, sOff: number, backward: boolean,
): void {
  const count = last - first + 1;
  for (let r0 = 0; r0 < n; r0 += ROW_BLOCK) {
    const r1 = Math.min(n, r0 + ROW_BLOCK);
    let k = 0;
    for (; k + 1 < count; k += 2) {
      if (backward) {
        // Rotation j on (j, j+1), then j − 1 on (j − 1, j).
        const j = last - k;
        const c1 = c[j], s1 = s[sOff + j], c2 = c[j - 1], s2 = s[sOff + j - 1];
        const pa = (j - 1) * n, pb = pa + n, pc = pb + n;
        for (let i = r0; i < r1; i++) {
          const a = z[pa + i], b = z[pb + i], cc = z[pc + i];
          const b1 = s1 * cc + c1 * b;
          z[pc + i] = c1 * cc - s1 * b;
          z[pb + i] = c2 * b1 - s2 * a;
          z[pa + i] = s2 * b1 + c2 * a;
        }
      } else {
        // Rotation j on (j, j+1), then j + 1 on (j + 1, j + 2).
        const j = first + k;
        const c1 = c[j], s1 = s[sOff + j], c2 = c[j + 1], s2 = s[sOff + j + 1];
        const pa = j * n, pb = pa + n, pc = pb + n;
        for (let i = r0; i < r1; i++) {
          const a = z[pa + i], b = z[pb + i], cc = z[pc + i];
          const b1 = c1 * b - s1 * a;
          z[pa + i] = s1 * b + c1 * a;
          z[pc + i] = c2 * cc - s2 * b1;
          z[pb + i] = s2 * cc + c2 * b1;
        }
      }
    }
    if (k < count) {
      const j = backward ? last - k : first + k;
      const cj = c[j];
      const sj = s[sOff + j];
      const p = j * n;
      const q = p + n;
      for (let i = r0; i < r1; i++) {
        const t = z[q + i];
        const u = z[p + i];
        z[q + i] = cj * t - sj * u;
        z[p + i] = sj * t + cj * u;
      }
    }
  }
}

function maxAbs(d: Float64Array, e: Float64Array, l: number, lend: number): number {
  let m = 0;
  for (let i = l; i <= lend; i++) m = Math.max(m, Math.abs(d[i]));
  for (let i = l; i < lend; i++) m = Math.max(m, Math.abs(e[i]));
  return m;
}

function scale(d: Float64Array, e: Float64Array, l: number, lend: number, f: number): void {
  for (let i = l; i <= lend; i++) d[i] *= f;
  for (let i = l; i < lend; i++) e[i] *= f;
}

/**
 * Unchecked kernel (see file header). `z` is null for eigenvalues only. Overwrites d with the
 * eigenvalues (ascending) and e with garbage. Returns the number of unconverged off-diagonal
 * entries (0 on success).
 */
export function hermitianTridiagonalQl(
  n: number, d: Float64Array, e: Float64Array, z: Float64Array | null, work?: Float64Array,
): number {
  if (n <= 1) return 0;
  // Saved rotations of one sweep: cosines at [0, n), sines at [n, 2n).
  const rot = z === null ? null : (work !== undefined && work.length >= 2 * n ? work : new Float64Array(2 * n));
  const nmaxit = n * MAX_SWEEPS_PER_VALUE;
  let jtot = 0;
  let l1 = 0;
  outer: while (l1 < n) {
    if (l1 > 0) e[l1 - 1] = 0;
    // Find a split point m: the block is l1..m.
    let m = l1;
    for (; m < n - 1; m++) {
      const tst = Math.abs(e[m]);
      if (tst === 0) break;
      if (tst <= Math.sqrt(Math.abs(d[m])) * Math.sqrt(Math.abs(d[m + 1])) * EPS) { e[m] = 0; break; }
    }
    let l = l1;
    const lsv = l;
    let lend = m;
    const lendsv = lend;
    l1 = m + 1;
    if (lend === l) continue;
    // Scale the block into a safe range.
    const anorm = maxAbs(d, e, l, lend);
    if (anorm === 0) continue;
    let iscale = 0;
    if (anorm > SCALE_DOWN_ABOVE) { iscale = 1; scale(d, e, l, lend, SCALE_DOWN_ABOVE / anorm); }
    if (anorm < SCALE_UP_BELOW) { iscale = 2; scale(d, e, l, lend, SCALE_UP_BELOW / anorm); }
    // QL when the bottom end is the larger, else QR.
    if (Math.abs(d[lend]) < Math.abs(d[l])) { lend = lsv; l = lendsv; }

    if (lend > l) {
      // QL iteration: deflate at the top (l), chase from the bottom.
      for (;;) {
        let mm = l;
        if (l !== lend) {
          for (; mm < lend; mm++) {
            const t = Math.abs(e[mm]);
            if (t * t <= EPS2 * Math.abs(d[mm]) * Math.abs(d[mm + 1]) + SAFMIN) break;
          }
        }
        if (mm < lend) e[mm] = 0;
        let p = d[l];
        if (mm === l) {
          // Eigenvalue found.
          d[l] = p;
          l++;
          if (l <= lend) continue;
          break;
        }
        if (mm === l + 1) {
          // 2×2 block.
          eigen2(d[l], e[l], d[l + 1]);
          if (z !== null) rotateColumns(z, n, l, tmp[2], tmp[3]);
          d[l] = tmp[0]; d[l + 1] = tmp[1]; e[l] = 0;
          l += 2;
          if (l <= lend) continue;
          break;
        }
        if (jtot === nmaxit) break;
        jtot++;
        // Shift.
        let g = (d[l + 1] - p) / (2 * e[l]);
        let r = Math.hypot(g, 1);
        g = d[mm] - p + e[l] / (g + (g >= 0 ? Math.abs(r) : -Math.abs(r)));
        let s = 1;
        let c = 1;
        p = 0;
        for (let i = mm - 1; i >= l; i--) {
          const f = s * e[i];
          const b = c * e[i];
          rotation(g, f);
          c = tmp[0]; s = tmp[1]; r = tmp[2];
          if (i !== mm - 1) e[i + 1] = r;
          g = d[i + 1] - p;
          r = (d[i] - g) * s + 2 * c * b;
          p = s * r;
          d[i + 1] = g + p;
          g = c * r - b;
          if (rot !== null) { rot[i] = c; rot[n + i] = -s; }
        }
        if (z !== null && rot !== null) applySweep(z, n, l, mm - 1, rot, rot, n, true);
        d[l] -= p;
        e[l] = g;
      }
    } else {
      // QR iteration: deflate at the bottom (l), chase from the top.
      for (;;) {
        let mm = l;
        if (l !== lend) {
          for (; mm > lend; mm--) {
            const t = Math.abs(e[mm - 1]);
            if (t * t <= EPS2 * Math.abs(d[mm]) * Math.abs(d[mm - 1]) + SAFMIN) break;
          }
        }
        if (mm > lend) e[mm - 1] = 0;
        let p = d[l];
        if (mm === l) {
          d[l] = p;
          l--;
          if (l >= lend) continue;
          break;
        }
        if (mm === l - 1) {
          eigen2(d[l - 1], e[l - 1], d[l]);
          if (z !== null) rotateColumns(z, n, l - 1, tmp[2], tmp[3]);
          d[l - 1] = tmp[0]; d[l] = tmp[1]; e[l - 1] = 0;
          l -= 2;
          if (l >= lend) continue;
          break;
        }
        if (jtot === nmaxit) break;
        jtot++;
        let g = (d[l - 1] - p) / (2 * e[l - 1]);
        let r = Math.hypot(g, 1);
        g = d[mm] - p + e[l - 1] / (g + (g >= 0 ? Math.abs(r) : -Math.abs(r)));
        let s = 1;
        let c = 1;
        p = 0;
        for (let i = mm; i <= l - 1; i++) {
          const f = s * e[i];
          const b = c * e[i];
          rotation(g, f);
          c = tmp[0]; s = tmp[1]; r = tmp[2];
          if (i !== mm) e[i - 1] = r;
          g = d[i] - p;
          r = (d[i + 1] - g) * s + 2 * c * b;
          p = s * r;
          d[i] = g + p;
          g = c * r - b;
          if (rot !== null) { rot[i] = c; rot[n + i] = s; }
        }
        if (z !== null && rot !== null) applySweep(z, n, mm, l - 1, rot, rot, n, false);
        d[l] -= p;
        e[l - 1] = g;
      }
    }
    // Undo the scaling.
    if (iscale === 1) scale(d, e, lsv, lendsv, anorm / SCALE_DOWN_ABOVE);
    if (iscale === 2) scale(d, e, lsv, lendsv, anorm / SCALE_UP_BELOW);
    if (jtot >= nmaxit) {
      let bad = 0;
      for (let i = 0; i < n - 1; i++) if (e[i] !== 0) bad++;
      return bad;
    }
    continue outer;
  }
  // Sort ascending (selection sort keeps column swaps to ≤ n − 1).
  for (let i = 0; i < n - 1; i++) {
    let k = i;
    let p = d[i];
    for (let j = i + 1; j < n; j++) if (d[j] < p) { k = j; p = d[j]; }
    if (k !== i) {
      d[k] = d[i];
      d[i] = p;
      if (z !== null) {
        const a = i * n;
        const b = k * n;
        for (let r = 0; r < n; r++) { const t = z[a + r]; z[a + r] = z[b + r]; z[b + r] = t; }
      }
    }
  }
  return 0;
}
