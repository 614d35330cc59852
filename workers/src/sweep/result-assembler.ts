/**
 * Collects the records of a sweep (thermodynamics, points, diagnostics) in any order and
 * builds the final result document. Pure: the local CLI feeds it live; the service replays
 * the stored records into it when the last branch finishes. A record seen twice (a retried
 * branch) simply overwrites the same slot, so replays are idempotent.
 */
import type {
  DiagnosticsRecord, SweepHeader, SweepPoint, SweepResult, SweepSpec, ThermoRecord,
} from '../../../shared-types/src/index.js';

/** Identifies one missing quench point. */
export interface PointRef {
  betaIndex: number;
  timeIndex: number;
}

export class ResultAssembler {
  private readonly values: Float64Array[][];
  private readonly errors: Float64Array[][];
  private readonly seen: Uint8Array[];
  private readonly thermoByBeta = new Map<number, ThermoRecord>();
  private readonly diagnosticsByBeta = new Map<number, DiagnosticsRecord>();
  private pointCount = 0;

  constructor(
    private readonly spec: SweepSpec,
    private readonly header: SweepHeader,
  ) {
    const nb = header.betas.length;
    const nt = header.times.length;
    this.values = header.series.map(() => Array.from({ length: nb }, () => new Float64Array(nt).fill(NaN)));
    this.errors = header.series.map(() => Array.from({ length: nb }, () => new Float64Array(nt).fill(NaN)));
    this.seen = Array.from({ length: nb }, () => new Uint8Array(nt));
  }

  /** Number of distinct points received so far. */
  get points(): number {
    return this.pointCount;
  }

  /** Number of points the sweep will have when complete. */
  get expectedPoints(): number {
    return this.header.betas.length * this.header.times.length;
  }

  thermo(record: ThermoRecord): void {
    this.checkBeta(record.betaIndex);
    this.thermoByBeta.set(record.betaIndex, record);
  }

  diagnostics(record: DiagnosticsRecord): void {
    this.checkBeta(record.betaIndex);
    this.diagnosticsByBeta.set(record.betaIndex, record);
  }

  point(p: SweepPoint): void {
    this.checkBeta(p.betaIndex);
    if (!(p.timeIndex >= 0 && p.timeIndex < this.header.times.length)) {
      throw new RangeError(`point timeIndex ${p.timeIndex} outside 0..${this.header.times.length - 1}`);
    }
    if (p.values.length !== this.header.series.length || p.errors.length !== this.header.series.length) {
      throw new RangeError(`point carries ${p.values.length} values for ${this.header.series.length} series`);
    }
    for (let k = 0; k < p.values.length; k++) {
      this.values[k][p.betaIndex][p.timeIndex] = p.values[k];
      this.errors[k][p.betaIndex][p.timeIndex] = p.errors[k];
    }
    if (!this.seen[p.betaIndex][p.timeIndex]) {
      this.seen[p.betaIndex][p.timeIndex] = 1;
      this.pointCount++;
    }
  }

  /** Points not yet received, in (β, t) order. */
  missing(): PointRef[] {
    const out: PointRef[] = [];
    this.seen.forEach((row, b) => row.forEach((s, t) => { if (!s) out.push({ betaIndex: b, timeIndex: t }); }));
    return out;
  }

  /** True when every point, every thermodynamics record and every diagnostics record is in. */
  complete(): boolean {
    const nb = this.header.betas.length;
    return this.pointCount === this.expectedPoints && this.thermoByBeta.size === nb && this.diagnosticsByBeta.size === nb;
  }

  /** The result document. Throws if records are missing (a result is never silently partial). */
  finish(timing: SweepResult['timing']): SweepResult {
    if (!this.complete()) {
      const miss = this.missing();
      throw new Error(
        `sweep incomplete: ${miss.length} of ${this.expectedPoints} points missing, ` +
        `${this.header.betas.length - this.thermoByBeta.size} thermodynamics and ` +
        `${this.header.betas.length - this.diagnosticsByBeta.size} diagnostics records missing`,
      );
    }
    const byIndex = <T>(m: Map<number, T>) => [...m.entries()].sort((a, b) => a[0] - b[0]).map((e) => e[1]);
    return {
      format: 'betasweep.result/1',
      spec: this.spec,
      specHash: this.header.specHash,
      engine: this.header.engine,
      plan: this.header.plan,
      betas: this.header.betas,
      times: this.header.times,
      series: this.header.series.map((s, k) => ({
        label: s.label,
        observable: s.observable,
        values: this.values[k].map((row) => Array.from(row)),
        errors: this.errors[k].map((row) => Array.from(row)),
      })),
      thermo: byIndex(this.thermoByBeta),
      diagnostics: byIndex(this.diagnosticsByBeta),
      timing,
    };
  }

  private checkBeta(b: number): void {
    if (!(Number.isInteger(b) && b >= 0 && b < this.header.betas.length)) {
      throw new RangeError(`betaIndex ${b} outside 0..${this.header.betas.length - 1}`);
    }
  }
}
