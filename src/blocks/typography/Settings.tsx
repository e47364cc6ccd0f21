// Settings of the typography block: roles shown, specimen text, the scale; flags unconfirmed font licences.
import type { ReactNodeViewProps } from '@tiptap/react';
import { FONT_LICENCE_CAUTION } from '@/lib/cautions';
import type { TypographyAttrs } from './definition';
import { TYPEFACE_ROLES } from '@/lib/identity/types';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { MultiPick, TextInput, Toggle } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as TypographyAttrs;
  const set = (patch: Partial<TypographyAttrs>) => props.updateAttributes(patch);
  const unconfirmed = identity.typefaces.filter((t) => !t.licence.confirmed);
  return (
    <BlockFrame
      props={props}
      settings={
        <>
          <MultiPick
            legend="Typefaces to show"
            options={TYPEFACE_ROLES.map((r) => ({ id: r, label: r === 'heading' ? 'Headings' : r === 'body' ? 'Running text' : 'Accents' }))}
            value={a.roles}
            onChange={(roles) => set({ roles: TYPEFACE_ROLES.filter((r) => roles.includes(r)) })}
            missingLabel="Unknown role"
          />
          <Toggle label="Show a specimen" checked={a.showSpecimen} onChange={(showSpecimen) => set({ showSpecimen })} />
          <TextInput label="Specimen text" value={a.specimenText} max={300} onChange={(specimenText) => set({ specimenText })} />
          <Toggle label="Show the type scale" checked={a.showScale} onChange={(showScale) => set({ showScale })} />
          {unconfirmed.length > 0 ? (
            <p role="note" className="rounded-md bg-warn-wash px-3 py-2 text-sm text-warn">
              Licence not confirmed yet for {unconfirmed.map((t) => t.family).join(', ')}. {FONT_LICENCE_CAUTION}
            </p>
          ) : null}
        </>
      }
    />
  );
}
