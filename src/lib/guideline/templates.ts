// Starter templates: documents whose identity references are placeholders, resolved against one brand's identity.
import * as z from 'zod';
import type { ColorRole, Identity } from '@/lib/identity/types';
import { COLOR_ROLES } from '@/lib/identity/types';
import { contrastRatio } from '@/lib/color/contrast';
import { AppError } from '@/lib/errors';
import { validateGuideline, type GuidelineDoc } from './document';
import { newBlockId } from './ids';
import { colorForRole, colorsInOrder, extremes, logosInOrder, markLogo, primaryLogo } from './identity';
import type { ContrastPair } from '@/blocks/contrastPairs/definition';
import { blockDefinition, type BlockDefinition, type RefSpec } from '@/blocks';

/**
 * Placeholders, allowed where a block's definition declares a reference: colour fields take "$all" (in a list) or a
 * role ("$primary", "$text", "$background", …); logo fields take "$all", "$primary" or "$mark"; a list of colour
 * pairs (foreground on background) takes "$suggested". Anything unresolvable becomes null (single) or is dropped
 * (lists), so the block shows its empty state.
 */
export const templateSchema = z.strictObject({
  name: z.string().min(1).max(120),
  description: z.string().max(500),
  doc: z.strictObject({ type: z.literal('doc'), content: z.array(z.looseObject({ type: z.string() })).max(2000) }),
});
export type GuidelineTemplate = z.output<typeof templateSchema>;

/** A starter template of ours that does not hold together: our fault, so a 500 that names where. */
export class TemplateError extends AppError<'invalid_template'> {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super('invalid_template', `${path}: ${message}`, { status: 500 });
  }
}

/**
 * Pairs worth showing first: text on the ground, then each key colour with whichever extreme (lightest or darkest)
 * it reads best against. Only pairs that reach WCAG 2.2 AA for body text (SC 1.4.3, 4.5:1) are suggested, since the
 * block presents pairs to use; the text-on-ground pair is always kept so that a failing one is seen.
 */
export function suggestedPairs(identity: Identity): ContrastPair[] {
  const { lightest, darkest } = extremes(identity);
  const text = colorForRole(identity, 'text');
  const ground = colorForRole(identity, 'background');
  const ratio = (fg?: { value: string }, bg?: { value: string }) => (fg && bg ? contrastRatio(fg.value, bg.value) : 0);
  const candidates: [string | undefined, string | undefined, boolean][] = [[text?.id, ground?.id, true]];
  for (const c of colorsInOrder(identity)) {
    if (c.role !== 'primary' && c.role !== 'secondary' && c.role !== 'accent') continue;
    candidates.push(ratio(c, lightest) >= ratio(darkest, c) ? [c.id, lightest?.id, false] : [darkest?.id, c.id, false]);
  }
  const primary = colorForRole(identity, 'primary');
  candidates.push([lightest?.id, primary?.id, false]);
  const byId = new Map(identity.colors.map((c) => [c.id, c]));
  const seen = new Set<string>();
  const pairs: ContrastPair[] = [];
  for (const [foreground, background, always] of candidates) {
    if (!foreground || !background || foreground === background || seen.has(`${foreground}/${background}`)) continue;
    if (!always && ratio(byId.get(foreground), byId.get(background)) < 4.5) continue;
    seen.add(`${foreground}/${background}`);
    pairs.push({ foreground, background });
  }
  return pairs.slice(0, 8);
}

function resolveColor(identity: Identity, token: string, path: string): string | null {
  const role = token.slice(1);
  if (!(COLOR_ROLES as readonly string[]).includes(role)) {
    throw new TemplateError(path, `Unknown colour placeholder "${token}"; use "$all" or one of ${COLOR_ROLES.map((r) => `$${r}`).join(', ')}.`);
  }
  return colorForRole(identity, role as ColorRole)?.id ?? null;
}

function resolveLogo(identity: Identity, token: string, path: string): string | null {
  if (token === '$primary') return primaryLogo(identity)?.id ?? null;
  if (token === '$mark') return markLogo(identity)?.id ?? null;
  throw new TemplateError(path, `Unknown logo placeholder "${token}"; use "$all", "$primary" or "$mark".`);
}

/** The declared reference of one attribute or item field (own keys only: a template's keys are not trusted). */
const refOf = (refs: Readonly<Record<string, RefSpec>> | undefined, key: string) => (refs && Object.hasOwn(refs, key) ? refs[key] : undefined);

