// Open fonts Plumbline ships (SIL Open Font License 1.1, from npm @fontsource-variable), usable by any brand.

export interface ShippedFont {
  key: string;
  family: string;
  category: 'sans-serif' | 'serif';
  /** Path of the Latin variable-weight WOFF2 inside node_modules. */
  file: string;
  licence: 'OFL-1.1';
  fallback: string[];
}

const font = (key: string, family: string, category: ShippedFont['category']): ShippedFont => ({
  key,
  family,
  category,
  file: `node_modules/@fontsource-variable/${key}/files/${key}-latin-wght-normal.woff2`,
  licence: 'OFL-1.1',
  fallback: category === 'serif' ? ['Georgia', 'serif'] : ['system-ui', 'sans-serif'],
});

export const SHIPPED_FONTS: readonly ShippedFont[] = [
  font('dm-sans', 'DM Sans', 'sans-serif'),
  font('bricolage-grotesque', 'Bricolage Grotesque', 'sans-serif'),
  font('hanken-grotesk', 'Hanken Grotesk', 'sans-serif'),
  font('source-serif-4', 'Source Serif 4', 'serif'),
  font('fraunces', 'Fraunces', 'serif'),
  font('newsreader', 'Newsreader', 'serif'),
];

/** A shipped font by key, or undefined. */
export const shippedFont = (key: string) => SHIPPED_FONTS.find((f) => f.key === key);
