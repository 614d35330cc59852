/**
 * The page reads API bodies through its own small interfaces (services/dashboard/src/types.ts,
 * no server code in the bundle). These type-level checks fail to compile (`npm run typecheck`)
 * when the API's schemas drift away from them; vitest runs them as no-ops.
 */
import type { z } from 'zod';
import { describe, expectTypeOf, it } from 'vitest';
import type { ListReply, PlanReply, SweepStatusBody } from '../../../services/api/src/schemas/sweep-bodies.js';
import type { SweepResult } from '../../../shared-types/src/index.js';
import type { CheckEntryBody, CheckReportBody } from '../../../services/plot/index.js';
import type { CheckEntry, CheckReport } from '../../../workers/src/series/index.js';
import type * as Page from '../../../services/dashboard/src/types.js';

describe('dashboard API types', () => {
  it('should accept what the API sends', () => {
    expectTypeOf<z.infer<typeof SweepStatusBody>>().toExtend<Page.SweepStatusReport>();
    expectTypeOf<z.infer<typeof ListReply>>().toExtend<Page.SweepList>();
    expectTypeOf<z.infer<typeof PlanReply>>().toExtend<Page.PlanReply>();
    expectTypeOf<SweepResult>().toExtend<Page.ResultDocument>();
  });

  it("should accept the series check's report as the overlay's wire shape", () => {
    // Assignability (not toExtend: the wire schema is loose, i.e. has an index signature).
    type Wire = z.input<typeof CheckReportBody>;
    // (Spread: an interface has no implicit index signature; its fields are what is checked.)
    const entry = (e: CheckEntry): z.input<typeof CheckEntryBody> => ({ ...e });
    const summary = (r: CheckReport): Wire['summary'] => r.summary;
    const flagged = (r: CheckReport): Wire['flagged'] => r.flagged;
    const series = (r: CheckReport): Wire['series'] => r.series;
    for (const f of [entry, summary, flagged, series]) expectTypeOf(f).toBeFunction();
  });
});
