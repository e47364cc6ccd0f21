// A repeat of the brand mark drawn from the pattern generator's layout (the same tile the export and the shelf draw):
// the one-colour knockout of the mark, tinted with the palette ink, so inner shapes stay open to the ground.
import { drawnPatternSettings, type PatternAttrs } from './definition';
import { findLogo } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import { patternColours } from '@/lib/pattern/colours';
import { patternLayout, PATTERN_LAYOUT_LABELS } from '@/lib/pattern/layout';
import { svgNumber } from '@/lib/pattern/tile';
import { EmptyHint, Missing, safeHex, type BlockRenderProps } from '@/components/guideline/parts';

export function Render({ attrs, identity, editing, uid }: BlockRenderProps<PatternAttrs> & { uid: string }) {
  const { settings, linked, missing } = drawnPatternSettings(attrs, identity);
  if (missing) {
    return editing ? (
      <Missing what="pattern" detail="It is not approved on the shelf, or its mark or colours have left the identity: approve it again, or choose another." />
    ) : null;
  }
  if (!settings) return editing ? <EmptyHint>Choose the mark the pattern repeats.</EmptyHint> : null;
  const logo = findLogo(identity, settings.logoId);
  if (!logo) return <Missing what="logo" />;
  // The one-colour knockout: its alpha is the ink with the inner shapes cut out, so the tint never fills a silhouette.
  const src = safeAssetUrl(logo.files.black);
  if (!src) return <Missing what="logo" detail="Its file address could not be used." />;
  // A chosen colour since removed from the palette: the brand's own roles stand in, and the page says so.
  const chosen = patternColours(identity, settings);
  const picked = chosen.ok ? chosen : patternColours(identity, { groundColorId: null, inkColorId: null });
  if (!picked.ok) return <Missing what="colour" detail={picked.message} />;
  const ground = safeHex(picked.colours.ground.hex.slice(0, 7), '#ffffff');
  const ink = safeHex(picked.colours.ink.hex.slice(0, 7), '#333333');
  const tile = patternLayout(settings, logo.canvas.width / logo.canvas.height);
  const { width: w, height: h } = tile.mark;
  const id = `${uid}-pattern`;
  return (
    <figure>
      <svg width="100%" height={attrs.height} role="img" aria-label={`Pattern of ${logo.name}, ${PATTERN_LAYOUT_LABELS[settings.layout].toLowerCase()}`} className="block rounded-xl border border-black/10">
        <defs>
          <filter id={`${id}-ink`}>
            <feFlood floodColor={ink} floodOpacity={settings.opacity} />
            <feComposite in2="SourceAlpha" operator="in" />
          </filter>
          <pattern id={id} width={tile.width} height={tile.height} patternUnits="userSpaceOnUse">
            <g filter={`url(#${id}-ink)`}>
              {tile.placements.map((p, i) => (
                <image
                  key={i}
                  href={src}
                  x={svgNumber(-w / 2)}
                  y={svgNumber(-h / 2)}
                  width={svgNumber(w)}
                  height={svgNumber(h)}
                  preserveAspectRatio="xMidYMid meet"
                  transform={`translate(${svgNumber(p.x)} ${svgNumber(p.y)})${p.rotation ? ` rotate(${svgNumber(p.rotation)})` : ''}`}
                />
              ))}
            </g>
          </pattern>
        </defs>
        <rect width="100%" height="100%" fill={ground} />
        <rect width="100%" height="100%" fill={`url(#${id})`} />
      </svg>
      {linked ? <figcaption className="mt-2 text-sm text-ink-soft" data-shelf-pattern={linked.id}>{linked.name}</figcaption> : null}
      {chosen.ok ? null : <div className="mt-2"><Missing what="colour" detail="The pattern falls back to the brand's own colours." /></div>}
    </figure>
  );
}
