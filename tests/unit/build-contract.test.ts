// The manifest paths a build writes and a request looks up must agree however a URL's query is written: the query's
// parameters are sorted by name as the WHATWG URL Standard's URLSearchParams.sort() does (a stable sort by code
// units), so two spellings of one address are one manifest entry.
import { describe, expect, test } from 'vitest';
import { AUDIENCES, builtKey, entryEtag, filePath, pagePath, pdfPath, presentationPath, printPath, tokenPath } from '@/lib/publishing/build/contract';

describe('manifest paths', () => {
  test.each([
    // [rest, query, expected] — WHATWG URL Standard §6.2 (URLSearchParams: sort(), and application/x-www-form-urlencoded serializing)
    ['files/logo', 'w=960&aspect=3:2', 'files/logo?aspect=3%3A2&w=960'],
    ['files/logo', 'aspect=3:2&w=960', 'files/logo?aspect=3%3A2&w=960'],
    ['files/logo', '', 'files/logo'],
    ['presentation', 'print', 'presentation?print='],
    ['files/face', 'weight=700&weight=400', 'files/face?weight=700&weight=400'], // stable: equal names keep their order
  ])('%s ? %s → %s', (rest, query, expected) => {
    expect(filePath(rest, query)).toBe(expected);
  });

  test('the PDF, token and print paths are the version URLs the site serves, in that normal form', () => {
    expect(pdfPath('a4')).toBe('guideline.pdf?size=a4');
    expect(pdfPath('letter')).toBe('guideline.pdf?size=letter');
    expect(pdfPath('slides')).toBe('presentation.pdf');
    expect(tokenPath('css')).toBe('tokens?format=css');
    expect(printPath('letter')).toBe(filePath('print', new URL('https://x.invalid/b/s/v/1/print?size=letter').search));
    expect(presentationPath('print')).toBe(filePath('presentation', new URL('https://x.invalid/b/s/v/1/presentation?print').search));
  });

  test('twelve page variants: latest or older × editor, member or link × downloads or not, each its own path', () => {
    expect(AUDIENCES).toHaveLength(12);
    expect(new Set(AUDIENCES.map(pagePath)).size).toBe(12);
  });

  test('stored keys sit under the brand and version, named by content; a strong ETag quotes the hash (RFC 9110 §8.8.3)', () => {
    const hash = 'ab'.repeat(32);
    expect(builtKey('brand-1', 'version-1', hash, 'PDF')).toBe(`brand-1/build/version-1/${hash}.pdf`);
    expect(builtKey('brand-1', 'version-1', hash, '../x')).toBe(`brand-1/build/version-1/${hash}.x`);
    expect(entryEtag({ hash })).toBe(`"${hash.slice(0, 32)}"`);
    expect(entryEtag({ hash }).startsWith('W/')).toBe(false);
  });
});
