import { converter, formatHex } from 'culori';
import { ColorError } from './errors';
import { toColor, type Color } from './parse';

export type ColorVisionKind = 'protanopia' | 'deuteranopia' | 'tritanopia';
export type Matrix3 = readonly [readonly [number, number, number], readonly [number, number, number], readonly [number, number, number]];

/** Machado, Oliveira & Fernandes (2009) simulation matrices at severity 1.0, for linear RGB. */
export const MACHADO_2009_MATRICES: Readonly<Record<ColorVisionKind, Matrix3>> = {
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
  tritanopia: [
    [1.255528, -0.076749, -0.178779],
    [-0.078411, 0.930809, 0.147602],
    [0.004733, 0.691367, 0.3039],
  ],
};

export const COLOR_VISION_KINDS = Object.keys(MACHADO_2009_MATRICES) as ColorVisionKind[];

const toLinear = converter('lrgb');
const clamp01 = (v: number) => Math.min(1, Math.max(0, v));

/** How a colour may look with a full colour-vision deficiency (matrix applied in linear RGB), as hex. */
export function simulateColorVision(color: string | Color, kind: ColorVisionKind): string {
  const matrix = MACHADO_2009_MATRICES[kind];
  if (!matrix) throw new ColorError('invalid_input', `Unknown colour-vision kind "${String(kind)}"; use ${COLOR_VISION_KINDS.join(', ')}.`);
  const { r, g, b } = toLinear(toColor(color).hex)!;
  const [lr, lg, lb] = matrix.map((row) => clamp01(row[0] * r + row[1] * g + row[2] * b));
  return formatHex({ mode: 'lrgb', r: lr, g: lg, b: lb });
}
