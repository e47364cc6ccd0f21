// Photographs on the shelf: the crop around the focal point, the widths a page offers, and what the upload inspector
// accepts as a photograph. Each check names its source.
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import { renderRendition } from '@/lib/assets/render.server';
import { focalCrop, imagerySizes, renditionHeight, RENDITION_WIDTHS, srcsetWidths, type PhotoAspect } from '@/lib/assets/photo';
import { inspectUpload, UploadRejection } from '@/lib/uploads/inspect.server';

describe('the crop around the focal point (sharp extract region: left, top, width, height)', () => {
  // Worked example, computed by hand: a 3000 × 2000 photograph cut square is 2000 × 2000. With the subject 60 % across
  // (x = 1800 px) the square is centred on it: left = 1800 − 2000 / 2 = 800, and it ends at 2800, inside the picture.
  test('3000 × 2000 cut to 1:1 around (0.6, 0.5): the square 800–2800 across, the full height', () => {
    expect(focalCrop({ width: 3000, height: 2000 }, '1:1', { x: 0.6, y: 0.5 })).toEqual({ left: 800, top: 0, width: 2000, height: 2000 });
  });
  // Same picture, subject at 90 % across (x = 2700): centring would end at 3700, so the box stops at the right edge
  // (left = 3000 − 2000 = 1000); the subject stays inside it (1000 ≤ 2700 < 3000).
  test('a subject near the edge: the box stops at the edge instead of leaving the picture', () => {
    expect(focalCrop({ width: 3000, height: 2000 }, '1:1', { x: 0.9, y: 0.5 })).toEqual({ left: 1000, top: 0, width: 2000, height: 2000 });
  });
  // 16:9 from 3:2 is limited by the width: 3000 × (9 / 16) = 1687.5 → 1688 px high. Subject 20 % down (y = 400):
  // 400 − 844 < 0, so top = 0; subject 75 % down (y = 1500): 1500 − 844 = 656, past 2000 − 1688 = 312, so top = 312.
  test.each([
    [0.2, 0],
    [0.75, 312],
    [0.5, 156],
  ])('3000 × 2000 cut to 16:9 with the subject at y = %s: top = %s', (y, top) => {
    expect(focalCrop({ width: 3000, height: 2000 }, '16:9', { x: 0.5, y })).toEqual({ left: 0, top, width: 3000, height: 1688 });
  });
  test.each(['4:3', '3:2', '1:1', '16:9', '4:5'] as PhotoAspect[])('every %s box lies inside the picture for any focal point', (aspect) => {
    for (const size of [{ width: 3000, height: 2000 }, { width: 1200, height: 1800 }, { width: 333, height: 333 }]) {
      for (const x of [0, 0.13, 0.5, 0.99, 1]) {
        for (const y of [0, 0.42, 1]) {
          const box = focalCrop(size, aspect, { x, y });
          expect(box.left).toBeGreaterThanOrEqual(0);
          expect(box.top).toBeGreaterThanOrEqual(0);
          expect(box.left + box.width).toBeLessThanOrEqual(size.width);
          expect(box.top + box.height).toBeLessThanOrEqual(size.height);
        }
      }
    }
  });

  test('sharp cuts the subject into the middle of the rendition (a red dot at (0.8, 0.3) of a grey picture, cut 1:1)', async () => {
    // A 1200 × 800 grey picture with a red disc centred at (960, 240); cut square around it, the disc is in the middle.
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="800"><rect width="1200" height="800" fill="#808080"/><circle cx="960" cy="240" r="40" fill="#ff0000"/></svg>`;
    const source = await sharp(Buffer.from(svg)).jpeg({ quality: 95 }).toBuffer();
    const params = { format: 'jpg' as const, width: 480, square: false, padding: 0, background: '#ffffff', variant: 'original' as const, color: null, colorSpace: 'rgb' as const, sizes: null };
    const made = await renderRendition({ bytes: source, format: 'jpeg', drawnBounds: null }, { ...params, focalCrop: { aspect: '1:1', focus: { x: 0.8, y: 0.3 } } });
    const { data, info } = await sharp(made.body).raw().toBuffer({ resolveWithObject: true });
    expect([info.width, info.height]).toEqual([480, 480]);
    // The box is 800 × 800 from left = min(960 − 400, 400) = 400, top 0: the disc centre lands at (560, 240) of 800, i.e. (336, 144) of 480.
    const at = (x: number, y: number) => data[(y * info.width + x) * info.channels];
    expect(at(336, 144)).toBeGreaterThan(200); // red channel of the disc
    expect(at(40, 440)).toBeLessThan(160); // grey elsewhere
  });
});

describe('srcset widths (HTML Living Standard, srcset attributes: a width descriptor is the width of the image in pixels (from memory), so no candidate may claim more than it has)', () => {
  test.each([
    [3000, [480, 960, 1600, 2400]],
    [2667, [480, 960, 1600, 2400]],
    [2000, [480, 960, 1600]],
    [1200, [480, 960]],
    [480, [480]],
    [300, [300]],
  ])('a crop %s px wide offers %j', (cropWidth, widths) => {
    expect(srcsetWidths(cropWidth)).toEqual(widths);
    expect(Math.max(...srcsetWidths(cropWidth))).toBeLessThanOrEqual(cropWidth);
  });
  test('the standard widths are 480, 960, 1600 and 2400 px (common practice: phone, tablet, desk, large desk at 2×)', () => {
    expect([...RENDITION_WIDTHS]).toEqual([480, 960, 1600, 2400]);
  });
  test.each([
    [960, '4:3', 720],
    [1600, '16:9', 900],
    [480, '4:5', 600],
  ] as const)('a %s px rendition in %s is %s px high', (w, aspect, h) => {
    expect(renditionHeight(w, aspect)).toBe(h);
  });
  test('sizes follow the grid: full width on phones, a share of the 952 px column with 16 px gaps on wider screens', () => {
    expect(imagerySizes(1)).toBe('(min-width: 952px) 952px, 100vw');
    // (952 − 2 × 16) / 3 = 306.67 → 306 px.
    expect(imagerySizes(3)).toBe('(min-width: 952px) 306px, (min-width: 640px) 33vw, 100vw');
  });
});

describe('what the shelf accepts as a photograph (the photo row of the upload table)', () => {
  const refusal = async (bytes: Buffer, filename: string) => {
    try {
      await inspectUpload(bytes, { as: 'photo', filename });
      return 'accepted';
    } catch (err) {
      if (!(err instanceof UploadRejection)) throw err;
      return { code: err.code, message: err.message };
    }
  };
  const picture = sharp({ create: { width: 64, height: 48, channels: 3, background: '#a0522d' } });

  test.each([
    ['JPEG', () => picture.clone().jpeg().toBuffer(), 'a.jpg'],
    ['PNG', () => picture.clone().png().toBuffer(), 'a.png'],
    ['WebP', () => picture.clone().webp().toBuffer(), 'a.webp'],
    ['AVIF', () => picture.clone().avif().toBuffer(), 'a.avif'],
  ])('a %s photograph (made by sharp/libvips) is accepted', async (_label, make, filename) => {
    expect(await refusal(await make(), filename)).toBe('accepted');
  });
  test('an SVG drawing sent as a photograph is refused, naming what a photograph may be', async () => {
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>');
    const refused = await refusal(svg, 'mark.svg');
    expect(refused).toMatchObject({ code: 'unsupported_file' });
    expect((refused as { message: string }).message).toContain('A photograph must be JPEG, PNG, WebP or AVIF');
  });
  test('text named .jpg is refused: the type comes from the bytes (JPEG starts FF D8 FF, ITU-T T.81 Annex B)', async () => {
    expect(await refusal(Buffer.from('this is not a picture at all'), 'beans.jpg')).toMatchObject({ code: 'unsupported_file' });
  });
  test('a PNG named .jpg is refused as a name that does not match its bytes', async () => {
    expect(await refusal(await picture.clone().png().toBuffer(), 'beans.jpg')).toMatchObject({ code: 'extension_mismatch' });
  });
  test('a PDF sent as a photograph is refused', async () => {
    const pdf = Buffer.from('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n');
    expect(await refusal(pdf, 'brief.pdf')).toMatchObject({ code: 'unsupported_file' });
  });
});
