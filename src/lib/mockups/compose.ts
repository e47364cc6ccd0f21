// A template filled from the identity: every element placed in template units (mm for print, px for screen), the logo
// fitted with its clear space and never below its minimum size, or a refusal that says what size it would need.
import type { Box, Identity, IdentityLogo } from '@/lib/identity/types';
import { fontStack, markLogo, primaryLogo, typefaceForRole, findLogo } from '@/lib/guideline/identity';
import { ptToMm, pxToPt } from '@/lib/type/units';
import { AppError } from '@/lib/errors';
import { boxUnit, trimSize, type LogoElement, type MockupElement, type MockupTemplate, type TextElement } from './templates';
import { isDarkGround, readableOn, roleHex, tint } from './colour';
import { mockupPattern, type MockupPattern, type PatternFill } from './pattern';

export type LogoFile = 'original' | 'white' | 'onDark';

export type PlacedItem =
  | { kind: 'fill'; role: 'panel' | 'photo-stand-in'; box: Box; hex: string }
  /** The brand's pattern over its ground; `unitsPerPx` turns the tile's CSS px into template units. */
  | { kind: 'pattern'; box: Box; hex: string; fill: PatternFill | null; unitsPerPx: number }
  | { kind: 'photo'; box: Box; href: string }
  | { kind: 'text'; box: Box; text: string; fontFamily: string; fontSize: number; lineHeight: number; weight: number; hex: string; align: TextElement['align'] }
  | {
      kind: 'logo';
      logo: IdentityLogo;
      file: LogoFile;
      href: string;
      /** Where the logo file's whole canvas goes. */
      image: Box;
      /** The drawn bounds, and the clear-space box around them. */
      drawn: Box;
      clearSpace: Box;
      /** The smallest drawn width allowed here, in template units. */
      minimumWidth: number;
    };

export interface PlacedPage {
  name: string;
  ground: string;
  items: PlacedItem[];
}

export interface MockupLayout {
  template: MockupTemplate;
  unit: 'mm' | 'px';
  trim: { width: number; height: number };
  pages: PlacedPage[];
}

export interface MockupRefusal {
  page: string;
  logo: string;
  unit: 'mm' | 'px';
  /** The logo area the template offers, and the area the logo needs at its minimum width with its clear space. */
  available: { width: number; height: number };
  needed: { width: number; height: number };
  message: string;
}

/** Where the pictures come from: the identity's own addresses on the guideline, data: URIs when the server prints. */
export interface MockupSources {
  logo(logo: IdentityLogo, file: LogoFile): string | null;
  /** The brand's photographs, in the order templates number them. */
  photos: readonly string[];
  /** The pattern's drawing (the generator's tile on the server, the mark's file on the page); none = the plain ground. */
  pattern?: (pattern: MockupPattern) => PatternFill | null;
}

export type Composed = { ok: true; layout: MockupLayout } | { ok: false; refusals: MockupRefusal[] };

/** The box an item takes on the page (a logo takes its clear space). */
export const itemBox = (item: PlacedItem): Box => (item.kind === 'logo' ? item.clearSpace : item.box);

/** A box from a template's [x, y, width, height]. */
const asBox = ([x, y, width, height]: readonly number[]): Box => ({ x, y, width, height });

/** True when two boxes share any area (touching edges do not count). */
export function overlaps(a: Box, b: Box): boolean {
  const eps = 1e-6;
  return a.x < b.x + b.width - eps && b.x < a.x + a.width - eps && a.y < b.y + b.height - eps && b.y < a.y + a.height - eps;
}

/** True when `inner` lies wholly inside `outer`. */
export const contains = (outer: Box, inner: Box): boolean =>
  inner.x >= outer.x - 1e-6 && inner.y >= outer.y - 1e-6 && inner.x + inner.width <= outer.x + outer.width + 1e-6 && inner.y + inner.height <= outer.y + outer.height + 1e-6;

const round1 = (v: number) => Math.round(v * 10) / 10;
const sizeText = (s: { width: number; height: number }, unit: string) => `${round1(s.width)} × ${round1(s.height)} ${unit}`;

