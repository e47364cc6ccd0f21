// Plumbline's own text inks on its own grounds, read from the tokens in global.css, checked with culori's
// WCAG contrast (a general-purpose reference library) against WCAG 2.2 SC 1.4.3: 4.5:1 for body text.
import { readFileSync } from 'node:fs';
import { wcagContrast } from 'culori';
import { describe, expect, test } from 'vitest';
import { inkOn } from '@/components/app/identity/shared';

const css = readFileSync(new URL('../../src/styles/global.css', import.meta.url), 'utf8');
const token = (name: string): string => {
  const m = css.match(new RegExp(`--color-${name}:\\s*(#[0-9a-f]{6})`, 'i'));
  if (!m) throw new Error(`no --color-${name} in global.css`);
  return m[1];
};
/** A token at an alpha over a ground, as Tailwind's `bg-x/10` paints it. */
const over = (hex: string, alpha: number, ground: string) => {
  const ch = (h: string, i: number) => parseInt(h.slice(1 + 2 * i, 3 + 2 * i), 16);
  return `#${[0, 1, 2].map((i) => Math.round(ch(hex, i) * alpha + ch(ground, i) * (1 - alpha)).toString(16).padStart(2, '0')).join('')}`;
};

// The pairs the app's chrome sets (text token on ground), each small body text somewhere on the app's screens.
const PAIRS: [text: string, ground: string][] = [
  ['ink', 'paper'],
  ['ink-soft', 'paper'],
  ['ink-soft', 'card'],
  ['ink-faint', 'paper'],
  ['ink-faint', 'card'],
  ['ink-faint', 'plumb-wash'],
  ['ink-faint', 'warn-wash'],
  ['plumb', 'card'],
  ['plumb', 'plumb-wash'],
  ['plumb-deep', 'plumb-wash'],
  ['warn', 'warn-wash'],
  ['danger', 'danger-wash'],
  ['danger', 'card'],
  ['ok', 'card'],
];

describe('WCAG 2.2 SC 1.4.3 (contrast minimum, 4.5:1 for text) on the app tokens', () => {
  test.each(PAIRS)('%s on %s', (text, ground) => {
    expect(wcagContrast(token(text), token(ground))).toBeGreaterThanOrEqual(4.5);
  });
  test('ok on its 10 % wash (status pills), and white on the accent (primary buttons)', () => {
    expect(wcagContrast(token('ok'), over(token('ok'), 0.1, token('card')))).toBeGreaterThanOrEqual(4.5);
    expect(wcagContrast('#ffffff', token('plumb'))).toBeGreaterThanOrEqual(4.5);
  });
  test('the faintest ink stays a step quieter than the soft one, so the hierarchy survives', () => {
    expect(wcagContrast(token('ink-faint'), token('paper'))).toBeLessThan(wcagContrast(token('ink-soft'), token('paper')));
  });
});

describe('labels laid over a brand swatch (identity screen) reach WCAG 2.2 SC 1.4.3, 4.5:1', () => {
  // Mid-tones are the hard case: by the WCAG relative-luminance definition, black and white tie near luminance
  // 0.18 at about 4.58:1, so one of them always passes; a warm near-black alone does not (e.g. on #c8553d).
  test.each(['#c8553d', '#767676', '#777777', '#808080', '#2f5d50', '#e9d8b8', '#4a2c21', '#0077cc', '#ff0000', '#00a000'])('on %s', (hex) => {
    expect(wcagContrast(inkOn(hex), hex)).toBeGreaterThanOrEqual(4.5);
  });
});
