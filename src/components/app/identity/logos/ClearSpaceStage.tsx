// The logo in its own units with the clear-space box and the drawn bounds drawn over it, at any drawn width.
import type { Box, IdentityLogo } from '@/lib/identity/types';
import { inkOn } from '../shared';
import type { FileKind } from './labels';

const union = (a: Box, b: Box): Box => {
  const x = Math.min(a.x, b.x);
  const y = Math.min(a.y, b.y);
  return { x, y, width: Math.max(a.x + a.width, b.x + b.width) - x, height: Math.max(a.y + a.height, b.y + b.height) - y };
};

/** The logo in its own units with the clear-space box and the drawn bounds drawn over it. */
export function ClearSpaceStage({ logo, drawnPx, ground, file, showGuides }: { logo: IdentityLogo; drawnPx: number; ground: string; file: FileKind; showGuides: boolean }) {
  const box = logo.clearSpace.box;
  const view = union(logo.canvas, box);
  const pad = Math.max(view.width, view.height) * 0.04;
  const vb = { x: view.x - pad, y: view.y - pad, width: view.width + 2 * pad, height: view.height + 2 * pad };
  const widthPx = (drawnPx * vb.width) / logo.bounds.width;
  const guide = inkOn(ground) === '#ffffff' ? '#d9ccff' : '#4b3a8c';
  const unit = logo.clearSpace.unitSize * logo.clearSpace.multiple;
  return (
    <svg
      role="img"
      aria-label={`${logo.name} at ${drawnPx} px wide, with its clear space of ${logo.clearSpace.multiple} × ${logo.clearSpace.unitLabel} drawn around it`}
      viewBox={`${vb.x} ${vb.y} ${vb.width} ${vb.height}`}
      width={widthPx}
      height={(widthPx * vb.height) / vb.width}
      className="block max-w-none"
      data-logo-stage={logo.id}
    >
      <rect x={vb.x} y={vb.y} width={vb.width} height={vb.height} fill={ground} />
      {showGuides && (
        <>
          {/* The protected band between the drawn bounds and the clear-space edge, tinted; the outline is the box itself. */}
          <path
            d={`M${box.x} ${box.y}h${box.width}v${box.height}h${-box.width}Z M${logo.bounds.x} ${logo.bounds.y}v${logo.bounds.height}h${logo.bounds.width}v${-logo.bounds.height}Z`}
            fill={guide}
            fillOpacity={0.14}
            fillRule="evenodd"
            aria-hidden="true"
          />
          <rect data-overlay="clear-space" x={box.x} y={box.y} width={box.width} height={box.height} fill="none" stroke={guide} strokeWidth={1.5} strokeDasharray="6 4" vectorEffect="non-scaling-stroke" />
          {unit > 0 && (
            <g fill={guide} fillOpacity={0.35} aria-hidden="true">
              <rect x={box.x} y={box.y} width={unit} height={unit} />
              <rect x={box.x + box.width - unit} y={box.y + box.height - unit} width={unit} height={unit} />
            </g>
          )}
        </>
      )}
      <image href={logo.files[file]} x={logo.canvas.x} y={logo.canvas.y} width={logo.canvas.width} height={logo.canvas.height} preserveAspectRatio="none" />
      {showGuides && (
        <rect data-overlay="bounds" x={logo.bounds.x} y={logo.bounds.y} width={logo.bounds.width} height={logo.bounds.height} fill="none" stroke={guide} strokeWidth={1} vectorEffect="non-scaling-stroke" />
      )}
    </svg>
  );
}
