// Settings of the imagery block: images chosen from the brand's asset shelf, with alt text, verdict and caption.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { ImageItem, ImageryAttrs } from './definition';
import { imageSrcSchema, looksLikeAddress, OUTSIDE_IMAGE_MESSAGE } from './definition';
import { useIdentity } from '@/components/editor/IdentityContext';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { NumberInput, Select, TextInput } from '@/components/editor/blocks/controls';

const TO_COME = 'image-to-come';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as ImageryAttrs;
  const set = (patch: Partial<ImageryAttrs>) => props.updateAttributes(patch);
  const change = (i: number, patch: Partial<ImageItem>) => set({ items: a.items.map((item, j) => (j === i ? { ...item, ...patch } : item)) });
  const shelf = (identity.assets ?? []).filter((asset) => asset.kind === 'image');
  return (
    <BlockFrame
      props={props}
      startOpen={a.items.length === 0}
      settings={
        <>
          {shelf.length === 0 && <p className="text-sm text-ink-soft">No approved images on the asset shelf yet. Upload and approve photographs on the Assets page; until then each image shows as a frame.</p>}
          {a.items.map((item, i) => {
            const outside = looksLikeAddress(item.src);
            const bad = !imageSrcSchema.safeParse(item.src).success;
            const options = [{ value: TO_COME, label: 'Image to come (a frame for now)' }, ...shelf.map((asset) => ({ value: asset.id, label: asset.name }))];
            if (!options.some((o) => o.value === item.src)) options.push({ value: item.src, label: outside ? 'An outside address (not accepted)' : 'A file no longer approved' });
            return (
              <fieldset key={i} className="grid gap-3 rounded-lg border border-rule bg-card p-3 sm:grid-cols-2">
                <legend className="px-1 text-sm font-semibold">Image {i + 1}</legend>
                <Select
                  label="Image from the asset shelf"
                  value={item.src}
                  options={options}
                  onChange={(src) => change(i, { src })}
                  hint={outside ? OUTSIDE_IMAGE_MESSAGE : bad ? 'Choose an image from the asset shelf; this one will not be saved.' : undefined}
                />
                <TextInput label="Description for screen readers" value={item.alt} max={300} onChange={(alt) => change(i, { alt })} />
                <Select label="Verdict" value={item.verdict} options={[{ value: 'do', label: 'Do' }, { value: 'dont', label: 'Don’t' }]} onChange={(verdict) => change(i, { verdict })} />
                <TextInput label="Caption" value={item.caption} max={500} onChange={(caption) => change(i, { caption })} />
                <button type="button" className="btn-danger justify-self-start" onClick={() => set({ items: a.items.filter((_, j) => j !== i) })}>
                  Remove image {i + 1}
                </button>
              </fieldset>
            );
          })}
          <button type="button" className="btn-quiet justify-self-start" disabled={a.items.length >= 24} onClick={() => set({ items: [...a.items, { src: shelf[0]?.id ?? TO_COME, alt: '', verdict: 'do', caption: '' }] })}>
            Add an image
          </button>
          <NumberInput label="Columns" value={a.columns} min={1} max={4} step={1} onChange={(columns) => set({ columns })} />
        </>
      }
    />
  );
}
