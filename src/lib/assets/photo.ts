// Photographs on the shelf: the focal point, the crop around it for a block's aspect ratio, and the widths a page offers.
// Pure and browser-safe: the shelf island, the imagery block and the published site's files route share it.
import { z } from 'zod';

/** Where the subject of a photograph sits, as fractions of its width and height (0,0 top left; 1,1 bottom right). */
export interface FocalPoint {
  x: number;
  y: number;
}

/** The middle of the picture: where a photo without a chosen focal point is cropped around. */
export const CENTRE: FocalPoint = { x: 0.5, y: 0.5 };

/** Longest alt text and caption a photograph keeps (alt text is a sentence or two, common practice). */
export const ALT_TEXT_MAX = 300;
export const CAPTION_MAX = 500;

/** The message when an approved photo would be without alt text (WCAG 2.2 SC 1.1.1 Non-text Content). */
export const ALT_TEXT_REQUIRED =
  'A photograph needs alt text before it is approved: describe what it shows for people who cannot see it (WCAG 2.2, 1.1.1). Add it under “Photo details”.';

export const focalPointSchema = z.strictObject({
  x: z.number({ error: 'The focal point’s x must be a number from 0 to 1.' }).min(0, 'x is at least 0').max(1, 'x is at most 1'),
  y: z.number({ error: 'The focal point’s y must be a number from 0 to 1.' }).min(0, 'y is at least 0').max(1, 'y is at most 1'),
});

/** The aspect ratios a photograph is cut to in a guideline (common practice for photography: 4:3, 3:2, 1:1, 16:9, 4:5). */
export const PHOTO_ASPECTS = ['4:3', '3:2', '1:1', '16:9', '4:5'] as const;
export type PhotoAspect = (typeof PHOTO_ASPECTS)[number];

/** An aspect ratio as it travels in a file address ("4x3"), since ":" is awkward in a query. */
export const aspectParam = (aspect: PhotoAspect) => aspect.replace(':', 'x');
export function aspectFromParam(value: string | null): PhotoAspect | null {
  const aspect = (value ?? '').replace('x', ':');
  return (PHOTO_ASPECTS as readonly string[]).includes(aspect) ? (aspect as PhotoAspect) : null;
}
const ratioOf = (aspect: PhotoAspect) => {
  const [w, h] = aspect.split(':').map(Number);
  return { w, h };
};

/** The widths a published page offers a photograph in (px); a rendition is never wider than its crop. */
export const RENDITION_WIDTHS = [480, 960, 1600, 2400] as const;

export interface CropBox {
  left: number;
  top: number;
  width: number;
  height: number;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/**
 * The largest box of the given aspect ratio inside a width × height picture, centred on the focal point as far as the
 * picture's edges allow (sharp's `extract` region: whole pixels, inside the image).
 */
export function focalCrop(size: { width: number; height: number }, aspect: PhotoAspect, focus: FocalPoint = CENTRE): CropBox {
  const { w, h } = ratioOf(aspect);
  const wider = size.width * h > size.height * w;
  const width = wider ? Math.min(size.width, Math.round((size.height * w) / h)) : size.width;
  const height = wider ? size.height : Math.min(size.height, Math.round((size.width * h) / w));
  const left = clamp(Math.round(clamp(focus.x, 0, 1) * size.width - width / 2), 0, size.width - width);
  const top = clamp(Math.round(clamp(focus.y, 0, 1) * size.height - height / 2), 0, size.height - height);
  return { left, top, width, height };
}

/** Height of a rendition `width` px wide in the given aspect ratio. */
export const renditionHeight = (width: number, aspect: PhotoAspect) => {
  const { w, h } = ratioOf(aspect);
  return Math.round((width * h) / w);
};

/** The widths offered for a crop `cropWidth` px wide: the standard ones that fit, or the crop itself when it is smaller than all. */
export function srcsetWidths(cropWidth: number): number[] {
  const fit = RENDITION_WIDTHS.filter((w) => w <= cropWidth);
  return fit.length ? fit : [Math.max(1, Math.floor(cropWidth))];
}

/** The published site's reading column (max-w-guideline) and the imagery grid's gap (gap-4), in CSS px. */
const COLUMN_PX = 952;
const GAP_PX = 16;

/** The `sizes` of a photograph in an imagery grid of `columns` columns (one column below Tailwind's sm, 640 px). */
export function imagerySizes(columns: number): string {
  const c = Math.max(1, Math.round(columns));
  const wide = Math.floor((COLUMN_PX - GAP_PX * (c - 1)) / c);
  return c === 1 ? `(min-width: ${COLUMN_PX}px) ${COLUMN_PX}px, 100vw` : `(min-width: ${COLUMN_PX}px) ${wide}px, (min-width: 640px) ${Math.floor(100 / c)}vw, 100vw`;
}

/** CSS object-position for a focal point, so a preview cropped by the browser keeps the same subject. */
export const objectPosition = (focus: FocalPoint | null | undefined) => `${Math.round((focus?.x ?? 0.5) * 100)}% ${Math.round((focus?.y ?? 0.5) * 100)}%`;
