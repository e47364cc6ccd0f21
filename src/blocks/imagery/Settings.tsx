// Settings of the imagery block: photographs picked from the brand's asset shelf by their thumbnails, with verdict,
// and the block's own alt text or caption where the shelf's should not be used.
import { useId } from 'react';
import type { ReactNodeViewProps } from '@tiptap/react';
import type { ImageItem, ImageryAttrs } from './definition';
import { imageSrcSchema, looksLikeAddress, OUTSIDE_IMAGE_MESSAGE } from './definition';
import { objectPosition, PHOTO_ASPECTS, type PhotoAspect } from '@/lib/assets/photo';
import type { IdentityAsset } from '@/lib/identity/types';
import { useIdentity } from '@/components/editor/IdentityContext';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { NumberInput, Select, TextInput } from '@/components/editor/blocks/controls';

const TO_COME = 'image-to-come';
const ASPECT_LABELS: Record<PhotoAspect, string> = { '4:3': '4:3 (classic)', '3:2': '3:2 (camera)', '1:1': '1:1 (square)', '16:9': '16:9 (wide)', '4:5': '4:5 (portrait)' };

/** The shelf's own small preview (a fixed rendition: drawn once, never counted as a download). */
const thumbnail = (asset: IdentityAsset) => `/api/assets/${asset.id}/file?format=png&width=480&preview=1`;

/** Approved photographs as a group of radio buttons with thumbnails: arrow keys move between them, the choice is an asset id. */
function PhotoPicker({ n, value, photos, onChange }: { n: number; value: string; photos: IdentityAsset[]; onChange: (src: string) => void }) {
  const name = useId();
  const chosen = photos.some((p) => p.id === value);
  const tile =
    'group relative block cursor-pointer overflow-hidden rounded-md border-2 border-transparent bg-card has-[:checked]:border-plumb has-[:checked]:bg-plumb-wash has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-plumb';
  const chosenMark = <span aria-hidden="true" className="absolute right-1 top-1 hidden rounded bg-plumb-deep px-1.5 py-0.5 text-[11px] font-semibold text-white group-has-[:checked]:block">Chosen</span>;
  return (
    <fieldset className="sm:col-span-2" data-photo-picker="">
      <legend className="label">Photograph {n}</legend>
      <div className="grid grid-cols-3 gap-2 sm:grid-cols-6">
        {photos.map((photo) => (
          <label key={photo.id} className={tile} title={photo.alt ?? undefined}>
            <input type="radio" name={name} value={photo.id} checked={value === photo.id} onChange={() => onChange(photo.id)} className="sr-only" />
            <img src={thumbnail(photo)} alt="" className="aspect-[4/3] w-full object-cover" style={{ objectPosition: objectPosition(photo.focus) }} loading="lazy" decoding="async" />
            <span className="block truncate px-1.5 py-1 text-xs">{photo.name}</span>
            {chosenMark}
          </label>
        ))}
        <label className={tile}>
          <input type="radio" name={name} value={TO_COME} checked={!chosen} onChange={() => onChange(TO_COME)} className="sr-only" />
          <span className="flex aspect-[4/3] items-center justify-center bg-paper p-2 text-center text-xs text-ink-soft">A frame for now</span>
          <span className="block truncate px-1.5 py-1 text-xs">Photo to come</span>
          {chosenMark}
        </label>
      </div>
    </fieldset>
  );
}

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as ImageryAttrs;
  const set = (patch: Partial<ImageryAttrs>) => props.updateAttributes(patch);
  const change = (i: number, patch: Partial<ImageItem>) => set({ items: a.items.map((item, j) => (j === i ? { ...item, ...patch } : item)) });
  const photos = (identity.assets ?? []).filter((asset) => asset.kind === 'photo');
  const byId = new Map((identity.assets ?? []).map((asset) => [asset.id, asset]));
  return (
    <BlockFrame
      props={props}
      startOpen={a.items.length === 0}
      settings={
        <>
          {photos.length === 0 && <p className="text-sm text-ink-soft">No approved photographs on the asset shelf yet. Upload them on the Assets page as photographs, give each its alt text and approve it; until then each one shows as a frame.</p>}
          {a.items.map((item, i) => {
            const outside = looksLikeAddress(item.src);
            const bad = !imageSrcSchema.safeParse(item.src).success;
            const current = byId.get(item.src);
            const older = current && current.kind !== 'photo';
            return (
              <fieldset key={i} className="grid gap-3 rounded-lg border border-rule bg-card p-3 sm:grid-cols-2">
                <legend className="px-1 text-sm font-semibold">Image {i + 1}</legend>
                {photos.length > 0 && <PhotoPicker n={i + 1} value={item.src} photos={photos} onChange={(src) => change(i, { src })} />}
                {(outside || bad) && <p className="error-text sm:col-span-2">{outside ? OUTSIDE_IMAGE_MESSAGE : 'Choose a photograph from the asset shelf; this one will not be saved.'}</p>}
                {older && <p className="hint sm:col-span-2">Shows “{current.name}”, an image filed before photographs had their own kind; pick a photograph to replace it.</p>}
                <TextInput
                  label="Alt text for this page (optional)"
                  hint={current?.alt ? `Empty uses the photo’s own: “${current.alt}”` : 'Empty uses the photo’s own alt text from the shelf.'}
                  value={item.alt}
                  max={300}
                  onChange={(alt) => change(i, { alt })}
                />
                <TextInput label="Caption" hint={current?.caption ? `Empty uses the shelf’s: “${current.caption}”` : undefined} value={item.caption} max={500} onChange={(caption) => change(i, { caption })} />
                <Select label="Verdict" value={item.verdict} options={[{ value: 'do', label: 'Do' }, { value: 'dont', label: 'Don’t' }]} onChange={(verdict) => change(i, { verdict })} />
                <button type="button" className="btn-danger self-end justify-self-start" onClick={() => set({ items: a.items.filter((_, j) => j !== i) })}>
                  Remove image {i + 1}
                </button>
              </fieldset>
            );
          })}
          <button
            type="button"
            className="btn-quiet justify-self-start"
            disabled={a.items.length >= 24}
            onClick={() => set({ items: [...a.items, { src: photos.find((p) => !a.items.some((item) => item.src === p.id))?.id ?? photos[0]?.id ?? TO_COME, alt: '', verdict: 'do', caption: '' }] })}
          >
            Add an image
          </button>
          <Select label="Shape of every photograph" value={a.aspect ?? '4:3'} options={PHOTO_ASPECTS.map((value) => ({ value, label: ASPECT_LABELS[value] }))} onChange={(aspect) => set({ aspect })} hint="Each photograph is cut to this shape around its focal point (set on the shelf)." />
          <NumberInput label="Columns" value={a.columns} min={1} max={4} step={1} onChange={(columns) => set({ columns })} />
        </>
      }
    />
  );
}
