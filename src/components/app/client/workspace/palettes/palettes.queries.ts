// Palette routes: the brand's sets, and the changes made to them.
import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/client/api';
import { useChange, type Reactions } from '@/lib/client/mutation';
import type { createRouteSetBody, sendRoutesBody } from '@/lib/palette-routes/schemas';
import type { RouteSetView } from '@/lib/palette-routes/views';
import type { Mailed } from '../chrome';

export type NewSet = z.input<typeof createRouteSetBody>;
export type SendSet = z.input<typeof sendRoutesBody>;

const setsKey = (brandId: string) => ['palette-routes', brandId] as const;
const setPath = (brandId: string, setId: string) => `/api/brands/${brandId}/palette-routes/${setId}`;

export const useRouteSets = (brandId: string) =>
  useQuery({ queryKey: setsKey(brandId), queryFn: () => api<{ sets: RouteSetView[] }>(`/api/brands/${brandId}/palette-routes`) });

function useRefreshSets(brandId: string) {
  const qc = useQueryClient();
  return () => qc.invalidateQueries({ queryKey: setsKey(brandId) });
}

export const useCreateSet = (brandId: string, on: Reactions<{ set: RouteSetView }, NewSet>) =>
  useChange((body: NewSet) => api<{ set: RouteSetView }>(`/api/brands/${brandId}/palette-routes`, { method: 'POST', body }), useRefreshSets(brandId), on);

export const useUpdateSet = (brandId: string, setId: string, on: Reactions<{ set: RouteSetView }, NewSet>) =>
  useChange((body: NewSet) => api<{ set: RouteSetView }>(setPath(brandId, setId), { method: 'PATCH', body }), useRefreshSets(brandId), on);

export const useDeleteSet = (brandId: string, setId: string, on: Reactions<unknown, void>) =>
  useChange(() => api(setPath(brandId, setId), { method: 'DELETE' }), useRefreshSets(brandId), on);

export const useSendSet = (brandId: string, setId: string, on: Reactions<Mailed, SendSet>) =>
  useChange((body: SendSet) => api<Mailed>(`${setPath(brandId, setId)}/send`, { method: 'POST', body }), useRefreshSets(brandId), on);

/** "Use this route": the chosen route's colours replace the identity's palette. */
export const useAdoptRoute = (brandId: string, setId: string, on: Reactions<{ set: RouteSetView }, void>) =>
  useChange(() => api<{ set: RouteSetView }>(`${setPath(brandId, setId)}/adopt`, { method: 'POST', body: {} }), useRefreshSets(brandId), on);
