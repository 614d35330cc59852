/**
 * The figures' data of one sweep as it arrives: the grids and series labels from the status
 * report, then every `point`, `thermo` and `diagnostics` event filled in; the final result
 * document replaces it all when the sweep has succeeded.
 */
import type { DiagnosticsRecord, ThermoRecord } from '../../../shared-types/src/result.js';
import type { PlotData } from '../../plot/figure-model.js';
import type { ResultDocument, SweepStatusReport } from './types.js';

/** A point event's data. */
interface PointEvent {
  betaIndex: number;
  timeIndex: number;
  values: number[];
  errors: number[];
}

/** One sweep's figure data as it arrives (see the file header). */
export class LiveSweep {
  data: PlotData;
  diagnostics: DiagnosticsRecord[] = [];
  /** Points filled in (from events or the result). */
  points = 0;
  /** True once the final result replaced the streamed points. */
  final = false;

  constructor(status: SweepStatusReport) {
    const nb = status.betas.length;
    const nt = status.times.length;
    const grid = () => Array.from({ length: nb }, () => new Array<number>(nt).fill(NaN));
    this.data = {
      label: status.label,
      betas: status.betas.slice(),
      times: status.times.slice(),
      series: status.series.map((s) => ({ label: s.label, values: grid(), errors: grid() })),
      thermo: [],
    };
  }

  /** Applies one event; returns true when the figures' data changed. */
  apply(type: string, raw: string): boolean {
    if (this.final) return false;
    let data: unknown;
    try { data = JSON.parse(raw); } catch { return false; }
    if (type === 'point') {
      const p = data as PointEvent;
      if (!(p.betaIndex < this.data.betas.length && p.timeIndex < this.data.times.length)) return false;
      let fresh = false;
      p.values.forEach((v, k) => {
        const s = this.data.series[k];
        if (!s) return;
        if (Number.isNaN(s.values[p.betaIndex][p.timeIndex])) fresh = true;
        s.values[p.betaIndex][p.timeIndex] = v;
        s.errors[p.betaIndex][p.timeIndex] = p.errors[k] ?? NaN;
      });
      if (fresh) this.points++;
      return true;
    }
    if (type === 'thermo') {
      const t = data as ThermoRecord;
      this.data.thermo = [...this.data.thermo.filter((r) => r.betaIndex !== t.betaIndex), t];
      return true;
    }
    if (type === 'diagnostics') {
      const d = data as DiagnosticsRecord;
      this.diagnostics = [...this.diagnostics.filter((r) => r.betaIndex !== d.betaIndex), d].sort((a, b) => a.betaIndex - b.betaIndex);
      return false;
    }
    return false;
  }

  /** Replaces everything with the final result document. */
  useResult(result: ResultDocument): void {
    this.data = {
      label: result.spec.label ?? this.data.label,
      betas: result.betas,
      times: result.times,
      series: result.series.map((s) => ({ label: s.label, values: s.values, errors: s.errors })),
      thermo: result.thermo,
    };
    this.diagnostics = result.diagnostics.slice().sort((a, b) => a.betaIndex - b.betaIndex);
    this.points = result.betas.length * result.times.length;
    this.final = true;
  }
}
