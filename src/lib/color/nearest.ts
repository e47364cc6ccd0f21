import { converter, formatHex, toGamut } from 'culori';
import { contrastRatio } from './contrast';
import { ColorError } from './errors';
import { toColor, type Color } from './parse';

export interface PassingShade {
  hex: string;
  ratio: number;
  /** OKLCH lightness (0–1) of the suggested colour. */
  lightness: number;
}

const toOklch = converter('oklch');
const toSrgbGamut = toGamut('rgb', 'oklch');
const STEP = 0.005;

/** The hex of the foreground's hue and chroma at OKLCH lightness l, gamut-mapped into sRGB. */
function shadeAt(base: { c: number; h?: number }, l: number): string {
  return formatHex(toSrgbGamut({ mode: 'oklch', l, c: base.c, h: base.h }));
}

/** Walks lightness in one direction; returns the closest passing shade, refined by bisection. */
function search(base: { l: number; c: number; h?: number }, bg: string, target: number, dir: 1 | -1): PassingShade | null {
  let previous = base.l;
  for (let l = base.l + dir * STEP; dir > 0 ? l <= 1 + 1e-9 : l >= -1e-9; l += dir * STEP) {
    const lightness = Math.min(1, Math.max(0, l));
    if (contrastRatio(shadeAt(base, lightness), bg) >= target) {
      let [fail, pass] = [previous, lightness];
      for (let i = 0; i < 20; i++) {
        const mid = (fail + pass) / 2;
        if (contrastRatio(shadeAt(base, mid), bg) >= target) pass = mid;
        else fail = mid;
      }
      const hex = shadeAt(base, pass);
      return { hex, ratio: contrastRatio(hex, bg), lightness: toOklch(hex)!.l };
    }
    previous = lightness;
  }
  return null;
}

/** The nearest tint or shade of the foreground (OKLCH lightness moved, hue kept) that reaches the target ratio, or null. */
export function nearestPassing(foreground: string | Color, background: string | Color, targetRatio: number): PassingShade | null {
  if (!Number.isFinite(targetRatio) || targetRatio < 1 || targetRatio > 21) {
    throw new ColorError('invalid_input', `A target contrast ratio must be between 1 and 21, got ${targetRatio}.`);
  }
  const fg = toColor(foreground);
  const bg = toColor(background).hex;
  const current = contrastRatio(fg.hex, bg);
  const ok = toOklch(fg.hex)!;
  if (current >= targetRatio) return { hex: fg.hex, ratio: current, lightness: ok.l };
  const base = { l: ok.l, c: ok.c, h: ok.h };
  const candidates = [search(base, bg, targetRatio, 1), search(base, bg, targetRatio, -1)].filter(
    (c): c is PassingShade => c !== null,
  );
  if (candidates.length === 0) return null;
  return candidates.sort((a, b) => Math.abs(a.lightness - ok.l) - Math.abs(b.lightness - ok.l))[0];
}
