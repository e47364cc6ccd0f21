import sharp from 'sharp';
import { rgb255, type Color } from './parse';

export { PRINT_CAUTION } from '@/lib/cautions';

/** ICC-managed CMYK estimate (libvips' built-in generic CMYK profile) as percentages 0–100 to 1 decimal. */
export async function iccCmyk(hex: string | Color): Promise<[number, number, number, number]> {
  const pixel = Buffer.from(rgb255(hex));
  const out = await sharp(pixel, { raw: { width: 1, height: 1, channels: 3 } })
    .withIccProfile('cmyk')
    .toColourspace('cmyk')
    .raw()
    .toBuffer();
  return [0, 1, 2, 3].map((i) => Math.round((out[i] / 255) * 1000) / 10) as [number, number, number, number];
}
