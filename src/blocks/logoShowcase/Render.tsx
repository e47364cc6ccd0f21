// Each chosen logo on light, dark and brand-colour grounds.
import { TRADEMARK_CAUTION } from '@/lib/cautions';
import type { LogoShowcaseAttrs } from './definition';
import { findLogo } from '@/lib/guideline/identity';
import { EmptyHint, LogoImage, Missing, Note, safeHex, type BlockRenderProps } from '@/components/guideline/parts';
import { logoGrounds } from './grounds';

export function Render({ attrs, identity, mode, editing }: BlockRenderProps<LogoShowcaseAttrs>) {
  if (attrs.logoIds.length === 0) return editing ? <EmptyHint>Choose the logos to show.</EmptyHint> : null;
  const grounds = logoGrounds(identity, attrs.brandColorId);
  return (
    <div className="grid gap-6">
      {attrs.logoIds.map((id) => {
        const logo = findLogo(identity, id);
        if (!logo) return <Missing key={id} what="logo" />;
        return (
          <figure key={id} data-logo-id={id}>
            <div className="grid gap-2 sm:grid-cols-3">
              {grounds.map((ground) => (
                <div key={ground.key} data-ground={ground.key} className="flex aspect-[3/2] flex-col rounded-xl border border-black/10 p-3" style={{ backgroundColor: safeHex(ground.hex, '#ffffff') }}>
                  <div className="flex flex-1 items-center justify-center p-4">
                    <LogoImage logo={logo} file={ground.key === 'light' ? 'original' : attrs.onDark === 'original' ? 'onDark' : attrs.onDark} on={ground.hex} className="max-h-24 max-w-[80%] object-contain" mode={mode} />
                  </div>
                  <span className={`self-start rounded bg-white/85 px-1.5 py-0.5 text-[11px] font-semibold text-[#1f1f1f]`}>
                    {ground.label}
                    {ground.missing ? ' (chosen colour was removed; showing the primary)' : ''}
                  </span>
                </div>
              ))}
            </div>
            <figcaption className="mt-2 text-sm font-semibold">{logo.name}</figcaption>
          </figure>
        );
      })}
      {attrs.caption ? <Note text={attrs.caption} /> : null}
      {editing ? <p className="hint text-xs">{TRADEMARK_CAUTION}</p> : null}
    </div>
  );
}