/** A list of objects whose declared references are a foreground colour on a background colour. */
const isColorPairs = (ref: RefSpec | undefined) => typeof ref === 'object' && ref.foreground === 'colour' && ref.background === 'colour';

function resolveValue(identity: Identity, ref: RefSpec | undefined, key: string, value: unknown, path: string): unknown {
  if (value === '$suggested' && isColorPairs(ref)) return suggestedPairs(identity);
  const isColor = ref === 'colour';
  const isLogo = ref === 'logo';
  if (Array.isArray(value)) {
    if (!isColor && !isLogo) return value.map((item, i) => resolveValue(identity, ref, key, item, `${path}.${i}`));
    const out: unknown[] = [];
    value.forEach((item, i) => {
      if (item === '$all') out.push(...(isColor ? colorsInOrder(identity) : logosInOrder(identity)).map((x) => x.id));
      else {
        const resolved = resolveValue(identity, ref, key, item, `${path}.${i}`);
        if (resolved !== null) out.push(resolved);
      }
    });
    return [...new Set(out)];
  }
  if (typeof value === 'string' && value.startsWith('$')) {
    if (isColor) return resolveColor(identity, value, path);
    if (isLogo) return resolveLogo(identity, value, path);
    throw new TemplateError(path, `"${value}" is a placeholder, but "${key}" takes no identity reference.`);
  }
  if (value && typeof value === 'object') {
    const fields = typeof ref === 'object' ? ref : {};
    const resolved = Object.fromEntries(Object.entries(value).map(([k, v]) => [k, resolveValue(identity, refOf(fields, k), k, v, `${path}.${k}`)]));
    // An item (a contrast pair) with a colour or logo that did not resolve is dropped by the caller.
    const unresolved = Object.entries(fields).some(([k, kind]) => (kind === 'colour' || kind === 'logo') && k in resolved && resolved[k] === null);
    return unresolved ? null : resolved;
  }
  return value;
}

/** A block's attributes with every placeholder resolved against the identity, by the block's declared references. */
function resolveAttrs(identity: Identity, block: BlockDefinition | undefined, attrs: Record<string, unknown>, path: (key: string) => string) {
  return Object.fromEntries(
    Object.entries(attrs).map(([key, value]) => {
      const out = resolveValue(identity, refOf(block?.refs, key), key, value, path(key));
      return [key, Array.isArray(out) ? out.filter((x) => x !== null) : out];
    }),
  );
}

/** Resolves a template's placeholders against an identity, gives every block a fresh id, and validates the result. */
export function instantiateTemplate(template: unknown, identity: Identity): GuidelineDoc {
  const parsed = templateSchema.safeParse(template);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new TemplateError(issue.path.join('.') || '(template)', issue.message);
  }
  const content = parsed.data.doc.content.map(({ instruction: _instruction, ...node }, i) => {
    const attrs = (node.attrs ?? {}) as Record<string, unknown>;
    const resolved = resolveAttrs(identity, blockDefinition(node.type), attrs, (key) => `doc.content.${i}.attrs.${key}`);
    return { ...node, attrs: { ...resolved, id: newBlockId() } };
  });
  const result = validateGuideline({ type: 'doc', content });
  if (!result.ok) throw new TemplateError(result.error.path, result.error.message);
  return result.doc;
}

type TextTree = { type?: string; text?: string; content?: TextTree[] };
const paragraphTexts = (node: TextTree, out: string[]): string[] => {
  if (node.type === 'paragraph' || node.type === 'heading') out.push((node.content ?? []).map((n) => n.text ?? '').join(''));
  else for (const child of node.content ?? []) paragraphTexts(child, out);
  return out;
};

/**
 * The instruction texts a template marks with `"instruction": true` on a top-level node ("Write two or three short
 * paragraphs…"): text meant for the designer, which the check before publishing finds if it was left in.
 */
export function templateInstructions(template: unknown): string[] {
  const nodes = ((template as { doc?: { content?: unknown[] } })?.doc?.content ?? []) as (TextTree & { instruction?: unknown })[];
  return nodes.filter((n) => n.instruction === true).flatMap((n) => paragraphTexts(n, []));
}

/** Attributes for a newly inserted block: its registry starter resolved against the identity. */
export function starterAttrs(block: BlockDefinition, identity: Identity): Record<string, unknown> {
  return resolveAttrs(identity, block, block.starter, (key) => key);
}
