// One logo: its previews and own versions, its minimum sizes, its one-colour proofs, and (for editors) its settings and removal.
import { useId } from 'react';
import type { IdentityColor, IdentityLogo } from '@/lib/identity/types';
import { messageOf, type NoticeState } from '../shared';
import { VARIANT_LABEL } from './labels';
import { LogoPreview } from './LogoPreview';
import { LogoSettings } from './LogoSettings';
import { useRemoveLogo } from './logos.queries';
import { MinimumSize } from './MinimumSize';
import { OneColourProofs } from './OneColourProofs';
import { OwnVersions } from './OwnVersions';

export function LogoCard({ brandId, logo, brandColor, colors, canEdit, onNotice }: { brandId: string; logo: IdentityLogo; brandColor: IdentityColor | undefined; colors: IdentityColor[]; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const remove = useRemoveLogo(brandId, logo.id, {
    onSuccess: () => onNotice({ kind: 'ok', text: `${logo.name} removed.` }),
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The logo could not be removed.') }),
  });
  return (
    <li className="panel overflow-hidden" aria-labelledby={`${id}-name`}>
      <div className="flex flex-wrap items-baseline justify-between gap-3 border-b border-rule px-5 py-4">
        <h3 id={`${id}-name`} className="text-lg font-semibold">
          {logo.name} <span className="ml-1 text-sm font-normal text-ink-soft">{VARIANT_LABEL[logo.variant]} · {logo.format.toUpperCase()}</span>
        </h3>
        <a className="text-sm font-semibold text-plumb hover:underline" href={`${logo.files.original}?download=1`}>Download original</a>
      </div>

      <div className="grid gap-6 p-5 lg:grid-cols-[1fr_19rem]">
        <div className="min-w-0 space-y-4">
          <LogoPreview logo={logo} brandColor={brandColor} />
          <OwnVersions brandId={brandId} logo={logo} canEdit={canEdit} onNotice={onNotice} />
        </div>

        <div className="space-y-5">
          <MinimumSize size={logo.minimumSize} />
          {canEdit && (
            <>
              <LogoSettings brandId={brandId} logo={logo} onNotice={onNotice} />
              <button
                type="button"
                className="btn-danger w-full"
                disabled={remove.isPending}
                onClick={() => { if (confirm(`Remove ${logo.name} and its file from the identity?`)) remove.mutate(); }}
              >
                {remove.isPending ? 'Removing…' : 'Remove logo'}
              </button>
            </>
          )}
        </div>
      </div>
      <OneColourProofs brandId={brandId} logo={logo} colors={colors} canEdit={canEdit} onNotice={onNotice} />
    </li>
  );
}
