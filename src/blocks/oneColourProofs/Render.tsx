// Each chosen logo in black on white, white on black and greyscale. The grey is an SVG colour matrix of the WCAG 2.2
// luminance weights applied in linear light (color-interpolation-filters: linearRGB), i.e. relative luminance.
import type { OneColourProofsAttrs } from './definition';
import { findLogo } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import type { IdentityLogo } from '@/lib/identity/types';
import { EmptyHint, LogoImage, Missing, Note, type BlockRenderProps } from '@/components/guideline/parts';

const LUMA = '0.2126 0.7152 0.0722 0 0';

function Greyscale({ logo, uid }: { logo: IdentityLogo; uid: string }) {
  const src = safeAssetUrl(logo.files.original);
  if (!src) return <Missing what="logo" detail="Its file address could not be used." />;
  const { width: w, height: h } = logo.canvas;
  const id = `${uid}-grey-${logo.id}`;
  return (
    <svg viewBox={`0 0 ${w} ${h}`} role="img" aria-label={`${logo.name} in greyscale`} className="max-h-24 max-w-[80%]" style={{ width: '100%' }}>
      <defs>
        <filter id={id} colorInterpolationFilters="linearRGB">
          <feColorMatrix type="matrix" values={`${LUMA} ${LUMA} ${LUMA} 0 0 0 1 0`} />
        </filter>
      </defs>
      <image href={src} width={w} height={h} filter={`url(#${id})`} />
    </svg>
  );
}

export function Render({ attrs, identity, mode, editing, uid }: BlockRenderProps<OneColourProofsAttrs> & { uid: string }) {
  if (attrs.logoIds.length === 0) return editing ? <EmptyHint>Choose the logos to show in one colour.</EmptyHint> : null;
  const tiles = [
    { key: 'black', label: 'Black on white', ground: '#ffffff' },
    { key: 'white', label: 'White on black', ground: '#000000' },
    { key: 'grey', label: 'Greyscale', ground: '#ffffff' },
  ] as const;
  return (
    <div className="grid gap-6">
      {attrs.logoIds.map((id) => {
        const logo = findLogo(identity, id);
        if (!logo) return <Missing key={id} what="logo" />;
        return (
          <figure key={id} data-logo-id={id}>
            <div className="grid gap-2 sm:grid-cols-3">
              {tiles.map((t) => (
                <div key={t.key} data-proof={t.key} className="flex aspect-[3/2] flex-col rounded-xl border border-black/10 p-3" style={{ backgroundColor: t.ground }}>
                  <div className="flex flex-1 items-center justify-center p-4">
                    {t.key === 'grey' ? <Greyscale logo={logo} uid={uid} /> : <LogoImage logo={logo} file={t.key} on={t.ground} className="max-h-24 max-w-[80%] object-contain" mode={mode} />}
                  </div>
                  <span className="self-start rounded bg-white/85 px-1.5 py-0.5 text-[11px] font-semibold text-[#1f1f1f]">{t.label}</span>
                </div>
              ))}
            </div>
            <figcaption className="mt-2 text-sm font-semibold">{logo.name}</figcaption>
          </figure>
        );
      })}
      {attrs.caption ? <Note text={attrs.caption} /> : null}
    </div>
  );
}
