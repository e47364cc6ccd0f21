import { describe, expect, test } from 'vitest';
import { firstFreeSlug, SLUG_PATTERN, slugify } from '@/lib/brands/slug';
import { safeNext } from '@/lib/http/redirect';

describe('slugify (URL-safe per RFC 3986 unreserved characters)', () => {
  test.each([
    ['Harbour Bakehouse', 'harbour-bakehouse'],
    ['Café Ölberg', 'cafe-olberg'],
    ['Salt & Pepper', 'salt-and-pepper'],
    ['  --Edge--  ', 'edge'],
    ['!!!', 'brand'],
    ['A'.repeat(100), 'a'.repeat(60)],
  ])('%s → %s', (name, slug) => {
    expect(slugify(name)).toBe(slug);
    expect(slugify(name)).toMatch(SLUG_PATTERN);
  });
  test('first free slug counts up from 2', () => {
    expect(firstFreeSlug('oak', new Set())).toBe('oak');
    expect(firstFreeSlug('oak', new Set(['oak', 'oak-2']))).toBe('oak-3');
  });
});

describe('safeNext keeps redirects on our own site (OWASP unvalidated redirects)', () => {
  test.each([
    ['/app/brands/1', '/app/brands/1'],
    ['https://evil.example', '/app'],
    ['//evil.example', '/app'],
    ['/\\evil.example', '/app'],
    [null, '/app'],
  ])('%s → %s', (next, expected) => expect(safeNext(next)).toBe(expected));
});
