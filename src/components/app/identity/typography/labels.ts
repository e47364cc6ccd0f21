// The words the typography screens share.
import type { TypefaceRole } from '@/lib/identity/types';

export const ROLE_LABEL: Record<TypefaceRole, string> = { heading: 'Headings', body: 'Body text', accent: 'Accent' };
