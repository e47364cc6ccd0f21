// Greyscale proofs and the check that a logo reads without colour. Greyscale is the WCAG 2.2 relative luminance of each
// pixel (sRGB, IEC 61966-2-1), encoded back with the sRGB transfer function, never an average of the channels. Two
// touching parts of distinct colour "collapse" when their greys are closer than the 3:1 that WCAG 2.2 SC 1.4.11
// (non-text contrast) asks between adjacent parts of a graphic; grey keeps relative luminance, so the greys' contrast
// is the colours' own WCAG contrast, and below 3:1 only hue tells the parts apart (SC 1.4.1, use of colour).
import { converter } from 'culori';
import { relativeLuminance, WCAG_THRESHOLDS } from '@/lib/color/contrast';
import { deltaE2000 } from '@/lib/color/difference';
import { NEAR_DUPLICATE_DELTA_E } from '@/lib/color/palette';
import type { LightParts } from '@/lib/identity/types';

/** Under this WCAG contrast two touching parts are too close to tell apart in grey (WCAG 2.2 SC 1.4.11, 3:1). */
export const TONE_CONTRAST = WCAG_THRESHOLDS.nonText;
/** Colours closer than this ΔE00 are one part (the palette's own "hard to tell apart", common practice). */
export const PART_DELTA_E = NEAR_DUPLICATE_DELTA_E;
/** A colour is a part of the logo when it covers at least this share of what the logo draws opaquely. */
export const PART_MIN_SHARE = 0.005;
/** Alpha (0–255) from which a pixel counts as painted; softer edge pixels are left out of the census. */
const OPAQUE = 250;
/** Pixels an edge may span between two parts (anti-aliased seam) and still count as touching, at the analysis size. */
const SEAM_PX = 3;

/** One colour of the logo as drawn, and its grey. */
export interface TonePart {
  hex: string;
  /** The grey of the same relative luminance, '#rrggbb'. */
  grey: string;
  /** WCAG 2.2 relative luminance, 0–1. */
  luminance: number;
  /** Share of the opaque drawing painted in this part, 0–1. */
  share: number;
}

/** Two touching parts whose greys are too close. */
export interface ToneCollapse {
  a: TonePart;
  b: TonePart;
  /** WCAG 2.2 contrast ratio between the two (the same in colour and in grey). */
  contrast: number;
  /** CIEDE2000 between the colours: how different they look in colour. */
  deltaE2000: number;
}

export interface ToneReport {
  parts: TonePart[];
  collapses: ToneCollapse[];
  /** True when at least one pair of touching parts is told apart only by hue. */
  dependsOnColour: boolean;
  /** The contrast the check asks of touching parts, with its source. */
  threshold: { contrast: number; source: string };
}

export const TONE_SOURCE = 'WCAG 2.2 SC 1.4.11 non-text contrast (3:1 between adjacent parts of a graphic); greys by WCAG 2.2 relative luminance';

/** RGBA pixels, row by row. */
export interface Raster {
  data: Uint8Array;
  width: number;
  height: number;
  channels: number;
}

/** The sRGB-encoded value (0–1) of a linear luminance: the IEC 61966-2-1 transfer function. */
export function encodeSrgb(linear: number): number {
  const v = Math.min(1, Math.max(0, linear));
  return v <= 0.0031308 ? 12.92 * v : 1.055 * v ** (1 / 2.4) - 0.055;
}

/** The 8-bit grey level (0–255) of the same WCAG 2.2 relative luminance as an sRGB colour. */
export function greyLevel(rgb: readonly [number, number, number]): number {
  return Math.round(encodeSrgb(relativeLuminance(rgb)) * 255);
}

const hex2 = (n: number) => n.toString(16).padStart(2, '0');
const toHex = (rgb: readonly [number, number, number]) => `#${rgb.map(hex2).join('')}`;

/** The grey of a colour as '#rrggbb'. */
export function greyOf(rgb: readonly [number, number, number]): string {
  const level = hex2(greyLevel(rgb));
  return `#${level}${level}${level}`;
}

