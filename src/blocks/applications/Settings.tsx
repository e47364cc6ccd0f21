// Settings of the applications block: which mock-ups, which logo, which shelf photographs, a note.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { ApplicationsAttrs } from './definition';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { LogoSelect, MultiPick, TextInput } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';
import { MOCKUP_TEMPLATES } from '@/lib/mockups/templates';
import { shelfPhotos } from '@/lib/mockups/photos';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as ApplicationsAttrs;
  const set = (patch: Partial<ApplicationsAttrs>) => props.updateAttributes(patch);
  const photos = shelfPhotos(identity);
  return (
    <BlockFrame
      props={props}
      startOpen={!a.templates.length}
      settings={
        <>
          <MultiPick
            legend="Mock-ups"
            options={MOCKUP_TEMPLATES.map((t) => ({ id: t.key, label: `${t.name} (${t.size.named})` }))}
            value={a.templates}
            onChange={(templates) => set({ templates })}
            missingLabel="A mock-up that no longer exists"
          />
          <LogoSelect label="Logo" identity={identity} value={a.logoId} onChange={(logoId) => set({ logoId })} />
          {photos.length ? (
            <MultiPick legend="Photographs (in order of use, up to 4)" options={photos.map((p) => ({ id: p.id, label: p.name }))} value={a.photoIds} onChange={(photoIds) => set({ photoIds: photoIds.slice(0, 4) })} missingLabel="A photograph no longer on the shelf" />
          ) : (
            <p className="hint">No approved photographs on the asset shelf yet: the pieces show tinted panels where photographs go.</p>
          )}
          <TextInput label="Note (optional)" value={a.note} max={500} onChange={(note) => set({ note })} />
        </>
      }
    />
  );
}
