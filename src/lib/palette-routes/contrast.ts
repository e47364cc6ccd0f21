// The contrast results shown with each palette route: every text colour on every ground, WCAG 2.2 ratio and verdict.
import { paletteReport, relativeLuminance, rgb255, toColor } from '@/lib/color';
import type { ContrastVerdict, RoutePair, RouteSwatch } from './views';

export { VERDICT_WORDS, type ContrastVerdict, type RoutePair, type RouteSwatch } from './views';

const luminance = (hex: string) => relativeLuminance(rgb255(toColor(hex)));

/**
 * The grounds of a route: its colours with the background role, or, when none has it, the lightest and the darkest
 * colour (what a page would most likely sit on). Every other colour is read as text on each ground.
 */
export function routeGrounds(colors: readonly RouteSwatch[]): RouteSwatch[] {
  const marked = colors.filter((c) => c.role === 'background');
  if (marked.length) return marked;
  if (colors.length < 2) return [...colors];
  const sorted = [...colors].sort((a, b) => luminance(b.hex) - luminance(a.hex));
  return [sorted[0], sorted[sorted.length - 1]];
}

export function verdictOf(levels: { aa: boolean; aaa: boolean; aaLarge: boolean }): ContrastVerdict {
  return levels.aaa ? 'AAA' : levels.aa ? 'AA' : levels.aaLarge ? 'AA large' : 'fails';
}

/** Each text colour on each ground of the route, from the palette report (WCAG 2.2 contrast, compared unrounded). */
export function routeContrast(colors: readonly RouteSwatch[]): RoutePair[] {
  const grounds = routeGrounds(colors);
  const groundIds = new Set(grounds.map((g) => g.id));
  const report = paletteReport(colors.map((c) => ({ id: c.id, name: c.name, hex: c.hex })));
  const out: RoutePair[] = [];
  for (const ground of grounds) {
    for (const text of colors) {
      if (groundIds.has(text.id)) continue;
      const pair = report.pairs.find((p) => p.foreground.id === text.id && p.background.id === ground.id)!;
      out.push({ text: text.id, ground: ground.id, ratio: pair.ratio, shown: (Math.floor(pair.ratio * 100) / 100).toFixed(2), verdict: verdictOf(pair) });
    }
  }
  return out;
}