/** The logo a logo element asks for: the block's chosen logo for "primary", the suite's mark for "mark". */
function logoFor(identity: Identity, element: LogoElement, chosen: string | null): IdentityLogo | undefined {
  const primary = findLogo(identity, chosen) ?? primaryLogo(identity);
  return element.logo === 'mark' ? (markLogo(identity) ?? primary) : primary;
}

/** The file that reads on a ground: the designer's own dark-ground version, else the one-colour white, on dark grounds. */
function fileFor(logo: IdentityLogo, ground: string): LogoFile {
  if (!isDarkGround(ground)) return 'original';
  return logo.ownVariants?.includes('on-dark') ? 'onDark' : 'white';
}

/** Font size and line height of a scale step on this piece: pt read at the template's factor on paper, image px on screens. */
function typeSize(identity: Identity, template: MockupTemplate, element: TextElement): { fontSize: number; lineHeight: number } {
  const steps = identity.typeScale.steps;
  const lo = Math.min(...steps.map((s) => s.step));
  const hi = Math.max(...steps.map((s) => s.step));
  const wanted = Math.min(hi, Math.max(lo, element.step));
  const step = steps.find((s) => s.step === wanted);
  const px = step?.px ?? identity.typeScale.basePx;
  const lineHeight = step?.lineHeight ?? identity.typeScale.bodyLineHeight;
  if (template.medium === 'print') return { fontSize: ptToMm(pxToPt(px) * template.typeScaleFactor), lineHeight };
  return { fontSize: px * template.density * template.typeScaleFactor, lineHeight };
}

/** The ground under a box: the last panel drawn before it that holds it whole, else the page's ground. */
function groundUnder(items: readonly PlacedItem[], box: Box, pageGround: string): string {
  for (let i = items.length - 1; i >= 0; i--) {
    const it = items[i];
    if (it.kind === 'fill' && it.role === 'panel' && contains(it.box, box)) return it.hex;
  }
  return pageGround;
}

/** Places a logo in its area: as large as the area allows with its clear space, or a refusal below the minimum size. */
function placeLogo(
  template: MockupTemplate,
  page: string,
  logo: IdentityLogo,
  element: LogoElement,
  ground: string,
  sources: MockupSources,
): Extract<PlacedItem, { kind: 'logo' }> | MockupRefusal {
  const unit = boxUnit(template);
  const area = asBox(element.box);
  const cs = logo.clearSpace.box;
  const bounds = logo.bounds;
  const minimumWidth = unit === 'mm' ? logo.minimumSize.printMm : logo.minimumSize.screenPx * template.density;
  const scale = Math.min(area.width / cs.width, area.height / cs.height);
  if (bounds.width * scale < minimumWidth - 1e-9) {
    const needScale = minimumWidth / bounds.width;
    const needed = { width: cs.width * needScale, height: cs.height * needScale };
    const available = { width: area.width, height: area.height };
    const where = template.pages.length > 1 ? `${template.name} (${page})` : template.name;
    const minimum = unit === 'mm' ? `${round1(minimumWidth)} mm` : `${Math.ceil(minimumWidth)} px (${logo.minimumSize.screenPx} CSS px at ${template.density}× density)`;
    return {
      page,
      logo: logo.name,
      unit,
      available,
      needed,
      message:
        `${where} cannot show “${logo.name}” as the guidelines ask: its logo area is ${sizeText(available, unit)}, ` +
        `but the logo at its minimum width of ${minimum} with its clear space (${logo.clearSpace.multiple} × ${logo.clearSpace.unitLabel || 'the clear-space unit'} on every side) ` +
        `needs ${sizeText(needed, unit)}. ${logo.variant === 'mark' ? 'Leave this template out, or set a smaller minimum size if the mark still reads there.' : 'Choose a logo with a smaller minimum size (such as the mark) or leave this template out.'}`,
    };
  }
  const w = cs.width * scale;
  const h = cs.height * scale;
  const csX = element.align === 'start' ? area.x : area.x + (area.width - w) / 2;
  const csY = element.align === 'start' ? area.y : area.y + (area.height - h) / 2;
  const at = (b: Box): Box => ({ x: csX + (b.x - cs.x) * scale, y: csY + (b.y - cs.y) * scale, width: b.width * scale, height: b.height * scale });
  const file = fileFor(logo, ground);
  return {
    kind: 'logo',
    logo,
    file,
    href: sources.logo(logo, file) ?? '',
    image: at(logo.canvas),
    drawn: at(bounds),
    clearSpace: { x: csX, y: csY, width: w, height: h },
    minimumWidth,
  };
}

