// Upload policy for logo SVGs.
// Rejected outright: DOCTYPE/ENTITY (entity expansion), <foreignObject>, any reference outside the file (href other than
// '#fragment', url() other than url(#id), @import), embedded documents (data: other than PNG/JPEG/GIF/WebP raster images),
// embedded images over the pixel cap (each, or all of them together, read from their headers without decoding),
// absurd or missing dimensions, and text that is not an SVG. Stripped and reported: scripts, event handlers,
// javascript: links, link targets on <a>, and anything else outside DOMPurify's SVG profile.
import { imageSize } from 'image-size';
import DOMPurify from 'isomorphic-dompurify';
import { MAX_RENDITION_PIXELS } from '@/lib/assets/kinds';
import { LogoError, type LogoErrorCode, type LogoErrorInfo } from './errors';
import { MAX_SVG_UNITS, parseViewBox, svgLengthPx, type Box } from './geometry';

export interface SanitizedSvg {
  svg: string;
  viewBox: Box;
  /** Intrinsic size in CSS px (from width/height, else the viewBox size). */
  width: number;
  height: number;
  /** What was stripped, e.g. "element <script>", "attribute onload". */
  removed: string[];
}

export type SanitizeResult = ({ ok: true } & SanitizedSvg) | { ok: false; error: LogoErrorInfo };

