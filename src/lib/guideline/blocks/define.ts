// One place that turns a block's fields into its attribute schema, defaults and registry entry.
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

export interface BlockDefinition<T extends string = string, S extends z.ZodObject = z.ZodObject> {
  type: T;
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
}

/** Builds a block description from its fields (each with a default). */
export function defineBlock<T extends string, F extends z.ZodRawShape>(spec: {
  type: T;
  label: string;
  description: string;
  group: BlockGroup;
  fields: F;
  starter?: Record<string, unknown>;
}): BlockDefinition<T, z.ZodObject<{ id: typeof blockIdSchema } & F, z.core.$strict>> {
  const schema = z.strictObject({ id: blockIdSchema, ...spec.fields });
  const { id: _id, ...defaults } = schema.parse({ id: 'defaults' }) as Record<string, unknown>;
  return {
    type: spec.type,
    label: spec.label,
    description: spec.description,
    group: spec.group,
    schema,
    defaults: defaults as never,
    starter: spec.starter ?? {},
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
