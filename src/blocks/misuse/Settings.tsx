// Settings of the logo don'ts: which logo and which wrong uses to draw.
import type { ReactNodeViewProps } from '@tiptap/react';
import { MISUSE_KINDS, MISUSE_LABELS, type MisuseAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { LogoSelect, MultiPick, TextInput } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as MisuseAttrs;
  const set = (patch: Partial<MisuseAttrs>) => props.updateAttributes(patch);
  const options = MISUSE_KINDS.map((k) => ({ id: k, label: MISUSE_LABELS[k].replace(/^Don’t /, '') }));
  return (
    <BlockFrame
      props={props}
      startOpen={!a.logoId}
      settings={
        <>
          <LogoSelect label="Logo" identity={identity} value={a.logoId} onChange={(logoId) => set({ logoId })} />
          <MultiPick
            legend="Wrong uses to show"
            options={options}
            value={a.tiles}
            onChange={(tiles) => set({ tiles: MISUSE_KINDS.filter((k) => tiles.includes(k)) })}
            missingLabel="Unknown tile"
          />
          <TextInput label="Note (optional)" value={a.note} max={500} onChange={(note) => set({ note })} />
        </>
      }
    />
  );
}
