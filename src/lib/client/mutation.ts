// One shape for every change an island makes: the screen reacts first (a notice, a cleared form), then the queries
// the change touched are refetched, all inside one pending state, so buttons stay busy until the new data shows.
import { useMutation, type UseMutationResult } from '@tanstack/react-query';

export interface Reactions<TData, TVars> {
  onSuccess?: (data: TData, vars: TVars) => unknown;
  onError?: (error: Error, vars: TVars) => unknown;
  onSettled?: () => unknown;
}

/** A mutation through `send`, then `refresh` (the invalidations) once the screen has reacted to the answer. */
export function useChange<TData, TVars = void>(
  send: (vars: TVars) => Promise<TData>,
  refresh: (() => Promise<unknown>) | null,
  on: Reactions<TData, TVars> = {},
): UseMutationResult<TData, Error, TVars> {
  return useMutation({
    mutationFn: send,
    onSuccess: async (data, vars) => {
      await on.onSuccess?.(data, vars);
      if (refresh) await refresh();
    },
    onError: (error, vars) => on.onError?.(error, vars),
    onSettled: () => on.onSettled?.(),
  });
}
