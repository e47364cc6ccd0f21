// The one place a mock-up asks for the brand's pattern. Until the pattern generator lands this is a plain palette
// field (the secondary colour, else the accent, else the primary); swap the generator's tile in here and nowhere else.
import type { Identity } from '@/lib/identity/types';
import { colorForRole } from '@/lib/guideline/identity';
import { storedHexOr } from './colour';

export interface MockupPattern {
  /** The field colour under (or instead of) the pattern tile. */
  hex: string;
}

/** The pattern a mock-up fills its pattern areas with. */
export function mockupPattern(identity: Identity): MockupPattern {
  const field = colorForRole(identity, 'secondary') ?? colorForRole(identity, 'accent') ?? colorForRole(identity, 'primary');
  return { hex: storedHexOr(field?.hex, '#d9d4c7') };
}
