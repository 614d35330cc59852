/** Messages a branch worker thread posts to its parent. */
import type { DiagnosticsRecord, SweepPoint, ThermoRecord } from '../../../../shared-types/src/index.js';

export type ThreadMessage =
  | { kind: 'thermo'; data: ThermoRecord }
  | { kind: 'point'; data: SweepPoint }
  | { kind: 'diagnostics'; data: DiagnosticsRecord }
  | { kind: 'done' }
  | { kind: 'error'; name: string; message: string };
