import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ApiErrorSchema } from '../../shared/schemas/errors';
import { readApiError } from '../../src/lib/api-client';

const strings = fc.array(fc.string({ maxLength: 8 }), { maxLength: 3 });
const fieldErrors = fc.oneof(
  fc.dictionary(fc.string({ maxLength: 6 }), strings, { maxKeys: 3 }),
  fc.dictionary(fc.string({ maxLength: 6 }), fc.oneof(strings, fc.jsonValue({ maxDepth: 1 })), { maxKeys: 3 }),
  fc.jsonValue({ maxDepth: 2 }),
);
const bodies = fc.oneof(
  fc.record({ error: fc.record({ message: fc.string({ maxLength: 12 }), fieldErrors, extra: fc.jsonValue({ maxDepth: 1 }) }, { requiredKeys: ['message'] }) }),
  fc.record({ error: fc.record({ message: fc.jsonValue({ maxDepth: 1 }), fieldErrors }, { requiredKeys: [] }) }),
  fc.record({ error: fc.jsonValue({ maxDepth: 2 }), other: fc.string() }, { requiredKeys: [] }),
  fc.jsonValue({ maxDepth: 3 }),
);

describe('reading an error answer without the validation library', () => {
  it('reads exactly what the shared error schema reads (fast-check)', () => {
    fc.assert(
      fc.property(bodies, (body) => {
        const parsed = ApiErrorSchema.safeParse(body);
        expect(readApiError(body)).toEqual(parsed.success ? parsed.data.error : null);
      }),
      { numRuns: 5000 },
    );
  });

  it('reads the server’s field errors', () => {
    const body = { error: { message: 'Some search options are not valid', fieldErrors: { sort: ['sort must be one of relevance'] } } };
    expect(readApiError(body)).toEqual(body.error);
    expect(readApiError({ error: { message: 'Not found' } })).toEqual({ message: 'Not found' });
    expect(readApiError('<html>')).toBeNull();
  });
});
