// Typography: the brand's typefaces by role (shipped open fonts or uploads, with the licence confirmation),
// the type scale settings, and a preview of every step in the brand's own fonts with the measure.
import { useState } from 'react';
import { FONT_LICENCE_CAUTION } from '@/lib/cautions';
import { Caution, IdentityRoot, LoadState, Notice, useIdentity, type NoticeState } from '../shared';
import { AddTypeface } from './AddTypeface';
import { ScalePreview } from './ScalePreview';
import { ScaleSettings } from './ScaleSettings';
import { TypefaceCard } from './TypefaceCard';

function Typography({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  const identity = useIdentity(brandId);
  const [notice, setNotice] = useState<NoticeState>(null);
  if (!identity.data) return <LoadState query={identity} what="typography" />;
  const faces = identity.data.typefaces;
  return (
    <div className="space-y-8">
      <Caution title="Font licences">{FONT_LICENCE_CAUTION} Uploaded fonts are not served on published pages until you tick the licence box.</Caution>
      <Notice notice={notice} />
      {faces.length === 0 ? (
        <div className="rounded-xl border border-rule bg-paper/60 px-6 py-10 text-center">
          <p className="text-lg font-semibold">No typefaces yet</p>
          <p className="mt-1 text-ink-soft">
            {canEdit ? 'Pick an open font below or upload the brand’s own, first for headings, then for body text.' : 'The brand’s designers have not chosen typefaces yet.'}
          </p>
        </div>
      ) : (
        <ul className="grid gap-5 lg:grid-cols-2" aria-label="Typefaces">
          {faces.map((f) => <TypefaceCard key={f.id} brandId={brandId} face={f} canEdit={canEdit} onNotice={setNotice} />)}
        </ul>
      )}
      {canEdit && <AddTypeface brandId={brandId} onNotice={setNotice} />}
      <div>
        <h3 className="text-lg font-semibold">Type scale</h3>
        <div className="mt-3 grid gap-6 lg:grid-cols-[18rem_1fr]">
          <ScaleSettings brandId={brandId} scale={identity.data.typeScale} canEdit={canEdit} onNotice={setNotice} />
          <ScalePreview identity={identity.data} />
        </div>
      </div>
    </div>
  );
}

export default function TypographyPanel({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  return (
    <IdentityRoot>
      <Typography brandId={brandId} canEdit={canEdit} />
    </IdentityRoot>
  );
}
