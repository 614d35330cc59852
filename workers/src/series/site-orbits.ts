/**
 * Translation orbits of sites and of Pauli strings on a lattice with periodic directions.
 *
 * Sites: the orbits under translations along periodic directions are represented by the sites
 * whose periodic coordinates equal the central cell's; each represents Π_{periodic} L_d sites.
 * Strings: a string's representative is the lexicographically smallest (sites, letters) among
 * its translates that bring one of its sites into the central cell (along periodic
 * directions only); every member of an orbit sees the same candidates, so equal orbit ⇒ equal
 * representative;
 * strings in one orbit have equal expectations for translation-invariant H0 and H1.
 * Cost: O(sites) for the site orbits; O(|supp|²) per string.
 */
import type { SitePauli } from './cluster-expansion.js';
import type { LatticeCells } from './lattice-cells.js';
import { cellCoordinates, centralCell, siteOfCell, translateSite } from './lattice-cells.js';

/** Orbit representatives of the sites with their multiplicities. */
export function siteOrbitRepresentatives(c: LatticeCells): Array<{ site: number; multiplicity: number }> {
  const [cx, cy] = centralCell(c);
  const xs = c.periodic[0] ? [cx] : Array.from({ length: c.lx }, (_, x) => x);
  const ys = c.periodic[1] ? [cy] : Array.from({ length: c.ly }, (_, y) => y);
  const mult = (c.periodic[0] ? c.lx : 1) * (c.periodic[1] ? c.ly : 1);
  const out: Array<{ site: number; multiplicity: number }> = [];
  for (const y of ys) for (const x of xs) for (let b = 0; b < c.nb; b++) out.push({ site: siteOfCell(c, b, x, y), multiplicity: mult });
  return out;
}

function sortedPauli(sites: number[], codes: readonly number[]): SitePauli {
  const idx = sites.map((_, k) => k).sort((a, b) => sites[a] - sites[b]);
  return { sites: idx.map((k) => sites[k]), codes: idx.map((k) => codes[k]) };
}

function lessPauli(a: SitePauli, b: SitePauli): boolean {
  for (let k = 0; k < a.sites.length; k++) {
    if (a.sites[k] !== b.sites[k]) return a.sites[k] < b.sites[k];
    if (a.codes[k] !== b.codes[k]) return a.codes[k] < b.codes[k];
  }
  return false;
}

/** The orbit representative of a string (see the file header); the string itself if nothing translates. */
export function canonicalTranslate(c: LatticeCells, p: SitePauli): SitePauli {
  const [cx, cy] = centralCell(c);
  let best: SitePauli | null = null;
  // Candidates: the translates taking each site of the string to the central cell (only these,
  // not the string itself, so every member of an orbit sees the same candidate set).
  for (const s of p.sites) {
    const [, x, y] = cellCoordinates(c, s);
    const dx = c.periodic[0] ? cx - x : 0;
    const dy = c.periodic[1] ? cy - y : 0;
    const moved: number[] = [];
    for (const u of p.sites) moved.push(translateSite(c, u, c.periodic[0] ? dx : 0, c.periodic[1] ? dy : 0)!);
    const cand = sortedPauli(moved, p.codes);
    if (best === null || lessPauli(cand, best)) best = cand;
  }
  return best ?? sortedPauli([...p.sites], p.codes);
}
