// Colour swatches with every notation and the print values, each with a copy button.
import { PRINT_CAUTION } from '@/lib/cautions';
import { formatCmyk, formatRgb } from '@/lib/color/notation';
import type { ColorPaletteAttrs } from './definition';
import { findColor } from '@/lib/guideline/identity';
import type { IdentityColor } from '@/lib/identity/types';
import { Caution, CopyButton, EmptyHint, Missing, Note, safeHex, type BlockRenderProps, type RenderMode } from '@/components/guideline/parts';


function Row({ label, value, mode, hint }: { label: string; value: string; mode: RenderMode; hint?: string }) {
  return (
    // A value that does not fit beside its label moves to a line of its own rather than breaking inside.
    <div className="flex flex-wrap items-baseline justify-between gap-x-2 border-t border-black/10 py-1.5 first:border-0">
      <dt className="text-xs font-semibold uppercase tracking-wider opacity-70">
        {label}
        {hint ? <span className="ml-1 font-normal normal-case tracking-normal">({hint})</span> : null}
      </dt>
      <dd className="ml-auto flex items-baseline gap-1 font-mono text-sm">
        <span data-value={label}>{value}</span>
        <CopyButton value={value} label={label} mode={mode} />
      </dd>
    </div>
  );
}

function Swatch({ color, showPrint, mode }: { color: IdentityColor; showPrint: boolean; mode: RenderMode }) {
  return (
    <li className="overflow-hidden rounded-xl border border-black/10 bg-white text-[#1f1f1f]" data-color-id={color.id}>
      <div className="h-28" style={{ backgroundColor: safeHex(color.hex, '#ffffff') }} aria-hidden="true" />
      <div className="p-4">
        <p className="text-base font-semibold" style={{ fontFamily: 'var(--brand-heading-font)' }}>
          {color.name}
        </p>
        {color.role ? <p className="text-xs uppercase tracking-wider opacity-70">{color.role}</p> : null}
        <dl className="mt-3">
          <Row label="HEX" value={color.hex} mode={mode} />
          <Row label="RGB" value={formatRgb(color.rgb)} mode={mode} />
          <Row label="HSL" value={color.hsl.css} mode={mode} />
          <Row label="OKLCH" value={color.oklch.css} mode={mode} />
          <Row label="Lab" value={color.lab.css} mode={mode} hint="D50" />
          {showPrint ? (
            color.cmykOverride ? (
              <Row label="CMYK" value={formatCmyk(color.cmykOverride)} mode={mode} hint="proofed by the designer" />
            ) : (
              <>
                <Row label="CMYK" value={formatCmyk(color.cmykIcc)} mode={mode} hint="press profile estimate" />
                <Row label="CMYK" value={formatCmyk(color.cmyk)} mode={mode} hint="plain formula" />
              </>
            )
          ) : null}
          {showPrint && color.spot ? <Row label="Spot" value={color.spot} mode={mode} /> : null}
        </dl>
      </div>
    </li>
  );
}

export function Render({ attrs, identity, mode, editing }: BlockRenderProps<ColorPaletteAttrs>) {
  if (attrs.colorIds.length === 0) return editing ? <EmptyHint>Choose the colours this palette shows.</EmptyHint> : null;
  return (
    <div>
      <ul className="grid grid-cols-[repeat(auto-fill,minmax(15rem,1fr))] gap-4">
        {attrs.colorIds.map((id) => {
          const color = findColor(identity, id);
          return color ? (
            <Swatch key={id} color={color} showPrint={attrs.showPrint} mode={mode} />
          ) : (
            <li key={id}>
              <Missing what="colour" />
            </li>
          );
        })}
      </ul>
      <Note text={attrs.note} />
      {attrs.showPrint ? <Caution>{PRINT_CAUTION}</Caution> : null}
    </div>
  );
}
