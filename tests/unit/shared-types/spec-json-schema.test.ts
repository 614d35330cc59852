/**
 * The spec and result schemas convert to draft-7 JSON Schema (what fastify-type-provider-zod
 * and @fastify/swagger publish), and that JSON Schema agrees with zod on the examples.
 */
import Fastify from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { SweepResult, SweepSpec } from '../../../shared-types/src/index.js';
import { exampleSpecs } from './spec-fixtures.js';

type Json = Record<string, any>;

const specSchema = z.toJSONSchema(SweepSpec, { target: 'draft-7', io: 'input' }) as Json;

describe('SweepSpec as JSON Schema (draft-7)', () => {
  it('should name the shared parts by their ids', () => {
    expect(specSchema.$ref).toBe('#/definitions/SweepSpec');
    expect(Object.keys(specSchema.definitions)).toEqual(expect.arrayContaining([
      'SweepSpec', 'Lattice', 'Hamiltonian', 'TimeGrid', 'Observable', 'PauliTerm', 'PauliWord',
    ]));
  });

  it('should carry the limits of betas and times', () => {
    const spec = specSchema.definitions.SweepSpec;
    expect(spec.properties.betas).toMatchObject({ minItems: 1, maxItems: 64, items: { minimum: 0, maximum: 1000 } });
    expect(spec.additionalProperties).toBe(false);
    expect(spec.required).toEqual(['lattice', 'h0', 'h1', 'betas', 'times', 'observables']);
  });

  it('should convert the result schema too', () => {
    const result = z.toJSONSchema(SweepResult, { target: 'draft-7' }) as Json;
    expect(Object.keys(result.definitions)).toEqual(expect.arrayContaining(['SweepResult', 'SweepPlan', 'ThermoRecord']));
  });

  describe('when validated by fastify (Ajv)', () => {
    // Ajv's defaults (useDefaults, removeAdditional) change the data while it tries each branch
    // of a oneOf, which breaks strict objects inside unions; zod applies the defaults, so Ajv is
    // run here as a pure checker. `strict: false` because Ajv warns about defaults under oneOf.
    const app = Fastify({ ajv: { customOptions: { strict: false, useDefaults: false, removeAdditional: false } } });

    beforeAll(async () => {
      app.post('/check', { schema: { body: specSchema } }, async () => ({ ok: true }));
      await app.ready();
    });
    afterAll(async () => {
      await app.close();
    });

    const post = (payload: unknown) => app.inject({ method: 'POST', url: '/check', payload: payload as object });

    it.each(exampleSpecs())('should accept %s', async (_name, input) => {
      expect((await post(input)).statusCode).toBe(200);
    });

    it.each<[string, Json]>([
      ['a negative β', { betas: [-1] }],
      ['an unknown field', { colour: 'red' }],
      ['a label with a control character', { label: 'bell\u0007' }],
      ['a malformed Pauli word', { h1: { model: 'pauli-sum', terms: [{ weight: 1, word: 'X0Y1' }] } }],
      ['too many time points', { times: { stop: 1, count: 10_002 } }],
    ])('should reject %s like zod does', async (_what, patch) => {
      const input = { ...(exampleSpecs()[0][1] as Json), ...patch };
      expect(SweepSpec.safeParse(input).success).toBe(false);
      expect((await post(input)).statusCode).toBe(400);
    });
  });
});
