// A shelf pattern as the guideline reads it: the settings kept with the tile, checked against the schema and against
// the identity they will be drawn with (its mark and both colours must still be the brand's).
import { findLogo } from '@/lib/guideline/identity';
import type { Identity, IdentityAsset } from '@/lib/identity/types';
import { patternColours } from './colours';
import { patternSettingsSchema, type PatternSettings } from './layout';

/** Settings of a shelf pattern that still draw with this identity, or null. */
export function shelfPatternSettings(identity: Identity, stored: unknown): PatternSettings | null {
  const parsed = patternSettingsSchema.safeParse(stored);
  if (!parsed.success || !findLogo(identity, parsed.data.logoId)) return null;
  return patternColours(identity, parsed.data).ok ? parsed.data : null;
}

/** An approved shelf pattern of the identity by id, or undefined (a draft, deleted, or not a pattern). */
export const shelfPattern = (identity: Identity, id: string | null): IdentityAsset | undefined =>
  id ? (identity.assets ?? []).find((a) => a.id === id && a.kind === 'pattern') : undefined;