/** WCAG 2.2 contrast ratio of two relative luminances. */
const contrastOf = (l1: number, l2: number) => (Math.max(l1, l2) + 0.05) / (Math.min(l1, l2) + 0.05);

/** The pixels turned to grey by relative luminance, alpha kept (RGBA out, whatever came in). */
export function greyscalePixels(raster: Raster): Buffer {
  const { data, width, height, channels } = raster;
  const out = Buffer.alloc(width * height * 4);
  const memo = new Map<number, number>();
  for (let i = 0, n = width * height; i < n; i++) {
    const at = i * channels;
    const key = (data[at] << 16) | (data[at + 1] << 8) | data[at + 2];
    let level = memo.get(key);
    if (level === undefined) {
      level = greyLevel([data[at], data[at + 1], data[at + 2]]);
      memo.set(key, level);
    }
    out[i * 4] = out[i * 4 + 1] = out[i * 4 + 2] = level;
    out[i * 4 + 3] = channels === 4 ? data[at + 3] : 255;
  }
  return out;
}

const toLab = converter('lab65');
function labOf(rgb: readonly [number, number, number]): [number, number, number] {
  const lab = toLab({ mode: 'rgb', r: rgb[0] / 255, g: rgb[1] / 255, b: rgb[2] / 255 });
  return [lab.l, lab.a, lab.b];
}

interface Cluster {
  rgb: [number, number, number];
  lab: [number, number, number];
  count: number;
}

/** Distance (sRGB levels) within which a colour counts as lying on the mix of two others. */
const BLEND_TOLERANCE = 6;

/**
 * True when a colour is only the anti-aliased mix of two larger ones (it lies on the line between them in sRGB, where
 * renderers blend edges), so a seam of mixed pixels is not taken for a part of its own.
 */
function isSeamBlend(clusters: Cluster[], i: number): boolean {
  const c = clusters[i].rgb;
  for (let a = 0; a < clusters.length; a++) {
    for (let b = a + 1; b < clusters.length; b++) {
      if (a === i || b === i || clusters[a].count <= clusters[i].count || clusters[b].count <= clusters[i].count) continue;
      const p = clusters[a].rgb;
      const d = clusters[b].rgb.map((v, k) => v - p[k]);
      const length2 = d[0] ** 2 + d[1] ** 2 + d[2] ** 2;
      if (length2 === 0) continue;
      const t = ((c[0] - p[0]) * d[0] + (c[1] - p[1]) * d[1] + (c[2] - p[2]) * d[2]) / length2;
      if (t <= 0.02 || t >= 0.98) continue;
      const off = Math.hypot(c[0] - p[0] - t * d[0], c[1] - p[1] - t * d[1], c[2] - p[2] - t * d[2]);
      if (off <= BLEND_TOLERANCE) return true;
    }
  }
  return false;
}

/**
 * The parts of a drawn logo (its distinct colours, anti-aliased seams left out) and the touching pairs whose greys are
 * under 3:1 apart. Touching: within SEAM_PX pixels of each other along a row or a column, with no transparent pixel
 * between, over at least 1 % of the raster's longer side (a single meeting point is not a shared edge).
 */
