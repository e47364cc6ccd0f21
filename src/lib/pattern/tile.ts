// One pattern tile as a plain SVG: a rectangle of the ground and the one-colour mark placed at every position of the
// layout. No <pattern> element (a tile is what other programs and the mock-ups repeat themselves), and every value
// written is a number we formatted, a hex colour checked here, or the mark already cleaned by the knockout.
import { AppError } from '@/lib/errors';
import type { TileLayout } from './layout';

/** The mark as the knockout made it: a cleaned one-colour SVG, or a one-colour PNG (for raster logos). */
export type TileMark =
  | { format: 'svg'; svg: string; viewBox: { x: number; y: number; width: number; height: number } }
  | { format: 'png'; png: Buffer };

const HEX = /^#[0-9a-f]{6}$/i;
const MARK_ID = 'plumbline-pattern-mark';

/** A number for an attribute: finite, at most three decimals, no exponent. */
export function svgNumber(value: number): string {
  if (!Number.isFinite(value)) throw new AppError('pattern_invalid', 'A pattern value was not a finite number.', { status: 422 });
  const rounded = Math.round(value * 1000) / 1000;
  return (Object.is(rounded, -0) ? 0 : rounded).toFixed(3).replace(/\.?0+$/, '');
}

function hexColour(value: string, what: string): string {
  if (!HEX.test(value)) throw new AppError('pattern_invalid', `The ${what} must be a six-digit hex colour.`, { status: 422 });
  return value.toLowerCase();
}

/** The <symbol> holding the mark, drawn in its own viewBox so each placement only scales and turns it. */
function markSymbol(mark: TileMark, size: { width: number; height: number }): string {
  if (mark.format === 'png') {
    const href = `data:image/png;base64,${mark.png.toString('base64')}`;
    return `<symbol id="${MARK_ID}" viewBox="0 0 ${svgNumber(size.width)} ${svgNumber(size.height)}"><image width="${svgNumber(size.width)}" height="${svgNumber(size.height)}" preserveAspectRatio="none" href="${href}"/></symbol>`;
  }
  const open = /^\s*<svg\b[^>]*>/i.exec(mark.svg);
  const close = mark.svg.lastIndexOf('</svg>');
  if (!open || close < 0) throw new AppError('pattern_invalid', 'The mark is not an SVG drawing.', { status: 422 });
  const { x, y, width, height } = mark.viewBox;
  const viewBox = [x, y, width, height];
  const inner = mark.svg.slice(open.index + open[0].length, close);
  return `<symbol id="${MARK_ID}" viewBox="${viewBox.map(svgNumber).join(' ')}">${inner}</symbol>`;
}

/**
 * The tile: ground, then the mark at every placement (centred, scaled to the layout's mark size, turned), in ink.
 * The ink is already in the mark (the knockout paints it); `opacity` fades the marks toward the ground.
 */
export function tileSvg(layout: TileLayout, mark: TileMark, colours: { ground: string; opacity: number }): string {
  const ground = hexColour(colours.ground, 'ground colour');
  const { width, height } = layout;
  const w = layout.mark.width;
  const h = layout.mark.height;
  const opacity = Math.min(1, Math.max(0, colours.opacity));
  const uses = layout.placements
    .map((p) => {
      const turn = p.rotation ? ` rotate(${svgNumber(p.rotation)})` : '';
      // Both spellings of the reference: SVG 2 readers take href, older desktop tools only xlink:href.
      return `<use href="#${MARK_ID}" xlink:href="#${MARK_ID}" x="${svgNumber(-w / 2)}" y="${svgNumber(-h / 2)}" width="${svgNumber(w)}" height="${svgNumber(h)}" transform="translate(${svgNumber(p.x)} ${svgNumber(p.y)})${turn}"/>`;
    })
    .join('');
  const fade = opacity < 1 ? ` opacity="${svgNumber(opacity)}"` : '';
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="${svgNumber(width)}" height="${svgNumber(height)}" viewBox="0 0 ${svgNumber(width)} ${svgNumber(height)}">` +
    `<defs>${markSymbol(mark, layout.mark)}</defs>` +
    `<rect width="${svgNumber(width)}" height="${svgNumber(height)}" fill="${ground}"/>` +
    `<g${fade}>${uses}</g>` +
    `</svg>`
  );
}
