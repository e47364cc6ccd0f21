import { requirePositive, TypographyError } from './errors';

/** Named modular-scale ratios: musical intervals in just intonation, plus the golden section. */
export const SCALE_RATIOS = {
  'minor-second': { label: 'Minor second', interval: '16:15', ratio: 16 / 15 },
  'major-second': { label: 'Major second', interval: '9:8', ratio: 9 / 8 },
  'minor-third': { label: 'Minor third', interval: '6:5', ratio: 6 / 5 },
  'major-third': { label: 'Major third', interval: '5:4', ratio: 5 / 4 },
  'perfect-fourth': { label: 'Perfect fourth', interval: '4:3', ratio: 4 / 3 },
  'augmented-fourth': { label: 'Augmented fourth', interval: '√2:1', ratio: Math.SQRT2 },
  'perfect-fifth': { label: 'Perfect fifth', interval: '3:2', ratio: 3 / 2 },
  'minor-sixth': { label: 'Minor sixth', interval: '8:5', ratio: 8 / 5 },
  'golden-section': { label: 'Golden section', interval: '1:φ', ratio: (1 + Math.sqrt(5)) / 2 },
  'major-sixth': { label: 'Major sixth', interval: '5:3', ratio: 5 / 3 },
  'minor-seventh': { label: 'Minor seventh', interval: '16:9', ratio: 16 / 9 },
  'major-seventh': { label: 'Major seventh', interval: '15:8', ratio: 15 / 8 },
  octave: { label: 'Octave', interval: '2:1', ratio: 2 },
} as const;

export type ScaleRatioName = keyof typeof SCALE_RATIOS;

export interface ScaleStep {
  /** 0 is the base size; positive steps are larger, negative smaller. */
  step: number;
  px: number;
}

export interface ModularScaleInput {
  base: number;
  ratio: number | ScaleRatioName;
  stepsUp: number;
  stepsDown?: number;
}

const MAX_STEPS = 24;

/** Resolves a ratio given by name or number into a number above 1. */
export function scaleRatio(ratio: number | ScaleRatioName): number {
  const value = typeof ratio === 'string' ? SCALE_RATIOS[ratio]?.ratio : ratio;
  if (value === undefined) {
    throw new TypographyError('invalid_input', `Unknown scale ratio "${String(ratio)}"; use one of ${Object.keys(SCALE_RATIOS).join(', ')}.`);
  }
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 1 || value > 4) {
    throw new TypographyError('invalid_input', `A scale ratio must be a number above 1 and at most 4, got ${String(ratio)}.`);
  }
  return value;
}

/** Sizes base × ratio^n from -stepsDown to +stepsUp, smallest first (unrounded px). */
export function modularScale({ base, ratio, stepsUp, stepsDown = 0 }: ModularScaleInput): ScaleStep[] {
  requirePositive(base, 'The base size');
  const r = scaleRatio(ratio);
  for (const [n, what] of [[stepsUp, 'Steps up'], [stepsDown, 'Steps down']] as const) {
    if (!Number.isInteger(n) || n < 0 || n > MAX_STEPS) {
      throw new TypographyError('invalid_input', `${what} must be a whole number from 0 to ${MAX_STEPS}, got ${String(n)}.`);
    }
  }
  const steps: ScaleStep[] = [];
  for (let n = -stepsDown; n <= stepsUp; n++) steps.push({ step: n, px: base * r ** n });
  return steps;
}
