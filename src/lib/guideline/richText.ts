// Rich text inside guidelines: the editor's paragraphs, headings, lists and quotes, with bold, italic and safe links.
import * as z from 'zod';
import { blockIdSchema } from './ids';
import { isSafeHref, MAX_HREF } from './links';

/** Longest run of text in one text node. */
export const MAX_TEXT = 10_000;
/** Most children one rich-text node may hold. */
export const MAX_CHILDREN = 500;

export interface LinkAttrs {
  href: string;
  target?: string | null;
  rel?: string | null;
  class?: null;
  title?: string | null;
}
export type TextMark = { type: 'bold' } | { type: 'italic' } | { type: 'link'; attrs: LinkAttrs };
export interface TextNode {
  type: 'text';
  text: string;
  marks?: TextMark[];
}
export interface HardBreakNode {
  type: 'hardBreak';
}
export type InlineNode = TextNode | HardBreakNode;
/** Rich-text blocks carry an id at the top level of the document; nested ones may have none. */
export interface RichAttrs {
  id?: string | null;
}
export interface ParagraphNode {
  type: 'paragraph';
  attrs?: RichAttrs;
  content?: InlineNode[];
}
export interface HeadingNode {
  type: 'heading';
  attrs: RichAttrs & { level: 2 | 3 | 4 };
  content?: InlineNode[];
}
export interface ListItemNode {
  type: 'listItem';
  content: RichBlockNode[];
}
export interface BulletListNode {
  type: 'bulletList';
  attrs?: RichAttrs;
  content: ListItemNode[];
}
export interface OrderedListNode {
  type: 'orderedList';
  attrs?: RichAttrs & { start?: number; type?: string | null };
  content: ListItemNode[];
}
export interface BlockquoteNode {
  type: 'blockquote';
  attrs?: RichAttrs;
  content: RichBlockNode[];
}
export type RichBlockNode = ParagraphNode | HeadingNode | BulletListNode | OrderedListNode | BlockquoteNode;

export const RICH_TEXT_TYPES = ['paragraph', 'heading', 'bulletList', 'orderedList', 'blockquote'] as const;
export type RichTextType = (typeof RICH_TEXT_TYPES)[number];
/** Node types that only ever appear inside other nodes. */
export const INNER_TYPES = ['listItem', 'text', 'hardBreak'] as const;

const richAttrs = { id: blockIdSchema.nullable().optional() };

const linkAttrsSchema = z.strictObject({
  href: z
    .string({ error: 'A link needs an address.' })
    .max(MAX_HREF, { error: `A link address may be at most ${MAX_HREF} characters.` })
    .refine(isSafeHref, { error: 'Links may only use http://, https:// or mailto: addresses.' }),
  target: z.enum(['_blank', '_self']).nullable().optional(),
  rel: z.string().max(100).nullable().optional(),
  class: z.null().optional(),
  title: z.string().max(200).nullable().optional(),
});

const markSchema = z.discriminatedUnion(
  'type',
  [z.strictObject({ type: z.literal('bold') }), z.strictObject({ type: z.literal('italic') }), z.strictObject({ type: z.literal('link'), attrs: linkAttrsSchema })],
  { error: 'Text may only be bold, italic or a link.' },
);

const textSchema = z.strictObject({
  type: z.literal('text'),
  text: z.string().min(1, { error: 'A text node may not be empty.' }).max(MAX_TEXT, { error: `A text run may be at most ${MAX_TEXT} characters.` }),
  marks: z
    .array(markSchema)
    .max(3)
    .refine((marks) => new Set(marks.map((m) => m.type)).size === marks.length, { error: 'Each mark may appear once on a text.' })
    .optional(),
});
const inlineSchema = z.discriminatedUnion('type', [textSchema, z.strictObject({ type: z.literal('hardBreak') })], {
  error: 'Inside a paragraph or heading only text and line breaks are allowed.',
});
const inlineContent = z.array(inlineSchema).max(MAX_CHILDREN, { error: `At most ${MAX_CHILDREN} pieces of text in one paragraph.` }).optional();

export const paragraphSchema = z.strictObject({
  type: z.literal('paragraph'),
  attrs: z.strictObject(richAttrs).optional(),
  content: inlineContent,
});
export const headingSchema = z.strictObject({
  type: z.literal('heading'),
  attrs: z.strictObject({ ...richAttrs, level: z.union([z.literal(2), z.literal(3), z.literal(4)], { error: 'A heading level must be 2, 3 or 4.' }) }),
  content: inlineContent,
});

const nested: z.ZodType<RichBlockNode> = z.lazy(() => richBlockSchema);
const blocks = z.array(nested).min(1).max(MAX_CHILDREN);

const listItemSchema: z.ZodType<ListItemNode> = z.strictObject({ type: z.literal('listItem'), content: blocks });
const items = z.array(listItemSchema).min(1, { error: 'A list needs at least one item.' }).max(MAX_CHILDREN);

export const bulletListSchema = z.strictObject({ type: z.literal('bulletList'), attrs: z.strictObject(richAttrs).optional(), content: items });
export const orderedListSchema = z.strictObject({
  type: z.literal('orderedList'),
  attrs: z
    .strictObject({ ...richAttrs, start: z.number().int().min(0).max(100_000).optional(), type: z.enum(['1', 'a', 'A', 'i', 'I']).nullable().optional() })
    .optional(),
  content: items,
});
export const blockquoteSchema = z.strictObject({ type: z.literal('blockquote'), attrs: z.strictObject(richAttrs).optional(), content: blocks });

export const richBlockSchema: z.ZodType<RichBlockNode> = z.discriminatedUnion(
  'type',
  [paragraphSchema, headingSchema, bulletListSchema, orderedListSchema, blockquoteSchema],
  { error: 'Only paragraphs, headings, lists and quotes may appear inside a list or quote.' },
);

/** The schema of each top-level rich-text node type. */
export const RICH_TEXT_SCHEMAS: Record<RichTextType, z.ZodType<RichBlockNode>> = {
  paragraph: paragraphSchema as z.ZodType<RichBlockNode>,
  heading: headingSchema as z.ZodType<RichBlockNode>,
  bulletList: bulletListSchema as z.ZodType<RichBlockNode>,
  orderedList: orderedListSchema as z.ZodType<RichBlockNode>,
  blockquote: blockquoteSchema as z.ZodType<RichBlockNode>,
};

/** Plain text of a rich node (for word counts and summaries). */
export function plainText(node: { text?: unknown; content?: unknown }): string {
  if (typeof node.text === 'string') return node.text;
  if (!Array.isArray(node.content)) return '';
  return node.content.map((child) => plainText(child as never)).join(' ');
}
