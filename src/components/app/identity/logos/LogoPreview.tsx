// Previews of one logo: the ground, the file and the guides to show, the drawn width against the screen minimum, the
// clear-space stage, and tiles of every version on light, dark and brand grounds.
import { useId, useState } from 'react';
import type { IdentityColor, IdentityLogo } from '@/lib/identity/types';
import { ClearSpaceStage } from './ClearSpaceStage';
import { DARK, FILE_LABEL, LIGHT, r2, type FileKind, type Ground } from './labels';

function Tile({ src, ground, label }: { src: string; ground: string; label: string }) {
  return (
    <figure className="overflow-hidden rounded-lg border border-rule">
      <div className="flex h-28 items-center justify-center p-4" style={{ background: ground }}>
        <img src={src} alt="" className="max-h-full max-w-full object-contain" />
      </div>
      <figcaption className="border-t border-rule px-3 py-1.5 text-xs text-ink-soft">{label}</figcaption>
    </figure>
  );
}

export function LogoPreview({ logo, brandColor }: { logo: IdentityLogo; brandColor: IdentityColor | undefined }) {
  const id = useId();
  const grounds: { key: Ground; label: string; hex: string }[] = [
    { key: 'light', label: 'Light', hex: LIGHT },
    { key: 'dark', label: 'Dark', hex: DARK },
    ...(brandColor ? [{ key: 'brand' as const, label: brandColor.name, hex: brandColor.hex }] : []),
  ];
  const [ground, setGround] = useState<Ground>('light');
  const [file, setFile] = useState<FileKind>('original');
  const [showGuides, setShowGuides] = useState(true);
  const minPx = logo.minimumSize.screenPx;
  const [drawnPx, setDrawnPx] = useState(Math.max(minPx, Math.min(360, Math.round(logo.bounds.width))));
  const groundHex = grounds.find((g) => g.key === ground)?.hex ?? LIGHT;
  return (
    <>
    <div className="flex flex-wrap items-center gap-x-6 gap-y-3 text-sm">
      <fieldset className="flex flex-wrap items-center gap-1">
        <legend className="sr-only">Background</legend>
        {grounds.map((g) => (
          <label key={g.key} className={`flex cursor-pointer items-center gap-1.5 rounded-md border px-2.5 py-1 has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-plumb ${ground === g.key ? 'border-plumb bg-plumb-wash' : 'border-rule-strong'}`}>
            <input type="radio" name={`${id}-ground`} className="sr-only" checked={ground === g.key} onChange={() => setGround(g.key)} />
            <span aria-hidden="true" className="h-3.5 w-3.5 rounded-sm border border-rule-strong" style={{ background: g.hex }} />
            {g.key === 'brand' ? `On ${g.label}` : `On ${g.label.toLowerCase()}`}
          </label>
        ))}
      </fieldset>
      <label className="flex items-center gap-2">
        <span className="text-ink-soft">File</span>
        <select className="field w-auto py-1 text-sm" value={file} onChange={(e) => setFile(e.target.value as FileKind)}>
          {(Object.keys(FILE_LABEL) as FileKind[]).map((k) => <option key={k} value={k}>{FILE_LABEL[k]}</option>)}
        </select>
      </label>
      <label className="flex items-center gap-2">
        <input type="checkbox" className="h-4 w-4 accent-plumb" checked={showGuides} onChange={(e) => setShowGuides(e.target.checked)} />
        Show clear space and bounds
      </label>
    </div>
    <div>
      <label htmlFor={`${id}-size`} className="flex flex-wrap justify-between gap-2 text-sm">
        <span className="font-semibold">Drawn width: <span className="font-mono">{drawnPx} px</span></span>
        {drawnPx < minPx ? (
          <span className="font-semibold text-danger">Below the {minPx} px screen minimum</span>
        ) : (
          <span className="text-ink-soft">minimum {minPx} px</span>
        )}
      </label>
      <input id={`${id}-size`} type="range" min={8} max={720} step={1} value={drawnPx} onChange={(e) => setDrawnPx(Number(e.target.value))} className="mt-1 w-full accent-plumb" />
    </div>
    <div className="overflow-auto rounded-lg border border-rule" style={{ background: groundHex, maxHeight: '32rem' }}>
      <div className="flex min-h-48 items-center justify-center p-4">
        <ClearSpaceStage logo={logo} drawnPx={drawnPx} ground={groundHex} file={file} showGuides={showGuides} />
      </div>
    </div>
    <p className="text-xs text-ink-soft">
      Dashed: the clear space, {logo.clearSpace.multiple} × {logo.clearSpace.unitLabel} ({r2(logo.clearSpace.unitSize * logo.clearSpace.multiple)} logo units) on every side of the
      drawn bounds (solid line); the shaded squares show one unit. Transparent margins in the file do not count.
    </p>
    <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
      {grounds.map((g) => <Tile key={g.key} src={logo.files.original} ground={g.hex} label={`As uploaded, on ${g.key === 'brand' ? g.label : g.label.toLowerCase()}`} />)}
      <Tile src={logo.files.black} ground={LIGHT} label="Black, on light" />
      <Tile src={logo.files.white} ground={DARK} label="White, on dark" />
      <Tile src={logo.files.reversed} ground={brandColor?.hex ?? DARK} label={`Reversed, on ${brandColor?.name ?? 'dark'}`} />
    </div>
    <p className="text-xs text-ink-soft">
      One-colour versions are computed from the drawing: shapes painted in the ground’s colour are cut out, so they show whatever ground the logo sits on.
      {logo.format === 'png' ? ' From a PNG they are traced pixel by pixel; upload a vector file of your own for print.' : ''}
    </p>
    </>
  );
}
