// Settings of the imagery block: images (asset id or address) with alt text, verdict and caption.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { ImageItem, ImageryAttrs } from '../../../../lib/guideline/blocks';
import { imageSrcSchema } from '../../../../lib/guideline/blocks';
import { BlockFrame } from '../BlockFrame';
import { NumberInput, Select, TextInput } from '../controls';

export function ImageryView(props: ReactNodeViewProps) {
  const a = props.node.attrs as ImageryAttrs;
  const set = (patch: Partial<ImageryAttrs>) => props.updateAttributes(patch);
  const change = (i: number, patch: Partial<ImageItem>) => set({ items: a.items.map((item, j) => (j === i ? { ...item, ...patch } : item)) });
  return (
    <BlockFrame
      props={props}
      startOpen={a.items.length === 0}
      settings={
        <>
          {a.items.map((item, i) => {
            const bad = !imageSrcSchema.safeParse(item.src).success;
            return (
              <fieldset key={i} className="grid gap-3 rounded-lg border border-rule bg-card p-3 sm:grid-cols-2">
                <legend className="px-1 text-sm font-semibold">Image {i + 1}</legend>
                <TextInput label="Asset id or https:// address" value={item.src} max={2048} onChange={(src) => change(i, { src })} hint={bad ? 'Use an asset id or an https:// address; this one will not be saved.' : undefined} />
                <TextInput label="Description for screen readers" value={item.alt} max={300} onChange={(alt) => change(i, { alt })} />
                <Select label="Verdict" value={item.verdict} options={[{ value: 'do', label: 'Do' }, { value: 'dont', label: 'Don’t' }]} onChange={(verdict) => change(i, { verdict })} />
                <TextInput label="Caption" value={item.caption} max={500} onChange={(caption) => change(i, { caption })} />
                <button type="button" className="btn-danger justify-self-start" onClick={() => set({ items: a.items.filter((_, j) => j !== i) })}>
                  Remove image {i + 1}
                </button>
              </fieldset>
            );
          })}
          <button type="button" className="btn-quiet justify-self-start" disabled={a.items.length >= 24} onClick={() => set({ items: [...a.items, { src: 'image-to-come', alt: '', verdict: 'do', caption: '' }] })}>
            Add an image
          </button>
          <NumberInput label="Columns" value={a.columns} min={1} max={4} step={1} onChange={(columns) => set({ columns })} />
        </>
      }
    />
  );
}
