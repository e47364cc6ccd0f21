// The mock-up templates of templates/mockups (one JSON file each), checked against one schema when they are loaded.
// Boxes are [x, y, width, height] in millimetres for print pieces and in image pixels for screen pieces.
import * as z from 'zod';
import { COLOR_ROLES } from '@/lib/identity/types';

const box = z.tuple([z.number().min(0), z.number().min(0), z.number().positive(), z.number().positive()]);
const role = z.enum(COLOR_ROLES);

const element = z.discriminatedUnion('type', [
  z.strictObject({ type: z.literal('panel'), box, fill: role }),
  /** Filled by the brand's pattern (see pattern.ts); until then a plain palette field. */
  z.strictObject({ type: z.literal('pattern'), box }),
  /** The brand's n-th photograph, cropped to the box; a tinted panel when the brand has none. */
  z.strictObject({ type: z.literal('photo'), box, index: z.number().int().min(0).default(0) }),
  z.strictObject({
    type: z.literal('logo'),
    /** Which logo of the suite: the primary logo, or the standalone mark (falls back to the primary). */
    logo: z.enum(['primary', 'mark']),
    box,
    align: z.enum(['start', 'center']).default('center'),
    /** The colour the logo stands on, when it is not the page's ground. */
    on: role.optional(),
  }),
  z.strictObject({
    type: z.literal('text'),
    box,
    /** Our own sample copy; "{brand}" becomes the brand's name. */
    text: z.string().min(1).max(2000),
    face: z.enum(['heading', 'body']),
    /** A step of the brand's type scale (0 = body, 1 = one step up, -1 = one step down), clamped to the steps it has. */
    step: z.number().int().min(-4).max(8),
    weight: z.number().int().min(100).max(900).default(400),
    color: role,
    align: z.enum(['start', 'center', 'end']).default('start'),
  }),
]);
export type MockupElement = z.output<typeof element>;
export type LogoElement = Extract<MockupElement, { type: 'logo' }>;
export type TextElement = Extract<MockupElement, { type: 'text' }>;

export const mockupTemplateSchema = z.strictObject({
  key: z.string().regex(/^[a-z0-9-]{1,40}$/),
  name: z.string().min(1).max(80),
  medium: z.enum(['print', 'screen']),
  size: z.strictObject({ width: z.number().positive(), height: z.number().positive(), unit: z.enum(['mm', 'in', 'px']), named: z.string().min(1).max(160) }),
  /** Image pixels per CSS pixel for screen pieces (a phone shows a 1080 px post about 400 CSS px wide). */
  density: z.number().positive().default(1),
  densityNote: z.string().max(300).optional(),
  /** The brand's scale is set for screen; paper reads it at this fraction (body 12.75 pt × 0.8 ≈ 10 pt on a letter). */
  typeScaleFactor: z.number().positive().max(20).default(1),
  /** The pattern is set for a page held in the hand; a piece read from further away draws it this many times larger. */
  patternScale: z.number().positive().max(20).default(1),
  pages: z
    .array(z.strictObject({ name: z.string().min(1).max(40), ground: role, elements: z.array(element).max(40) }))
    .min(1)
    .max(4),
});
export type MockupTemplate = z.output<typeof mockupTemplateSchema>;

/** 1 in = 25.4 mm (exact, by definition of the international inch). */
export const MM_PER_IN = 25.4;

/** The trim size in the units boxes are written in: mm for print, px for screen. */
export function trimSize(template: MockupTemplate): { width: number; height: number } {
  const f = template.size.unit === 'in' ? MM_PER_IN : 1;
  return { width: template.size.width * f, height: template.size.height * f };
}

/** The unit boxes are written in. */
export const boxUnit = (template: MockupTemplate): 'mm' | 'px' => (template.medium === 'print' ? 'mm' : 'px');

const ORDER = ['business-card', 'letterhead-a4', 'letterhead-letter', 'envelope-dl', 'social-post', 'social-story', 'editorial-spread', 'sign'];

const files = import.meta.glob('/templates/mockups/*.json', { eager: true, import: 'default' });

/** Every template, checked, in a steady order (stationery first, then screens, editorial and signs). */
export const MOCKUP_TEMPLATES: readonly MockupTemplate[] = Object.entries(files)
  .map(([path, raw]) => {
    const parsed = mockupTemplateSchema.safeParse(raw);
    if (!parsed.success) throw new Error(`${path} is not a valid mock-up template: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
    if (!path.endsWith(`/${parsed.data.key}.json`)) throw new Error(`${path} must be named after its key "${parsed.data.key}".`);
    return parsed.data;
  })
  .sort((a, b) => ORDER.indexOf(a.key) - ORDER.indexOf(b.key) || a.key.localeCompare(b.key));

export const MOCKUP_KEYS = MOCKUP_TEMPLATES.map((t) => t.key);

/** A template by key, or undefined. */
export const mockupTemplate = (key: string): MockupTemplate | undefined => MOCKUP_TEMPLATES.find((t) => t.key === key);
