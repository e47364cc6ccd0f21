// APCA is the draft contrast method proposed for WCAG 3; it is shown as a second opinion only, never as a pass/fail.
// The apca-w3 package carries its own licence with limits on use and naming: see the package licence.
import { APCAcontrast, sRGBtoY } from 'apca-w3';
import { flatten } from './contrast';
import type { Color } from './parse';

/** APCA lightness contrast Lc (signed: positive for dark text on light, negative for light on dark). */
export function apcaContrast(text: string | Color, background: string | Color): number {
  const bg = flatten(background, [255, 255, 255]);
  const fg = flatten(text, bg);
  return Number(APCAcontrast(sRGBtoY(fg), sRGBtoY(bg)));
}
