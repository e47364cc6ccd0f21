// Mock-ups printed by Chromium and read back: PDF page sizes with pdf-lib (trim + 2 × 3 mm bleed; ISO 216 A4, ISO 269 DL,
// US Letter 8.5 × 11 in from ANSI/ASME Y14.1, 1 in = 25.4 mm, 1 pt = 1/72 in), trim and bleed boxes (ISO 32000-1
// §14.11.2), crop marks sampled from Ghostscript's own rendering (png16m), screen PNGs measured with sharp.
// The demo logos are measured as the seed measures them. Needs Chromium and Ghostscript.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PDFDocument } from 'pdf-lib';
import sharp from 'sharp';
import { beforeAll, describe, expect, test } from 'vitest';
import type { Identity, IdentityLogo } from '@/lib/identity/types';
import { drawnBounds } from '@/lib/logo/bounds.server';
import { clearSpace } from '@/lib/logo/clear-space';
import { minimumSize } from '@/lib/logo/minimum-size';
import { toSanitizedSvg } from '@/lib/logo/sanitize';
import { thinnestStroke } from '@/lib/logo/stroke.server';
import { fontFaceCss } from '@/lib/guideline/identity';
import { composeMockup, requireLayout, type MockupLayout } from '@/lib/mockups/compose';
import { mockupTemplate } from '@/lib/mockups/templates';
import { FIT_FLOOR, fitText, mockupPdf, mockupPng } from '@/lib/mockups/render.server';
import { printBrowser, releaseBrowser } from '@/lib/logo/print-files.server';
import { mockupPattern } from '@/lib/mockups/pattern';
import { patternTile } from '@/lib/pattern/pattern.server';

const fixture = JSON.parse(readFileSync('tests/fixtures/identity-larchmere.json', 'utf8')) as Identity;
// MOCKUP_OUT keeps the files for a person to look at; otherwise a fresh temporary folder.
const out = process.env.MOCKUP_OUT || mkdtempSync(join(tmpdir(), 'plumbline-mockups-'));
const PT = (mm: number) => (mm / 25.4) * 72;
const dataUri = (bytes: Buffer, type: string) => `data:${type};base64,${bytes.toString('base64')}`;

/** A demo logo measured as the seed does: drawn bounds, thinnest stroke, clear space of a fraction of its height. */
async function demoLogo(file: string, variant: IdentityLogo['variant'], unitOf: number): Promise<{ logo: IdentityLogo; uri: string }> {
  const clean = toSanitizedSvg(readFileSync(join('db/seeders/files', file), 'utf8'));
  const bytes = Buffer.from(clean.svg);
  const bounds = (await drawnBounds(bytes)).box;
  const stroke = await thinnestStroke(bytes, clean.viewBox, true);
  const unitSize = bounds.height * unitOf;
  const min = minimumSize({ logoWidthUnits: bounds.width, thinnestStrokeUnits: stroke });
  const uri = dataUri(bytes, 'image/svg+xml');
  return {
    uri,
    logo: {
      id: file,
      name: file,
      variant,
      format: 'svg',
      canvas: clean.viewBox,
      bounds,
      clearSpace: { unitSize, unitLabel: 'a fraction of the height', multiple: 1, box: clearSpace({ bounds, unitSize, multiple: 1 }) },
      minimumSize: { thinnestStroke: stroke, suggested: min, screenPx: min.screenPx, printMm: min.printMm },
      files: { original: uri, black: uri, white: uri, reversed: uri },
      position: variant === 'primary' ? 0 : 1,
    },
  };
}

let identity: Identity;
let fontCss: string;
const layoutOf = (key: string): MockupLayout => requireLayout(composeMockup(mockupTemplate(key)!, identity, { logo: (l, f) => l.files[f] ?? l.files.original, photos: [] }));

beforeAll(async () => {
  const lockup = await demoLogo('larchmere-lockup.svg', 'primary', 0.38);
  const mark = await demoLogo('larchmere-mark.svg', 'mark', 0.25);
  identity = { ...fixture, logos: [lockup.logo, mark.logo] };
  // The brand's own faces, shipped with the app (SIL OFL), embedded as the server does.
  const file = { heading: 'node_modules/@fontsource-variable/dm-sans/files/dm-sans-latin-wght-normal.woff2', body: 'node_modules/@fontsource-variable/source-serif-4/files/source-serif-4-latin-wght-normal.woff2' };
  fontCss = fontFaceCss(identity.typefaces.map((f) => ({ ...f, fileUrl: dataUri(readFileSync(file[f.role as 'heading' | 'body']), 'font/woff2') })));
});

