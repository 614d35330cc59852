/**
 * CSV export of a result: one row per (β, time, series) with value and error, then the
 * thermodynamics as rows with time empty and series names prefixed "thermo:".
 * Numbers are written with full double precision (shortest round-trip form).
 */
import type { SweepResult } from '../../../shared-types/src/index.js';

const quote = (s: string) => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

export function resultToCsv(result: SweepResult): string {
  const lines: string[] = ['beta,time,series,value,error'];
  result.betas.forEach((beta, b) => {
    result.times.forEach((time, t) => {
      for (const s of result.series) {
        lines.push(`${beta},${time},${quote(s.label)},${s.values[b][t]},${s.errors[b][t]}`);
      }
    });
  });
  for (const th of result.thermo) {
    const rows: Array<[string, number | null, number | null]> = [
      ['lnZ', th.lnZ, th.errors.lnZ],
      ['energy', th.energy, th.errors.energy],
      ['heatCapacity', th.heatCapacity, th.errors.heatCapacity],
      ['freeEnergy', th.freeEnergy, th.errors.freeEnergy],
      ['entropy', th.entropy, th.errors.entropy],
    ];
    for (const [name, v, e] of rows) lines.push(`${th.beta},,thermo:${name},${v ?? ''},${e ?? ''}`);
  }
  return lines.join('\n') + '\n';
}
