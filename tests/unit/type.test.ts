import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { brotliDecompressSync } from 'node:zlib';
import * as harfbuzz from 'harfbuzzjs';
import { beforeAll, describe, expect, test } from 'vitest';
import {
  columnWidthFor,
  fontMetrics,
  lineHeightFromMetrics,
  measure,
  MEASURE_RANGE,
  MEASURE_SAMPLE,
  mmToPt,
  modularScale,
  openFont,
  ptToMm,
  ptToPx,
  pxToMm,
  pxToPt,
  pxToRem,
  remToPx,
  SCALE_RATIOS,
  TypographyError,
} from '@/lib/type';

const FONT_DIR = 'node_modules/@fontsource-variable';
const DM_SANS = readFileSync(`${FONT_DIR}/dm-sans/files/dm-sans-latin-wght-normal.woff2`);
const SOURCE_SERIF = readFileSync(`${FONT_DIR}/source-serif-4/files/source-serif-4-latin-wght-normal.woff2`);

describe('modular-scale ratios are the just-intonation intervals (music theory: just intonation frequency ratios)', () => {
  test.each([
    ['minor-second', 16, 15],
    ['major-second', 9, 8],
    ['minor-third', 6, 5],
    ['major-third', 5, 4],
    ['perfect-fourth', 4, 3],
    ['perfect-fifth', 3, 2],
    ['minor-sixth', 8, 5],
    ['major-sixth', 5, 3],
    ['minor-seventh', 16, 9],
    ['major-seventh', 15, 8],
    ['octave', 2, 1],
  ] as const)('%s = %i:%i', (name, a, b) => {
    expect(SCALE_RATIOS[name].ratio).toBe(a / b);
    expect(SCALE_RATIOS[name].interval).toBe(`${a}:${b}`);
  });
  test('golden section = (1 + √5) / 2 and satisfies φ² = φ + 1 (Euclid, Elements VI, extreme and mean ratio)', () => {
    const phi = SCALE_RATIOS['golden-section'].ratio;
    expect(phi).toBeCloseTo(1.6180339887, 10);
    expect(phi * phi).toBeCloseTo(phi + 1, 12);
  });
  test('augmented fourth (tritone) in equal temperament = √2, half an octave', () => {
    expect(SCALE_RATIOS['augmented-fourth'].ratio ** 2).toBeCloseTo(2, 12);
  });
  test('scale steps are base × ratio^n (definition of a geometric scale)', () => {
    const steps = modularScale({ base: 16, ratio: 'major-third', stepsUp: 3, stepsDown: 1 });
    expect(steps.map((s) => s.step)).toEqual([-1, 0, 1, 2, 3]);
    expect(steps.map((s) => s.px)).toEqual([12.8, 16, 20, 25, 31.25]);
    expect(modularScale({ base: 10, ratio: 2, stepsUp: 2 }).map((s) => s.px)).toEqual([10, 20, 40]);
  });
  test.each([
    [{ base: 0, ratio: 1.25, stepsUp: 2 }],
    [{ base: 16, ratio: 'no-such' as 'octave', stepsUp: 2 }],
    [{ base: 16, ratio: 0.9, stepsUp: 2 }],
    [{ base: 16, ratio: 1.2, stepsUp: 2.5 }],
    [{ base: 16, ratio: 1.2, stepsUp: 1000 }],
  ])('bad input %j is a typed invalid_input error', (input) => {
    expect(() => modularScale(input)).toThrow(TypographyError);
  });
});

describe('units: CSS Values 4 absolute units (1in = 96px = 72pt) and the PostScript point (Adobe PLRM: 1 pt = 1/72 in)', () => {
  test.each([
    ['1 in = 96 px = 72 pt (CSS Values 4 §6.2)', () => pxToPt(96), 72],
    ['72 pt = 96 px (CSS Values 4 §6.2)', () => ptToPx(72), 96],
    ['72 pt = 25.4 mm (1 in = 25.4 mm, international inch)', () => ptToMm(72), 25.4],
    ['96 px = 25.4 mm (CSS Values 4 §6.2)', () => pxToMm(96), 25.4],
    ['16 px = 1 rem at a 16 px root (CSS Values 4 rem unit)', () => pxToRem(16), 1],
    ['1.5 rem = 30 px at a 20 px root', () => remToPx(1.5, 20), 30],
    ['12 pt = 16 px (CSS Values 4 §6.2)', () => ptToPx(12), 16],
  ])('%s', (_name, compute, expected) => {
    expect(compute()).toBeCloseTo(expected, 10);
  });
  test.each([
    ['A4', 210, 297, 595.28, 841.89],
    ['A5', 148, 210, 419.53, 595.28],
    ['A3', 297, 420, 841.89, 1190.55],
  ])('ISO 216 %s %i×%i mm = %f×%f pt', (_name, wMm, hMm, wPt, hPt) => {
    expect(mmToPt(wMm)).toBeCloseTo(wPt, 2);
    expect(mmToPt(hMm)).toBeCloseTo(hPt, 2);
  });
  test('non-numbers are typed errors', () => {
    expect(() => pxToRem(Number.NaN)).toThrow(TypographyError);
    expect(() => pxToRem(16, 0)).toThrow(TypographyError);
  });
});

