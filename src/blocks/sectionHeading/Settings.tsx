// A section heading edited in place: eyebrow, title and intro; the outline and the site's contents follow it.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { SectionHeadingAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';

export function Settings(props: ReactNodeViewProps) {
  const a = props.node.attrs as SectionHeadingAttrs;
  const set = (patch: Partial<SectionHeadingAttrs>) => props.updateAttributes(patch);
  const preview = (
    <div className="grid gap-2">
      <input aria-label="Section label above the title (optional)" placeholder="Label above the title (optional)" className="w-full bg-transparent text-xs font-semibold uppercase tracking-[0.16em] text-ink-faint outline-none focus-visible:ring-2 focus-visible:ring-plumb/30" value={a.eyebrow} maxLength={80} onChange={(e) => set({ eyebrow: e.target.value })} />
      <input aria-label="Section title" placeholder="Section title" className="w-full bg-transparent text-4xl font-semibold leading-tight outline-none focus-visible:ring-2 focus-visible:ring-plumb/30" style={{ fontFamily: 'var(--brand-heading-font)' }} value={a.title} maxLength={200} onChange={(e) => set({ title: e.target.value })} />
      <textarea aria-label="Section introduction (optional)" placeholder="A sentence or two that opens the section (optional)" rows={2} className="w-full resize-y bg-transparent text-lg leading-relaxed outline-none focus-visible:ring-2 focus-visible:ring-plumb/30" value={a.intro} maxLength={1000} onChange={(e) => set({ intro: e.target.value })} />
    </div>
  );
  return <BlockFrame props={props} preview={preview} settings={null} />;
}
