// One place that turns a block's fields into its attribute schema, defaults, declared references and registry entry.
import * as z from 'zod';
import { isCleanNote, NOTE_MESSAGE } from '@/lib/safe/values';
import { blockIdSchema } from '@/lib/guideline/ids';

export const BLOCK_GROUPS = {
  structure: 'Structure',
  logo: 'Logo',
  colour: 'Colour',
  type: 'Type',
  imagery: 'Imagery and pattern',
  files: 'Files',
} as const;
export type BlockGroup = keyof typeof BLOCK_GROUPS;

/**
 * What an attribute points at in the brand: a colour, a logo or a shelf asset by id, a typeface by its role.
 * An "image" is a shelf asset drawn in the page (a published version keeps its own copy); an "asset" is a shelf
 * file listed for download (it stays behind the download rules).
 */
export type RefKind = 'colour' | 'logo' | 'typeface' | 'image' | 'asset';

/** The references of one attribute: a kind for an id (or a list of ids), or a kind per field for a list of objects. */
export type RefSpec = RefKind | Readonly<Record<string, RefKind>>;

type RefOf<V> =
  NonNullable<V> extends readonly (infer I)[] ? (I extends string ? RefKind : { readonly [K in keyof I]?: RefKind }) : NonNullable<V> extends string ? RefKind : never;

/** Declared references of a block, by attribute (typed against the block's own fields). */
export type BlockRefs<F extends z.ZodRawShape> = { readonly [K in keyof F]?: RefOf<z.output<F[K]>> };

export interface BlockDefinition<T extends string = string, S extends z.ZodObject = z.ZodObject> {
  type: T;
  /** Place in the registry (insert menu order within a group); lower comes first. */
  order: number;
  /** Our own name for the block, shown in the insert menu. */
  label: string;
  /** One line under the label in the insert menu. */
  description: string;
  group: BlockGroup;
  /** The attribute schema (id included); unknown attributes are refused. */
  schema: S;
  /** Every attribute but the id, at its default. */
  defaults: Omit<z.output<S>, 'id'>;
  /** Attributes a new block starts with, in the template placeholder convention ("$all", "$primary"). */
  starter: Record<string, unknown>;
  /** Which attributes point at the brand's colours, logos, typefaces and assets. */
  refs: Readonly<Record<string, RefSpec>>;
  /** Stored attributes made safe before parsing (old drafts may hold values a newer rule refuses). */
  fromStored: (attrs: unknown) => unknown;
}

/** Builds a block description from its fields (each with a default). */
export function defineBlock<T extends string, F extends z.ZodRawShape>(spec: {
  type: T;
  order: number;
  label: string;
  description: string;
  group: BlockGroup;
  fields: F;
  refs?: BlockRefs<F>;
  starter?: Record<string, unknown>;
  fromStored?: (attrs: unknown) => unknown;
}): BlockDefinition<T, z.ZodObject<{ id: typeof blockIdSchema } & F, z.core.$strict>> {
  const schema = z.strictObject({ id: blockIdSchema, ...spec.fields });
  const { id: _id, ...defaults } = schema.parse({ id: 'defaults' }) as Record<string, unknown>;
  return {
    type: spec.type,
    order: spec.order,
    label: spec.label,
    description: spec.description,
    group: spec.group,
    schema,
    defaults: defaults as never,
    starter: spec.starter ?? {},
    refs: (spec.refs ?? {}) as Record<string, RefSpec>,
    fromStored: spec.fromStored ?? ((attrs) => attrs),
  };
}

/** Plain text of bounded length, no control characters but line breaks (React escapes it; it is never HTML). */
export const text = (max: number, fallback = '') =>
  z.string({ error: 'Expected text.' }).max(max, { error: `At most ${max} characters.` }).refine(isCleanNote, NOTE_MESSAGE).default(fallback);

/** A list of distinct items with a cap. */
export function distinctList<T extends z.ZodType>(item: T, max: number, what: string) {
  return z
    .array(item)
    .max(max, { error: `At most ${max} ${what}.` })
    .refine((list) => new Set(list.map((v) => JSON.stringify(v))).size === list.length, { error: `Each of the ${what} may appear once.` });
}
