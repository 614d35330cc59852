/**
 * bondGates — the TEBD gates of a bond model for one stage:
 *
 *   imaginary time (e^{−τ H0/2} ⊗ 1 by steps): G_b = e^{−τ·h_b} ⊗ 1_aux
 *   real time (generator K = H1 ⊗ 1 − 1 ⊗ H1ᵀ, DESIGN.md §2):
 *     G_b = e^{−iτh_b} ⊗ e^{+iτh_bᵀ}  ('transpose'; e^{+iτh_bᵀ} = conj(e^{−iτh_b}) since h_b is
 *     Hermitian), e^{−iτh_b} ⊗ e^{+iτh_b} ('plain', wrong when h_b ≠ h_bᵀ — tests only), or
 *     e^{−iτh_b} ⊗ 1 ('none': H1 ⊗ 1 alone, no back-evolution — tests only), or
 *     e^{−iτh_b} ⊗ e^{+iτh0_bᵀ} ('echo': the auxiliary spins run backwards under H0 instead of
 *     H1; since ρ0^{1/2} commutes with H0 the doubled state is M(t) = e^{−iH1t}e^{+iH0t}·ρ0^{1/2},
 *     the Loschmidt echo operator times the thermal state: close to ρ0^{1/2} for small quenches
 *     at any temperature). Physical observables are the same in every mode.
 * Index: q = 4·p_b + p_{b+1}, p = s + 2·s̃; the two-spin index of h_b is s_b + 2·s_{b+1}.
 * A chain of one site gets 4×4 site gates the same way; long bonds (bond-model.ts) get 16×16
 * gates in the index of their two ends, applied between swap gates. The auxiliary back-evolution keeps
 * the operator entanglement of the doubled state low (Karrasch, Bardarson & Moore, PRL 108,
 * 227206 (2012)). Exponentials: complexExpm (tensor/complex-expm.ts).
 */
import { complexExpm } from '../../tensor/complex-expm.js';
import type { BondModel } from './bond-model.js';
import { identityMatrix, transpose } from './local-operators.js';

/** How the auxiliary spins evolve in real time (see the file header). */
export type AuxiliaryMode = 'transpose' | 'plain' | 'none' | 'echo';

/** Imaginary- or real-time gate kind. */
export type GateKind = { readonly kind: 'imaginary' } | { readonly kind: 'real'; readonly auxiliary: AuxiliaryMode };

/** exp(z·h) for a complex scalar z = (zr, zi) and an n×n matrix h. */
function expScaled(n: number, h: Float64Array, zr: number, zi: number): Float64Array {
  const a = new Float64Array(2 * n * n);
  for (let k = 0; k < n * n; k++) {
    const hr = h[2 * k];
    const hi = h[2 * k + 1];
    a[2 * k] = zr * hr - zi * hi;
    a[2 * k + 1] = zr * hi + zi * hr;
  }
  const out = new Float64Array(2 * n * n);
  complexExpm(n, a, out);
  return out;
}

/** g_phys ⊗ g_aux on a site pair (16×16, index 4·p_b + p_{b+1}) or one site (4×4, index p). */
function doubledGate(spins: 1 | 2, gp: Float64Array, ga: Float64Array): Float64Array {
  const dimS = spins === 1 ? 2 : 4; // physical (or auxiliary) dimension of the gate
  const dim = dimS * dimS;
  const out = new Float64Array(2 * dim * dim);
  // p-index of a site = s + 2·s̃; for a pair q = 4·p_b + p_{b+1}.
  const split = (q: number): [number, number] => {
    if (spins === 1) return [q & 1, q >> 1];
    const pb = q >> 2;
    const pn = q & 3;
    return [(pb & 1) + 2 * (pn & 1), (pb >> 1) + 2 * (pn >> 1)];
  };
  for (let q = 0; q < dim; q++) {
    const [s, a] = split(q);
    for (let qq = 0; qq < dim; qq++) {
      const [ss, aa] = split(qq);
      const pr = gp[2 * (s * dimS + ss)];
      const pi = gp[2 * (s * dimS + ss) + 1];
      const ar = ga[2 * (a * dimS + aa)];
      const ai = ga[2 * (a * dimS + aa) + 1];
      out[2 * (q * dim + qq)] = pr * ar - pi * ai;
      out[2 * (q * dim + qq) + 1] = pr * ai + pi * ar;
    }
  }
  return out;
}

/** The doubled gate of one pair (or site) Hamiltonian h for the time τ; `auxH` feeds the 'echo' mode. */
function gateOf(spins: 1 | 2, h: Float64Array, auxH: Float64Array, tau: number, kind: GateKind): Float64Array {
  const dimS = spins === 1 ? 2 : 4;
  const id = identityMatrix(dimS);
  if (kind.kind === 'imaginary') return doubledGate(spins, expScaled(dimS, h, -tau, 0), id);
  const gp = expScaled(dimS, h, 0, -tau);
  let ga: Float64Array;
  switch (kind.auxiliary) {
    case 'transpose': ga = expScaled(dimS, transpose(dimS, h), 0, tau); break;
    case 'plain': ga = expScaled(dimS, h, 0, tau); break;
    case 'none': ga = id; break;
    case 'echo': ga = expScaled(dimS, transpose(dimS, auxH), 0, tau); break;
    default: {
      const never: never = kind.auxiliary;
      throw new TypeError(`bondGates: unknown auxiliary mode ${String(never)}`);
    }
  }
  return doubledGate(spins, gp, ga);
}

/**
 * Gates for the time τ (imaginary: e^{−τh}; real: e^{−iτh} on the physical spins): one per
 * neighbour bond (16×16), or one 4×4 site gate when the model has a single site. `auxModel`
 * (same chain) is the generator of the auxiliary spins in the 'echo' mode.
 */
export function bondGates(model: BondModel, tau: number, kind: GateKind, auxModel: BondModel = model): Float64Array[] {
  if (model.site !== null) return [gateOf(1, model.site, auxModel.site ?? model.site, tau, kind)];
  return model.bonds.map((h, b) => gateOf(2, h, auxModel.bonds[b], tau, kind));
}

/**
 * Gates of the long bonds (model.long, same order; index 4·p_left + p_right). In the 'echo'
 * mode the auxiliary generator of a long bond is auxModel's bond on the same pair (or zero).
 * @throws RangeError in the 'echo' mode if auxModel has a long bond that the model lacks.
 */
export function longBondGates(model: BondModel, tau: number, kind: GateKind, auxModel: BondModel = model): Float64Array[] {
  const aux = new Map(auxModel.long.map((g) => [`${g.left},${g.right}`, g.h]));
  if (kind.kind === 'real' && kind.auxiliary === 'echo') {
    const own = new Set(model.long.map((g) => `${g.left},${g.right}`));
    for (const key of aux.keys()) {
      if (!own.has(key)) throw new RangeError(`longBondGates: the echo mode needs the long bond ${key} of H0 in H1 as well`);
    }
  }
  return model.long.map((g) => gateOf(2, g.h, aux.get(`${g.left},${g.right}`) ?? new Float64Array(32), tau, kind));
}

/** The 16×16 swap of two purified sites: (p_b, p_{b+1}) → (p_{b+1}, p_b), index 4·p_b + p_{b+1}. */
export function swapGate(): Float64Array {
  const g = new Float64Array(2 * 256);
  for (let a = 0; a < 4; a++) {
    for (let b = 0; b < 4; b++) g[2 * ((4 * a + b) * 16 + (4 * b + a))] = 1;
  }
  return g;
}
