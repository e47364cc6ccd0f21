// Settings of a remark box: tone, optional title and the text.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { CalloutAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { Select, TextInput } from '@/components/editor/blocks/controls';

export function Settings(props: ReactNodeViewProps) {
  const a = props.node.attrs as CalloutAttrs;
  const set = (patch: Partial<CalloutAttrs>) => props.updateAttributes(patch);
  return (
    <BlockFrame
      props={props}
      startOpen={!a.text}
      settings={
        <>
          <Select label="Tone" value={a.tone} options={[{ value: 'note', label: 'Note' }, { value: 'caution', label: 'Caution' }]} onChange={(tone) => set({ tone })} />
          <TextInput label="Title (optional)" value={a.title} max={120} onChange={(title) => set({ title })} />
          <TextInput label="Text" value={a.text} max={4000} multiline onChange={(text) => set({ text })} hint="A blank line starts a new paragraph." />
        </>
      }
    />
  );
}
