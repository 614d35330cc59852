import { describe, expect, it } from 'vitest';
import { buildFigures, figureCsv, figureFileStem } from '../../../services/plot/index.js';
import { BETAS, TIMES, checkReport, plotData } from './fixtures.js';

describe('figureCsv', () => {
  describe('when the figure is a time series', () => {
    it('should write one row per (β, t) with the value and, where drawn, the error band half-width', () => {
      const [, zz] = buildFigures(plotData());
      const lines = figureCsv(zz).trimEnd().split('\n');
      expect(lines[0]).toBe('beta,time,"⟨ZZ⟩ connected, nearest pairs",error');
      expect(lines).toHaveLength(1 + BETAS.length * TIMES.length);
      const [beta, t, v, e] = lines[5].split(',').map(Number);
      expect([beta, t]).toEqual([0.5, 0]);
      expect(v).toBe(plotData().series[1].values[1][0]);
      expect(e).toBeCloseTo(0.02, 12);
    });

    it('should leave missing values and negligible errors empty, and add the series check where there is one', () => {
      const data = plotData();
      data.series[0].values[2][3] = Number.NaN;
      const [x] = buildFigures(data, { check: checkReport() });
      const lines = figureCsv(x).trimEnd().split('\n');
      expect(lines[0]).toBe('beta,time,"⟨X⟩, site average",error,series_check,series_check_error');
      expect(lines.at(-1)).toBe('2,1.5,,,,');
      const row = lines[2].split(',');
      expect(row.slice(0, 2)).toEqual(['0', '0.5']);
      expect(row[3]).toBe('');
      expect(Number(row[4])).toBeCloseTo(data.series[0].values[0][1] + 0.01, 12);
      expect(Number(row[5])).toBeCloseTo(1e-4, 12);
    });
  });

  describe('when the figure is thermodynamics', () => {
    it('should write one row per β', () => {
      const free = buildFigures(plotData())[5];
      expect(figureCsv(free)).toBe('beta,F/N,error\n0,,\n0.5,-1.75,\n2,-0.25,\n');
    });
  });

  describe('figureFileStem', () => {
    it('should make file-name-safe stems of figure ids', () => {
      const figures = buildFigures(plotData());
      expect(figures.map(figureFileStem)).toEqual(['series-X-avg', 'series-ZZ-nearest-conn', 'thermo-energy', 'thermo-heatCapacity', 'thermo-entropy', 'thermo-freeEnergy']);
    });
  });
});
