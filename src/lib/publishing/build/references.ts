// Which addresses a built page or stylesheet refers to, so the build can make every one of them and a version is
// never ready with a broken image: HTML attributes that load or link (src, href, srcset, poster, …), inline and
// embedded CSS, and a stylesheet's url() and @import. Parsing is left to htmlparser2 and css-tree.
import * as csstree from 'css-tree';
import { Parser } from 'htmlparser2';

/** Attributes whose value is one address. */
const URL_ATTRIBUTES = new Set(['src', 'href', 'poster', 'data', 'action', 'formaction', 'xlink:href', 'background', 'cite']);
/** Attributes whose value is a list of image candidates (HTML, "srcset attributes"). */
const SRCSET_ATTRIBUTES = new Set(['srcset', 'imagesrcset']);

/**
 * The URLs of a srcset value, following the HTML Living Standard's "parse a srcset attribute": a candidate is a run
 * of non-whitespace (trailing commas end it), then descriptors up to the next comma outside parentheses.
 */
export function srcsetUrls(value: string): string[] {
  const urls: string[] = [];
  let i = 0;
  const space = /[\t\n\f\r ]/;
  while (i < value.length) {
    while (i < value.length && (space.test(value[i]) || value[i] === ',')) i++;
    if (i >= value.length) break;
    let start = i;
    while (i < value.length && !space.test(value[i])) i++;
    let url = value.slice(start, i);
    if (url.endsWith(',')) {
      url = url.replace(/,+$/, '');
    } else {
      // Descriptors: skip to the comma that ends this candidate (a comma inside parentheses does not).
      let depth = 0;
      for (start = i; i < value.length; i++) {
        if (value[i] === '(') depth++;
        else if (value[i] === ')') depth = Math.max(0, depth - 1);
        else if (value[i] === ',' && depth === 0) break;
      }
    }
    if (url) urls.push(url);
  }
  return urls;
}

/** The url() and @import addresses of CSS: a whole stylesheet, or a declaration list (a style attribute). */
export function cssUrls(css: string, context: 'stylesheet' | 'declarationList' = 'stylesheet'): string[] {
  const urls: string[] = [];
  const ast = csstree.parse(css, { context, parseValue: true, parseAtrulePrelude: true });
  csstree.walk(ast, (node) => {
    if (node.type === 'Url') urls.push(node.value);
    else if (node.type === 'Atrule' && node.name.toLowerCase() === 'import' && node.prelude?.type === 'AtrulePrelude') {
      const first = node.prelude.children.first;
      if (first?.type === 'String') urls.push(first.value);
    }
  });
  return urls;
}

/** Every address an HTML document refers to: link and load attributes, srcsets, style attributes and <style> blocks. */
export function htmlUrls(html: string): string[] {
  const urls: string[] = [];
  let inStyle = false;
  let styleText = '';
  const parser = new Parser(
    {
      onopentag(name, attributes) {
        for (const [attribute, value] of Object.entries(attributes)) {
          const a = attribute.toLowerCase();
          if (URL_ATTRIBUTES.has(a)) urls.push(value.trim());
          else if (SRCSET_ATTRIBUTES.has(a)) urls.push(...srcsetUrls(value));
          else if (a === 'style') urls.push(...cssUrls(value, 'declarationList'));
        }
        if (name === 'style') {
          inStyle = true;
          styleText = '';
        }
      },
      ontext(text) {
        if (inStyle) styleText += text;
      },
      onclosetag(name) {
        if (name !== 'style' || !inStyle) return;
        inStyle = false;
        urls.push(...cssUrls(styleText));
      },
    },
    { decodeEntities: true, lowerCaseAttributeNames: true },
  );
  parser.write(html);
  parser.end();
  return urls.filter((u) => u !== '');
}

/**
 * Where `url` (as written in a document at `documentPath`, a path on our site) lands inside the version whose
 * base path is `versionBase` ("/b/<slug>/v/<n>"): the rest of the path, decoded, and the query; or null for an
 * address elsewhere (another site, another version, a data: URL, the page itself or a fragment of it).
 */
export function insideVersion(url: string, documentPath: string, versionBase: string): { rest: string; search: string } | null {
  if (url.startsWith('#')) return null; // a place on the same page
  const origin = 'http://site.invalid';
  let resolved: URL;
  try {
    resolved = new URL(url, origin + documentPath);
  } catch {
    return null;
  }
  if (resolved.origin !== origin) return null;
  const prefix = `${versionBase}/`;
  if (!resolved.pathname.startsWith(prefix)) return null;
  const raw = resolved.pathname.slice(prefix.length);
  if (!raw) return null;
  let rest: string;
  try {
    rest = decodeURIComponent(raw);
  } catch {
    rest = raw;
  }
  return { rest, search: resolved.search };
}
