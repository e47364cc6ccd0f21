// Wrong uses of the logo, each drawn from the real file with SVG transforms and filters, marked "Don't".
import { toColor } from '@/lib/color/parse';
import { MISUSE_LABELS, type MisuseAttrs, type MisuseKind } from './definition';
import { colorForRole, colorsInOrder, extremes, findLogo } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import type { Identity, IdentityLogo } from '@/lib/identity/types';
import { EmptyHint, Missing, Note, type BlockRenderProps } from '@/components/guideline/parts';

/** A colour far from the brand's own: the primary's hue turned half way round the OKLCH wheel. */
function offBrandHex(identity: Identity): string {
  const primary = colorForRole(identity, 'primary');
  const hue = ((primary?.oklch.h ?? 20) + 180) % 360;
  return toColor(`oklch(62% 0.19 ${hue.toFixed(1)})`).hex;
}

function Tile({ kind, logo, identity, uid }: { kind: MisuseKind; logo: IdentityLogo; identity: Identity; uid: string }) {
  const { width: w, height: h } = logo.canvas;
  const vw = w * 1.6;
  const vh = h * 1.9;
  const x = (vw - w) / 2;
  const y = (vh - h) / 2;
  const id = `${uid}-${kind}`;
  const { lightest, darkest } = extremes(identity);
  const light = lightest?.hex ?? '#ffffff';
  const dark = darkest?.hex ?? '#1a1a1a';
  const original = safeAssetUrl(logo.files.original);
  const unit = Math.max(w, h);
  let ground = '#ffffff';
  let defs: React.ReactNode = null;
  let image: React.ReactNode = original ? <image href={original} x={x} y={y} width={w} height={h} /> : null;

  switch (kind) {
    case 'stretched':
      image = original ? <image href={original} x={vw * 0.06} y={y + h * 0.2} width={vw * 0.88} height={h * 0.6} preserveAspectRatio="none" /> : null;
      break;
    case 'rotated':
      image = original ? <image href={original} x={x} y={y} width={w} height={h} transform={`rotate(-16 ${vw / 2} ${vh / 2})`} /> : null;
      break;
    case 'recoloured':
      defs = (
        <filter id={id}>
          <feFlood floodColor={offBrandHex(identity)} />
          <feComposite in2="SourceAlpha" operator="in" />
        </filter>
      );
      break;
    case 'outlined':
      defs = (
        <filter id={id}>
          <feMorphology in="SourceAlpha" operator="dilate" radius={unit * 0.01} result="grown" />
          <feComposite in="grown" in2="SourceAlpha" operator="out" result="ring" />
          <feFlood floodColor={dark} />
          <feComposite in2="ring" operator="in" />
        </filter>
      );
      break;
    case 'dropShadow':
      defs = (
        <filter id={id} x="-20%" y="-20%" width="150%" height="150%">
          <feDropShadow dx={unit * 0.02} dy={unit * 0.03} stdDeviation={unit * 0.015} floodColor="#000000" floodOpacity={0.55} />
        </filter>
      );
      break;
    case 'busyBackground': {
      const inks = [...colorsInOrder(identity).map((c) => c.hex), '#8a8a8a', '#d9c27a'].slice(0, 5);
      const s = unit / 10;
      defs = (
        <pattern id={id} width={s * inks.length} height={s * inks.length} patternUnits="userSpaceOnUse" patternTransform="rotate(35)">
          {inks.map((ink, i) => <rect key={i} x={i * s} y={0} width={s} height={s * inks.length} fill={ink} />)}
          <circle cx={s} cy={s} r={s * 0.8} fill="#ffffff" fillOpacity={0.6} />
        </pattern>
      );
      break;
    }
    case 'lowContrast':
      ground = light;
      defs = (
        <filter id={id}>
          <feFlood floodColor={dark} floodOpacity={0.1} />
          <feComposite in2="SourceAlpha" operator="in" />
        </filter>
      );
      break;
  }
  const filtered = ['recoloured', 'outlined', 'dropShadow', 'lowContrast'].includes(kind);
  // Tinting filters read the alpha: the one-colour knockout keeps inner shapes open, the original would fill them.
  const oneColour = safeAssetUrl(logo.files.black);
  if (['recoloured', 'outlined', 'lowContrast'].includes(kind) && oneColour) image = <image href={oneColour} x={x} y={y} width={w} height={h} />;
  return (
    <figure className="overflow-hidden rounded-xl border border-black/10 bg-white text-[#1f1f1f]" data-misuse={kind}>
      <svg viewBox={`0 0 ${vw} ${vh}`} role="img" aria-label={`Wrong use: ${MISUSE_LABELS[kind].replace(/^Don’t /, '')}`} className="block h-auto w-full">
        {defs ? <defs>{defs}</defs> : null}
        <rect width={vw} height={vh} fill={kind === 'busyBackground' ? `url(#${id})` : ground} />
        {filtered ? <g filter={`url(#${id})`}>{image}</g> : image}
        <g aria-hidden="true">
          <line x1={vw * 0.04} y1={vh * 0.96} x2={vw * 0.96} y2={vh * 0.04} stroke="#b3261e" strokeWidth={unit * 0.012} strokeOpacity={0.55} />
        </g>
      </svg>
      <figcaption className="flex items-start gap-2 border-t border-black/10 px-3 py-2 text-sm">
        <span className="rounded bg-[#b3261e] px-1.5 py-0.5 text-[11px] font-bold uppercase tracking-wider text-white">Don’t</span>
        <span>{MISUSE_LABELS[kind]}</span>
      </figcaption>
    </figure>
  );
}

export function Render({ attrs, identity, editing, uid }: BlockRenderProps<MisuseAttrs> & { uid: string }) {
  if (!attrs.logoId) return editing ? <EmptyHint>Choose the logo to build the don’ts from.</EmptyHint> : null;
  const logo = findLogo(identity, attrs.logoId);
  if (!logo) return <Missing what="logo" />;
  if (attrs.tiles.length === 0) return editing ? <EmptyHint>Tick the wrong uses to show.</EmptyHint> : null;
  return (
    <div>
      <div className="grid grid-cols-[repeat(auto-fill,minmax(12rem,1fr))] gap-3">
        {attrs.tiles.map((kind) => <Tile key={kind} kind={kind} logo={logo} identity={identity} uid={uid} />)}
      </div>
      <Note text={attrs.note} />
    </div>
  );
}
