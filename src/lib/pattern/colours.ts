// The two colours of a pattern, always from the brand's palette: the ground and the ink of the mark.
import { colorForRole, findColor } from '@/lib/guideline/identity';
import type { Identity, IdentityColor } from '@/lib/identity/types';

export interface PatternColours {
  ground: IdentityColor;
  ink: IdentityColor;
}

export type PatternColoursResult = { ok: true; colours: PatternColours } | { ok: false; code: 'pattern_colour_missing' | 'pattern_needs_palette'; message: string };

/**
 * Ground and ink by id, or by role when none is chosen (background and primary, then the lightest and darkest):
 * never a colour from outside the palette. A chosen colour that is no longer in the palette is an error, not a guess.
 */
export function patternColours(identity: Identity, chosen: { groundColorId: string | null; inkColorId: string | null }): PatternColoursResult {
  if (!identity.colors.length) return { ok: false, code: 'pattern_needs_palette', message: 'Add colours to the palette first: a pattern takes its ground and ink from it.' };
  const pick = (id: string | null, fallback: () => IdentityColor | undefined) => (id ? findColor(identity, id) : fallback());
  const ground = pick(chosen.groundColorId, () => colorForRole(identity, 'background'));
  const ink = pick(chosen.inkColorId, () => {
    const primary = colorForRole(identity, 'primary');
    return primary && primary.id !== ground?.id ? primary : colorForRole(identity, 'text');
  });
  if (!ground || !ink) {
    const which = !ground ? 'ground' : 'ink';
    return { ok: false, code: 'pattern_colour_missing', message: `The ${which} colour is no longer in the palette: choose another.` };
  }
  return { ok: true, colours: { ground, ink } };
}
