// Changes to the brand's logos: upload, settings, removal and the designer's own versions; each refreshes the identity.
// Beside them the one read of its own, the one-colour proofs.
import { useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import { api, apiUpload } from '@/lib/client/api';
import { useChange, type Reactions } from '@/lib/client/mutation';
import type { updateLogoBody } from '@/lib/identity/schemas';
import type { IdentityLogo, LogoVariant, LogoVariantSlot } from '@/lib/identity/types';
import type { LogoProofs } from '@/lib/logo/tones';
import { useRefreshIdentity } from '../shared';

export type LogoChanges = z.output<typeof updateLogoBody>;
export interface NewLogo { file: File; variant: LogoVariant; onProgress: (fraction: number) => void }
export interface OwnFile { slot: LogoVariantSlot; file: File }

const logos = (brandId: string) => `/api/brands/${brandId}/logos`;

export function useUploadLogo(brandId: string, on: Reactions<{ logo: IdentityLogo; duplicate: boolean }, NewLogo>) {
  const send = ({ file, variant, onProgress }: NewLogo) => {
    const form = new FormData();
    form.set('file', file);
    form.set('variant', variant);
    return apiUpload<{ logo: IdentityLogo; duplicate: boolean }>(logos(brandId), form, onProgress);
  };
  return useChange(send, useRefreshIdentity(brandId), on);
}

export const useUpdateLogo = (brandId: string, logoId: string, on: Reactions<{ logo: IdentityLogo }, LogoChanges>) =>
  useChange((body: LogoChanges) => api<{ logo: IdentityLogo }>(`${logos(brandId)}/${logoId}`, { method: 'PATCH', body }), useRefreshIdentity(brandId), on);

export const useRemoveLogo = (brandId: string, logoId: string, on: Reactions<unknown, void>) =>
  useChange(() => api(`${logos(brandId)}/${logoId}`, { method: 'DELETE' }), useRefreshIdentity(brandId), on);

export function useUploadOwnVersion(brandId: string, logoId: string, on: Reactions<{ logo: IdentityLogo }, OwnFile>) {
  const send = ({ slot, file }: OwnFile) => {
    const form = new FormData();
    form.set('file', file);
    return apiUpload<{ logo: IdentityLogo }>(`${logos(brandId)}/${logoId}/variants/${slot}`, form);
  };
  return useChange(send, useRefreshIdentity(brandId), on);
}

export const useDropOwnVersion = (brandId: string, logoId: string, on: Reactions<unknown, LogoVariantSlot>) =>
  useChange((slot: LogoVariantSlot) => api(`${logos(brandId)}/${logoId}/variants/${slot}`, { method: 'DELETE' }), useRefreshIdentity(brandId), on);

/** The one-colour proofs of a logo; asked again when the designer's own one-colour files or the light-parts choice change. */
export function useLogoProofs(brandId: string, logo: IdentityLogo) {
  return useQuery({
    queryKey: ['logo-proofs', brandId, logo.id, [...(logo.ownVariants ?? [])].sort().join(','), logo.lightParts ?? 'holes'],
    queryFn: () => api<{ proofs: LogoProofs }>(`${logos(brandId)}/${logo.id}/proofs`).then((r) => r.proofs),
  });
}
