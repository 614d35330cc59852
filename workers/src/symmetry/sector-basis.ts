/**
 * sectorBasis — an orthonormal basis of symmetry-adapted vectors, one per (sector σ, orbit O)
 * pair for which σ's character is trivial on the orbit's stabiliser:
 *   |O, σ⟩ = |O|^{−1/2} · Σ_{s ∈ O} conj(χ_σ(g_s))·|s⟩,   s = g_s·r  (r = the orbit's smallest state),
 * the normalised image of |r⟩ under the projector (1/|S|)·Σ_g conj(χ(g))·g (well defined
 * because χ is 1 on the stabiliser; zero otherwise). Any operator A commuting with the group
 * then has (matrix-elements.ts)
 *   ⟨O′, σ|A|O, σ⟩ = Σ_{terms: A|r⟩ ∋ c·|s⟩, s ∈ O′} c·χ_σ(g_s)·√(|O|/|O′|)
 * (standard construction for translation and point-group blocks; common practice). Sectors
 * are symmetrised over the translations or over the whole group (group-sectors.ts), each with
 * its own orbit table. Vectors are numbered sector by sector, by ascending representative;
 * counted with their multiplicities they span the 2^N states exactly (checked on build).
 * With the trivial group this is the computational basis (|O| = 1, χ = 1, q = s).
 * Cost: the orbit tables (orbit-table.ts) plus O(orbits·|Stab|) per sector; memory ≈ 10·2^N
 * bytes of tables and 12 bytes per vector.
 */
import type { Sector } from './group-sectors.js';
import type { OrbitTable } from './orbit-table.js';
import { orbitTable } from './orbit-table.js';
import type { SpatialGroup } from './spatial-group.js';

/** The symmetry-adapted basis (see the file header). */
export interface SectorBasis {
  readonly sites: number;
  readonly group: SpatialGroup;
  readonly sectors: readonly Sector[];
  /** Orbit tables over the translations and over the whole group (null when no sector uses one). */
  readonly translationOrbits: OrbitTable | null;
  readonly fullOrbits: OrbitTable | null;
  /** Number of basis vectors kept (2^N minus the mirror-image sectors left out). */
  readonly count: number;
  /** Representative state, sector and orbit size of each vector q. */
  readonly rep: Int32Array;
  readonly sectorOf: Int32Array;
  readonly orbitSize: Int32Array;
  /** Per sector: orbit index (of its table) → vector q, or −1 when incompatible. */
  readonly vectorOf: readonly Int32Array[];
}

/** The orbit table a sector is symmetrised over. */
export function sectorOrbits(basis: SectorBasis, sector: number): OrbitTable {
  return (basis.sectors[sector].full ? basis.fullOrbits : basis.translationOrbits)!;
}

/** True when χ is 1 on the stabiliser of orbit o. */
function compatible(table: OrbitTable, o: number, characters: Float64Array): boolean {
  for (let k = table.stabStart[o]; k < table.stabStart[o + 1]; k++) {
    const g = table.stabElements[k];
    // Characters are roots of unity of order ≤ 255: ≠ 1 means |χ − 1| ≥ 0.02.
    if (Math.abs(characters[2 * g] - 1) > 1e-9 || Math.abs(characters[2 * g + 1]) > 1e-9) return false;
  }
  return true;
}

/**
 * Builds the basis of `group` over `sectors`.
 * @throws Error if the vectors, counted with multiplicity, do not number 2^N.
 */
export function sectorBasis(group: SpatialGroup, sectors: readonly Sector[]): SectorBasis {
  const n = group.sites;
  const nT = group.translationCount;
  const needT = sectors.some((s) => !s.full);
  const needFull = sectors.some((s) => s.full);
  const translationOrbits = needT ? orbitTable(n, group.elements.slice(0, nT)) : null;
  const fullOrbits = needFull ? orbitTable(n, group.elements) : null;
  const rep: number[] = [];
  const sectorOf: number[] = [];
  const orbitSize: number[] = [];
  const vectorOf: Int32Array[] = [];
  let spanned = 0;
  sectors.forEach((s, sigma) => {
    const table = (s.full ? fullOrbits : translationOrbits)!;
    const map = new Int32Array(table.reps.length).fill(-1);
    let kept = 0;
    for (let o = 0; o < table.reps.length; o++) {
      if (!compatible(table, o, s.characters)) continue;
      map[o] = rep.length;
      rep.push(table.reps[o]);
      sectorOf.push(sigma);
      orbitSize.push(table.sizes[o]);
      kept++;
    }
    vectorOf.push(map);
    spanned += s.multiplicity * kept;
  });
  if (spanned !== 2 ** n) throw new Error(`sectorBasis: the sectors span ${spanned} states, not 2^${n}`);
  return {
    sites: n, group, sectors, translationOrbits, fullOrbits, count: rep.length,
    rep: Int32Array.from(rep), sectorOf: Int32Array.from(sectorOf), orbitSize: Int32Array.from(orbitSize), vectorOf,
  };
}
