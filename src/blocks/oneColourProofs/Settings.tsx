// Settings of the one-colour block: which logos, and a caption.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { OneColourProofsAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { logoOptions, MultiPick, TextInput } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as OneColourProofsAttrs;
  const set = (patch: Partial<OneColourProofsAttrs>) => props.updateAttributes(patch);
  return (
    <BlockFrame
      props={props}
      startOpen={a.logoIds.length === 0}
      settings={
        <>
          <MultiPick legend="Logos" options={logoOptions(identity)} value={a.logoIds} onChange={(logoIds) => set({ logoIds })} missingLabel="Removed logo" />
          <TextInput label="Caption (optional)" value={a.caption} max={500} onChange={(caption) => set({ caption })} />
        </>
      }
    />
  );
}