export function toneReport(raster: Raster): ToneReport {
  const { data, width, height, channels } = raster;
  const threshold = { contrast: TONE_CONTRAST, source: TONE_SOURCE };
  const count = width * height;
  const alpha = (i: number) => (channels === 4 ? data[i * channels + 3] : 255);
  const keyAt = (i: number) => (data[i * channels] << 16) | (data[i * channels + 1] << 8) | data[i * channels + 2];
  const rgbOf = (key: number): [number, number, number] => [(key >> 16) & 255, (key >> 8) & 255, key & 255];

  const colours = new Map<number, number>();
  let opaque = 0;
  for (let i = 0; i < count; i++) {
    if (alpha(i) < OPAQUE) continue;
    opaque++;
    const key = keyAt(i);
    colours.set(key, (colours.get(key) ?? 0) + 1);
  }
  if (opaque === 0) return { parts: [], collapses: [], dependsOnColour: false, threshold };

  // Most painted colours first; near-identical ones (ΔE00 < 5) join the first cluster they resemble.
  const byCount = [...colours.entries()].sort((x, y) => y[1] - x[1]);
  const seedMin = Math.max(2, opaque * PART_MIN_SHARE * 0.2);
  const clusters: Cluster[] = [];
  const clusterOf = new Map<number, number>();
  // Bounded work however noisy the file: at most 4096 colours are sorted, at most 64 clusters formed.
  for (const [key, n] of byCount.slice(0, 4096)) {
    const rgb = rgbOf(key);
    const lab = labOf(rgb);
    const near = clusters.findIndex((c) => deltaE2000(c.lab, lab) < PART_DELTA_E);
    if (near >= 0) {
      clusters[near].count += n;
      clusterOf.set(key, near);
    } else if (n >= seedMin && clusters.length < 64) {
      clusters.push({ rgb, lab, count: n });
      clusterOf.set(key, clusters.length - 1);
    }
  }
  const isPart = clusters.map((c, i) => c.count / opaque >= PART_MIN_SHARE && !isSeamBlend(clusters, i));
  const label = new Int16Array(count).fill(-1);
  for (let i = 0; i < count; i++) {
    if (alpha(i) < OPAQUE) continue;
    const c = clusterOf.get(keyAt(i));
    if (c !== undefined && isPart[c]) label[i] = c;
  }

  // Contacts between parts, counted once per pixel and direction (right and down).
  const contacts = new Map<number, number>();
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const a = label[y * width + x];
      if (a < 0) continue;
      for (const [dx, dy] of [[1, 0], [0, 1]] as const) {
        for (let k = 1; k <= SEAM_PX; k++) {
          const nx = x + dx * k;
          const ny = y + dy * k;
          if (nx >= width || ny >= height) break;
          const j = ny * width + nx;
          if (alpha(j) === 0) break;
          const b = label[j];
          if (b === a) break;
          if (b >= 0) {
            const pair = Math.min(a, b) * 64 + Math.max(a, b);
            contacts.set(pair, (contacts.get(pair) ?? 0) + 1);
            break;
          }
        }
      }
    }
  }

  const parts = new Map<number, TonePart>();
  clusters.forEach((c, i) => {
    if (isPart[i]) parts.set(i, { hex: toHex(c.rgb), grey: greyOf(c.rgb), luminance: relativeLuminance(c.rgb), share: c.count / opaque });
  });
  const minContacts = Math.max(4, Math.round(0.01 * Math.max(width, height)));
  const collapses: ToneCollapse[] = [];
  for (const [pair, n] of contacts) {
    if (n < minContacts) continue;
    const a = parts.get(Math.floor(pair / 64))!;
    const b = parts.get(pair % 64)!;
    const contrast = contrastOf(a.luminance, b.luminance);
    if (contrast < TONE_CONTRAST) {
      collapses.push({ a, b, contrast, deltaE2000: deltaE2000(clusters[Math.floor(pair / 64)].lab, clusters[pair % 64].lab) });
    }
  }
  collapses.sort((x, y) => x.contrast - y.contrast);
  const ordered = [...parts.values()].sort((x, y) => y.share - x.share);
  return { parts: ordered, collapses, dependsOnColour: collapses.length > 0, threshold };
}

/** What the proofs route answers for one logo: the analysis and where the three proof images and the sheet are. */
export interface LogoProofs {
  tones: ToneReport;
  /** How the logo's light parts print in one colour, as the proofs in `files` show them. */
  lightParts: LightParts;
  /** The logo's light colours that the choice decides ('#rrggbb'): empty when both choices print the same. */
  lightColours: string[];
  files: { blackOnWhite: string; whiteOnBlack: string; greyscale: string; sheet: string };
  /** The one-colour proofs drawn with the other choice, to compare before changing it. */
  compare: { lightParts: LightParts; blackOnWhite: string; whiteOnBlack: string };
}

export const PROOF_KINDS = ['black-on-white', 'white-on-black', 'greyscale', 'sheet'] as const;
export type ProofKind = (typeof PROOF_KINDS)[number];
