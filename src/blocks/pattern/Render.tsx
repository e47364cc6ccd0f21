// A repeat of the brand mark: size, gap, angle, row shift and colours from the block, its one-colour knockout tinted with an SVG filter.
import type { PatternAttrs } from './definition';
import { colorForRole, findColor, findLogo } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import { EmptyHint, Missing, safeHex, type BlockRenderProps } from '@/components/guideline/parts';

export function Render({ attrs, identity, editing, uid }: BlockRenderProps<PatternAttrs> & { uid: string }) {
  if (!attrs.logoId) return editing ? <EmptyHint>Choose the mark the pattern repeats.</EmptyHint> : null;
  const logo = findLogo(identity, attrs.logoId);
  if (!logo) return <Missing what="logo" />;
  // The one-colour knockout, so the tint fills only the ink and inner shapes stay open (not a filled silhouette).
  const src = safeAssetUrl(logo.files.black);
  if (!src) return <Missing what="logo" detail="Its file address could not be used." />;
  const bg = findColor(identity, attrs.backgroundColorId) ?? colorForRole(identity, 'background');
  const ink = findColor(identity, attrs.markColorId) ?? colorForRole(identity, 'primary');
  const removed = (attrs.backgroundColorId && !findColor(identity, attrs.backgroundColorId)) || (attrs.markColorId && !findColor(identity, attrs.markColorId));
  const h = attrs.scale;
  const w = (logo.canvas.width / logo.canvas.height) * h;
  const gap = attrs.spacing * h;
  const tileW = w + gap;
  const tileH = h + gap;
  const shift = attrs.offset * tileW;
  const id = `${uid}-pattern`;
  const marks = [
    [gap / 2, gap / 2],
    [gap / 2 + shift, tileH + gap / 2],
    [gap / 2 + shift - tileW, tileH + gap / 2],
  ];
  return (
    <figure>
      <svg width="100%" height={attrs.height} role="img" aria-label={`Pattern of ${logo.name}`} className="block rounded-xl border border-black/10">
        <defs>
          <filter id={`${id}-ink`}>
            <feFlood floodColor={safeHex(ink?.hex, '#333333')} floodOpacity={attrs.opacity} />
            <feComposite in2="SourceAlpha" operator="in" />
          </filter>
          <pattern id={id} width={tileW} height={tileH * 2} patternUnits="userSpaceOnUse" patternTransform={`rotate(${attrs.rotation})`}>
            <g filter={`url(#${id}-ink)`}>
              {marks.map(([x, y], i) => <image key={i} href={src} x={x} y={y} width={w} height={h} />)}
            </g>
          </pattern>
        </defs>
        <rect width="100%" height="100%" fill={safeHex(bg?.hex, '#ffffff')} />
        <rect width="100%" height="100%" fill={`url(#${id})`} />
      </svg>
      {removed ? <div className="mt-2"><Missing what="colour" detail="The pattern falls back to the brand's own colours." /></div> : null}
    </figure>
  );
}
