// A boxed note or caution, set apart from the running text.
import type { CalloutAttrs } from './definition';
import { EmptyHint, type BlockRenderProps } from '@/components/guideline/parts';

export function Render({ attrs, editing }: BlockRenderProps<CalloutAttrs>) {
  if (!attrs.text && !attrs.title) return editing ? <EmptyHint>Write the note.</EmptyHint> : null;
  const caution = attrs.tone === 'caution';
  return (
    <aside
      role="note"
      data-tone={attrs.tone}
      className={`rounded-xl border-l-4 px-5 py-4 ${caution ? 'border-[#b06a00] bg-[#fbf3e2] text-[#4a3300]' : 'bg-black/[0.04]'}`}
      style={caution ? undefined : { borderColor: 'var(--brand-primary, #666666)' }}
    >
      <p className="text-xs font-bold uppercase tracking-wider opacity-80">{attrs.title || (caution ? 'Take care' : 'Note')}</p>
      {attrs.text.split(/\n{2,}/).map((para, i) => (
        <p key={i} className="mt-1 whitespace-pre-line leading-relaxed">
          {para}
        </p>
      ))}
    </aside>
  );
}
