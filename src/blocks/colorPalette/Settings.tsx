// Settings of the colour palette: which colours, in the order ticked, and whether to show print values.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { ColorPaletteAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { colorOptions, MultiPick, TextInput, Toggle } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as ColorPaletteAttrs;
  const set = (patch: Partial<ColorPaletteAttrs>) => props.updateAttributes(patch);
  return (
    <BlockFrame
      props={props}
      startOpen={a.colorIds.length === 0}
      settings={
        <>
          <MultiPick legend="Colours" options={colorOptions(identity)} value={a.colorIds} onChange={(colorIds) => set({ colorIds })} missingLabel="Removed colour" />
          <Toggle label="Show print values (CMYK and spot)" checked={a.showPrint} onChange={(showPrint) => set({ showPrint })} />
          <TextInput label="Note (optional)" value={a.note} max={500} onChange={(note) => set({ note })} />
        </>
      }
    />
  );
}
