/**
 * Small valid spec inputs for the shared-types tests. Each call returns a fresh object, so a
 * test may mutate it.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Lattice, SweepSpecInput } from '../../../shared-types/src/index.js';

/** The smallest useful spec: an Ising chain quench with one observable; defaults left out. */
export function minimalSpec(): SweepSpecInput & Record<string, unknown> {
  return {
    lattice: { kind: 'chain', length: 4 },
    h0: { model: 'ising', hx: 0.5 },
    h1: { model: 'ising', hx: 1.5 },
    betas: [0.5, 1, 2],
    times: { stop: 2, count: 5 },
    observables: [{ kind: 'site', pauli: 'X' }],
  };
}

/** A spec that exercises every canonicalisation: explicit terms, bonds, pairs, momenta, times. */
export function richSpec(): SweepSpecInput {
  return {
    label: 'rich',
    lattice: {
      kind: 'bonds', sites: 4, bonds: [[1, 0], [2, 1], [3, 2]], farBonds: [[2, 0]],
      positions: [[0, 0], [1, 0], [2, 0], [3, 0]],
    },
    h0: {
      model: 'pauli-sum',
      terms: [
        { weight: 1, word: 'Z1 Z0' },
        { weight: -0.5, word: 'X2' },
        { weight: 0.25, word: 'X3 Y1' },
        { weight: 0.75, word: 'Y1  X3' },
      ],
    },
    h1: { model: 'xxz', J: 1, delta: 0.5, hz: 0.1 },
    betas: [2, 0.5, 1, 0.5],
    times: { values: [1, 0.5, 0, 1] },
    observables: [
      { kind: 'pair', paulis: 'XY', pairs: [[2, 3], [1, 0], [0, 2]] },
      { kind: 'site', pauli: 'Z', sites: [3, 1] },
      { kind: 'structure-factor', paulis: 'ZZ', momenta: [[3.14, 0], [0, 0]] },
    ],
    seed: 7,
  };
}

const EXAMPLES_DIR = fileURLToPath(new URL('../../../shared-types/examples/', import.meta.url));

/** The example spec files: [file name, parsed JSON]. */
export function exampleSpecs(): Array<[string, unknown]> {
  return readdirSync(EXAMPLES_DIR)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => [f, JSON.parse(readFileSync(EXAMPLES_DIR + f, 'utf8')) as unknown]);
}

/** The examples README text. */
export function examplesReadme(): string {
  return readFileSync(`${EXAMPLES_DIR}README.md`, 'utf8');
}

/** Number of sites of a lattice (numbering as in DESIGN.md; honeycomb has 2 sites per cell). */
export function siteCount(l: Lattice): number {
  switch (l.kind) {
    case 'chain': return l.length;
    case 'ladder': return 2 * l.length;
    case 'square':
    case 'triangular': return l.size[0] * l.size[1];
    case 'honeycomb': return 2 * l.size[0] * l.size[1];
    case 'bonds': return l.sites;
  }
}
