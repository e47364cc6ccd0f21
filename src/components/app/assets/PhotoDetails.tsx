// A photograph's details on the shelf: alt text (needed before approval), caption, and the focal point, set by a click
// on the picture (or typed as percentages), with the crops a page would cut around it.
import { useState, type MouseEvent } from 'react';
import { ALT_TEXT_MAX, CAPTION_MAX, CENTRE, objectPosition, type FocalPoint } from '@/lib/assets/photo';
import type { ShelfAsset } from './AssetShelf';

const PREVIEW_CROPS = [
  { label: '1:1', className: 'aspect-square' },
  { label: '16:9', className: 'aspect-video' },
  { label: '4:5', className: 'aspect-[4/5]' },
];
const percent = (v: number) => Math.round(v * 100);
const fraction = (v: string) => Math.min(1, Math.max(0, Number(v) / 100));

export function PhotoDetails({ asset, onSave }: { asset: ShelfAsset; onSave: (body: Record<string, unknown>) => void }) {
  const [alt, setAlt] = useState(asset.altText ?? '');
  const [caption, setCaption] = useState(asset.caption ?? '');
  const [focus, setFocus] = useState<FocalPoint>(asset.focus ?? CENTRE);
  const pick = (e: MouseEvent<HTMLImageElement>) => {
    const box = e.currentTarget.getBoundingClientRect();
    setFocus({ x: Math.round(((e.clientX - box.left) / box.width) * 1000) / 1000, y: Math.round(((e.clientY - box.top) / box.height) * 1000) / 1000 });
  };
  const id = (what: string) => `${what}-${asset.id}`;
  const preview = asset.files.preview;
  return (
    <details className="text-sm" open={!asset.altText} data-photo-details="">
      <summary className="cursor-pointer font-semibold">Photo details: alt text, caption, focal point</summary>
      <form
        className="mt-2 space-y-2"
        onSubmit={(e) => {
          e.preventDefault();
          onSave({ altText: alt.trim() || null, caption: caption.trim() || null, focus });
        }}
      >
        <label className="label" htmlFor={id('alt')}>Alt text (what the photo shows, for people who cannot see it)</label>
        <textarea id={id('alt')} className="field py-1.5 text-sm" rows={2} maxLength={ALT_TEXT_MAX} value={alt} onChange={(e) => setAlt(e.target.value)} aria-describedby={id('alt-hint')} />
        <p id={id('alt-hint')} className="hint">Needed before approval. Describe the scene in a sentence; leave out “photo of”.</p>
        <label className="label" htmlFor={id('caption')}>Caption (shown under the photo)</label>
        <input id={id('caption')} className="field py-1.5 text-sm" maxLength={CAPTION_MAX} value={caption} onChange={(e) => setCaption(e.target.value)} />
        {preview && (
          <div>
            <p className="label" id={id('focus-label')}>Focal point: click the subject</p>
            <div className="relative">
              {/* The pointer sets the point; the two number fields below do the same from the keyboard. */}
              <img src={preview} alt={`Set the focal point of ${asset.name}`} className="block w-full cursor-crosshair rounded" onClick={pick} data-focus-target="" />
              <span
                aria-hidden="true"
                className="pointer-events-none absolute size-5 -translate-x-1/2 -translate-y-1/2 rounded-full border-2 border-white shadow-[0_0_0_2px_rgba(0,0,0,0.6)]"
                style={{ left: `${focus.x * 100}%`, top: `${focus.y * 100}%` }}
              />
            </div>
            <div className="mt-2 flex gap-3">
              <label className="flex items-center gap-1">
                Across <input type="number" className="field w-20 py-1 text-sm" min={0} max={100} step={1} value={percent(focus.x)} onChange={(e) => setFocus({ ...focus, x: fraction(e.target.value) })} /> %
              </label>
              <label className="flex items-center gap-1">
                Down <input type="number" className="field w-20 py-1 text-sm" min={0} max={100} step={1} value={percent(focus.y)} onChange={(e) => setFocus({ ...focus, y: fraction(e.target.value) })} /> %
              </label>
            </div>
            <p className="hint mt-2">How pages cut it:</p>
            <div className="mt-1 flex items-start gap-2">
              {PREVIEW_CROPS.map((crop) => (
                <figure key={crop.label} className="w-20">
                  <img src={preview} alt="" className={`${crop.className} w-full rounded object-cover`} style={{ objectPosition: objectPosition(focus) }} />
                  <figcaption className="text-center text-xs text-ink-soft">{crop.label}</figcaption>
                </figure>
              ))}
            </div>
          </div>
        )}
        <button className="btn-quiet px-3 py-1.5">Save photo details</button>
      </form>
    </details>
  );
}
