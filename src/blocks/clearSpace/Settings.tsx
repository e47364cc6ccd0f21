// Settings of the clear-space diagram: which logo, whether to draw the unit, a note.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { ClearSpaceAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { LogoSelect, TextInput, Toggle } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as ClearSpaceAttrs;
  const set = (patch: Partial<ClearSpaceAttrs>) => props.updateAttributes(patch);
  return (
    <BlockFrame
      props={props}
      startOpen={!a.logoId}
      settings={
        <>
          <LogoSelect label="Logo" identity={identity} value={a.logoId} onChange={(logoId) => set({ logoId })} />
          <Toggle label="Draw one unit in each corner" checked={a.showUnit} onChange={(showUnit) => set({ showUnit })} />
          <TextInput label="Note (optional)" value={a.note} max={500} onChange={(note) => set({ note })} />
          <p className="hint">The unit and multiple are set with the logo on the identity screen.</p>
        </>
      }
    />
  );
}
