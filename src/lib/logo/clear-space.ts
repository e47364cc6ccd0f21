import { requireSize } from './errors';
import type { Box } from './geometry';

export interface ClearSpace extends Box {
  /** The margin kept free on every side, in logo units. */
  margin: number;
}

/** The clear-space box: the drawn bounds grown on every side by multiple × unitSize (e.g. 1 × the x-height). */
export function clearSpace({ bounds, unitSize, multiple }: { bounds: Box; unitSize: number; multiple: number }): ClearSpace {
  for (const key of ['width', 'height'] as const) requireSize(bounds?.[key], `The bounds ${key}`);
  for (const key of ['x', 'y'] as const) {
    if (!Number.isFinite(bounds[key])) requireSize(Number.NaN, `The bounds ${key}`);
  }
  const margin = requireSize(unitSize, 'The clear-space unit') * requireSize(multiple, 'The clear-space multiple', true);
  return { x: bounds.x - margin, y: bounds.y - margin, width: bounds.width + 2 * margin, height: bounds.height + 2 * margin, margin };
}
