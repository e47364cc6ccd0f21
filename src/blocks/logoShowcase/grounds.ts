// The three grounds every logo preview offers: light, dark and the brand colour.
import { colorForRole, extremes, findColor } from '@/lib/guideline/identity';
import type { Identity } from '@/lib/identity/types';

export interface Ground {
  key: 'light' | 'dark' | 'brand';
  label: string;
  hex: string;
  /** The brand colour id was chosen but is gone from the identity. */
  missing?: boolean;
}

export function logoGrounds(identity: Identity, brandColorId: string | null): Ground[] {
  const { lightest, darkest } = extremes(identity);
  const chosen = findColor(identity, brandColorId);
  const brand = chosen ?? colorForRole(identity, 'primary');
  return [
    { key: 'light', label: 'On light', hex: lightest?.hex ?? '#ffffff' },
    { key: 'dark', label: 'On dark', hex: darkest && darkest !== lightest ? darkest.hex : '#1a1a1a' },
    { key: 'brand', label: brand ? `On ${brand.name}` : 'On the brand colour', hex: brand?.hex ?? '#4a4a4a', missing: brandColorId !== null && !chosen },
  ];
}
