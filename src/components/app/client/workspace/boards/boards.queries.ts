// Mood boards: the list with the direction, and the changes made to a board and its pieces.
import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/client/api';
import { useChange, type Reactions } from '@/lib/client/mutation';
import type { createBoardBody, newItemSchema, sendBoardBody } from '@/lib/moodboards/schemas';
import type { BoardView, DirectionStatus } from '@/lib/moodboards/views';
import type { Mailed } from '../chrome';

export type NewPiece = z.input<typeof newItemSchema>;
export type SendBoard = z.input<typeof sendBoardBody>;
export type NewBoard = z.input<typeof createBoardBody>;
export interface Adopted { added: unknown[]; skipped: string[] }

const boardsKey = (brandId: string) => ['boards', brandId] as const;
const board = (brandId: string, boardId: string) => `/api/brands/${brandId}/moodboards/${boardId}`;

export const useBoards = (brandId: string) =>
  useQuery({ queryKey: boardsKey(brandId), queryFn: () => api<{ boards: BoardView[]; direction: DirectionStatus }>(`/api/brands/${brandId}/moodboards`) });

function useRefreshBoards(brandId: string) {
  const qc = useQueryClient();
  return () => qc.invalidateQueries({ queryKey: boardsKey(brandId) });
}

export const useStartBoard = (brandId: string, on: Reactions<unknown, NewBoard>) =>
  useChange((body: NewBoard) => api(`/api/brands/${brandId}/moodboards`, { method: 'POST', body }), useRefreshBoards(brandId), on);

export const useAddPiece = (brandId: string, boardId: string, on: Reactions<unknown, NewPiece>) =>
  useChange((body: NewPiece) => api(`${board(brandId, boardId)}/items`, { method: 'POST', body }), useRefreshBoards(brandId), on);

/** An image piece goes as multipart ("file"); the list is refreshed whether or not it was accepted. */
export function useAddImage(brandId: string, boardId: string, on: Reactions<unknown, File>) {
  const refresh = useRefreshBoards(brandId);
  return useChange(
    (file: File) => {
      const form = new FormData();
      form.set('file', file);
      return api(`${board(brandId, boardId)}/items`, { method: 'POST', body: form });
    },
    null,
    { ...on, onSettled: refresh },
  );
}

export const useRemovePiece = (brandId: string, boardId: string, on: Reactions<unknown, string>) =>
  useChange((itemId: string) => api(`${board(brandId, boardId)}/items/${itemId}`, { method: 'DELETE' }), useRefreshBoards(brandId), on);

export const useSendBoard = (brandId: string, boardId: string, on: Reactions<Mailed, SendBoard>) =>
  useChange((body: SendBoard) => api<Mailed>(`${board(brandId, boardId)}/send`, { method: 'POST', body }), useRefreshBoards(brandId), on);

/** The kept swatches become identity colours; the boards do not change. */
export const useAdoptSwatches = (brandId: string, boardId: string, on: Reactions<Adopted, void>) =>
  useChange(() => api<Adopted>(`${board(brandId, boardId)}/adopt-swatches`, { method: 'POST', body: {} }), null, on);