// An independent reader of the same OpenType tables, straight from the WOFF2 container (W3C WOFF 2.0 §5, OpenType spec):
// the tables head, hhea, OS/2 and fvar are never transformed, so they sit verbatim in the Brotli stream.
const WOFF2_KNOWN_TAGS = ['cmap', 'head', 'hhea', 'hmtx', 'maxp', 'name', 'OS/2', 'post', 'cvt ', 'fpgm', 'glyf', 'loca', 'prep',
  'CFF ', 'VORG', 'EBDT', 'EBLC', 'gasp', 'hdmx', 'kern', 'LTSH', 'PCLT', 'VDMX', 'vhea', 'vmtx', 'BASE', 'GDEF', 'GPOS', 'GSUB',
  'EBSC', 'JSTF', 'MATH', 'CBDT', 'CBLC', 'COLR', 'CPAL', 'SVG ', 'sbix', 'acnt', 'avar', 'bdat', 'bloc', 'bsln', 'cvar', 'fdsc',
  'feat', 'fmtx', 'fvar', 'gvar', 'hsty', 'just', 'lcar', 'mort', 'morx', 'opbd', 'prop', 'trak', 'Zapf', 'Silf', 'Glat', 'Gloc',
  'Feat', 'Sill'];

function readWoff2Tables(file: Buffer): Map<string, Buffer> {
  expect(file.toString('latin1', 0, 4)).toBe('wOF2');
  const numTables = file.readUInt16BE(12);
  const compressedLength = file.readUInt32BE(20);
  let p = 48;
  const base128 = () => {
    let value = 0;
    for (let i = 0; i < 5; i++) {
      const byte = file[p++];
      value = value * 128 + (byte & 0x7f);
      if ((byte & 0x80) === 0) break;
    }
    return value;
  };
  const entries: { tag: string; length: number }[] = [];
  for (let i = 0; i < numTables; i++) {
    const flags = file[p++];
    const tag = (flags & 0x3f) === 63 ? file.toString('latin1', p, (p += 4)) : WOFF2_KNOWN_TAGS[flags & 0x3f];
    const version = flags >> 6;
    const origLength = base128();
    const transformed = tag === 'glyf' || tag === 'loca' ? version === 0 : tag === 'hmtx' ? version === 1 : version !== 0;
    entries.push({ tag, length: transformed ? base128() : origLength });
  }
  const data = brotliDecompressSync(file.subarray(p, p + compressedLength));
  const tables = new Map<string, Buffer>();
  let offset = 0;
  for (const e of entries) {
    tables.set(e.tag, data.subarray(offset, offset + e.length));
    offset += e.length;
  }
  return tables;
}

describe('fontMetrics of shipped OFL fonts agree with an independent read of the OpenType tables', () => {
  test.each([
    ['DM Sans (OFL)', DM_SANS],
    ['Source Serif 4 (OFL)', SOURCE_SERIF],
  ])('%s: head, hhea, OS/2 and fvar (OpenType spec table layouts)', (_name, file) => {
    const tables = readWoff2Tables(file);
    const head = tables.get('head')!;
    const hhea = tables.get('hhea')!;
    const os2 = tables.get('OS/2')!;
    const fvar = tables.get('fvar')!;
    expect(head.readUInt32BE(12)).toBe(0x5f0f3cf5); // head.magicNumber: proves the offsets are right
    const m = fontMetrics(file);
    expect(m.unitsPerEm).toBe(head.readUInt16BE(18));
    expect(m.ascender).toBe(hhea.readInt16BE(4));
    expect(m.descender).toBe(hhea.readInt16BE(6));
    expect(m.lineGap).toBe(hhea.readInt16BE(8));
    expect(m.typo.ascender).toBe(os2.readInt16BE(68));
    expect(m.typo.descender).toBe(os2.readInt16BE(70));
    expect(m.xHeight).toBe(os2.readInt16BE(86));
    expect(m.capHeight).toBe(os2.readInt16BE(88));
    // fvar: axesArrayOffset at 4, axisCount at 8, axis records of 20 bytes: tag, min, default, max (Fixed 16.16).
    const axisStart = fvar.readUInt16BE(4);
    const axisCount = fvar.readUInt16BE(8);
    const axes = Array.from({ length: axisCount }, (_, i) => {
      const r = fvar.subarray(axisStart + i * 20);
      return { tag: r.toString('latin1', 0, 4), min: r.readInt32BE(4) / 65536, def: r.readInt32BE(8) / 65536, max: r.readInt32BE(12) / 65536 };
    });
    const wght = axes.find((a) => a.tag === 'wght')!;
    expect(m.isVariable).toBe(true);
    expect(m.weight).toEqual({ min: wght.min, default: wght.def, max: wght.max });
    expect(m.family.length).toBeGreaterThan(0);
  });
  test.each([
    ['not a font', Buffer.from('this is plainly text, not a font file')],
    ['empty', Buffer.alloc(0)],
    ['truncated WOFF2', DM_SANS.subarray(0, 64)],
  ])('%s → font_unreadable', (_name, bytes) => {
    try {
      fontMetrics(bytes);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(TypographyError);
      expect((error as TypographyError).code).toBe('font_unreadable');
    }
  });
  test('line heights: body never below 1.5 (WCAG 2.2 SC 1.4.8); natural spacing from the raw tables (OpenType spec)', () => {
    const lh = lineHeightFromMetrics(fontMetrics(DM_SANS));
    expect(lh.body).toBeGreaterThanOrEqual(1.5);
    // OpenType spec, OS/2 fsSelection bit 7 USE_TYPO_METRICS: typo ascender − descender + line gap, else hhea's.
    const tables = readWoff2Tables(DM_SANS);
    const [hhea, os2] = [tables.get('hhea')!, tables.get('OS/2')!];
    const useTypo = (os2.readUInt16BE(62) & 0x80) !== 0;
    const [ascender, descender, lineGap] = useTypo ? [68, 70, 72].map((o) => os2.readInt16BE(o)) : [4, 6, 8].map((o) => hhea.readInt16BE(o));
    expect(lh.natural).toBeCloseTo((ascender - descender + lineGap) / tables.get('head')!.readUInt16BE(18), 12);
  });
});

