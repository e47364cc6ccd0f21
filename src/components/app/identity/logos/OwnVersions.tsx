// The designer's own files for the one-colour and dark-ground versions; each wins everywhere over the computed one.
import { useId, useState } from 'react';
import { LOGO_VARIANT_SLOT_LABELS, LOGO_VARIANT_SLOTS, type IdentityLogo, type LogoVariantSlot } from '@/lib/identity/types';
import { messageOf, type NoticeState } from '../shared';
import { useDropOwnVersion, useUploadOwnVersion } from './logos.queries';
import { acceptAttribute } from '@/lib/uploads/rules';

export function OwnVersions({ brandId, logo, canEdit, onNotice }: { brandId: string; logo: IdentityLogo; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const own = new Set(logo.ownVariants ?? []);
  const [busy, setBusy] = useState<LogoVariantSlot | null>(null);
  const upload = useUploadOwnVersion(brandId, logo.id, {
    onSuccess: (_r, { slot }) => onNotice({ kind: 'ok', text: `Your file is now the “${LOGO_VARIANT_SLOT_LABELS[slot]}” version of ${logo.name}.` }),
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'That file was refused.') }),
    onSettled: () => setBusy(null),
  });
  const drop = useDropOwnVersion(brandId, logo.id, {
    onSuccess: () => onNotice({ kind: 'ok', text: 'The computed version is used again.' }),
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The file could not be removed.') }),
  });
  if (!canEdit && own.size === 0) return null;
  return (
    <section aria-labelledby={`${id}-own`} className="rounded-lg bg-paper px-4 py-3">
      <h4 id={`${id}-own`} className="text-sm font-semibold">Your own versions</h4>
      <p className="mt-1 text-xs text-ink-soft">A file uploaded here replaces the computed version on the site, in the PDF, in patterns and in downloads.</p>
      <ul className="mt-2 space-y-2 text-sm">
        {LOGO_VARIANT_SLOTS.map((slot) => (
          <li key={slot} className="flex flex-wrap items-center justify-between gap-2">
            <span>
              {LOGO_VARIANT_SLOT_LABELS[slot]}: <span className="font-semibold">{own.has(slot) ? 'your file' : slot === 'on-dark' ? 'the logo as drawn' : 'computed'}</span>
            </span>
            {canEdit && (
              <span className="flex gap-2">
                <label className="btn-quiet cursor-pointer px-2 py-1 text-xs">
                  {busy === slot ? 'Uploading…' : own.has(slot) ? 'Replace' : 'Upload SVG or PNG'}
                  <input
                    type="file"
                    accept={acceptAttribute('logo')}
                    className="sr-only"
                    aria-label={`Upload your own file for ${LOGO_VARIANT_SLOT_LABELS[slot]}`}
                    onChange={(e) => {
                      const file = e.target.files?.[0];
                      if (file) {
                        setBusy(slot);
                        upload.mutate({ slot, file });
                      }
                      e.target.value = '';
                    }}
                  />
                </label>
                {own.has(slot) && (
                  <button type="button" className="btn-quiet px-2 py-1 text-xs" disabled={drop.isPending} onClick={() => drop.mutate(slot)}>
                    Use computed
                  </button>
                )}
              </span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
