// Settings of the minimum-size block: which logo, whether to show the print minimum, a note.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { MinimumSizeAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { LogoSelect, TextInput, Toggle } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as MinimumSizeAttrs;
  const set = (patch: Partial<MinimumSizeAttrs>) => props.updateAttributes(patch);
  return (
    <BlockFrame
      props={props}
      startOpen={!a.logoId}
      settings={
        <>
          <LogoSelect label="Logo" identity={identity} value={a.logoId} onChange={(logoId) => set({ logoId })} />
          <Toggle label="Show the print minimum" checked={a.showPrint} onChange={(showPrint) => set({ showPrint })} />
          <TextInput label="Note (optional)" value={a.note} max={500} onChange={(note) => set({ note })} />
          <p className="hint">The sizes themselves are set with the logo on the identity screen.</p>
        </>
      }
    />
  );
}
