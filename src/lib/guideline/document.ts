// The guideline document: ProseMirror JSON made of registry blocks and rich text, with the limits the server enforces.
import * as z from 'zod';
import { BLOCKS, blockDefinition, type BlockDefinition } from '@/blocks';
import {
  blockquoteSchema,
  bulletListSchema,
  headingSchema,
  INNER_TYPES,
  orderedListSchema,
  paragraphSchema,
  RICH_TEXT_TYPES,
  type RichBlockNode,
} from './richText';

/** Limits on one stored document. */
export const GUIDELINE_LIMITS = {
  /** Size of the document as JSON, in bytes (UTF-8). */
  maxBytes: 2 * 1024 * 1024,
  /** Nesting of content arrays below the doc (a paragraph's text is at depth 2). */
  maxDepth: 12,
  maxTopLevelBlocks: 2000,
} as const;

/** A registry block: its type names a folder under src/blocks, its attributes fit that block's schema. */
export type IdentityBlockNode = { type: string; attrs: { id: string } & Record<string, unknown> };
export type TopLevelNode = IdentityBlockNode | RichBlockNode;
export interface GuidelineDoc {
  type: 'doc';
  content: TopLevelNode[];
}

const blockNodeSchemas = BLOCKS.map((b) => z.strictObject({ type: z.literal(b.type), attrs: b.schema }));

const topLevelSchema = z.discriminatedUnion('type', [...blockNodeSchemas, paragraphSchema, headingSchema, bulletListSchema, orderedListSchema, blockquoteSchema] as unknown as [
  z.ZodObject<{ type: z.ZodLiteral<string> }>,
  ...z.ZodObject<{ type: z.ZodLiteral<string> }>[],
]);

/** The whole document: every top-level block carries a distinct id. */
export const guidelineDocSchema = z
  .strictObject({
    type: z.literal('doc', { error: 'The document must have type "doc".' }),
    content: z
      .array(topLevelSchema)
      .max(GUIDELINE_LIMITS.maxTopLevelBlocks, { error: `A document may hold at most ${GUIDELINE_LIMITS.maxTopLevelBlocks} blocks.` }),
  })
  .superRefine((doc, ctx) => {
    const seen = new Set<string>();
    (doc.content as TopLevelNode[]).forEach((node, i) => {
      const id = (node.attrs as { id?: unknown } | undefined)?.id;
      if (typeof id !== 'string') ctx.addIssue({ code: 'custom', path: ['content', i, 'attrs', 'id'], message: 'Every block needs an id.' });
      else if (seen.has(id)) ctx.addIssue({ code: 'custom', path: ['content', i, 'attrs', 'id'], message: `The block id "${id}" is used twice.` });
      else seen.add(id);
    });
  }) as unknown as z.ZodType<GuidelineDoc>;

export type ValidationResult = { ok: true; doc: GuidelineDoc } | { ok: false; error: { path: string; message: string } };

const KNOWN_TYPES = new Set<string>([...BLOCKS.map((b) => b.type), ...RICH_TEXT_TYPES, ...INNER_TYPES]);

const fail = (path: (string | number)[], message: string): ValidationResult => ({ ok: false, error: { path: path.join('.'), message } });

/** UTF-8 length of a string without allocating a buffer. */
function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code < 0x80) bytes += 1;
    else if (code < 0x800) bytes += 2;
    else if (code >= 0xd800 && code <= 0xdbff) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}

/** Walks node trees in document order: too deep, not an object or an unknown type → the first offending path. */
function checkTree(nodes: unknown[], path: (string | number)[], depth: number): ValidationResult | null {
  for (let i = 0; i < nodes.length; i++) {
    const node = nodes[i];
    const here = [...path, i];
    if (depth > GUIDELINE_LIMITS.maxDepth) return fail(here, `The document nests deeper than ${GUIDELINE_LIMITS.maxDepth} levels.`);
    if (typeof node !== 'object' || node === null || Array.isArray(node)) return fail(here, 'Expected a block (an object with a type).');
    const { type, content } = node as { type?: unknown; content?: unknown };
    if (typeof type !== 'string') return fail([...here, 'type'], 'A block needs a type.');
    if (!KNOWN_TYPES.has(type)) return fail([...here, 'type'], `Unknown block type "${type.slice(0, 60)}".`);
    if (depth === 1 && (INNER_TYPES as readonly string[]).includes(type)) {
      return fail([...here, 'type'], `"${type}" may only appear inside another block.`);
    }
    if (Array.isArray(content)) {
      const inner = checkTree(content, [...here, 'content'], depth + 1);
      if (inner) return inner;
    }
  }
  return null;
}

function describeIssue(issue: z.core.$ZodIssue): { path: (string | number)[]; message: string } {
  const path = issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p));
  if (issue.code === 'unrecognized_keys') return { path: [...path, issue.keys[0]], message: `Unknown attribute "${issue.keys[0]}".` };
  return { path, message: issue.message };
}

/** Checks a stored or submitted document against the limits and every block's schema; names the first bad path. */
export function validateGuideline(doc: unknown): ValidationResult {
  let json: string | undefined;
  try {
    json = JSON.stringify(doc);
  } catch {
    return fail([], 'The document could not be read as JSON.');
  }
  if (json === undefined || typeof doc !== 'object' || doc === null || Array.isArray(doc)) return fail([], 'The document must be an object {type:"doc", content:[…]}.');
  const bytes = utf8Length(json);
  if (bytes > GUIDELINE_LIMITS.maxBytes) {
    return fail([], `The document is ${(bytes / 1024 / 1024).toFixed(1)} MB; the limit is ${GUIDELINE_LIMITS.maxBytes / 1024 / 1024} MB.`);
  }
  const { type, content } = doc as { type?: unknown; content?: unknown };
  if (type !== 'doc') return fail(['type'], 'The document must have type "doc".');
  if (!Array.isArray(content)) return fail(['content'], 'The document needs a content list.');
  if (content.length > GUIDELINE_LIMITS.maxTopLevelBlocks) {
    return fail(['content'], `A document may hold at most ${GUIDELINE_LIMITS.maxTopLevelBlocks} blocks; this one has ${content.length}.`);
  }
  const treeError = checkTree(content, ['content'], 1);
  if (treeError) return treeError;
  const parsed = guidelineDocSchema.safeParse(doc);
  if (parsed.success) return { ok: true, doc: parsed.data };
  const first = parsed.error.issues[0];
  const { path, message } = describeIssue(first);
  return fail(path, message);
}

/** Parses a block's attributes through its schema (defaults filled), or null when they do not fit. */
export function parseBlockAttrs<S extends z.ZodObject>(block: BlockDefinition<string, S>, attrs: unknown): z.output<S> | null {
  const result = block.schema.safeParse(attrs ?? {});
  return result.success ? result.data : null;
}

/** True for a top-level node that is a registry block (not rich text). */
export function isIdentityBlock(node: { type: string }): node is IdentityBlockNode {
  return blockDefinition(node.type) !== undefined;
}
