// The published guideline: static, semantic HTML in the brand's fonts and colours, one <section> per section heading.
import type { CSSProperties, ReactNode } from 'react';
import { parseBlockAttrs, type GuidelineDoc, type TopLevelNode } from '@/lib/guideline/document';
import { brandStyle } from '@/lib/guideline/identity';
import { outline, type OutlineEntry } from '@/lib/guideline/outline';
import { RICH_TEXT_TYPES, type RichBlockNode } from '@/lib/guideline/richText';
import type { Identity } from '@/lib/identity/types';
import { BlockRenderer } from '@/blocks/renderers';
import { SectionHeader } from '@/blocks/sectionHeading/Render';
import { sectionHeadingBlock } from '@/blocks/sectionHeading/definition';
import type { RenderMode } from './parts';
import { RichBlock } from './RichText';

export { outline, type OutlineEntry };

function Node({ node, identity, mode }: { node: TopLevelNode; identity: Identity; mode: RenderMode }) {
  const id = (node.attrs as { id?: string | null } | undefined)?.id ?? undefined;
  if ((RICH_TEXT_TYPES as readonly string[]).includes(node.type)) return <RichBlock node={node as RichBlockNode} blockId={id} />;
  return (
    <div className="my-6 break-inside-avoid" data-block={node.type} data-block-id={id}>
      <BlockRenderer type={node.type} attrs={node.attrs} identity={identity} mode={mode} />
    </div>
  );
}

/** The CSS page name of the nth section in the print edition (running heads carry its title). */
export const printPageName = (index: number) => `section-${index + 1}`;

/** Renders a validated guideline document for the published site ('site') or the PDF ('print'). */
export function GuidelineDocument({ doc, identity, mode }: { doc: GuidelineDoc; identity: Identity; mode: RenderMode }) {
  const entries = outline(doc);
  const groups: { entry: OutlineEntry | null; intro: string; nodes: TopLevelNode[] }[] = [{ entry: null, intro: '', nodes: [] }];
  let sectionIndex = 0;
  for (const node of doc.content) {
    if (node.type === 'sectionHeading') {
      const attrs = parseBlockAttrs(sectionHeadingBlock, node.attrs);
      groups.push({ entry: entries[sectionIndex++], intro: attrs?.intro ?? '', nodes: [] });
    } else groups[groups.length - 1].nodes.push(node);
  }
  const style = { ...brandStyle(identity), fontFamily: 'var(--brand-body-font)', color: 'var(--brand-text)' } as CSSProperties;
  const body = (nodes: TopLevelNode[]): ReactNode => nodes.map((node, i) => <Node key={(node.attrs as { id?: string } | undefined)?.id ?? i} node={node} identity={identity} mode={mode} />);
  return (
    <article className="guideline" data-mode={mode} style={style}>
      {groups.map((group, i) =>
        group.entry ? (
          <section key={group.entry.anchor} id={group.entry.anchor} aria-labelledby={`${group.entry.anchor}-title`} data-block-id={group.entry.blockId} className={`py-10 ${mode === 'print' ? 'break-before-page' : ''}`} data-print-page={mode === 'print' ? printPageName(entries.indexOf(group.entry)) : undefined}>
            <SectionHeader entry={group.entry} intro={group.intro} mode={mode} />
            {body(group.nodes)}
          </section>
        ) : group.nodes.length > 0 ? (
          <div key={`intro-${i}`} className="py-6">
            {body(group.nodes)}
          </div>
        ) : null,
      )}
    </article>
  );
}

export default GuidelineDocument;