export const MAX_SVG_BYTES = 2 * 1024 * 1024;
const SVG_NS = 'http://www.w3.org/2000/svg';
const RASTER_DATA_URI = /^data:image\/(png|jpeg|gif|webp);base64,[a-z0-9+/=\s]*$/i;
const URL_REF = /url\(\s*(['"]?)(.*?)\1\s*\)/gi;

const fail = (code: LogoErrorCode, message: string): SanitizeResult => ({ ok: false, error: { code, message } });

/** The first url() target that points outside the document, if any. */
function externalUrl(text: string): string | undefined {
  for (const match of text.matchAll(URL_REF)) if (!match[2].trim().startsWith('#')) return match[2];
  return undefined;
}

/**
 * Embedded images are decoded in full whenever the SVG is drawn, whatever size they are shown at: together they may
 * hold at most as many pixels as one rendition (MAX_RENDITION_PIXELS).
 */
export const MAX_EMBEDDED_IMAGE_PIXELS = MAX_RENDITION_PIXELS;

/** Width and height an embedded data: image declares in its header (never decoded), or undefined when unreadable. */
function embeddedImageSize(uri: string): { width: number; height: number } | undefined {
  try {
    const base64 = uri.slice(uri.indexOf(',') + 1).replace(/\s+/g, '');
    const { width, height } = imageSize(Uint8Array.from(atob(base64), (c) => c.charCodeAt(0)));
    return width > 0 && height > 0 ? { width, height } : undefined;
  } catch {
    return undefined;
  }
}

/** Collapses whitespace and control characters the way browsers do before reading a URL scheme. */
const scheme = (href: string) => href.replace(/[\p{Cc}\s]/gu, "").toLowerCase();

/** Attributes of the root <svg> start tag of serialised markup. */
function rootAttributes(svg: string): Record<string, string> {
  const tag = /^<svg\b([^>]*)>/i.exec(svg)?.[1] ?? '';
  return Object.fromEntries([...tag.matchAll(/([\w:-]+)\s*=\s*"([^"]*)"/g)].map((m) => [m[1], m[2]]));
}

/** Cleans an uploaded SVG logo, or rejects it with a typed reason (see the policy above). */
export function sanitizeSvg(text: string): SanitizeResult {
  if (typeof text !== 'string') return fail('svg_not_svg', 'The logo must be SVG text.');
  if (text.length > MAX_SVG_BYTES) return fail('svg_too_large', `The SVG is larger than ${MAX_SVG_BYTES / 1024 / 1024} MB.`);
  if (/<!DOCTYPE|<!ENTITY/i.test(text)) {
    return fail('svg_entity', 'The SVG declares a DOCTYPE or ENTITY, which can expand into a huge document; export it again without one.');
  }
  const body = text.replace(/^\uFEFF/, '').replace(/<\?[\s\S]*?\?>/g, '').replace(/<!--[\s\S]*?-->/g, '').trim();
  if (!/^<svg[\s>/]/i.test(body)) return fail('svg_not_svg', 'This is not an SVG file: it must start with an <svg> element.');
  if (/<([\w-]+:)?foreignObject[\s>/]/i.test(body)) {
    return fail('svg_foreign_object', 'The SVG embeds HTML through <foreignObject>, which is not allowed in a logo.');
  }

  let violation: LogoErrorInfo | undefined;
  let embeddedPixels = 0;
  const removed = new Set<string>();
  const millions = (n: number) => `${Math.round(n / 1e6).toLocaleString('en')} million`;
  const measureEmbedded = (uri: string) => {
    const size = embeddedImageSize(uri);
    if (!size) {
      violation ??= { code: 'svg_embedded_image_unreadable', message: 'An image embedded in the SVG could not be read (its size is unknown); embed a PNG, JPEG, GIF or WebP that opens on its own.' };
      return;
    }
    const pixels = size.width * size.height;
    embeddedPixels += pixels;
    if (pixels > MAX_EMBEDDED_IMAGE_PIXELS) {
      violation ??= {
        code: 'svg_embedded_image_too_large',
        message: `An image embedded in the SVG is ${size.width.toLocaleString('en')} × ${size.height.toLocaleString('en')} px (${millions(pixels)} pixels); embedded images can hold at most ${millions(MAX_EMBEDDED_IMAGE_PIXELS)} pixels. Embed a smaller image.`,
      };
    } else if (embeddedPixels > MAX_EMBEDDED_IMAGE_PIXELS) {
      violation ??= {
        code: 'svg_embedded_image_too_large',
        message: `The images embedded in the SVG hold ${millions(embeddedPixels)} pixels together; at most ${millions(MAX_EMBEDDED_IMAGE_PIXELS)} are allowed. Embed fewer or smaller images.`,
      };
    }
  };
  const reject = (message: string) => (violation ??= { code: 'svg_external_reference', message });
  const onElement = (node: Node, data: { tagName: string }) => {
    const tag = data.tagName?.toLowerCase();
    if (tag === 'foreignobject') violation ??= { code: 'svg_foreign_object', message: 'The SVG embeds <foreignObject>.' };
    if (tag === 'style') {
      const css = node.textContent ?? '';
      if (/@import/i.test(css)) reject('A <style> block imports another stylesheet (@import); logos must be self-contained.');
      const url = externalUrl(css);
      if (url !== undefined) reject(`A <style> block points outside the file (url(${url})); logos must be self-contained.`);
    }
  };
  const onAttribute = (node: Element, data: { attrName: string; attrValue: string; keepAttr: boolean }) => {
    const name = data.attrName.toLowerCase();
    const value = data.attrValue ?? '';
    if (name === 'href' || name === 'xlink:href') {
      const s = scheme(value);
      const tag = node.nodeName.toLowerCase();
      if (s.startsWith('javascript:') || s.startsWith('vbscript:')) {
        removed.add(`${s.split(':')[0]}: link`);
        data.keepAttr = false;
      } else if (tag === 'a') {
        if (!value.trim().startsWith('#')) {
          removed.add('link target on <a>');
          data.keepAttr = false;
        }
      } else if (tag === 'image' && RASTER_DATA_URI.test(value.trim())) {
        measureEmbedded(value.trim());
      } else if (!value.trim().startsWith('#')) {
        reject(`<${tag}> refers to "${value.slice(0, 80)}" outside the file; only #references and embedded PNG, JPEG, GIF or WebP images are allowed.`);
      }
    }
    const url = externalUrl(value);
    if (url !== undefined) reject(`The attribute ${name} points outside the file (url(${url.slice(0, 80)})).`);
  };

  DOMPurify.addHook('uponSanitizeElement', onElement);
  DOMPurify.addHook('uponSanitizeAttribute', onAttribute);
  let clean: string;
  try {
    clean = DOMPurify.sanitize(body, { USE_PROFILES: { svg: true, svgFilters: true }, ADD_TAGS: ['use'] });
    for (const item of DOMPurify.removed) {
      if ('element' in item && item.element && !/^(html|head|body)$/i.test(item.element.nodeName)) removed.add(`element <${item.element.nodeName.toLowerCase()}>`);
      if ('attribute' in item && item.attribute) removed.add(`attribute ${item.attribute.name}`);
    }
  } finally {
    DOMPurify.removeHook('uponSanitizeAttribute', onAttribute);
    DOMPurify.removeHook('uponSanitizeElement', onElement);
  }
  if (violation) return { ok: false, error: violation };
  clean = clean.trim();
  if (!/^<svg[\s>]/i.test(clean) || !/<\/svg>$/i.test(clean)) {
    return fail('svg_not_svg', 'Nothing usable was left after cleaning: the file must hold a single <svg> element.');
  }

  const attrs = rootAttributes(clean);
  const widthPx = svgLengthPx(attrs.width);
  const heightPx = svgLengthPx(attrs.height);
  const viewBoxAttr = parseViewBox(attrs.viewBox);
  if (attrs.viewBox !== undefined && !viewBoxAttr) return fail('svg_no_size', `The viewBox "${attrs.viewBox}" is not four numbers.`);
  const viewBox = viewBoxAttr ?? (widthPx !== undefined && heightPx !== undefined ? { x: 0, y: 0, width: widthPx, height: heightPx } : undefined);
  if (!viewBox) return fail('svg_no_size', 'The SVG has neither a viewBox nor a width and height, so its size is unknown.');
  const extents = [viewBox.width, viewBox.height, widthPx ?? viewBox.width, heightPx ?? viewBox.height];
  if (extents.some((v) => !(v > 0) || v > MAX_SVG_UNITS) || [viewBox.x, viewBox.y].some((v) => Math.abs(v) > MAX_SVG_UNITS)) {
    return fail('svg_absurd_size', `The SVG's size must be above zero and at most ${MAX_SVG_UNITS} units on each side.`);
  }
  const width = widthPx ?? (heightPx !== undefined ? (heightPx * viewBox.width) / viewBox.height : viewBox.width);
  const height = heightPx ?? (widthPx !== undefined ? (widthPx * viewBox.height) / viewBox.width : viewBox.height);
  if (!attrs.xmlns) clean = clean.replace(/^<svg/i, `<svg xmlns="${SVG_NS}"`);
  return { ok: true, svg: clean, viewBox, width, height, removed: [...removed] };
}

/** Like sanitizeSvg but throws a LogoError. */
export function toSanitizedSvg(text: string): SanitizedSvg {
  const result = sanitizeSvg(text);
  if (!result.ok) throw new LogoError(result.error.code, result.error.message);
  const { ok: _ok, ...rest } = result;
  return rest;
}
