/**
 * Point-group operations used to relabel clusters before comparing them (cluster-expansion.ts):
 * linear maps of the plane, as [a, b, c, d] for (x, y) ↦ (a·x + b·y, c·x + d·y).
 *
 * Any relabelling of a cluster's sites is a valid candidate for its memo key (the key encodes the
 * relabelled Hamiltonian exactly); symmetry operations of the lattice are the ones that make
 * rotated and reflected copies of a cluster share one computation. Groups (common practice):
 * chain {1, x ↦ −x}; ladder D2; square D4 (8); triangular and honeycomb D6 (12).
 */
import type { Lattice } from '../../../shared-types/src/index.js';

/** A linear map [a, b, c, d]: (x, y) ↦ (a·x + b·y, c·x + d·y). */
export type PlaneMap = readonly [number, number, number, number];

const ID: PlaneMap = [1, 0, 0, 1];

function rotations(k: number): PlaneMap[] {
  const out: PlaneMap[] = [];
  for (let j = 0; j < k; j++) {
    const a = (2 * Math.PI * j) / k;
    const c = Math.round(Math.cos(a) * 1e12) / 1e12;
    const s = Math.round(Math.sin(a) * 1e12) / 1e12;
    out.push([c, -s, s, c]);
  }
  return out;
}

function withReflection(maps: PlaneMap[]): PlaneMap[] {
  // Compose each with the reflection y ↦ −y.
  return [...maps, ...maps.map(([a, b, c, d]) => [a, -b, c, -d] as const)];
}

/** The point group used for a lattice kind (identity only for explicit bond lists). */
export function pointGroupOf(kind: Lattice['kind']): PlaneMap[] {
  switch (kind) {
    case 'chain': return [ID, [-1, 0, 0, 1]];
    case 'ladder': return [ID, [-1, 0, 0, 1], [1, 0, 0, -1], [-1, 0, 0, -1]];
    case 'square': return withReflection(rotations(4));
    case 'triangular':
    case 'honeycomb': return withReflection(rotations(6));
    default: return [ID];
  }
}
