// Rich text to semantic HTML; text goes through React (escaped), links only when their address is safe.
import type { ReactNode } from 'react';
import { isSafeHref } from '../../lib/guideline/links';
import type { InlineNode, RichBlockNode, TextNode } from '../../lib/guideline/richText';

function Text({ node }: { node: TextNode }) {
  let out: ReactNode = node.text;
  const marks = node.marks ?? [];
  if (marks.some((m) => m.type === 'italic')) out = <em>{out}</em>;
  if (marks.some((m) => m.type === 'bold')) out = <strong>{out}</strong>;
  const link = marks.find((m) => m.type === 'link');
  if (link && link.type === 'link' && isSafeHref(link.attrs.href)) {
    const external = /^https?:/i.test(link.attrs.href);
    out = (
      <a href={link.attrs.href} rel={external ? 'noopener noreferrer' : undefined} className="underline underline-offset-2" style={{ color: 'var(--brand-link, inherit)' }}>
        {out}
      </a>
    );
  }
  return <>{out}</>;
}

function Inline({ nodes }: { nodes?: InlineNode[] }) {
  return <>{(nodes ?? []).map((n, i) => (n.type === 'text' ? <Text key={i} node={n} /> : <br key={i} />))}</>;
}

const HEADING_CLASS = { 2: 'mt-10 text-3xl font-semibold', 3: 'mt-8 text-2xl font-semibold', 4: 'mt-6 text-xl font-semibold' } as const;

/** One rich-text block (paragraph, heading, list or quote) and everything inside it. */
export function RichBlock({ node }: { node: RichBlockNode }) {
  switch (node.type) {
    case 'paragraph':
      return <p className="my-3 leading-relaxed"><Inline nodes={node.content} /></p>;
    case 'heading': {
      const Tag = `h${node.attrs.level}` as 'h2' | 'h3' | 'h4';
      return (
        <Tag className={HEADING_CLASS[node.attrs.level]} style={{ fontFamily: 'var(--brand-heading-font)' }}>
          <Inline nodes={node.content} />
        </Tag>
      );
    }
    case 'bulletList':
    case 'orderedList': {
      const items = node.content.map((item, i) => (
        <li key={i} className="my-1">
          {item.content.map((child, j) => <RichBlock key={j} node={child} />)}
        </li>
      ));
      return node.type === 'bulletList' ? (
        <ul className="my-3 list-disc pl-6">{items}</ul>
      ) : (
        <ol className="my-3 list-decimal pl-6" start={node.attrs?.start && node.attrs.start !== 1 ? node.attrs.start : undefined}>
          {items}
        </ol>
      );
    }
    case 'blockquote':
      return (
        <blockquote className="my-4 border-l-4 pl-4 italic opacity-90" style={{ borderColor: 'var(--brand-accent, var(--brand-primary, #888888))' }}>
          {node.content.map((child, j) => <RichBlock key={j} node={child} />)}
        </blockquote>
      );
    default:
      return null;
  }
}