// The reference for the average advance: HarfBuzz (the shaping engine of Chromium and Firefox, through harfbuzzjs)
// shapes the same sample from the font's TrueType tables (WOFF2 unpacked by Google's woff2 decoder, through wawoff2),
// independently of fontkit, which our measure uses. Both packages come with subset-font.
const woff2ToTtf = createRequire(import.meta.url)('wawoff2/decompress') as (woff2: Uint8Array) => Promise<Uint8Array>;
async function harfbuzzAdvanceEm(woff2: Buffer, text: string): Promise<number> {
  const face = new harfbuzz.Face(new harfbuzz.Blob(await woff2ToTtf(woff2)), 0);
  const buffer = new harfbuzz.Buffer();
  buffer.addText(text);
  buffer.guessSegmentProperties();
  harfbuzz.shape(new harfbuzz.Font(face), buffer);
  const advance = buffer.getGlyphPositions().reduce((sum, p) => sum + p.xAdvance, 0);
  return advance / [...text].length / face.upem;
}

describe('measure: characters per line (Bringhurst, The Elements of Typographic Style, §2.1.2: 45–75, 66 ideal)', () => {
  const font = openFont(DM_SANS);
  let referenceEm: number;
  beforeAll(async () => {
    referenceEm = await harfbuzzAdvanceEm(DM_SANS, MEASURE_SAMPLE);
  });
  test('the range is Bringhurst\'s: 45 to 75 characters, 66 the ideal', () => {
    expect(MEASURE_RANGE).toEqual({ min: 45, max: 75, ideal: 66 });
  });
  test.each([
    ['DM Sans 16 px in a 520 px column', DM_SANS, 16, 520],
    ['DM Sans 18 px in a 560 px column', DM_SANS, 18, 560],
    ['Source Serif 4 17 px in a 560 px column', SOURCE_SERIF, 17, 560],
  ])('%s falls in the comfortable range', (_name, file, size, width) => {
    const m = measure(file, { sizePx: size, columnWidthPx: width });
    expect(m.charsPerLine).toBeGreaterThanOrEqual(45);
    expect(m.charsPerLine).toBeLessThanOrEqual(75);
    expect(m.verdict).toBe('comfortable');
  });
  test.each([
    [16, 300],
    [16, 600],
    [32, 600],
    [18, 560],
  ])('at %i px in a %i px column: the width over the average advance HarfBuzz gives for the sample', (sizePx, columnWidthPx) => {
    expect(measure(font, { sizePx, columnWidthPx }).charsPerLine).toBeCloseTo(columnWidthPx / (sizePx * referenceEm), 6);
  });
  test('verdicts outside the range', () => {
    expect(measure(font, { sizePx: 16, columnWidthPx: 200 }).verdict).toBe('too-short');
    expect(measure(font, { sizePx: 16, columnWidthPx: 1400 }).verdict).toBe('too-long');
    // A 680 px column at 16 px already runs past 75 characters in this face: wide columns need larger type.
    expect(measure(font, { sizePx: 16, columnWidthPx: 680 }).verdict).toBe('too-long');
  });
  test('the column for 66 characters is 66 of HarfBuzz\'s average advances wide', () => {
    expect(columnWidthFor(font, 18)).toBeCloseTo(66 * 18 * referenceEm, 6);
  });
  test('bad sizes are typed errors', () => {
    expect(() => measure(font, { sizePx: -1, columnWidthPx: 600 })).toThrow(TypographyError);
    expect(() => measure(font, { sizePx: 16, columnWidthPx: 600, sample: '' })).toThrow(TypographyError);
  });
});
