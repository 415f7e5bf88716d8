import { z } from 'zod';
import { installPlainWords } from '../../../shared/schemas/plain-words';

// A refusal reads as a sentence about the field, never as the parser's words ("Too big: expected …").
installPlainWords();
const firstMessage = (schema: z.ZodType, value: unknown) => schema.safeParse(value).error?.issues[0].message;

describe('plain words for refusals that carry no words of their own', () => {
  it.each([
    ['is at most 100 characters', z.string().max(100), 'a'.repeat(101)],
    ['is required', z.string().min(1), ''],
    ['is at least 3 characters', z.string().min(3), 'ab'],
    ['must be at most 200', z.number().max(200), 201],
    ['must be above 0', z.number().positive(), 0],
    ['must be a whole number', z.number().int(), 1.5],
    ['must be a number', z.number(), 'ten'],
    ['is required', z.object({ a: z.string() }), {}],
    ['is at most 2 entries', z.array(z.number()).max(2), [1, 2, 3]],
    ['must be one of: a, b', z.enum(['a', 'b']), 'c'],
    ['has fields this form does not have: x', z.strictObject({}), { x: 1 }],
  ] as const)('when a value is refused, then the message reads "%s"', (words, schema, value) => {
    expect(firstMessage(schema as z.ZodType, value)).toBe(words);
  });

  it('when a schema names its own words, then those are kept', () => {
    expect(firstMessage(z.string().max(3, 'is at most 3 letters'), 'abcd')).toBe('is at most 3 letters');
  });
});
