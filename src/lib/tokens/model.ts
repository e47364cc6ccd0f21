import { parseColor, type Color } from '@/lib/color/parse';
import { TokenError } from './errors';
import { kebabName, uniqueName } from './names';
import type { IdentityForTokens, TypefaceRole } from './types';

/** Root font size that rem values assume. */
export const ROOT_PX = 16;

export interface Dimension {
  value: number;
  unit: 'px' | 'rem';
}

export interface Typography {
  fontFamily: string[];
  fontSize: Dimension;
  fontWeight: number;
  lineHeight: number;
  letterSpacing: Dimension;
}

/** One token, format-neutral: every exporter renders this list, so a token is described once. */
export type Token = { path: string[]; description?: string } & (
  | { type: 'color'; value: Color }
  | { type: 'fontFamily'; value: string[] }
  | { type: 'fontWeight'; value: number }
  | { type: 'dimension'; value: Dimension }
  | { type: 'number'; value: number }
  | { type: 'typography'; value: Typography }
);

const UNSAFE_FAMILY = /[;{}<>"\\\n\r]/;

function invalid(message: string): never {
  throw new TokenError('invalid_identity', message);
}

const positive = (v: unknown, what: string): number =>
  typeof v === 'number' && Number.isFinite(v) && v > 0 ? v : invalid(`${what} must be a number above zero, got ${String(v)}.`);

const rem = (px: number): Dimension => ({ value: Math.round((px / ROOT_PX) * 10_000) / 10_000, unit: 'rem' });

function family(name: unknown, what: string): string {
  const text = typeof name === 'string' ? name.trim() : '';
  if (!text) invalid(`${what} needs a font family name.`);
  if (UNSAFE_FAMILY.test(text) || text.length > 100) invalid(`${what}: the family name "${text.slice(0, 40)}" has characters not allowed in a font name.`);
  return text;
}

/** Checks an identity and flattens it into tokens: colours, families, weights, sizes, line heights, typography, spacing. */
export function identityTokens(identity: IdentityForTokens): Token[] {
  if (!identity || typeof identity !== 'object') invalid('No identity was given.');
  const tokens: Token[] = [];
  const taken = new Map<string, Set<string>>();
  const name = (group: string, text: string) => {
    if (!taken.has(group)) taken.set(group, new Set());
    return uniqueName(kebabName(text), taken.get(group)!);
  };

  for (const c of identity.colors ?? []) {
    const parsed = parseColor(c?.hex);
    if (!parsed.ok) invalid(`Colour "${c?.name}": ${parsed.error.message}`);
    tokens.push({ path: ['color', name('color', c.name)], type: 'color', value: parsed.color, ...(c.role ? { description: c.role } : {}) });
  }

  const faces = new Map<TypefaceRole, { family: string[]; weights: number[] }>();
  for (const face of identity.typefaces ?? []) {
    if (!['heading', 'body', 'accent'].includes(face?.role)) invalid(`A typeface role must be heading, body or accent, got "${face?.role}".`);
    const stack = [family(face.family, `The ${face.role} typeface`), ...(face.fallback ?? []).map((f) => family(f, `A ${face.role} fallback`))];
    const weights = (face.weights?.length ? face.weights : [400]).map((w) =>
      Number.isInteger(w) && w >= 1 && w <= 1000 ? w : invalid(`Font weights run from 1 to 1000, got ${w}.`),
    );
    faces.set(face.role, { family: stack, weights });
    tokens.push({ path: ['font-family', name('font-family', face.role)], type: 'fontFamily', value: stack });
    for (const w of weights) tokens.push({ path: ['font-weight', name('font-weight', `${face.role}-${w}`)], type: 'fontWeight', value: w });
  }

  const scale = identity.typeScale;
  if (scale) {
    const base = positive(scale.basePx, 'The base type size');
    const ratioNote = `${scale.ratioName ?? 'custom'} scale, ratio ${Number(scale.ratio).toFixed(3)}`;
    for (const step of scale.steps ?? []) {
      const px = positive(step?.px, `Type size "${step?.name}"`);
      const lineHeight = positive(step.lineHeight, `Line height of "${step.name}"`);
      const stepName = name('font-size', step.name);
      const role = step.role ?? (px > base ? 'heading' : 'body');
      const face = faces.get(role) ?? faces.get('body') ?? [...faces.values()][0];
      const description = `${Math.round(px * 100) / 100} px at a ${ROOT_PX} px root; ${ratioNote}`;
      tokens.push({ path: ['font-size', stepName], type: 'dimension', value: rem(px), description });
      tokens.push({ path: ['line-height', stepName], type: 'number', value: lineHeight });
      if (face) {
        tokens.push({
          path: ['typography', stepName],
          type: 'typography',
          value: {
            fontFamily: face.family,
            fontSize: rem(px),
            fontWeight: step.weight ?? face.weights[0],
            lineHeight,
            letterSpacing: { value: step.letterSpacingPx ?? 0, unit: 'px' },
          },
        });
      }
    }
  }

  for (const s of identity.spacing ?? []) {
    tokens.push({ path: ['spacing', name('spacing', s?.name)], type: 'dimension', value: rem(positive(s?.px, `Spacing "${s?.name}"`)) });
  }
  return tokens;
}