/** Page count, media, bleed and trim boxes of every page. */
async function boxes(pdf: Buffer) {
  const doc = await PDFDocument.load(pdf);
  return doc.getPages().map((p) => ({ media: p.getMediaBox(), bleed: p.getBleedBox(), trim: p.getTrimBox() }));
}

describe.each([
  { key: 'letterhead-a4', trim: [210, 297], pages: 1, source: 'ISO 216 A4' },
  { key: 'envelope-dl', trim: [220, 110], pages: 1, source: 'ISO 269 DL' },
  { key: 'letterhead-letter', trim: [215.9, 279.4], pages: 1, source: 'ANSI/ASME Y14.1 size A, 8.5 × 11 in' },
  { key: 'business-card', trim: [85, 55], pages: 2, source: 'common practice in Europe, 85 × 55 mm' },
  { key: 'editorial-spread', trim: [210, 297], pages: 3, source: 'ISO 216 A4, three pages' },
])('the $key PDF ($source)', ({ key, trim, pages }) => {
  let pdf: Buffer;
  beforeAll(async () => {
    pdf = await mockupPdf(layoutOf(key), fontCss);
    writeFileSync(join(out, `${key}.pdf`), pdf);
  }, 60_000);

  test('every page is the trim plus 3 mm bleed on each side, with the trim box inside it', async () => {
    const read = await boxes(pdf);
    expect(read).toHaveLength(pages);
    for (const { media, bleed, trim: t } of read) {
      expect(media.width).toBeCloseTo(PT(trim[0] + 6), 2);
      expect(media.height).toBeCloseTo(PT(trim[1] + 6), 2);
      expect(bleed).toEqual(media);
      expect(t.width).toBeCloseTo(PT(trim[0]), 2);
      expect(t.height).toBeCloseTo(PT(trim[1]), 2);
      expect(t.x - media.x).toBeCloseTo(PT(3), 2);
      expect(t.y - media.y).toBeCloseTo(PT(3), 2);
    }
  });
});

/** Ghostscript's rendering of one page, as raw RGB with a reader in millimetres from the page's top left. */
async function rasterise(pdf: Buffer, page: number, dpi: number) {
  const file = join(out, `page-${page}.pdf`);
  writeFileSync(file, pdf);
  const png = join(out, `card-page-${page}.png`);
  execFileSync(process.env.GHOSTSCRIPT_PATH || '/usr/bin/gs', ['-q', '-dSAFER', '-dBATCH', '-dNOPAUSE', '-sDEVICE=png16m', `-r${dpi}`, `-dFirstPage=${page}`, `-dLastPage=${page}`, `-sOutputFile=${png}`, file]);
  const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
  const px = (mm: number) => Math.round((mm / 25.4) * dpi);
  const at = (xMm: number, yMm: number) => {
    const i = (px(yMm) * info.width + px(xMm)) * info.channels;
    return [data[i], data[i + 1], data[i + 2]];
  };
  /** The darkest pixel in a small window around a point (lines are a pixel or two wide). */
  const darkest = (xMm: number, yMm: number, r = 2) => {
    let min = 255 * 3;
    for (let dy = -r; dy <= r; dy++) for (let dx = -r; dx <= r; dx++) {
      const i = ((px(yMm) + dy) * info.width + px(xMm) + dx) * info.channels;
      min = Math.min(min, data[i] + data[i + 1] + data[i + 2]);
    }
    return min;
  };
  return { at, darkest, info };
}

