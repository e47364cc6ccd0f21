// Rich text to semantic HTML; text goes through React (escaped), links only when their address is safe.
import type { ReactNode } from 'react';
import { isSafeHref } from '@/lib/guideline/links';
import type { InlineNode, RichBlockNode, TextNode } from '@/lib/guideline/richText';

function Text({ node }: { node: TextNode }) {
  let out: ReactNode = node.text;
  const marks = node.marks ?? [];
  if (marks.some((m) => m.type === 'italic')) out = <em>{out}</em>;
  if (marks.some((m) => m.type === 'bold')) out = <strong>{out}</strong>;
  const link = marks.find((m) => m.type === 'link');
  if (link && link.type === 'link' && isSafeHref(link.attrs.href)) {
    const external = /^https?:/i.test(link.attrs.href);
    out = (
      <a href={link.attrs.href} rel={external ? 'noopener noreferrer' : undefined}>
        {out}
      </a>
    );
  }
  return <>{out}</>;
}

function Inline({ nodes }: { nodes?: InlineNode[] }) {
  return <>{(nodes ?? []).map((n, i) => (n.type === 'text' ? <Text key={i} node={n} /> : <br key={i} />))}</>;
}

/**
 * One rich-text block (paragraph, heading, list or quote) and everything inside it; the flow-* classes are the editor's
 * too. A top-level block carries its id (`data-block-id`), so search results can jump to it.
 */
export function RichBlock({ node, blockId }: { node: RichBlockNode; blockId?: string }) {
  switch (node.type) {
    case 'paragraph':
      return <p className="flow-p" data-block-id={blockId}><Inline nodes={node.content} /></p>;
    case 'heading': {
      const Tag = `h${node.attrs.level}` as 'h2' | 'h3' | 'h4';
      return (
        <Tag className="flow-heading" data-block-id={blockId}>
          <Inline nodes={node.content} />
        </Tag>
      );
    }
    case 'bulletList':
    case 'orderedList': {
      const items = node.content.map((item, i) => (
        <li key={i} className="flow-li">
          {item.content.map((child, j) => <RichBlock key={j} node={child} />)}
        </li>
      ));
      return node.type === 'bulletList' ? (
        <ul className="flow-ul" data-block-id={blockId}>{items}</ul>
      ) : (
        <ol className="flow-ol" data-block-id={blockId} start={node.attrs?.start && node.attrs.start !== 1 ? node.attrs.start : undefined}>
          {items}
        </ol>
      );
    }
    case 'blockquote':
      return (
        <blockquote className="flow-quote" data-block-id={blockId}>
          {node.content.map((child, j) => <RichBlock key={j} node={child} />)}
        </blockquote>
      );
    default:
      return null;
  }
}
