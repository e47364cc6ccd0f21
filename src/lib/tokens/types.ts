export type TypefaceRole = 'heading' | 'body' | 'accent';

/** What the token exporters need from an identity (see model.ts for how each part becomes tokens). */
export interface IdentityForTokens {
  brand: { name: string; slug: string };
  colors: { name: string; hex: string; role?: string }[];
  typefaces: { role: TypefaceRole; family: string; fallback: string[]; weights?: number[] }[];
  typeScale: {
    basePx: number;
    ratioName: string;
    ratio: number;
    /** role defaults to heading above the base size and body at or below it; weight to that face's first weight. */
    steps: { name: string; px: number; lineHeight: number; role?: TypefaceRole; weight?: number; letterSpacingPx?: number }[];
  };
  spacing?: { name: string; px: number }[];
}

export type TokenFormat = 'dtcg' | 'dtcg-hex' | 'css' | 'tailwind' | 'scss';
