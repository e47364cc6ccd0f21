// The clear-space diagram drawn from the logo's own measured bounds and the identity's clear-space box.
import type { ClearSpaceAttrs } from './definition';
import { findLogo } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import { EmptyHint, Missing, Note, type BlockRenderProps } from '@/components/guideline/parts';

const round = (n: number) => Math.round(n * 100) / 100;

export function Render({ attrs, identity, editing }: BlockRenderProps<ClearSpaceAttrs>) {
  if (!attrs.logoId) return editing ? <EmptyHint>Choose the logo whose clear space to draw.</EmptyHint> : null;
  const logo = findLogo(identity, attrs.logoId);
  if (!logo) return <Missing what="logo" />;
  const { canvas, bounds, clearSpace } = logo;
  const box = clearSpace.box;
  const margin = round(bounds.x - box.x);
  const pad = Math.max(box.width, box.height) * 0.08;
  const viewBox = [box.x - pad, box.y - pad, box.width + 2 * pad, box.height + 2 * pad].map(round).join(' ');
  const stroke = Math.max(box.width, box.height) / 300;
  const src = safeAssetUrl(logo.files.original);
  const corners = [
    [box.x, box.y],
    [bounds.x + bounds.width, box.y],
    [box.x, bounds.y + bounds.height],
    [bounds.x + bounds.width, bounds.y + bounds.height],
  ];
  return (
    <figure data-logo-id={logo.id}>
      <svg viewBox={viewBox} role="img" aria-label={`Clear space around ${logo.name}`} className="h-auto max-h-[22rem] w-full rounded-xl border border-black/10 bg-white">
        <rect x={box.x} y={box.y} width={box.width} height={box.height} fill="#6b7fd7" fillOpacity={0.12} stroke="#3d4fa3" strokeWidth={stroke} strokeDasharray={`${stroke * 4} ${stroke * 3}`} />
        <rect x={bounds.x} y={bounds.y} width={bounds.width} height={bounds.height} fill="#ffffff" />
        {src ? <image href={src} x={canvas.x} y={canvas.y} width={canvas.width} height={canvas.height} /> : null}
        <rect x={bounds.x} y={bounds.y} width={bounds.width} height={bounds.height} fill="none" stroke="#3d4fa3" strokeWidth={stroke} />
        {attrs.showUnit && margin > 0
          ? corners.map(([x, y], i) => <rect key={i} x={x} y={y} width={margin} height={margin} fill="#3d4fa3" fillOpacity={0.28} />)
          : null}
      </svg>
      <figcaption className="mt-3 text-sm leading-relaxed">
        Keep {clearSpace.multiple === 1 ? 'one' : clearSpace.multiple} × <em>{clearSpace.unitLabel || 'the unit'}</em> free on every side of the logo
        {attrs.showUnit ? ' (the shaded squares show one unit)' : ''}. Nothing else — text, images or edges — may enter this space.
      </figcaption>
      <Note text={attrs.note} />
    </figure>
  );
}
