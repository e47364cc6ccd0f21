// Changes to the brand's typefaces and type scale; each refreshes the identity.
import type { z } from 'zod';
import { api, apiUpload } from '@/lib/client/api';
import { useChange, type Reactions } from '@/lib/client/mutation';
import type { shippedTypefaceBody, typeScaleBody, updateTypefaceBody } from '@/lib/identity/schemas';
import type { Identity, IdentityTypeface, TypefaceRole } from '@/lib/identity/types';
import { useRefreshIdentity } from '../shared';

export type ShippedTypeface = z.input<typeof shippedTypefaceBody>;
export type TypefaceChanges = z.input<typeof updateTypefaceBody>;
export type TypeScaleSettings = z.output<typeof typeScaleBody>;
export interface FontUpload { file: File; role: TypefaceRole; onProgress: (fraction: number) => void }
type Added = { typeface: IdentityTypeface };

const typefaces = (brandId: string) => `/api/brands/${brandId}/typefaces`;

export const useAddShippedTypeface = (brandId: string, on: Reactions<Added, ShippedTypeface>) =>
  useChange((body: ShippedTypeface) => api<Added>(typefaces(brandId), { method: 'POST', body }), useRefreshIdentity(brandId), on);

export function useUploadTypeface(brandId: string, on: Reactions<Added, FontUpload>) {
  const send = ({ file, role, onProgress }: FontUpload) => {
    const form = new FormData();
    form.set('file', file);
    form.set('role', role);
    return apiUpload<Added>(typefaces(brandId), form, onProgress);
  };
  return useChange(send, useRefreshIdentity(brandId), on);
}

export const useUpdateTypeface = (brandId: string, faceId: string, on: Reactions<Added, TypefaceChanges> = {}) =>
  useChange((body: TypefaceChanges) => api<Added>(`${typefaces(brandId)}/${faceId}`, { method: 'PATCH', body }), useRefreshIdentity(brandId), on);

export const useRemoveTypeface = (brandId: string, faceId: string, on: Reactions<unknown, void>) =>
  useChange(() => api(`${typefaces(brandId)}/${faceId}`, { method: 'DELETE' }), useRefreshIdentity(brandId), on);

export const useSaveTypeScale = (brandId: string, on: Reactions<{ typeScale: Identity['typeScale'] }, TypeScaleSettings>) =>
  useChange((body: TypeScaleSettings) => api<{ typeScale: Identity['typeScale'] }>(`/api/brands/${brandId}/type-scale`, { method: 'PUT', body }), useRefreshIdentity(brandId), on);
