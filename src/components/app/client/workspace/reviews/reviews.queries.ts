// Reviews of the draft and the comment threads on its blocks: reading them, asking, deciding, replying, resolving.
import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/client/api';
import { useChange, type Reactions } from '@/lib/client/mutation';
import type { addCommentBody, decideReviewBody, requestReviewBody } from '@/lib/reviews/schemas';
import type { CommentView, ReviewSummary, ReviewView } from '@/lib/reviews/views';

export type RequestReview = z.input<typeof requestReviewBody>;
export type Decision = z.input<typeof decideReviewBody> & { id: string };
export type Reply = Pick<z.input<typeof addCommentBody>, 'body'> & { parentId: string };
export interface Requested { notified: string[]; problems: string[] }

const reviewsKey = (brandId: string) => ['reviews', brandId] as const;
const commentsKey = (brandId: string) => ['comments', brandId] as const;

export const useReviews = (brandId: string) =>
  useQuery({ queryKey: reviewsKey(brandId), queryFn: () => api<{ reviews: ReviewView[] } & ReviewSummary>(`/api/brands/${brandId}/reviews`) });
export const useComments = (brandId: string) => useQuery({ queryKey: commentsKey(brandId), queryFn: () => api<{ comments: CommentView[] }>(`/api/brands/${brandId}/comments`) });

/** Every change here can move both the reviews (open threads) and the comments. */
function useRefreshReviews(brandId: string) {
  const qc = useQueryClient();
  return () => Promise.all([qc.invalidateQueries({ queryKey: reviewsKey(brandId) }), qc.invalidateQueries({ queryKey: commentsKey(brandId) })]);
}

export const useRequestReview = (brandId: string, on: Reactions<Requested, RequestReview>) =>
  useChange((body: RequestReview) => api<Requested>(`/api/brands/${brandId}/reviews`, { method: 'POST', body }), useRefreshReviews(brandId), on);

export const useDecideReview = (brandId: string, on: Reactions<unknown, Decision>) =>
  useChange(({ id, ...body }: Decision) => api(`/api/brands/${brandId}/reviews/${id}/decision`, { method: 'POST', body }), useRefreshReviews(brandId), on);

export const useReply = (brandId: string, on: Reactions<unknown, Reply>) =>
  useChange((body: Reply) => api(`/api/brands/${brandId}/comments`, { method: 'POST', body }), useRefreshReviews(brandId), on);

export const useResolveThread = (brandId: string, on: Reactions<unknown, { id: string; resolved: boolean }>) =>
  useChange(({ id, resolved }: { id: string; resolved: boolean }) => api(`/api/brands/${brandId}/comments/${id}`, { method: 'PATCH', body: { resolved } }), useRefreshReviews(brandId), on);
