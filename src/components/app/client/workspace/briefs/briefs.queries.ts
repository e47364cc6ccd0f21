// The brand's briefs: the list with the questionnaires to choose from, one brief's answers, sending a new one.
import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/client/api';
import { useChange, type Reactions } from '@/lib/client/mutation';
import type { sendBriefBody } from '@/lib/briefs/schemas';
import type { BriefView } from '@/lib/briefs/views';
import type { Mailed } from '../chrome';

export interface BriefTemplate { id: string; title: string; intro: string; questions: number }
export interface BriefsData { briefs: BriefView[]; templates: BriefTemplate[] }
export interface BriefDetail { questionnaire: { sections: { title: string; questions: { id: string; label: string }[] }[] }; answers: Record<string, string | string[]> }
export type SendBrief = z.input<typeof sendBriefBody>;

const briefsKey = (brandId: string) => ['briefs', brandId] as const;

export const useBriefs = (brandId: string) => useQuery({ queryKey: briefsKey(brandId), queryFn: () => api<BriefsData>(`/api/brands/${brandId}/briefs`) });

export const useBriefAnswers = (brandId: string, briefId: string) =>
  useQuery({ queryKey: ['brief', briefId], queryFn: () => api<BriefDetail>(`/api/brands/${brandId}/briefs/${briefId}`) });

export function useSendBrief(brandId: string, on: Reactions<Mailed, SendBrief>) {
  const qc = useQueryClient();
  return useChange((body: SendBrief) => api<Mailed>(`/api/brands/${brandId}/briefs`, { method: 'POST', body }), () => qc.invalidateQueries({ queryKey: briefsKey(brandId) }), on);
}
