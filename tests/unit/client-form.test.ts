// Form limits read from zod schemas: what an input shows (maxLength, min, max) is what the schema enforces.
// Reference: zod 4's own parsing (a general-purpose library) — each limit read is checked by parsing values at and past it.
import { describe, expect, test } from 'vitest';
import { z } from 'zod';
import { firstError, maxLengthOf, rangeOf } from '@/lib/client/form';

describe('maxLengthOf', () => {
  const letters = (n: number) => 'a'.repeat(n);
  const address = (n: number) => `${'a'.repeat(n - 8)}@b.co.uk`;
  test.each([
    ['a plain string', z.string().max(80), letters],
    ['trimmed and refined', z.string().trim().min(1).max(80).refine(() => true), letters],
    ['optional', z.string().max(80).optional(), letters],
    ['nullable and optional', z.string().max(80).nullable().optional(), letters],
    ['an e-mail address', z.email().max(80), address],
  ])('reads the limit of %s: zod accepts that length and refuses one more', (_name, schema, fill) => {
    const max = maxLengthOf(schema);
    expect(max).toBe(80);
    expect(schema.safeParse(fill(max!)).success).toBe(true);
    expect(schema.safeParse(fill(max! + 1)).success).toBe(false);
  });

  test('a string without a limit has none', () => expect(maxLengthOf(z.string())).toBeUndefined());
});

describe('rangeOf', () => {
  test.each([
    ['a plain number', z.number().min(10).max(32)],
    ['an optional integer', z.number().int().min(10).max(32).optional()],
    ['a nullable number', z.number().min(10).max(32).nullable().optional()],
  ])('reads the range of %s, the bounds zod accepts and refuses just outside', (_name, schema) => {
    const { min, max } = rangeOf(schema);
    expect([min, max]).toEqual([10, 32]);
    expect(schema.safeParse(min).success && schema.safeParse(max).success).toBe(true);
    expect(schema.safeParse(min! - 1).success || schema.safeParse(max! + 1).success).toBe(false);
  });
});

describe('firstError', () => {
  test('takes the first message in field order, nested ones included', () => {
    expect(firstError({ title: undefined, name: { type: 'too_small', message: 'Name the swatch.' }, value: { type: 'x', message: 'later' } })).toBe('Name the swatch.');
    expect(firstError({ fallback: [undefined, { type: 'invalid_string', message: 'Letters only.' }] } as never)).toBe('Letters only.');
    expect(firstError({})).toBeUndefined();
  });
});
