import { differenceCiede2000 } from 'culori';
import { ColorError } from './errors';

export type Lab = readonly [number, number, number];

const ciede2000 = differenceCiede2000();

/** CIEDE2000 colour difference ΔE00 between two CIELAB triples [L, a, b] (kL = kC = kH = 1). */
export function deltaE2000(lab1: Lab, lab2: Lab): number {
  for (const lab of [lab1, lab2]) {
    if (!Array.isArray(lab) || lab.length !== 3 || !lab.every((v) => Number.isFinite(v))) {
      throw new ColorError('invalid_input', 'A CIELAB colour must be three finite numbers [L, a, b].');
    }
  }
  // culori computes in its 'lab65' mode; tagging the triples so means they are used as given, with no conversion.
  return ciede2000({ mode: 'lab65', l: lab1[0], a: lab1[1], b: lab1[2] }, { mode: 'lab65', l: lab2[0], a: lab2[1], b: lab2[2] });
}
