// Settings of the downloads block: its title and a note; the files themselves are chosen once assets exist.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { DownloadsAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { TextInput } from '@/components/editor/blocks/controls';

export function Settings(props: ReactNodeViewProps) {
  const a = props.node.attrs as DownloadsAttrs;
  const set = (patch: Partial<DownloadsAttrs>) => props.updateAttributes(patch);
  return (
    <BlockFrame
      props={props}
      settings={
        <>
          <TextInput label="Title" value={a.title} max={200} onChange={(title) => set({ title })} />
          <TextInput label="Note (optional)" value={a.note} max={500} onChange={(note) => set({ note })} />
          <p className="hint">Choosing approved files arrives with asset uploads.</p>
        </>
      }
    />
  );
}