describe('crop marks and bleed on the business card (Ghostscript png16m at 300 dpi)', () => {
  let pdf: Buffer;
  beforeAll(async () => {
    pdf = await mockupPdf(layoutOf('business-card'), fontCss);
  }, 60_000);

  test('a mark lies on each trim line in every bleed corner of the white front, and none enters the trim', async () => {
    const { darkest, at } = await rasterise(pdf, 1, 300);
    const [w, h] = [85 + 6, 55 + 6];
    // Trim lines at 3 mm and w − 3 mm / h − 3 mm; marks run from 1 mm to 3 mm outside the trim corner.
    for (const [x, y] of [[1, 3], [3, 1], [w - 1, 3], [w - 3, 1], [1, h - 3], [3, h - 1], [w - 1, h - 3], [w - 3, h - 1]]) {
      expect(darkest(x, y), `mark at ${x}, ${y} mm`).toBeLessThan(120);
    }
    // Just inside the trim at the top-left corner the white ground is untouched; off the trim lines the bleed is ground.
    expect(at(3.6, 3.6)).toEqual([255, 255, 255]);
    expect(at(1, 1)).toEqual([255, 255, 255]);
  });

  test('the back runs its primary ground into the bleed, to the page edge', async () => {
    const { at } = await rasterise(pdf, 2, 300);
    // Roast Umber #4a2e22 (the fixture's primary) at 0.5 mm from the page corner, in the bleed.
    const [r, g, b] = at(0.5, 0.5);
    expect(Math.abs(r - 0x4a) + Math.abs(g - 0x2e) + Math.abs(b - 0x22)).toBeLessThan(12);
  });
});

describe('screen PNGs', () => {
  test.each([
    { key: 'social-post', width: 1080, height: 1080, source: 'common practice: 1080 × 1080 px' },
    { key: 'social-story', width: 1080, height: 1920, source: 'common practice: 1080 × 1920 px' },
  ])('$key is drawn at its own pixels ($source)', async ({ key, width, height }) => {
    const png = await mockupPng(layoutOf(key), fontCss);
    writeFileSync(join(out, `${key}.png`), png);
    const meta = await sharp(png).metadata();
    expect([meta.width, meta.height]).toEqual([width, height]);
  }, 60_000);

  test('a print piece shows its pages side by side at about 2 px per CSS px, with no transparent hairline at its edges', async () => {
    const png = await mockupPng(layoutOf('business-card'), fontCss);
    writeFileSync(join(out, 'business-card.png'), png);
    const meta = await sharp(png).metadata();
    const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
    // Alpha of the last column and the last row of the back card (its primary ground runs to every edge).
    const alpha = (x: number, y: number) => data[(y * info.width + x) * info.channels + 3];
    expect(alpha(info.width - 1, 10)).toBe(255);
    expect(alpha(info.width - 10, info.height - 1)).toBe(255);
    const cardPx = (85 / 25.4) * 96;
    // Two cards and a gap of 6 % of a card's width, at 2 device px per CSS px (96 CSS px = 1 in).
    expect(meta.width).toBe(2 * Math.floor(2 * cardPx + Math.round(cardPx * 0.06)));
    expect(meta.height).toBe(2 * Math.floor((55 / 25.4) * 96));
  }, 60_000);
});

