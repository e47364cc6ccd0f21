// What a built page refers to, so the build makes every address before a version turns ready. Checked against the
// HTML Living Standard (§4.8.4.3.10 "parse a srcset attribute", and its examples of srcset with x and w descriptors),
// CSS Values and Units Level 4 §4.5 (url() unquoted and quoted) and CSS Cascading and Inheritance §2 (@import with
// a string or a url()).
import { describe, expect, test } from 'vitest';
import { cssUrls, htmlUrls, insideVersion, srcsetUrls } from '@/lib/publishing/build/references';

describe('srcset (HTML Living Standard, parse a srcset attribute)', () => {
  test("the standard's examples: density and width descriptors", () => {
    expect(srcsetUrls('image-2x.png 2x, image-3x.png 3x, image-4x.png 4x')).toEqual(['image-2x.png', 'image-3x.png', 'image-4x.png']);
    expect(srcsetUrls('/uploads/100-marie-lloyd.jpg 1x, /uploads/150-marie-lloyd.jpg 1.5x')).toEqual(['/uploads/100-marie-lloyd.jpg', '/uploads/150-marie-lloyd.jpg']);
    expect(srcsetUrls('pic-400.jpg 400w,pic-800.jpg 800w')).toEqual(['pic-400.jpg', 'pic-800.jpg']);
  });

  test('a candidate without descriptors ends at trailing commas; a comma inside a URL stays in it', () => {
    expect(srcsetUrls('a.jpg, b.jpg 2x')).toEqual(['a.jpg', 'b.jpg']);
    expect(srcsetUrls('/f/x?w=480&aspect=3:2 480w, /f/x?w=960&aspect=3:2 960w')).toEqual(['/f/x?w=480&aspect=3:2', '/f/x?w=960&aspect=3:2']);
    // No whitespace: by the algorithm this is one URL, commas and all.
    expect(srcsetUrls('a.jpg,b.jpg')).toEqual(['a.jpg,b.jpg']);
    expect(srcsetUrls('  ,, ')).toEqual([]);
  });
});

describe('CSS url() and @import (CSS Values 4 §4.5, CSS Cascade §2)', () => {
  test('unquoted, single- and double-quoted url(), and both forms of @import', () => {
    const css = `@import "first.css"; @import url(second.css) screen;
      .a { background: url(/b/x/v/1/files/p?w=480) no-repeat; }
      @font-face { font-family: X; src: url("/b/x/v/1/files/f?weight=700") format("truetype"), url('/static/a b.woff2'); }`;
    expect(cssUrls(css)).toEqual(['first.css', 'second.css', '/b/x/v/1/files/p?w=480', '/b/x/v/1/files/f?weight=700', '/static/a b.woff2']);
  });

  test('a style attribute is a declaration list', () => {
    expect(cssUrls('background-image: url(/i.png); color: red', 'declarationList')).toEqual(['/i.png']);
  });
});

describe('HTML documents', () => {
  test('link and load attributes, srcset, style attributes and <style> blocks; entities decoded', () => {
    const html = `<!doctype html><html><head><link rel="stylesheet" href="/s.css"><style>@font-face{src:url(/f.woff2)}</style></head>
      <body><a href="/b/x/v/1/mockups/card?format=png&amp;x=1">card</a><img src="/l.svg" srcset="/p1.jpg 1x, /p2.jpg 2x">
      <div style="background:url('/bg.png')"></div><video poster="/poster.jpg"></video><svg><image xlink:href="/i.svg"/></svg></body></html>`;
    expect(htmlUrls(html).sort()).toEqual(['/b/x/v/1/mockups/card?format=png&x=1', '/bg.png', '/f.woff2', '/i.svg', '/l.svg', '/p1.jpg', '/p2.jpg', '/poster.jpg', '/s.css'].sort());
  });
});

describe('addresses inside a version', () => {
  const base = '/b/acme/v/3';
  test('a path under the version, decoded, with its query', () => {
    expect(insideVersion('/b/acme/v/3/files/abc?variant=black', base, base)).toEqual({ rest: 'files/abc', search: '?variant=black' });
    expect(insideVersion('/b/acme/v/3/mockups/bus%20stop', base, base)).toEqual({ rest: 'mockups/bus stop', search: '' });
  });

  test('elsewhere is not inside: another version, the site root, another origin, data:, a fragment, the page itself', () => {
    for (const url of ['/b/acme/v/30/files/x', '/b/acme', 'https://example.com/b/acme/v/3/files/x', 'data:image/png;base64,AAAA', '#colour', '/b/acme/v/3', '/b/acme/v/3/']) {
      expect(insideVersion(url, base, base), url).toBeNull();
    }
  });
});
