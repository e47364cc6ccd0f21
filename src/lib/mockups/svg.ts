// A placed mock-up page as SVG text: the same drawing for the guideline (trim only), the screen PNG and the print PDF
// (with bleed and crop marks). Every value is escaped here; colours are parsed #rrggbb, addresses checked by the caller.
import type { Box } from '@/lib/identity/types';
import { escapeHtml, escapeXml } from '@/lib/safe/escape';
import type { MockupLayout, PlacedItem, PlacedPage } from './compose';
import type { PatternFill } from './pattern';

/** Bleed on every side of a print piece: 3 mm (common practice; ask the printer). */
export const BLEED_MM = 3;
/** Crop marks start this far from the trim corner, so they never touch the trimmed piece (common practice). */
export const MARK_OFFSET_MM = 1;
/** Crop-mark stroke: 0.25 pt, the thinnest line presses hold (common practice), over a 0.75 pt white halo. */
export const MARK_STROKE_PT = 0.25;

export interface SvgOptions {
  /** Draw the bleed (print pieces only): the ground and the edge-touching fields run 3 mm past the trim. */
  bleed?: boolean;
  /** Crop marks in the bleed corners (print pieces only). */
  marks?: boolean;
  /** The width and height attributes; the viewBox always keeps the template's proportions. */
  width?: string;
  height?: string;
  /** Text for assistive technology. */
  label?: string;
  /** Added to the drawing's ids when one page shows the same piece more than once. */
  idSuffix?: string;
}

/** SVG user units per template unit: a tenth of a millimetre on paper, so text sizes stay well above browser minimums. */
export const unitsPer = (layout: MockupLayout) => (layout.unit === 'mm' ? 10 : 1);

const n = (v: number) => (Math.round(v * 100) / 100).toString();

/** A fill or photo that touches a trim edge runs on into the bleed on that side. */
function bled(box: Box, trim: { width: number; height: number }, bleed: number): Box {
  if (!bleed) return box;
  const e = 1e-6;
  const left = box.x <= e ? bleed : 0;
  const top = box.y <= e ? bleed : 0;
  const right = box.x + box.width >= trim.width - e ? bleed : 0;
  const bottom = box.y + box.height >= trim.height - e ? bleed : 0;
  return { x: box.x - left, y: box.y - top, width: box.width + left + right, height: box.height + top + bottom };
}

const HEX = /^#[0-9a-f]{6}$/i;

/** The pattern's repeat as an SVG <pattern>: the generator's tile as one image, or the mark's file at every placement, tinted. */
function patternDef(fill: PatternFill, id: string, origin: string): string {
  const size = fill.kind === 'tile' ? fill : fill.layout;
  const open = `<pattern id="${id}" patternUnits="userSpaceOnUse" width="${n(size.width)}" height="${n(size.height)}" patternTransform="${origin}">`;
  if (fill.kind === 'tile') return `${open}<image width="${n(fill.width)}" height="${n(fill.height)}" href="${escapeXml(fill.href)}" preserveAspectRatio="none"/></pattern>`;
  const ink = HEX.test(fill.ink) ? fill.ink : '#333333';
  const { width: w, height: h } = fill.layout.mark;
  // The one-colour file's alpha is the ink with the inner shapes cut out; the flood paints it in the palette's ink.
  const marks = fill.layout.placements
    .map((p) => `<image href="${escapeXml(fill.href)}" x="${n(-w / 2)}" y="${n(-h / 2)}" width="${n(w)}" height="${n(h)}" preserveAspectRatio="xMidYMid meet" transform="translate(${n(p.x)} ${n(p.y)})${p.rotation ? ` rotate(${n(p.rotation)})` : ''}"/>`)
    .join('');
  const filter = `<filter id="${id}-ink"><feFlood flood-color="${ink}" flood-opacity="${n(Math.min(1, Math.max(0, fill.opacity)))}"/><feComposite in2="SourceAlpha" operator="in"/></filter>`;
  return `${filter}${open}<g filter="url(#${id}-ink)">${marks}</g></pattern>`;
}

