import { describe, expect, it } from 'vitest';
import { parseHexColour, temperatureColourAt, temperatureColours, TEMPERATURE_STOPS } from '../../../services/plot/index.js';

const lin = (c: number) => { const s = c / 255; return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4; };

/** Relative luminance (WCAG 2), for the contrast check. */
function luminance(hex: string): number {
  const [r, g, b] = parseHexColour(hex).map(lin);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** CIE L*a*b* (D65) of a colour. */
function lab(hex: string): [number, number, number] {
  const [r, g, b] = parseHexColour(hex).map(lin);
  const f = (t: number) => (t > 0.008856 ? Math.cbrt(t) : 7.787 * t + 16 / 116);
  const x = f((0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047);
  const y = f(0.2126 * r + 0.7152 * g + 0.0722 * b);
  const z = f((0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883);
  return [116 * y - 16, 500 * (x - y), 200 * (y - z)];
}

/** CIE 1976 colour difference. */
const deltaE = (p: string, q: string) => Math.hypot(...lab(p).map((v, k) => v - lab(q)[k]));

describe('temperatureColours', () => {
  describe('when given a β grid', () => {
    it('should give the hottest (smallest β) the warm end and the coldest the cold end, whatever the order', () => {
      const hot = `#${TEMPERATURE_STOPS[0].map((c) => c.toString(16).padStart(2, '0')).join('')}`;
      const cold = `#${TEMPERATURE_STOPS.at(-1)!.map((c) => c.toString(16).padStart(2, '0')).join('')}`;
      expect(temperatureColours([2, 0, 0.5])).toEqual([cold, hot, temperatureColourAt(0.5)]);
    });

    it('should give equal βs equal colours and every distinct β its own colour', () => {
      const c = temperatureColours([0.1, 0.2, 0.1, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1]);
      expect(c[0]).toBe(c[2]);
      expect(new Set(c).size).toBe(10);
    });

    it('should keep neighbouring colours apart (CIE ΔE ≥ 20 for up to 8 βs, ≥ 10 for 12)', () => {
      for (const [n, min] of [[2, 20], [3, 20], [5, 20], [8, 20], [12, 10]] as const) {
        const c = temperatureColours(Array.from({ length: n }, (_, i) => i));
        for (let i = 1; i < n; i++) expect(deltaE(c[i], c[i - 1]), `${n} βs, pair ${i}`).toBeGreaterThanOrEqual(min);
      }
    });

    it('should keep every colour dark enough to read as a line on white (contrast ≥ 3:1)', () => {
      for (let u = 0; u <= 1; u += 0.05) expect(1.05 / (luminance(temperatureColourAt(u)) + 0.05)).toBeGreaterThanOrEqual(3);
    });

    it('should put a single β in the middle of the scale and clamp positions outside [0, 1]', () => {
      expect(temperatureColours([3])).toEqual([temperatureColourAt(0.5)]);
      expect(temperatureColourAt(-1)).toBe(temperatureColourAt(0));
      expect(temperatureColourAt(7)).toBe(temperatureColourAt(1));
      expect(temperatureColourAt(Number.NaN)).toBe(temperatureColourAt(0));
      expect(temperatureColours([])).toEqual([]);
    });
  });

  describe('parseHexColour', () => {
    it('should reject anything but #rrggbb', () => {
      expect(parseHexColour('#0a0B0c')).toEqual([10, 11, 12]);
      expect(() => parseHexColour('red')).toThrow(RangeError);
    });
  });
});
