import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Color from 'colorjs.io';
import StyleDictionary from 'style-dictionary';
import type { DesignTokens } from 'style-dictionary/types';
import { afterAll, describe, expect, test } from 'vitest';
import {
  toCss,
  toDtcg,
  toDtcgHex,
  tokenFile,
  toScss,
  toTailwindTheme,
  TokenError,
  TOKEN_FORMATS,
  type IdentityForTokens,
} from '@/lib/tokens';

// Invented demo identity (not a real brand). The scale is a major third (5:4) from 16 px, worked by hand:
// 16 × 1.25ⁿ for n = −1…4.
const identity: IdentityForTokens = {
  brand: { name: 'Harbour & Finch', slug: 'harbour-finch' },
  colors: [
    { name: 'Deep Harbour', hex: '#1d3557', role: 'Primary text and marks' },
    { name: 'Signal Coral', hex: '#e4572e' },
    { name: 'Sand', hex: '#f1e9da', role: 'Backgrounds' },
    { name: 'Mist', hex: '#1d355780' },
  ],
  typefaces: [
    { role: 'heading', family: 'Fraunces Variable', fallback: ['Georgia', 'serif'], weights: [600, 700] },
    { role: 'body', family: 'DM Sans Variable', fallback: ['system-ui', 'sans-serif'], weights: [400, 500] },
  ],
  typeScale: {
    basePx: 16,
    ratioName: 'major-third',
    ratio: 1.25,
    steps: [
      { name: 'small', px: 12.8, lineHeight: 1.5 },
      { name: 'body', px: 16, lineHeight: 1.5 },
      { name: 'h4', px: 20, lineHeight: 1.2 },
      { name: 'h3', px: 25, lineHeight: 1.2 },
      { name: 'h2', px: 31.25, lineHeight: 1.2 },
      { name: 'h1', px: 39.0625, lineHeight: 1.2 },
    ],
  },
  spacing: [
    { name: 'sm', px: 8 },
    { name: 'md', px: 16 },
  ],
};

/** Custom properties of a CSS text as a name → value map. */
const cssVars = (css: string) => new Map([...css.matchAll(/--([\w-]+):\s*([^;]+);/g)].map((m) => [m[1], m[2].trim()]));

type Node = Record<string, unknown>;
const TOKEN_TYPES = ['color', 'dimension', 'fontFamily', 'fontWeight', 'number', 'typography'];

/** Walks a DTCG tree, returning [path, token] for every object with a $value. */
function tokensOf(node: Node, path: string[] = []): [string[], Node][] {
  if ('$value' in node) return [[path, node]];
  return Object.entries(node)
    .filter(([k]) => !k.startsWith('$'))
    .flatMap(([k, v]) => tokensOf(v as Node, [...path, k]));
}

describe('DTCG 2025.10 export follows the format rules (Design Tokens Format Module 2025.10 and Color Module 2025.10)', () => {
  const tree = toDtcg(identity) as Node;
  const all = tokensOf(tree);
  test('every token has $type and $value; names never start with $ nor contain { } or . (Format Module §5 names)', () => {
    expect(all.length).toBeGreaterThan(20);
    for (const [path, token] of all) {
      expect(TOKEN_TYPES).toContain(token.$type);
      for (const part of path) expect(part).toMatch(/^[^${}.][^{}.]*$/);
    }
  });
  test('colours: colorSpace srgb, components and hex as colorjs.io reads the typed value (Color Module: srgb)', () => {
    const colors = all.filter(([, t]) => t.$type === 'color');
    expect(colors).toHaveLength(4);
    const typed = new Map(identity.colors.map((c) => [c.name.toLowerCase().replace(/\s+/g, '-'), c.hex]));
    for (const [path, t] of colors) {
      const v = t.$value as { colorSpace: string; components: number[]; hex: string; alpha?: number };
      const ref = new Color(typed.get(path[path.length - 1])!);
      expect(v.colorSpace).toBe('srgb');
      expect(v.components).toHaveLength(3);
      v.components.forEach((c, i) => expect(c).toBeCloseTo(Number(ref.coords[i]), 4));
      expect(v.hex).toBe(ref.toString({ format: 'hex', collapse: false, alpha: false }));
      if (v.alpha !== undefined) expect(v.alpha).toBeCloseTo(ref.alpha.valueOf(), 3);
    }
    expect(((tree.color as Node)['deep-harbour'] as Node).$description).toBe('Primary text and marks');
    expect(((tree.color as Node).mist as Node).$value).toMatchObject({ alpha: 0.502 });
  });
  test('dimensions are {value, unit} with unit px or rem (Format Module §8.2 dimension)', () => {
    const dims = all.filter(([, t]) => t.$type === 'dimension');
    for (const [, t] of dims) {
      const v = t.$value as { value: number; unit: string };
      expect(typeof v.value).toBe('number');
      expect(['px', 'rem']).toContain(v.unit);
    }
    expect(((tree['font-size'] as Node).h1 as Node).$value).toEqual({ value: 2.4414, unit: 'rem' }); // 16 × 1.25⁴ = 39.0625 px
  });
  test('fontFamily is a list, fontWeight a number 1–1000, typography a composite (Format Module §8.3, §8.4, §9.7)', () => {
    expect(((tree['font-family'] as Node).heading as Node).$value).toEqual(['Fraunces Variable', 'Georgia', 'serif']);
    for (const [, t] of all.filter(([, x]) => x.$type === 'fontWeight')) expect(t.$value as number).toBeGreaterThanOrEqual(1);
    const h1 = ((tree.typography as Node).h1 as Node).$value as Node;
    expect(h1).toEqual({
      fontFamily: ['Fraunces Variable', 'Georgia', 'serif'],
      fontSize: { value: 2.4414, unit: 'rem' },
      fontWeight: 600,
      lineHeight: 1.2,
      letterSpacing: { value: 0, unit: 'px' },
    });
    expect(((tree.typography as Node).body as Node).$value).toMatchObject({ fontFamily: ['DM Sans Variable', 'system-ui', 'sans-serif'] });
  });
});