function item(it: PlacedItem, u: number, trim: { width: number; height: number }, bleed: number, id: string): string {
  const rect = (b: Box) => `x="${n(b.x * u)}" y="${n(b.y * u)}" width="${n(b.width * u)}" height="${n(b.height * u)}"`;
  if (it.kind === 'fill') return `<rect ${rect(bled(it.box, trim, bleed))} fill="${escapeXml(it.hex)}"/>`;
  if (it.kind === 'pattern') {
    const field = rect(bled(it.box, trim, bleed));
    const ground = `<rect ${field} fill="${escapeXml(it.hex)}"/>`;
    if (!it.fill) return ground;
    // The repeat starts at the area's trim corner, whatever bleed it runs into; tile px become template units.
    const origin = `translate(${n(it.box.x * u)} ${n(it.box.y * u)}) scale(${n(it.unitsPerPx * u)})`;
    return `<defs>${patternDef(it.fill, id, origin)}</defs>${ground}<rect ${field} fill="url(#${id})"/>`;
  }
  if (it.kind === 'photo') return `<image ${rect(bled(it.box, trim, bleed))} href="${escapeXml(it.href)}" preserveAspectRatio="xMidYMid slice"/>`;
  if (it.kind === 'logo') return it.href ? `<image ${rect(it.image)} href="${escapeXml(it.href)}" preserveAspectRatio="none"/>` : '';
  const style = [
    'margin:0',
    `font-family:${it.fontFamily}`,
    `font-size:${n(it.fontSize * u)}px`,
    `line-height:${n(it.lineHeight)}`,
    `font-weight:${it.weight}`,
    `color:${it.hex}`,
    `text-align:${it.align}`,
    'white-space:pre-line',
    'overflow-wrap:break-word',
    'overflow:hidden',
    `height:${n(it.box.height * u)}px`,
  ].join(';');
  return `<foreignObject ${rect(it.box)}><div xmlns="http://www.w3.org/1999/xhtml" style="${escapeXml(style)}">${escapeHtml(it.text)}</div></foreignObject>`;
}

/** Crop marks: at each trim corner one horizontal and one vertical line in the bleed, on the trim lines, short of the corner. */
export function cropMarkLines(trim: { width: number; height: number }, bleed = BLEED_MM, offset = MARK_OFFSET_MM): [number, number, number, number][] {
  const { width: w, height: h } = trim;
  const lines: [number, number, number, number][] = [];
  for (const [x, sx] of [[0, -1], [w, 1]] as const) {
    for (const [y, sy] of [[0, -1], [h, 1]] as const) {
      lines.push([x + sx * offset, y, x + sx * bleed, y]);
      lines.push([x, y + sy * offset, x, y + sy * bleed]);
    }
  }
  return lines;
}

/** One page of the layout as an SVG document. */
export function pageSvg(layout: MockupLayout, page: PlacedPage, options: SvgOptions = {}): string {
  const u = unitsPer(layout);
  const bleed = options.bleed && layout.unit === 'mm' ? BLEED_MM : 0;
  const { width: w, height: h } = layout.trim;
  const view = `${n(-bleed * u)} ${n(-bleed * u)} ${n((w + 2 * bleed) * u)} ${n((h + 2 * bleed) * u)}`;
  const size = `${options.width ? ` width="${escapeXml(options.width)}"` : ''}${options.height ? ` height="${escapeXml(options.height)}"` : ''}`;
  const label = options.label ? ` role="img" aria-label="${escapeXml(options.label)}"` : ' aria-hidden="true"';
  const parts = [`<rect x="${n(-bleed * u)}" y="${n(-bleed * u)}" width="${n((w + 2 * bleed) * u)}" height="${n((h + 2 * bleed) * u)}" fill="${escapeXml(page.ground)}"/>`];
  // Ids unique per piece and page, so several drawings can share one HTML page.
  const prefix = `mockup-${layout.template.key}-${page.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}${options.idSuffix ? `-${options.idSuffix.replace(/[^a-z0-9-]/gi, '')}` : ''}`;
  page.items.forEach((it, i) => parts.push(item(it, u, layout.trim, bleed, `${prefix}-${i}`)));
  if (options.marks && bleed) {
    const pt = (v: number) => n(((v * 25.4) / 72) * u);
    const d = cropMarkLines(layout.trim).map(([x1, y1, x2, y2]) => `M${n(x1 * u)} ${n(y1 * u)}L${n(x2 * u)} ${n(y2 * u)}`).join('');
    parts.push(`<path d="${d}" stroke="#ffffff" stroke-width="${pt(MARK_STROKE_PT * 3)}" fill="none"/>`);
    parts.push(`<path d="${d}" stroke="#000000" stroke-width="${pt(MARK_STROKE_PT)}" fill="none"/>`);
  }
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${view}"${size}${label} preserveAspectRatio="xMidYMid meet">${parts.join('')}</svg>`;
}