describe('the pattern is the mark (the generator’s tile, against librsvg’s own drawing of it through sharp)', () => {
  let tileInk: number;
  let layout: MockupLayout;
  let ink: [number, number, number];
  let ground: [number, number, number];
  const rgb = (hex: string): [number, number, number] => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
  /** Share of pixels nearer the ink than the ground in a region of raw RGB(A) pixels. */
  const inkShare = (data: Buffer, channels: number, width: number, region: { x0: number; y0: number; x1: number; y1: number }) => {
    let inked = 0;
    let all = 0;
    for (let y = region.y0; y < region.y1; y++) {
      for (let x = region.x0; x < region.x1; x++) {
        const i = (y * width + x) * channels;
        const d = (c: [number, number, number]) => Math.abs(data[i] - c[0]) + Math.abs(data[i + 1] - c[1]) + Math.abs(data[i + 2] - c[2]);
        if (d(ink) < d(ground)) inked++;
        all++;
      }
    }
    return inked / all;
  };

  beforeAll(async () => {
    const pattern = mockupPattern(identity);
    const markFile = { bytes: Buffer.from(toSanitizedSvg(readFileSync('db/seeders/files/larchmere-mark.svg', 'utf8')).svg), format: 'svg' as const };
    const tile = await patternTile(identity, pattern.settings!, { readMark: async () => markFile });
    ink = rgb(tile.colours.ink.hex);
    ground = rgb(tile.colours.ground.hex);
    // librsvg (through sharp) draws the same tile: its ink share is what the piece must show.
    const drawn = await sharp(Buffer.from(tile.svg), { density: 72 * 4 }).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    tileInk = inkShare(drawn.data, drawn.info.channels, drawn.info.width, { x0: 0, y0: 0, x1: drawn.info.width, y1: drawn.info.height });
    const fill = { kind: 'tile' as const, href: dataUri(Buffer.from(tile.svg), 'image/svg+xml'), width: tile.width, height: tile.height };
    layout = requireLayout(composeMockup(mockupTemplate('business-card')!, identity, { logo: (l, f) => l.files[f] ?? l.files.original, photos: [], pattern: () => fill }));
  }, 60_000);

  test('the tile itself is the mark on its ground: neither empty nor a flat field', () => {
    expect(tileInk).toBeGreaterThan(0.05);
    expect(tileInk).toBeLessThan(0.6);
  });

  test('the card’s pattern column on screen shows the mark at the tile’s share of ink (Chromium against librsvg)', async () => {
    const png = await mockupPng(layout, fontCss);
    writeFileSync(join(out, 'business-card-pattern.png'), png);
    const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
    // The column [62, 0, 23, 55] mm at 2 device px per CSS px (96 CSS px = 1 in), 1 mm in from its edges.
    const px = (mm: number) => Math.round((mm / 25.4) * 96 * 2);
    const share = inkShare(data, info.channels, info.width, { x0: px(63), y0: px(1), x1: px(84), y1: px(54) });
    expect(Math.abs(share - tileInk)).toBeLessThan(0.06);
  }, 60_000);

  test('the printed card keeps the pattern in its column and bleed (Ghostscript png16m at 300 dpi)', async () => {
    const pdf = await mockupPdf(layout, fontCss);
    writeFileSync(join(out, 'business-card-pattern.pdf'), pdf);
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-pattern-gs-'));
    writeFileSync(join(dir, 'card.pdf'), pdf);
    execFileSync('gs', ['-q', '-dSAFER', '-dBATCH', '-dNOPAUSE', '-sDEVICE=png16m', '-r300', '-dFirstPage=1', '-dLastPage=1', `-sOutputFile=${join(dir, 'front.png')}`, join(dir, 'card.pdf')]);
    const { data, info } = await sharp(join(dir, 'front.png')).raw().toBuffer({ resolveWithObject: true });
    const px = (mm: number) => Math.round((mm / 25.4) * 300);
    // Page = trim + 3 mm bleed: the column runs from 65 mm to the page's right edge (94 mm), top to bottom.
    const share = inkShare(data, info.channels, info.width, { x0: px(66), y0: px(4), x1: px(87), y1: px(57) });
    expect(Math.abs(share - tileInk)).toBeLessThan(0.06);
    const bleed = inkShare(data, info.channels, info.width, { x0: px(88.4), y0: px(0.2), x1: px(90.8), y1: px(60.8) });
    expect(bleed).toBeGreaterThan(0);
  }, 60_000);
});

describe('text a larger scale would clip (CSS Overflow 3: content taller than its box is clipped by overflow: hidden)', () => {
  /** Three lines at line-height 1 in a box `height` px tall, fitted in Chromium; the size it ends at and whether it still overflows. */
  async function fitted(height: number) {
    const browser = await printBrowser();
    const page = await browser.newPage();
    try {
      await page.setContent(`<svg xmlns="http://www.w3.org/2000/svg" width="200" height="200"><foreignObject width="200" height="${height}"><div xmlns="http://www.w3.org/1999/xhtml" style="margin:0;font-size:20px;line-height:1;white-space:pre-line;overflow:hidden;height:${height}px">One\nTwo\nThree</div></foreignObject></svg>`);
      await page.evaluate(fitText, FIT_FLOOR);
      return await page.$eval('foreignObject > div', (el) => ({ size: parseFloat((el as HTMLElement).style.fontSize), clipped: el.scrollHeight > el.clientHeight + 0.5 }));
    } finally {
      await page.close();
      releaseBrowser();
    }
  }

  test('is set smaller in 4 % steps until it fits: three 20 px lines in 45 px end at 72 % (3 × 14.4 = 43.2 px)', async () => {
    expect(await fitted(45)).toEqual({ size: expect.closeTo(14.4, 6), clipped: false });
  }, 60_000);

  test('never below 70 % of its scale size: three 20 px lines in 30 px stay clipped at 72 %', async () => {
    expect(await fitted(30)).toEqual({ size: expect.closeTo(14.4, 6), clipped: true });
  }, 60_000);

  test('text that fits is left at its size', async () => {
    expect(await fitted(80)).toEqual({ size: 20, clipped: false });
  }, 60_000);
});
