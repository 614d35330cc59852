/**
 * Reference-only exact thermodynamics of classical Ising models H = −J Σ_bonds s_i s_j
 * (s = ±1) by two independent routes:
 *  - brute-force enumeration of all 2^N configurations into a histogram of the bond sum
 *    B = Σ s_i s_j, from which ln Z, E and C follow in closed form at any β (exact counts);
 *  - a row-to-row transfer matrix for rectangular lattices with rings of n spins stacked m
 *    times (periodic or open between rings), Z = Tr T^m or uᵀ T^{m−1} u.
 * Common practice (textbook statistical mechanics); no published values are used.
 * Cost: enumeration O(2^N · bonds) (N ≤ 20); transfer O(m · 8^n) (n ≤ 6).
 */

/** Histogram of the bond sum B over all 2^N configurations: count[B + bonds.length]. */
export function bondSumHistogram(sites: number, bonds: ReadonlyArray<readonly [number, number]>): number[] {
  if (!Number.isInteger(sites) || sites < 1 || sites > 24) throw new RangeError(`bondSumHistogram: sites must be 1…24, got ${sites}`);
  const nb = bonds.length;
  const count = new Array<number>(2 * nb + 1).fill(0);
  for (let s = 0; s < 2 ** sites; s++) {
    let b = 0;
    for (const [i, j] of bonds) b += ((s >> i) & 1) === ((s >> j) & 1) ? 1 : -1;
    count[b + nb]++;
  }
  return count;
}

/** ln Z, E = ⟨H⟩ and C = β² Var(H) at β from a bond-sum histogram, with H = −J B. */
export function histogramThermo(count: readonly number[], J: number, beta: number): { lnZ: number; energy: number; heatCapacity: number } {
  const nb = (count.length - 1) / 2;
  // log-sum-exp over the populated levels of −βH = βJB.
  let top = -Infinity;
  count.forEach((c, k) => { if (c > 0) top = Math.max(top, beta * J * (k - nb)); });
  let z = 0, e1 = 0, e2 = 0;
  count.forEach((c, k) => {
    if (c === 0) return;
    const energy = -J * (k - nb);
    const w = c * Math.exp(beta * J * (k - nb) - top);
    z += w; e1 += w * energy; e2 += w * energy * energy;
  });
  const energy = e1 / z;
  return { lnZ: top + Math.log(z), energy, heatCapacity: beta * beta * (e2 / z - energy * energy) };
}

/** Bonds of a ring of n spins: n bonds if n ≥ 3, one if n = 2 (one bond per pair), none if n = 1. */
function ringBonds(n: number): Array<[number, number]> {
  if (n === 1) return [];
  if (n === 2) return [[0, 1]];
  return [...Array(n).keys()].map((i) => [i, (i + 1) % n] as [number, number]);
}

/**
 * ln Z of m stacked rings of n spins (bonds within each ring as ringBonds(n); bonds between
 * consecutive rings site by site; `stack` = 'periodic' adds ring m−1 → ring 0, which for m = 2
 * is NOT added again: one bond per pair, as on our lattices). K = βJ.
 */
export function transferMatrixLogZ(n: number, m: number, K: number, stack: 'open' | 'periodic'): number {
  const dim = 2 ** n;
  const ring = ringBonds(n);
  const ringSum = (s: number) => ring.reduce((acc, [i, j]) => acc + (((s >> i) & 1) === ((s >> j) & 1) ? 1 : -1), 0);
  const between = (s: number, t: number) => {
    let b = 0;
    for (let i = 0; i < n; i++) b += ((s >> i) & 1) === ((t >> i) & 1) ? 1 : -1;
    return b;
  };
  // Symmetric T_st = e^{K R(s)/2} e^{K s·t} e^{K R(t)/2}, scaled by e^{−c} to keep powers finite.
  const c = K * (ring.length + n);
  const t: number[][] = [];
  for (let s = 0; s < dim; s++) {
    t.push([]);
    for (let u = 0; u < dim; u++) t[s].push(Math.exp(0.5 * K * ringSum(s) + K * between(s, u) + 0.5 * K * ringSum(u) - c));
  }
  const mul = (a: number[][], b: number[][]) => a.map((row) => b[0].map((_, j) => row.reduce((acc, v, k) => acc + v * b[k][j], 0)));
  if (stack === 'periodic' && m >= 3) {
    let p = t;
    for (let k = 1; k < m; k++) p = mul(p, t);
    let tr = 0;
    for (let s = 0; s < dim; s++) tr += p[s][s];
    return Math.log(tr) + m * c;
  }
  // Open stack (also periodic with m ≤ 2: no extra bond): Z = uᵀ T^{m−1} u, u_s = e^{K R(s)/2}.
  const cu = 0.5 * K * ring.length;
  let v = [...Array(dim).keys()].map((s) => Math.exp(0.5 * K * ringSum(s) - cu));
  for (let k = 1; k < m; k++) v = v.map((_, s) => t[s].reduce((acc, x, u) => acc + x * v[u], 0));
  const z = v.reduce((acc, x, s) => acc + x * Math.exp(0.5 * K * ringSum(s) - cu), 0);
  return Math.log(z) + (m - 1) * c + 2 * cu;
}

/** Bonds of an Lx × Ly square lattice, site = x + Lx·y, with our rule for periodic length 2. */
export function squareBonds(lx: number, ly: number, periodic: readonly [boolean, boolean]): Array<[number, number]> {
  const set = new Set<string>();
  const out: Array<[number, number]> = [];
  const add = (a: number, b: number) => {
    if (a === b) return;
    const [i, j] = a < b ? [a, b] : [b, a];
    const key = `${i},${j}`;
    if (!set.has(key)) { set.add(key); out.push([i, j]); }
  };
  for (let y = 0; y < ly; y++) {
    for (let x = 0; x < lx; x++) {
      const s = x + lx * y;
      if (x + 1 < lx || periodic[0]) add(s, ((x + 1) % lx) + lx * y);
      if (y + 1 < ly || periodic[1]) add(s, x + lx * ((y + 1) % ly));
    }
  }
  return out;
}
