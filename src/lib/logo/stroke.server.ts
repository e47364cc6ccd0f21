// An estimate of a logo's thinnest stroke, from the runs of drawn pixels in a raster of it.
import sharp from 'sharp';
import type { Box } from './geometry';

/**
 * The thinnest stroke in logo units: the 5th percentile of horizontal and vertical runs of opaque pixels,
 * ignoring one-pixel runs (anti-aliasing). An estimate the designer can correct.
 */
export async function thinnestStroke(drawable: Buffer, canvas: Box, isSvg: boolean): Promise<number> {
  const longest = 800;
  const image = isSvg
    ? sharp(drawable, { density: Math.min(100_000, Math.max(1, (72 * longest) / Math.max(canvas.width, canvas.height))), limitInputPixels: 50_000_000 })
    : sharp(drawable, { limitInputPixels: 50_000_000 });
  const { data, info } = await image.ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  const { width, height, channels } = info;
  const opaque = (x: number, y: number) => data[(y * width + x) * channels + channels - 1] > 127;
  const runs: number[] = [];
  const scan = (outer: number, inner: number, at: (o: number, i: number) => boolean) => {
    for (let o = 0; o < outer; o++) {
      let run = 0;
      for (let i = 0; i <= inner; i++) {
        if (i < inner && at(o, i)) run++;
        else if (run) {
          if (run > 1) runs.push(run);
          run = 0;
        }
      }
    }
  };
  scan(height, width, (y, x) => opaque(x, y));
  scan(width, height, (x, y) => opaque(x, y));
  if (runs.length === 0) return Math.max(canvas.width, canvas.height) / 100;
  runs.sort((a, b) => a - b);
  const px = runs[Math.floor(runs.length * 0.05)];
  return (px * canvas.width) / width;
}
