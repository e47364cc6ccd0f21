import sharp from 'sharp';
import { LogoError, requireSize } from './errors';
import type { Box } from './geometry';
import { toSanitizedSvg } from './sanitize';

export interface DrawnBounds {
  /** Bounding box of the drawn (non-transparent) pixels, in the logo's units: viewBox units for SVG, px for rasters. */
  box: Box;
  /** The same box as fractions (0–1) of the canvas (viewBox or image). */
  fraction: Box;
  /** The canvas the fractions refer to, in the logo's units. */
  canvas: Box;
  /** Size of the raster that was scanned, in pixels. */
  raster: { width: number; height: number };
}

export interface DrawnBoundsOptions {
  /** Alpha (0–255) above which a pixel counts as drawn; default 8 ignores faint anti-aliasing. */
  alphaThreshold?: number;
  /** Longest side of the raster an SVG is drawn at; default 1200 px. */
  resolutionPx?: number;
}

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47]);

/** Draws an SVG at its viewBox aspect, longest side resolutionPx, returning raw RGBA and the viewBox. */
async function rasteriseSvg(text: string, resolutionPx: number) {
  const clean = toSanitizedSvg(text);
  const { viewBox } = clean;
  // Width and height set to the viewBox size so one raster pixel maps linearly onto viewBox units.
  const sized = clean.svg.replace(/^<svg\b([^>]*)>/i, (_m, attrs: string) => {
    const rest = attrs.replace(/\s(width|height|preserveAspectRatio)\s*=\s*"[^"]*"/gi, '');
    return `<svg${rest} width="${viewBox.width}" height="${viewBox.height}" preserveAspectRatio="none">`;
  });
  const density = Math.min(100_000, Math.max(1, (72 * resolutionPx) / Math.max(viewBox.width, viewBox.height)));
  const { data, info } = await sharp(Buffer.from(sized), { density, limitInputPixels: 50_000_000 })
    .ensureAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { data, info, canvas: viewBox };
}

/** Finds the box of pixels drawn with alpha above a threshold: the logo's real extent inside its canvas. */
export async function drawnBounds(input: Buffer | string, options: DrawnBoundsOptions = {}): Promise<DrawnBounds> {
  const threshold = requireSize(options.alphaThreshold ?? 8, 'The alpha threshold', true);
  const resolutionPx = requireSize(options.resolutionPx ?? 1200, 'The raster resolution');
  if (threshold > 254) throw new LogoError('invalid_input', 'The alpha threshold must be below 255.');
  const isRaster = Buffer.isBuffer(input) && input.subarray(0, 4).equals(PNG_SIGNATURE);
  let raster: { data: Buffer; info: sharp.OutputInfo; canvas?: Box };
  try {
    raster = isRaster
      ? await sharp(input, { limitInputPixels: 50_000_000 }).ensureAlpha().raw().toBuffer({ resolveWithObject: true })
      : await rasteriseSvg(Buffer.isBuffer(input) ? input.toString('utf8') : input, resolutionPx);
  } catch (error) {
    if (error instanceof LogoError) throw error;
    throw new LogoError('logo_unreadable', `The logo could not be drawn (${(error as Error).message}).`);
  }
  const { data, info } = raster;
  const canvas: Box = raster.canvas ?? { x: 0, y: 0, width: info.width, height: info.height };
  const { width, height, channels } = info;
  let [minX, minY, maxX, maxY] = [width, height, -1, -1];
  for (let y = 0; y < height; y++) {
    const row = y * width * channels;
    for (let x = 0; x < width; x++) {
      if (data[row + x * channels + channels - 1] > threshold) {
        if (x < minX) minX = x;
        if (x > maxX) maxX = x;
        if (y < minY) minY = y;
        if (y > maxY) maxY = y;
      }
    }
  }
  if (maxX < 0) throw new LogoError('logo_empty', 'The logo draws nothing visible: every pixel is transparent.');
  const fraction = { x: minX / width, y: minY / height, width: (maxX + 1 - minX) / width, height: (maxY + 1 - minY) / height };
  const box = {
    x: canvas.x + fraction.x * canvas.width,
    y: canvas.y + fraction.y * canvas.height,
    width: fraction.width * canvas.width,
    height: fraction.height * canvas.height,
  };
  return { box, fraction, canvas, raster: { width, height } };
}
