// The one place a mock-up asks for the brand's pattern: the settings of the brand's shelf pattern when it keeps one,
// else a quiet default cut from the mark. The server draws them with the pattern generator (`patternTile()`); the
// guideline page draws the same layout from the mark's one-colour file. Pure: no database, no files.
import type { Identity } from '@/lib/identity/types';
import { colorForRole, findLogo, markLogo } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import { patternColours } from '@/lib/pattern/colours';
import { patternLayout, patternSettingsSchema, type PatternSettings, type TileLayout } from '@/lib/pattern/layout';
import { shelfPatternSettings } from '@/lib/pattern/shelf';
import { contrastRatio } from '@/lib/color/contrast';
import { storedHexOr } from './colour';

export interface MockupPattern {
  /** The generator's settings, or null when the brand has no logo yet (a plain field then). */
  settings: PatternSettings | null;
  /** The shelf pattern the settings come from, or null for the default cut from the mark. */
  assetId: string | null;
  /** The ground: under the tile, and the whole field where no tile can be drawn. */
  hex: string;
}

/** How a pattern area is filled: one tile the generator drew (server), or the mark's file placed by the layout (page). */
export type PatternFill =
  | { kind: 'tile'; href: string; width: number; height: number }
  | { kind: 'marks'; href: string; ink: string; opacity: number; layout: TileLayout };

/** The default pattern cut from the mark: a half-drop, marks as tall as a line of display type, a mark's height apart. */
export const DEFAULT_MOCKUP_PATTERN = { layout: 'half-drop', scale: 22, spacing: 0.9, rotation: 0, seed: 1, opacity: 1 } as const;

/** The brand's pattern for mock-ups: its first approved shelf pattern that still draws, else the default from the mark. */
export function mockupPattern(identity: Identity): MockupPattern {
  for (const asset of identity.assets ?? []) {
    if (asset.kind !== 'pattern') continue;
    const settings = shelfPatternSettings(identity, asset.pattern);
    if (settings) return { settings, assetId: asset.id, hex: groundHex(identity, settings) };
  }
  const mark = markLogo(identity);
  // The field the pieces had before patterns: secondary, accent, then primary; the mark in the colour that stands out most on it.
  const field = colorForRole(identity, 'secondary') ?? colorForRole(identity, 'accent') ?? colorForRole(identity, 'primary');
  if (!mark || !field) return { settings: null, assetId: null, hex: storedHexOr(field?.hex, '#d9d4c7') };
  const ink = inkOn(identity, field.id);
  // A one-colour palette has no ink to set on its only colour: a plain field.
  if (!ink) return { settings: null, assetId: null, hex: storedHexOr(field.hex.slice(0, 7), '#d9d4c7') };
  const parsed = patternSettingsSchema.safeParse({ ...DEFAULT_MOCKUP_PATTERN, logoId: mark.id, groundColorId: field.id, inkColorId: ink });
  const settings = parsed.success ? parsed.data : null;
  return { settings, assetId: null, hex: storedHexOr(field.hex.slice(0, 7), '#d9d4c7') };
}

/** The palette colour (not the ground itself) that contrasts most with the ground (WCAG 2.2 ratio): primary, text or background. */
function inkOn(identity: Identity, groundId: string): string | null {
  const ground = identity.colors.find((c) => c.id === groundId);
  const candidates = (['primary', 'text', 'background'] as const).flatMap((role) => colorForRole(identity, role) ?? []).filter((c) => c.id !== groundId);
  if (!ground || !candidates.length) return null;
  const against = (hex: string) => contrastRatio(storedHexOr(hex.slice(0, 7), '#808080'), storedHexOr(ground.hex.slice(0, 7), '#808080'));
  return candidates.reduce((best, c) => (against(c.hex) > against(best.hex) ? c : best)).id;
}

function groundHex(identity: Identity, settings: PatternSettings): string {
  const picked = patternColours(identity, settings);
  return storedHexOr(picked.ok ? picked.colours.ground.hex.slice(0, 7) : undefined, '#d9d4c7');
}

/** The page's drawing of the pattern: the mark's one-colour file at every placement of the generator's layout, tinted with the ink. */
export function pagePatternFill(identity: Identity, pattern: MockupPattern): PatternFill | null {
  if (!pattern.settings) return null;
  const logo = findLogo(identity, pattern.settings.logoId);
  const href = safeAssetUrl(logo?.files.black);
  const picked = patternColours(identity, pattern.settings);
  if (!logo || !href || !picked.ok) return null;
  return {
    kind: 'marks',
    href,
    ink: storedHexOr(picked.colours.ink.hex.slice(0, 7), '#333333'),
    opacity: pattern.settings.opacity,
    layout: patternLayout(pattern.settings, logo.canvas.width / logo.canvas.height),
  };
}
