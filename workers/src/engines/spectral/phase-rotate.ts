/**
 * phaseRotate — the time-dependent weights of the spectral quench formula for one block and one
 * time, over a range of packed columns:
 *   ⟨O(t)⟩ = Σ_mn ρ̃_nm·Õ_mn·e^{i(E_m − E_n)t} = Σ_mn R_mn·Õ_mn,   R_mn = conj(ρ̃_mn)·a_m·conj(a_n),
 * a_m = e^{iE_m t}, E the H1 eigenvalues. R and Õ are Hermitian, so the (m, n) and (n, m)
 * terms are complex conjugates and the sum is Σ_m R_mm·Õ_mm + 2·Σ_{m<n} Re(R_mn·Õ_mn). This
 * routine writes R as two real planes
 *   re′: diagonal ρ̃_mm, off-diagonal 2·Re R_mn;   im′: diagonal 0, off-diagonal −2·Im R_mn,
 * so that ⟨O(t)⟩ = re′·Õ_re + im′·Õ_im (two real dot products, packed-planes.ts layout).
 * Phases a_m are given (one sin/cos per level and time); products of them replace per-pair
 * trigonometry. The rounding of E_m·t itself, ≈ ε·|E_m t|, is the dominant phase error at
 * long times (spectral-error.ts).
 *
 * Cost: ≈ 6 flops per packed entry (4 when ρ̃ is real); no allocation.
 */

/**
 * For packed columns n0 ≤ n < n1, writes re′ and im′ of entries (m ≤ n) into outRe/outIm
 * from index outOff (entry (m, n) at outOff + n(n+1)/2 + m − n0(n0+1)/2). `rhoIm` null means
 * ρ̃ is real. `phases` holds (cos E_m t, sin E_m t) interleaved from index phaseOff.
 * Unchecked kernel.
 */
export function phaseRotate(
  n0: number, n1: number, rhoRe: Float64Array, rhoIm: Float64Array | null,
  phasesAll: Float64Array, phaseOff: number, outRe: Float64Array, outIm: Float64Array, outOff: number,
): void {
  const base = (n0 * (n0 + 1)) / 2 - outOff;
  const phases = phasesAll;
  const po = phaseOff;
  for (let n = n0; n < n1; n++) {
    const col = (n * (n + 1)) / 2;
    const o = col - base;
    const br = phases[po + 2 * n];
    const bi = -phases[po + 2 * n + 1]; // conj(a_n)
    if (rhoIm === null) {
      for (let m = 0; m < n; m++) {
        const ar = phases[po + 2 * m], ai = phases[po + 2 * m + 1];
        const r = 2 * rhoRe[col + m];
        outRe[o + m] = r * (ar * br - ai * bi);
        outIm[o + m] = -r * (ar * bi + ai * br);
      }
    } else {
      for (let m = 0; m < n; m++) {
        const ar = phases[po + 2 * m], ai = phases[po + 2 * m + 1];
        const qr = ar * br - ai * bi; // a_m·conj(a_n)
        const qi = ar * bi + ai * br;
        const rr = rhoRe[col + m], ri = -rhoIm[col + m]; // conj(ρ̃_mn)
        outRe[o + m] = 2 * (rr * qr - ri * qi);
        outIm[o + m] = -2 * (rr * qi + ri * qr);
      }
    }
    outRe[o + n] = rhoRe[col + n];
    outIm[o + n] = 0;
  }
}
