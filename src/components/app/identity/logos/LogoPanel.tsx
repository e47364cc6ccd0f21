// Logos: upload, previews on light, dark and brand-colour grounds, the clear-space box and drawn bounds over
// the logo at any size, minimum sizes, recoloured variants, and the settings behind them.
import { useState } from 'react';
import { TRADEMARK_CAUTION } from '@/lib/cautions';
import { Caution, IdentityRoot, LoadState, Notice, useIdentity, type NoticeState } from '../shared';
import { LogoCard } from './LogoCard';
import { UploadLogo } from './UploadLogo';

function Logos({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  const identity = useIdentity(brandId);
  const [notice, setNotice] = useState<NoticeState>(null);
  if (!identity.data) return <LoadState query={identity} what="logos" />;
  const { logos, colors } = identity.data;
  const brandColor = colors.find((c) => c.role === 'primary') ?? colors[0];
  return (
    <div className="space-y-6">
      <Caution title="Trademark clearance">{TRADEMARK_CAUTION}</Caution>
      <Notice notice={notice} />
      {logos.length === 0 ? (
        <div className="rounded-xl border border-rule bg-paper/60 px-6 py-10 text-center">
          <p className="text-lg font-semibold">No logos yet</p>
          <p className="mt-1 text-ink-soft">
            {canEdit
              ? 'Upload the primary logo below, as an SVG if you have one. Plumbline measures its drawn bounds, clear space and minimum sizes.'
              : 'The brand’s designers have not uploaded a logo yet.'}
          </p>
        </div>
      ) : (
        <ul className="space-y-6" aria-label="Logos">
          {logos.map((l) => <LogoCard key={l.id} brandId={brandId} logo={l} brandColor={brandColor} colors={colors} canEdit={canEdit} onNotice={setNotice} />)}
        </ul>
      )}
      {canEdit && <UploadLogo brandId={brandId} onNotice={setNotice} />}
    </div>
  );
}

export default function LogoPanel({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  return (
    <IdentityRoot>
      <Logos brandId={brandId} canEdit={canEdit} />
    </IdentityRoot>
  );
}
