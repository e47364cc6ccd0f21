// Settings of the logo-on-grounds block: which logos, the brand ground, and the file used on dark grounds.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { LogoShowcaseAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { ColorSelect, logoOptions, MultiPick, Select, TextInput } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as LogoShowcaseAttrs;
  const set = (patch: Partial<LogoShowcaseAttrs>) => props.updateAttributes(patch);
  return (
    <BlockFrame
      props={props}
      startOpen={a.logoIds.length === 0}
      settings={
        <>
          <MultiPick legend="Logos" options={logoOptions(identity)} value={a.logoIds} onChange={(logoIds) => set({ logoIds })} missingLabel="Removed logo" />
          <ColorSelect label="Brand ground" identity={identity} value={a.brandColorId} onChange={(brandColorId) => set({ brandColorId })} noneLabel="The primary colour" />
          <Select
            label="File on dark and brand grounds"
            value={a.onDark}
            options={[{ value: 'white', label: 'One colour, white (inner shapes cut out)' }, { value: 'reversed', label: 'Reversed' }, { value: 'original', label: 'Full colour (your dark-ground file, if uploaded)' }]}
            onChange={(onDark) => set({ onDark })}
          />
          <TextInput label="Caption (optional)" value={a.caption} max={500} onChange={(caption) => set({ caption })} />
        </>
      }
    />
  );
}
