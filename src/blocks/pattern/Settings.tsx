// Settings of the pattern: the mark, its size, gap, angle, row shift, colours and strength.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { PatternAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { ColorSelect, LogoSelect, NumberInput } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as PatternAttrs;
  const set = (patch: Partial<PatternAttrs>) => props.updateAttributes(patch);
  return (
    <BlockFrame
      props={props}
      startOpen={!a.logoId}
      settings={
        <div className="grid gap-4 sm:grid-cols-2">
          <LogoSelect label="Mark" identity={identity} value={a.logoId} onChange={(logoId) => set({ logoId })} />
          <ColorSelect label="Mark colour" identity={identity} value={a.markColorId} onChange={(markColorId) => set({ markColorId })} noneLabel="The primary colour" />
          <ColorSelect label="Ground colour" identity={identity} value={a.backgroundColorId} onChange={(backgroundColorId) => set({ backgroundColorId })} noneLabel="The background colour" />
          <NumberInput label="Mark size" unit="px" value={a.scale} min={8} max={160} step={1} onChange={(scale) => set({ scale })} />
          <NumberInput label="Gap" unit="× mark size" value={a.spacing} min={0.25} max={8} step={0.25} onChange={(spacing) => set({ spacing })} />
          <NumberInput label="Angle" unit="°" value={a.rotation} min={-180} max={180} step={1} onChange={(rotation) => set({ rotation })} />
          <NumberInput label="Row shift" unit="of a repeat" value={a.offset} min={0} max={1} step={0.05} onChange={(offset) => set({ offset })} />
          <NumberInput label="Strength" unit="opacity" value={a.opacity} min={0.05} max={1} step={0.01} onChange={(opacity) => set({ opacity })} />
          <NumberInput label="Height" unit="px" value={a.height} min={80} max={600} step={10} onChange={(height) => set({ height })} />
        </div>
      }
    />
  );
}
