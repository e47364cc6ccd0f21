// A section's header on the published page: the document draws it at the top of the <section> the heading opens.
import type { OutlineEntry } from '@/lib/guideline/outline';
import type { RenderMode } from '@/components/guideline/parts';

export function SectionHeader({ entry, intro, mode }: { entry: OutlineEntry; intro: string; mode: RenderMode }) {
  // In print the section title is the document's top heading level, so the PDF outline has one entry per section.
  const Title = mode === 'print' ? 'h1' : 'h2';
  return (
    <header className="mb-6">
      {entry.eyebrow ? <p className="text-xs font-semibold uppercase tracking-[0.16em] opacity-70">{entry.eyebrow}</p> : null}
      <Title id={`${entry.anchor}-title`} data-block-id={mode === 'print' || !entry.blockId ? undefined : entry.blockId} data-section-heading={mode === 'print' || !entry.blockId ? undefined : ''} className="group mt-1 text-4xl font-semibold leading-tight" style={{ fontFamily: 'var(--brand-heading-font)' }}>
        {entry.title}
        {mode === 'print' ? null : (
          <a href={`#${entry.anchor}`} className="ml-3 text-2xl no-underline opacity-0 group-hover:opacity-40 focus-visible:opacity-60" aria-label={`Link to the section ${entry.title}`}>
            #
          </a>
        )}
      </Title>
      {intro ? <p className="mt-3 max-w-prose text-lg leading-relaxed opacity-85">{intro}</p> : null}
    </header>
  );
}
