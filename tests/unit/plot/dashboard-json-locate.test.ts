import { describe, expect, it } from 'vitest';
import { jsonErrorOffset, lineColumn, locateJsonPath } from '../../../services/dashboard/src/json-locate.js';

const TEXT = JSON.stringify({
  label: 'a "quoted" {label}',
  lattice: { kind: 'chain', length: 4 },
  betas: [0.5, -1, 2],
  observables: [{ kind: 'site', pauli: 'X' }, { kind: 'pair', paulis: 'ZZ' }],
}, null, 2);

const at = (path: Array<string | number>) => {
  const r = locateJsonPath(TEXT, path);
  return r ? TEXT.slice(r[0], r[1]) : null;
};

describe('locateJsonPath', () => {
  it('should find array elements, nested fields and whole values', () => {
    expect(at(['betas', 1])).toBe('-1');
    expect(at(['observables', 1, 'paulis'])).toBe('"ZZ"');
    expect(at(['lattice'])).toBe('{\n    "kind": "chain",\n    "length": 4\n  }');
    expect(at(['label'])).toBe('"a \\"quoted\\" {label}"');
  });

  it('should point at the nearest existing parent when the field is missing', () => {
    expect(at(['lattice', 'boundary'])).toBe(at(['lattice']));
    expect(at(['betas', 7])).toBe(at(['betas']));
  });

  it('should cover the whole document for the root path and return null for garbage', () => {
    expect(at([])).toBe(TEXT);
    expect(locateJsonPath('', ['a'])).toBeNull();
  });
});

describe('jsonErrorOffset and lineColumn', () => {
  it('should find where strict JSON parsing stops, as a line and column', () => {
    const bad = '{\n  "a": 1,\n  "b": ]\n}';
    expect(lineColumn(bad, jsonErrorOffset(bad)!)).toEqual({ line: 3, column: 8 });
    expect(jsonErrorOffset('{"a": [1, 2,]}')).toBe(12);
    expect(jsonErrorOffset('{"a": 01}')).toBe(7);
    expect(jsonErrorOffset('{"a": "x\ty"}')).toBe(8);
    expect(jsonErrorOffset('{"a": 1} x')).toBe(9);
    expect(jsonErrorOffset('')).toBe(0);
  });

  it('should agree with JSON.parse on valid text', () => {
    for (const text of [TEXT, '[]', '{}', '-1.5e+3', '"\\u00e9"', '[true, false, null, {"x": [{}]}]']) {
      expect(() => JSON.parse(text)).not.toThrow();
      expect(jsonErrorOffset(text), text).toBeNull();
    }
  });
});
