/** Schemas of the engine catalogue, health, readiness and token routes. */
import { z } from 'zod';

export const EngineCatalog = z.object({
  engines: z.array(z.object({
    name: z.string(),
    version: z.string(),
    description: z.string(),
  })),
  /** Schema-level limits every spec must respect, whatever the engine. */
  limits: z.record(z.string(), z.number()),
  /** Service limits that apply to each token. */
  service: z.object({
    maxBodyBytes: z.number().int(),
    maxActiveSweepsPerOwner: z.number().int(),
    rateLimit: z.object({ max: z.number().int(), windowMs: z.number().int() }),
  }),
}).meta({ id: 'EngineCatalog' });

export const HealthReply = z.object({ status: z.literal('ok') });

export const ReadyReply = z.object({
  status: z.enum(['ready', 'not-ready']),
  redis: z.boolean(),
  queue: z.boolean(),
});
