/** POST /v1/plan — a dry run: validate, canonicalise and plan a spec; nothing is stored. */
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import type { ApiContext } from '../context.js';
import { BetasweepApiError } from '../errors.js';
import { errorResponses } from '../schemas/error-body.js';
import { PlanReply, SweepSpecBody } from '../schemas/sweep-bodies.js';
import { specValidatorCompiler } from './sweeps.js';

export function planRoutes(ctx: ApiContext): FastifyPluginAsyncZod {
  return async (app) => {
    app.post('', {
      validatorCompiler: specValidatorCompiler(ctx.planner),
      schema: {
        summary: 'Plan a spec without running it (engine, cost, accuracy, fan-out, or the refusal)',
        tags: ['plan'],
        body: SweepSpecBody,
        response: { 200: PlanReply, ...errorResponses(400, 401, 413, 415, 429) },
      },
    }, async (request) => {
      const parsed = ctx.planner.parse(request.body);
      if (!parsed.success) throw new BetasweepApiError('BSW_ERR_SPEC_INVALID', [parsed.issues[0]?.message ?? 'invalid'], { issues: parsed.issues });
      const { plan, header } = ctx.planner.plan(parsed.spec, parsed.hash);
      return { specHash: parsed.hash, feasible: plan.feasible, plan, header, points: header.betas.length * header.times.length, spec: parsed.spec };
    });
  };
}
