// Mock-ups drawn from the identity as inline SVG (the page's own fonts and the identity's logo files), each with its
// size named; a template that cannot keep the logo's clear space and minimum size says so instead.
import type { ApplicationsAttrs } from './definition';
import { safeAssetUrl } from '@/lib/guideline/links';
import { composeMockup, type Composed, type MockupSources } from '@/lib/mockups/compose';
import { mockupTemplate, type MockupTemplate } from '@/lib/mockups/templates';
import { pageSvg } from '@/lib/mockups/svg';
import { photoAddresses } from '@/lib/mockups/photos';
import { pagePatternFill } from '@/lib/mockups/pattern';
import { mockupDownloadHref } from '@/lib/mockups/links';
import { MOCKUP_PRINT_NOTE } from '@/lib/cautions';
import { Caution, EmptyHint, Note, type BlockRenderProps } from '@/components/guideline/parts';

function composeSafely(template: MockupTemplate, attrs: ApplicationsAttrs, identity: BlockRenderProps<ApplicationsAttrs>['identity'], sources: MockupSources): Composed | { ok: false; broken: string } {
  try {
    return composeMockup(template, identity, sources, { logoId: attrs.logoId });
  } catch (err) {
    return { ok: false, broken: (err as Error).message };
  }
}

/** PNG for every piece and PDF for print pieces, where the page offers downloads (the editor, a published version). */
function Downloads({ identity, template, attrs, editing }: { identity: BlockRenderProps<ApplicationsAttrs>['identity']; template: MockupTemplate; attrs: ApplicationsAttrs; editing: boolean }) {
  const png = mockupDownloadHref(identity, template.key, 'png', attrs, editing);
  const pdf = template.medium === 'print' ? mockupDownloadHref(identity, template.key, 'pdf', attrs, editing) : null;
  if (!png) return null;
  return (
    <span className="ml-2 inline-flex gap-3">
      <a href={png} download className="underline">PNG</a>
      {pdf ? <a href={pdf} download className="underline">PDF with bleed and crop marks</a> : null}
    </span>
  );
}

export function Render({ attrs, identity, mode, editing }: BlockRenderProps<ApplicationsAttrs>) {
  const templates = attrs.templates.flatMap((key) => mockupTemplate(key) ?? []);
  if (!templates.length) return editing ? <EmptyHint>Choose the mock-ups to show.</EmptyHint> : null;
  if (!identity.logos.length) return editing ? <EmptyHint>Add a logo on the identity screen; the mock-ups are built around it.</EmptyHint> : null;
  const sources: MockupSources = {
    logo: (logo, file) => safeAssetUrl(logo.files[file] ?? logo.files.original),
    photos: photoAddresses(identity, attrs.photoIds),
    pattern: (pattern) => pagePatternFill(identity, pattern),
  };
  return (
    <div className="grid gap-8">
      {templates.map((template) => {
        const composed = composeSafely(template, attrs, identity, sources);
        return (
          <figure key={template.key} data-mockup={template.key} className="grid gap-3">
            {composed.ok ? (
              <div className="flex flex-wrap items-start gap-3">
                {composed.layout.pages.map((page) => (
                  <div
                    key={page.name}
                    className="min-w-0 overflow-hidden rounded-sm shadow-[0_1px_4px_rgba(0,0,0,0.18)]"
                    style={{ flex: `1 1 ${Math.round(Math.min(28, Math.max(9, (composed.layout.trim.width / composed.layout.trim.height) * 14)))}rem`, maxWidth: template.pages.length > 1 ? undefined : '36rem' }}
                    // pageSvg escapes every value it writes; colours are parsed #rrggbb and addresses checked.
                    dangerouslySetInnerHTML={{ __html: pageSvg(composed.layout, page, { width: '100%', label: `${template.name}, ${page.name}`, idSuffix: attrs.id }).replace('<svg ', '<svg style="display:block;height:auto" ') }}
                  />
                ))}
              </div>
            ) : (
              <div role="note" className="rounded-lg border border-dashed border-rule-strong px-4 py-3 text-sm" data-mockup-refused>
                {'broken' in composed ? <p>{composed.broken}</p> : composed.refusals.map((r) => <p key={`${r.page}-${r.logo}`}>{r.message}</p>)}
              </div>
            )}
            <figcaption className="text-sm">
              <span className="font-semibold">{template.name}</span> · {template.size.named}
              {composed.ok && mode !== 'print' ? <Downloads identity={identity} template={template} attrs={attrs} editing={!!editing} /> : null}
            </figcaption>
          </figure>
        );
      })}
      {templates.some((t) => t.medium === 'print') ? (
        <Caution>{MOCKUP_PRINT_NOTE}</Caution>
      ) : null}
      <Note text={attrs.note} />
    </div>
  );
}
