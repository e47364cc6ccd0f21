// Request bodies for brands and members: strict objects, so an unknown field is an error, not a no-op.
import { z } from 'zod';
import { isOneLine } from '@/lib/safe/values';
import { BRAND_ROLES } from '@/lib/auth/roles';
import { SLUG_PATTERN } from './slug';

export const brandName = z
  .string({ error: 'Give the brand a name.' })
  .trim()
  .min(1, 'Give the brand a name.')
  .max(120, 'A brand name can be at most 120 characters.')
  .refine(isOneLine, 'A brand name must be one line of text, without control characters.');

export const brandSlug = z
  .string()
  .regex(SLUG_PATTERN, 'Use lower-case letters, digits and hyphens (at most 80), starting and ending with a letter or digit.');

export const createBrandBody = z.strictObject({ name: brandName, studioId: z.uuid().optional() });

export const updateBrandBody = z
  .strictObject({ name: brandName.optional(), slug: brandSlug.optional() })
  .refine((b) => b.name !== undefined || b.slug !== undefined, 'Send a name or a slug to change.');

export const brandRole = z.enum(BRAND_ROLES, { error: `Choose one of: ${BRAND_ROLES.join(', ')}.` });

export const addMemberBody = z.strictObject({
  email: z.email('Enter a valid e-mail address.').max(320).transform((e) => e.toLowerCase()),
  role: brandRole,
});

export const updateMemberBody = z.strictObject({ role: brandRole });
