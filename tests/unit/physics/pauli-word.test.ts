import { describe, expect, it } from 'vitest';
import { formatPauliWord, parsePauliWord, pauliFactors } from '../../../workers/src/physics/pauli-word.js';

describe('parsePauliWord', () => {
  it('sets the x mask for X and Y and the z mask for Z and Y', () => {
    expect(parsePauliWord('X0 Z3 Y2', 4)).toEqual({ x: 0b0101, z: 0b1100 });
  });

  it('reads the empty and all-blank word as the identity', () => {
    expect(parsePauliWord('', 3)).toEqual({ x: 0, z: 0 });
    expect(parsePauliWord('   ', 3)).toEqual({ x: 0, z: 0 });
  });

  it('accepts factors in any order and extra blanks', () => {
    expect(parsePauliWord('  Z3   X0 ', 4)).toEqual(parsePauliWord('X0 Z3', 4));
  });

  it('accepts site 29, the highest site of the mask form', () => {
    expect(parsePauliWord('Z29', 30)).toEqual({ x: 0, z: 2 ** 29 });
  });

  it('throws a RangeError naming the site and the lattice size when a site is outside the lattice', () => {
    expect(() => parsePauliWord('X0 Z4', 4)).toThrow(RangeError);
    expect(() => parsePauliWord('X0 Z4', 4)).toThrow(/site 4.*0\.\.3/);
  });

  it('throws a RangeError naming the mask limit for a site above 29', () => {
    expect(() => parsePauliWord('X30', 100)).toThrow(/site 30.*0\.\.29/);
  });

  it('throws a RangeError when a site is repeated', () => {
    expect(() => parsePauliWord('X1 Z1', 4)).toThrow(/site 1 appears more than once/);
  });

  it('throws a TypeError naming a malformed token', () => {
    expect(() => parsePauliWord('X0 W1', 4)).toThrow(TypeError);
    expect(() => parsePauliWord('X0 W1', 4)).toThrow(/"W1"/);
    expect(() => parsePauliWord('x0', 4)).toThrow(TypeError);
  });
});

describe('pauliFactors', () => {
  it('reads sites beyond the mask limit', () => {
    expect(pauliFactors('Y4000 X1')).toEqual([{ letter: 'Y', site: 4000 }, { letter: 'X', site: 1 }]);
  });
});

describe('formatPauliWord', () => {
  it('writes factors in ascending site order', () => {
    expect(formatPauliWord({ x: 0b0101, z: 0b1100 })).toBe('X0 Y2 Z3');
  });

  it('writes the identity as the empty string', () => {
    expect(formatPauliWord({ x: 0, z: 0 })).toBe('');
  });

  it('round-trips every string on three sites', () => {
    for (let x = 0; x < 8; x++) for (let z = 0; z < 8; z++) {
      expect(parsePauliWord(formatPauliWord({ x, z }), 3)).toEqual({ x, z });
    }
  });

  it('handles site 29', () => {
    expect(formatPauliWord({ x: 2 ** 29, z: 2 ** 29 })).toBe('Y29');
  });
});
