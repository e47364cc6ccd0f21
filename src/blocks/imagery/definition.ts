// Photographs with a do or don't verdict. Every image comes from the brand's own asset shelf (an asset id, chosen in a
// picker of approved photographs); a name that is not yet an asset ("photo-to-come-1") shows as a frame. Outside
// addresses are never fetched.
import * as z from 'zod';
import { PHOTO_ASPECTS } from '@/lib/assets/photo';
import { assetRef } from '@/lib/safe/values';
import { refIdSchema } from '@/lib/guideline/ids';
import { defineBlock, text } from '@/blocks/define';

export const IMAGE_VERDICTS = ['do', 'dont'] as const;

/** Looks like an address (a scheme, "//host" or a path) rather than a shelf reference. */
export const looksLikeAddress = (value: string) => /^[a-z][a-z0-9+.-]*:|^\s*[/\\]|[/\\]/i.test(value.trim());

export const OUTSIDE_IMAGE_MESSAGE = 'Images come from the brand’s asset shelf; outside addresses are not accepted. Upload the file on the Assets page and choose it here.';

/** An image source: a shelf asset id, or a placeholder name for an image to come; never an address. */
export const imageSrcSchema = z
  .string({ error: 'Choose an image from the brand’s asset shelf.' })
  .refine((v) => !looksLikeAddress(v), { error: OUTSIDE_IMAGE_MESSAGE, abort: true })
  .pipe(z.union([assetRef, refIdSchema('asset')], { error: 'Choose an image from the brand’s asset shelf (an asset id).' }));

export const imageItemSchema = z.strictObject({
  src: imageSrcSchema,
  alt: text(300),
  verdict: z.enum(IMAGE_VERDICTS, { error: 'The verdict must be "do" or "dont".' }).default('do'),
  caption: text(500),
});
export type ImageItem = z.output<typeof imageItemSchema>;

/** Placeholder that stands in for an outside address found in a stored draft (saved before the shelf rule). */
export const OUTSIDE_IMAGE_PLACEHOLDER = 'outside-image-removed';

/** Stored imagery attributes with every outside address replaced by the placeholder, so nothing is ever fetched. */
export function withoutOutsideImages(attrs: unknown): unknown {
  if (!attrs || typeof attrs !== 'object' || !Array.isArray((attrs as { items?: unknown }).items)) return attrs;
  const items = (attrs as { items: unknown[] }).items.map((item) => {
    if (!item || typeof item !== 'object') return item;
    const src = (item as { src?: unknown }).src;
    return typeof src === 'string' && imageSrcSchema.safeParse(src).success ? item : { ...item, src: OUTSIDE_IMAGE_PLACEHOLDER };
  });
  return { ...attrs, items };
}

export const imageryBlock = defineBlock({
  type: 'imagery',
  order: 100,
  label: 'Imagery',
  description: 'Photographs with do and don’t notes.',
  group: 'imagery',
  fields: {
    items: z.array(imageItemSchema).max(24, { error: 'At most 24 images.' }).default(() => []),
    columns: z.number({ error: 'columns must be a number.' }).int().min(1).max(4).default(3),
    /** The shape every photograph is cut to, around its focal point (drafts saved before this field read as 4:3). */
    aspect: z.enum(PHOTO_ASPECTS, { error: `The aspect ratio must be one of ${PHOTO_ASPECTS.join(', ')}.` }).default('4:3'),
  },
  refs: { items: { src: 'image' } },
  fromStored: withoutOutsideImages,
});
export const imagerySchema = imageryBlock.schema;
export type ImageryAttrs = ReturnType<typeof imagerySchema.parse>;

export default imageryBlock;
