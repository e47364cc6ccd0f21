// Photographs with a do or don't verdict; src is an asset id (assets arrive later) or a plain web address.
import * as z from 'zod';
import { refIdSchema } from '../ids';
import { defineBlock, text } from './define';

export const IMAGE_VERDICTS = ['do', 'dont'] as const;

/** An image source: an asset id, an https:// address or a path on our own site. */
export const imageSrcSchema = z.union([refIdSchema('asset'), z.string().max(2048).regex(/^(https:\/\/[^\s"'<>]+|\/[^\s"'<>/][^\s"'<>]*)$/)], {
  error: 'An image must be an asset id, an https:// address or a path starting with "/".',
});

export const imageItemSchema = z.strictObject({
  src: imageSrcSchema,
  alt: text(300),
  verdict: z.enum(IMAGE_VERDICTS, { error: 'The verdict must be "do" or "dont".' }).default('do'),
  caption: text(500),
});
export type ImageItem = z.output<typeof imageItemSchema>;

export const imageryBlock = defineBlock({
  type: 'imagery',
  label: 'Imagery',
  description: 'Photographs with do and don’t notes.',
  group: 'imagery',
  fields: {
    items: z.array(imageItemSchema).max(24, { error: 'At most 24 images.' }).default(() => []),
    columns: z.number({ error: 'columns must be a number.' }).int().min(1).max(4).default(3),
  },
});
export const imagerySchema = imageryBlock.schema;
export type ImageryAttrs = ReturnType<typeof imagerySchema.parse>;
