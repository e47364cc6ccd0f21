// A repeat built from the brand mark; the defaults stay quiet (sparse, small, faint) so it supports, not shouts.
import * as z from 'zod';
import { refIdSchema } from '@/lib/guideline/ids';
import { PATTERN_LAYOUTS, patternSettingsSchema, PATTERN_LIMITS, type PatternSettings } from '@/lib/pattern/layout';
import { defineBlock } from '@/blocks/define';
import type { Identity, IdentityAsset } from '@/lib/identity/types';
import { shelfPattern, shelfPatternSettings } from '@/lib/pattern/shelf';

const num = (what: string, min: number, max: number, fallback: number) =>
  z.number({ error: `${what} must be a number.` }).min(min, { error: `${what} must be at least ${min}.` }).max(max, { error: `${what} must be at most ${max}.` }).default(fallback);

export const patternBlock = defineBlock({
  type: 'pattern',
  order: 110,
  label: 'Pattern',
  description: 'A seamless repeat of the brand mark: layout, size, spacing, turn and palette colours.',
  group: 'imagery',
  fields: {
    /** A lasting link to an approved shelf pattern: while set, the block draws that pattern's own settings, not the ones below. */
    patternId: refIdSchema('asset').nullable().default(null),
    logoId: refIdSchema('logo').nullable().default(null),
    /** How the marks repeat (the pattern generator's layouts). */
    layout: z.enum(PATTERN_LAYOUTS, { error: `layout must be one of ${PATTERN_LAYOUTS.join(', ')}.` }).default('brick'),
    /** Height of one mark in CSS px. */
    scale: num('scale', 8, 160, 20),
    /** Gap between marks as a multiple of the mark's height. */
    spacing: num('spacing', 0.25, 8, 3),
    /** Turn of each mark about its centre, in degrees. */
    rotation: num('rotation', -180, 180, 0),
    /** Seed of the scatter layout: the same seed draws the same tile. */
    seed: z.number({ error: 'seed must be a number.' }).int({ error: 'seed must be a whole number.' }).min(0).max(PATTERN_LIMITS.seed.max).default(1),
    /** Kept for documents saved before layouts: the shift of every other row (0 read as a grid, anything else as brick). */
    offset: num('offset', 0, 1, 0.5),
    opacity: num('opacity', 0.05, 1, 0.18),
    backgroundColorId: refIdSchema('colour').nullable().default(null),
    markColorId: refIdSchema('colour').nullable().default(null),
    height: num('height', 80, 600, 220),
  },
  refs: { patternId: 'asset', logoId: 'logo', backgroundColorId: 'colour', markColorId: 'colour' },
  starter: { logoId: '$mark', backgroundColorId: '$background', markColorId: '$primary' },
  // Before layouts, a row shift of 0 drew a plain grid and any other shift rows across: keep what those drafts showed.
  fromStored: (attrs) => {
    if (!attrs || typeof attrs !== 'object' || 'layout' in attrs) return attrs;
    const offset = (attrs as { offset?: unknown }).offset;
    return { ...attrs, layout: offset === 0 ? 'grid' : 'brick' };
  },
});
export const patternSchema = patternBlock.schema;
export type PatternAttrs = ReturnType<typeof patternSchema.parse>;

/**
 * What the block draws: the linked shelf pattern's settings while it links one (`missing` when that pattern is no longer
 * approved on the shelf, or no longer draws with this identity), else its own settings.
 */
export function drawnPatternSettings(attrs: PatternAttrs, identity: Identity): { settings: PatternSettings | null; linked: IdentityAsset | null; missing: boolean } {
  if (!attrs.patternId) return { settings: blockPatternSettings(attrs), linked: null, missing: false };
  const linked = shelfPattern(identity, attrs.patternId) ?? null;
  const settings = linked ? shelfPatternSettings(identity, linked.pattern) : null;
  return { settings, linked, missing: !settings };
}

/** The generator's settings for this block (the same tile the export and the shelf draw), or null without a mark. */
export function blockPatternSettings(attrs: PatternAttrs): PatternSettings | null {
  if (!attrs.logoId) return null;
  const parsed = patternSettingsSchema.safeParse({
    logoId: attrs.logoId,
    layout: attrs.layout,
    scale: attrs.scale,
    spacing: attrs.spacing,
    rotation: attrs.rotation,
    seed: attrs.seed,
    groundColorId: attrs.backgroundColorId,
    inkColorId: attrs.markColorId,
    opacity: attrs.opacity,
  });
  return parsed.success ? parsed.data : null;
}

const clamp = (v: number, min: number, max: number) => Math.min(max, Math.max(min, v));

/** Block attributes from the settings of a shelf pattern (its size and gap held to what the block allows), or null when they do not read. */
export function attrsFromPatternSettings(stored: unknown): Partial<PatternAttrs> | null {
  const parsed = patternSettingsSchema.safeParse(stored);
  if (!parsed.success) return null;
  const s = parsed.data;
  return {
    logoId: s.logoId,
    layout: s.layout,
    scale: clamp(s.scale, 8, 160),
    spacing: clamp(s.spacing, 0.25, 8),
    rotation: s.rotation,
    seed: s.seed,
    backgroundColorId: s.groundColorId,
    markColorId: s.inkColorId,
    opacity: s.opacity,
  };
}

export default patternBlock;
