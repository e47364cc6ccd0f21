// Request bodies for the identity: colours, logos, typefaces and the type scale.
import { z } from 'zod';
import { SCALE_RATIOS } from '@/lib/type/scale';
import { SHIPPED_FONTS } from '@/lib/type/shipped-fonts';
import { cssColorInput, displayName, fallbackFamily, noteText, singleLine, typefaceFamily } from '@/lib/safe/values';
import { COLOR_ROLES, LIGHT_PARTS, LOGO_VARIANTS, TYPEFACE_ROLES } from './types';

const percent = z.number().min(0, 'CMYK values run from 0 to 100.').max(100, 'CMYK values run from 0 to 100.');
export const cmykSchema = z.tuple([percent, percent, percent, percent], { error: 'Give CMYK as four numbers [c, m, y, k] from 0 to 100.' });

const colorName = displayName('colour', 80);
const colorValue = cssColorInput;
const spot = singleLine('spot reference', 120).nullable();

export const createColorBody = z.strictObject({
  name: colorName,
  value: colorValue,
  role: z.enum(COLOR_ROLES).nullable().optional(),
  cmyk: cmykSchema.nullable().optional(),
  spot: spot.optional(),
});

export const updateColorBody = z
  .strictObject({
    name: colorName.optional(),
    value: colorValue.optional(),
    role: z.enum(COLOR_ROLES).nullable().optional(),
    cmyk: cmykSchema.nullable().optional(),
    spot: spot.optional(),
  })
  .refine((b) => Object.keys(b).length > 0, 'Send at least one field to change.');

export const reorderBody = z.strictObject({ ids: z.array(z.uuid()).min(1).max(500) });

export const logoFields = z.strictObject({
  name: displayName('logo', 120).optional(),
  variant: z.enum(LOGO_VARIANTS, { error: `Choose a variant: ${LOGO_VARIANTS.join(', ')}.` }).default('primary'),
});

const SCREEN_MINIMUM = 'The screen minimum is a whole number of px from 4 to 4000, or empty for the suggestion.';
const PRINT_MINIMUM = 'The print minimum is a number of mm from 1 to 2000, or empty for the suggestion.';

// The logo settings form checks with this same schema, so its words are written for the person at the form.
export const updateLogoBody = z
  .strictObject({
    name: displayName('logo', 120).optional(),
    variant: z.enum(LOGO_VARIANTS).optional(),
    clearSpaceUnit: z.number({ error: 'Type the unit as a number.' }).positive('The clear-space unit must be larger than 0.').max(1e5).optional(),
    clearSpaceLabel: singleLine('clear-space label', 120).min(1, 'Say what the unit is, e.g. “the height of the letter o”.').optional(),
    clearSpaceMultiple: z.number({ error: 'Type the multiple as a number.' }).min(0.25, 'Use a multiple of at least 0.25.').max(10, 'Use a multiple of at most 10.').optional(),
    thinnestStroke: z.number({ error: 'Type the stroke as a number.' }).positive('The thinnest stroke must be larger than 0.').max(1e5).optional(),
    minScreenPx: z.number({ error: SCREEN_MINIMUM }).int(SCREEN_MINIMUM).min(4, SCREEN_MINIMUM).max(4000, SCREEN_MINIMUM).nullable().optional(),
    minPrintMm: z.number({ error: PRINT_MINIMUM }).min(1, PRINT_MINIMUM).max(2000, PRINT_MINIMUM).nullable().optional(),
    lightParts: z.enum(LIGHT_PARTS, { error: `Light parts print as one of: ${LIGHT_PARTS.join(', ')}.` }).optional(),
  })
  .refine((b) => Object.keys(b).length > 0, 'Send at least one field to change.');

const fallback = z.array(fallbackFamily).max(8, 'At most 8 fallback fonts.');

export const shippedTypefaceBody = z.strictObject({
  shipped: z.enum(SHIPPED_FONTS.map((f) => f.key) as [string, ...string[]], { error: 'Pick one of the open fonts Plumbline ships.' }),
  role: z.enum(TYPEFACE_ROLES),
  fallback: fallback.optional(),
});

export const typefaceUploadFields = z.strictObject({
  role: z.enum(TYPEFACE_ROLES, { error: `Choose a role: ${TYPEFACE_ROLES.join(', ')}.` }),
  family: typefaceFamily.optional(),
});

export const updateTypefaceBody = z
  .strictObject({
    role: z.enum(TYPEFACE_ROLES).optional(),
    fallback: fallback.optional(),
    weights: z.array(z.number().int().min(1).max(1000)).max(12).optional(),
    licenceConfirmed: z.boolean().optional(),
    licenceNote: noteText('licence note', 500).transform((v) => v.trim()).nullable().optional(),
  })
  .refine((b) => Object.keys(b).length > 0, 'Send at least one field to change.');

export const typeScaleBody = z.strictObject({
  basePx: z.number().min(10, 'A base size under 10 px is too small to read.').max(32),
  ratioName: z.enum(Object.keys(SCALE_RATIOS) as [string, ...string[]], { error: `Choose a ratio: ${Object.keys(SCALE_RATIOS).join(', ')}.` }),
  stepsUp: z.number().int().min(1).max(10),
  stepsDown: z.number().int().min(0).max(4),
  bodyLineHeight: z.number().min(1).max(2.5),
  headingLineHeight: z.number().min(0.9).max(2),
  columnPx: z.number().int().min(200).max(1600),
});

export const DEFAULT_TYPE_SCALE = {
  basePx: 16,
  ratioName: 'major-third',
  stepsUp: 5,
  stepsDown: 1,
  bodyLineHeight: 1.5,
  headingLineHeight: 1.15,
  columnPx: 600,
} as const;
