// The logo drawn at its smallest allowed size, with the print minimum beside it.
import type { MinimumSizeAttrs } from './definition';
import { findLogo } from '@/lib/guideline/identity';
import { EmptyHint, LogoImage, Missing, Note, type BlockRenderProps } from '@/components/guideline/parts';

export function Render({ attrs, identity, mode, editing }: BlockRenderProps<MinimumSizeAttrs>) {
  if (!attrs.logoId) return editing ? <EmptyHint>Choose the logo whose minimum size to show.</EmptyHint> : null;
  const logo = findLogo(identity, attrs.logoId);
  if (!logo) return <Missing what="logo" />;
  const { screenPx, printMm } = logo.minimumSize;
  return (
    <figure data-logo-id={logo.id} className="grid gap-4 sm:grid-cols-2">
      <div className="flex min-h-32 items-center justify-center rounded-xl border border-black/10 bg-white p-6">
        <LogoImage logo={logo} style={{ width: mode === 'print' ? `${printMm}mm` : `${screenPx}px`, height: 'auto', maxWidth: 'none' }} mode={mode} />
      </div>
      <figcaption className="self-center text-sm leading-relaxed">
        <p>
          <span className="block text-xs font-semibold uppercase tracking-wider opacity-70">On screen</span>
          <span className="text-2xl font-semibold" data-min="screen">{screenPx} px</span> wide at least
        </p>
        {attrs.showPrint ? (
          <p className="mt-3">
            <span className="block text-xs font-semibold uppercase tracking-wider opacity-70">In print</span>
            <span className="text-2xl font-semibold" data-min="print">{printMm} mm</span> wide at least
          </p>
        ) : null}
        <p className="mt-3 opacity-80">{mode === 'print' ? `Shown here at ${printMm} mm.` : `Shown here at ${screenPx} px.`} Smaller, its finest details blur or break up.</p>
        <Note text={attrs.note} />
      </figcaption>
    </figure>
  );
}
