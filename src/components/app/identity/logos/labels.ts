// The words and grounds the logo screens share.
import type { IdentityLogo, LogoVariant } from '@/lib/identity/types';

export type Ground = 'light' | 'dark' | 'brand';
export type FileKind = keyof IdentityLogo['files'];

export const VARIANT_LABEL: Record<LogoVariant, string> = {
  primary: 'Primary',
  secondary: 'Secondary',
  mark: 'Mark',
  wordmark: 'Wordmark',
  lockup: 'Lockup',
  monogram: 'Monogram',
};
export const FILE_LABEL: Record<FileKind, string> = { original: 'As uploaded', black: 'Black', white: 'White', reversed: 'Reversed', onDark: 'For dark grounds' };
export const LIGHT = '#ffffff';
export const DARK = '#1c1a17';

/** Rounded to two decimals, for logo units shown in words. */
export const r2 = (n: number) => Math.round(n * 100) / 100;
