import { converter } from 'culori';
import { apcaContrast } from './apca';
import { contrastRatio, wcagLevels, type WcagLevels } from './contrast';
import { deltaE2000 } from './difference';
import { ColorError } from './errors';
import { parseColor } from './parse';
import { COLOR_VISION_KINDS, simulateColorVision, type ColorVisionKind } from './vision';

/** ΔE00 below which two palette colours are flagged as hard to tell apart (rule of thumb, common practice). */
export const NEAR_DUPLICATE_DELTA_E = 5;

export interface PaletteColor {
  id: string;
  name: string;
  hex: string;
}

export interface PalettePair extends WcagLevels {
  foreground: { id: string; hex: string };
  background: { id: string; hex: string };
  ratio: number;
  apca: number;
}

export interface PaletteReport {
  pairs: PalettePair[];
  nearDuplicates: { a: string; b: string; deltaE2000: number }[];
  colorVision: Record<string, Record<ColorVisionKind, string>>;
}

// ΔE00 is taken on CIELAB D50, the Lab that CSS lab() uses.
const toLab = converter('lab');

/** Contrast of every ordered pair, near-duplicate colours (ΔE00) and colour-vision previews for a palette. */
export function paletteReport(colors: readonly PaletteColor[]): PaletteReport {
  if (!Array.isArray(colors)) throw new ColorError('invalid_input', 'A palette must be a list of colours.');
  const palette = colors.map((c) => {
    const parsed = parseColor(c?.hex);
    if (!parsed.ok) throw new ColorError('color_unparsed', `Colour "${c?.name ?? c?.id}": ${parsed.error.message}`);
    const lab = toLab(parsed.color.hex)!;
    return { id: c.id, hex: parsed.color.hex, color: parsed.color, lab: [lab.l, lab.a, lab.b] as const };
  });
  const pairs: PalettePair[] = [];
  const nearDuplicates: PaletteReport['nearDuplicates'] = [];
  palette.forEach((fg, i) =>
    palette.forEach((bg, j) => {
      if (i === j) return;
      const ratio = contrastRatio(fg.color, bg.color);
      pairs.push({
        foreground: { id: fg.id, hex: fg.hex },
        background: { id: bg.id, hex: bg.hex },
        ratio,
        ...wcagLevels(ratio),
        apca: apcaContrast(fg.color, bg.color),
      });
      if (i < j) {
        const d = deltaE2000(fg.lab, bg.lab);
        if (d < NEAR_DUPLICATE_DELTA_E) nearDuplicates.push({ a: fg.id, b: bg.id, deltaE2000: d });
      }
    }),
  );
  const colorVision = Object.fromEntries(
    palette.map((c) => [c.id, Object.fromEntries(COLOR_VISION_KINDS.map((k) => [k, simulateColorVision(c.color, k)]))]),
  ) as PaletteReport['colorVision'];
  return { pairs, nearDuplicates, colorVision };
}