/** Our sample copy with the brand's name put in (the output escapes it). */
const fillText = (identity: Identity, text: string) => text.replaceAll('{brand}', identity.brand.name);

/** Fills a template from the identity; a logo that cannot keep its clear space and minimum size refuses the template. */
export function composeMockup(template: MockupTemplate, identity: Identity, sources: MockupSources, options: { logoId?: string | null } = {}): Composed {
  const unit = boxUnit(template);
  const trim = trimSize(template);
  const page = { x: 0, y: 0, ...trim };
  const pattern = mockupPattern(identity);
  const fill = sources.pattern?.(pattern) ?? null;
  // CSS px (the pattern's unit) in template units: 25.4 / 96 mm on paper (CSS Values 4), the image density on screens;
  // times the piece's own pattern scale (a sign is read from across the street).
  const unitsPerPx = (unit === 'mm' ? 25.4 / 96 : template.density) * template.patternScale;
  const refusals: MockupRefusal[] = [];
  const pages: PlacedPage[] = [];
  for (const spec of template.pages) {
    const ground = roleHex(identity, spec.ground);
    const items: PlacedItem[] = [];
    for (const element of spec.elements as MockupElement[]) {
      const box = asBox(element.box);
      if (element.type === 'panel') items.push({ kind: 'fill', role: 'panel', box, hex: roleHex(identity, element.fill) });
      else if (element.type === 'pattern') items.push({ kind: 'pattern', box, hex: pattern.hex, fill, unitsPerPx });
      else if (element.type === 'photo') {
        const href = sources.photos.length ? sources.photos[element.index % sources.photos.length] : null;
        // No photographs chosen yet: a panel tinted with the brand's secondary colour holds the place.
        items.push(href ? { kind: 'photo', box, href } : { kind: 'fill', role: 'photo-stand-in', box, hex: tint(roleHex(identity, 'secondary'), roleHex(identity, 'background'), 0.45) });
      } else if (element.type === 'text') {
        const face = typefaceForRole(identity, element.face) ?? typefaceForRole(identity, element.face === 'heading' ? 'body' : 'heading');
        const { fontSize, lineHeight } = typeSize(identity, template, element);
        const hex = readableOn(identity, roleHex(identity, element.color), groundUnder(items, box, ground));
        items.push({ kind: 'text', box, text: fillText(identity, element.text), fontFamily: fontStack(face), fontSize, lineHeight, weight: element.weight, hex, align: element.align });
      } else {
        const logo = logoFor(identity, element, options.logoId ?? null);
        if (!logo) continue;
        const on = element.on ? roleHex(identity, element.on) : groundUnder(items, box, ground);
        const placed = placeLogo(template, spec.name, logo, element, on, sources);
        if ('message' in placed) refusals.push(placed);
        else items.push(placed);
      }
    }
    for (const it of items) {
      if (it.kind !== 'logo') continue;
      if (!contains(page, it.clearSpace)) throw new AppError('mockup_template', `The ${template.name} template puts the logo's clear space past the page edge.`, { status: 500 });
      // Nothing but the ground it stands on may enter the clear space: a template that does so is wrong, not the brand.
      const intruder = items.find((o) => o !== it && overlaps(itemBox(o), it.clearSpace) && !(o.kind === 'fill' && o.role === 'panel' && contains(o.box, it.clearSpace)));
      if (intruder) throw new AppError('mockup_template', `The ${template.name} template puts other content inside the logo's clear space.`, { status: 500 });
    }
    pages.push({ name: spec.name, ground, items });
  }
  if (refusals.length) return { ok: false, refusals };
  return { ok: true, layout: { template, unit, trim, pages } };
}

/** The composed layout, or a 422 answer that lists what each refused logo needs. */
export function requireLayout(composed: Composed): MockupLayout {
  if (composed.ok) return composed.layout;
  throw new AppError('mockup_too_small', composed.refusals.map((r) => r.message).join(' '), { status: 422, details: { refusals: composed.refusals } });
}