describe('read back by style-dictionary 4.4 (general-purpose reference tool) equals our own CSS', () => {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-sd-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  test('the legacy hex flavour built to css/variables gives the same custom properties as toCss', async () => {
    const sd = new StyleDictionary({
      tokens: toDtcgHex(identity) as DesignTokens,
      log: { verbosity: 'silent' },
      platforms: { css: { transformGroup: 'css', buildPath: `${dir}/`, files: [{ destination: 'vars.css', format: 'css/variables' }] } },
    });
    await sd.buildAllPlatforms();
    const theirs = cssVars(readFileSync(join(dir, 'vars.css'), 'utf8'));
    const ours = cssVars(toCss(identity));
    expect(theirs.size).toBeGreaterThan(20);
    expect(Object.fromEntries(ours)).toEqual(Object.fromEntries(theirs));
  });
});

describe('text formats', () => {
  test('CSS custom properties on :root (CSS Custom Properties Level 1)', () => {
    const css = toCss(identity);
    expect(css).toMatch(/^\/\*.*\*\/\n:root \{\n/);
    const vars = cssVars(css);
    expect(vars.get('color-deep-harbour')).toBe('#1d3557');
    expect(vars.get('color-mist')).toBe('rgba(29, 53, 87, 0.5)');
    expect(vars.get('font-family-heading')).toBe("'Fraunces Variable', Georgia, serif");
    expect(vars.get('font-size-body')).toBe('1rem');
    expect(vars.get('spacing-sm')).toBe('0.5rem');
  });
  test('Tailwind 4 @theme uses its namespaces (Tailwind CSS v4 theme variables documentation, from memory)', () => {
    const tw = toTailwindTheme(identity);
    expect(tw).toContain('@theme {');
    const vars = cssVars(tw);
    expect(vars.get('color-signal-coral')).toBe('#e4572e');
    expect(vars.get('font-body')).toBe("'DM Sans Variable', system-ui, sans-serif");
    expect(vars.get('text-h1')).toBe('2.4414rem');
    expect(vars.get('text-h1--line-height')).toBe('1.2');
    expect(vars.get('spacing-md')).toBe('1rem');
  });
  test('SCSS variables', () => {
    const scss = toScss(identity);
    expect(scss).toContain('$color-sand: #f1e9da;');
    expect(scss).toContain("$font-family-body: 'DM Sans Variable', system-ui, sans-serif;");
  });
  test.each([
    ['dtcg', 'harbour-finch.tokens.json'],
    ['dtcg-hex', 'harbour-finch.legacy.tokens.json'],
    ['css', 'harbour-finch-tokens.css'],
    ['tailwind', 'harbour-finch-theme.css'],
    ['scss', '_harbour-finch-tokens.scss'],
  ] as const)('tokenFile(%s) → %s', (format, filename) => {
    const file = tokenFile(format, identity);
    expect(file.filename).toBe(filename);
    expect(file.body.length).toBeGreaterThan(100);
    if (format.startsWith('dtcg')) expect(() => JSON.parse(file.body)).not.toThrow();
  });
  test('all formats are listed', () => {
    expect([...TOKEN_FORMATS]).toEqual(['dtcg', 'dtcg-hex', 'css', 'tailwind', 'scss']);
  });
});

describe('bad identities are typed errors', () => {
  test.each([
    ['a colour that is not a colour', { ...identity, colors: [{ name: 'Oops', hex: 'blurple' }] }, /Oops/],
    ['a font name that could break out of CSS', { ...identity, typefaces: [{ role: 'body', family: 'X; } body { display:none', fallback: [] }] }, /not allowed/],
    ['a negative size', { ...identity, spacing: [{ name: 'x', px: -4 }] }, /above zero/],
  ] as [string, IdentityForTokens, RegExp][])('%s', (_name, bad, message) => {
    expect(() => toCss(bad)).toThrow(TokenError);
    expect(() => toDtcg(bad)).toThrow(message);
  });
  test('unknown format', () => {
    expect(() => tokenFile('xml' as 'css', identity)).toThrow(TokenError);
  });
  test('duplicate and odd names become distinct kebab-case names', () => {
    const vars = cssVars(toCss({ ...identity, colors: [{ name: 'Café Crème', hex: '#c8a27a' }, { name: 'café crème', hex: '#c8a27b' }] }));
    expect(vars.get('color-cafe-creme')).toBe('#c8a27a');
    expect(vars.get('color-cafe-creme-2')).toBe('#c8a27b');
  });
});
