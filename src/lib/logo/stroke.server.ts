// An estimate of a logo's thinnest stroke, from the runs of drawn pixels in a raster of it.
import sharp from 'sharp';
import type { Box } from './geometry';

/**
 * The thinnest stroke in logo units: the 5th percentile of horizontal and vertical runs of one paint
 * (an opaque pixel of one colour; a change of colour ends a run too, so a ring drawn on a disc counts),
 * ignoring runs under 3 px (anti-aliased edges). An estimate the designer can correct.
 */
export async function thinnestStroke(drawable: Buffer, canvas: Box, isSvg: boolean): Promise<number> {
  const longest = 800;
  const image = isSvg
    ? sharp(drawable, { density: Math.min(100_000, Math.max(1, (72 * longest) / Math.max(canvas.width, canvas.height))), limitInputPixels: 50_000_000 })
    : sharp(drawable, { limitInputPixels: 50_000_000 });
  const { data, info } = await image.ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  const { width, height, channels } = info;
  // The paint of a pixel: -1 when transparent, else its colour quantised to 4 bits a channel.
  const paint = (x: number, y: number) => {
    const at = (y * width + x) * channels;
    if (data[at + channels - 1] <= 127) return -1;
    return ((data[at] >> 4) << 8) | ((data[at + 1] >> 4) << 4) | (data[at + 2] >> 4);
  };
  const runs: number[] = [];
  const scan = (outer: number, inner: number, at: (o: number, i: number) => number) => {
    for (let o = 0; o < outer; o++) {
      let run = 0;
      let current = -1;
      for (let i = 0; i <= inner; i++) {
        const p = i < inner ? at(o, i) : -1;
        if (p === current && p !== -1) {
          run++;
          continue;
        }
        if (current !== -1 && run >= 3) runs.push(run);
        current = p;
        run = p === -1 ? 0 : 1;
      }
    }
  };
  scan(height, width, (y, x) => paint(x, y));
  scan(width, height, (x, y) => paint(x, y));
  if (runs.length === 0) return Math.max(canvas.width, canvas.height) / 100;
  runs.sort((a, b) => a - b);
  const px = runs[Math.floor(runs.length * 0.05)];
  return (px * canvas.width) / width;
}
