// What the identity islands share: one query client (so a palette change refreshes the contrast table), the
// identity query, the copy button and the small pieces of chrome every section uses.
import { QueryClient, QueryClientProvider, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { api, ApiClientError } from '@/lib/client/api';
import { contrastRatio } from '@/lib/color/contrast';
import type { Identity } from '@/lib/identity/types';

// Module-level, so every island on the page reads and invalidates the same cache.
let sharedClient: QueryClient | null = null;
function identityClient(): QueryClient {
  // On the server each render gets its own client, so nothing is shared between requests.
  if (typeof window === 'undefined') return newClient();
  sharedClient ??= newClient();
  return sharedClient;
}

function newClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 15_000,
        refetchOnWindowFocus: false,
        retry: (count, err) => !(err instanceof ApiClientError && err.status >= 400 && err.status < 500) && count < 2,
      },
    },
  });
}

/** Provider for one island; renders its content only once mounted, so the server's HTML and the first client render agree. */
export function IdentityRoot({ children }: { children: ReactNode }) {
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  return (
    <QueryClientProvider client={identityClient()}>
      {mounted ? children : <p className="py-8 text-ink-soft" role="status">Loading…</p>}
    </QueryClientProvider>
  );
}

export const identityKey = (brandId: string) => ['identity', brandId] as const;
export const reportKey = (brandId: string) => ['palette-report', brandId] as const;

/** The brand's whole identity document. */
export function useIdentity(brandId: string) {
  return useQuery({ queryKey: identityKey(brandId), queryFn: () => api<{ identity: Identity }>(`/api/brands/${brandId}/identity`).then((r) => r.identity) });
}

/** Refetch the identity and the palette report after a change. */
export function useRefreshIdentity(brandId: string) {
  const client = useQueryClient();
  return () => Promise.all([client.invalidateQueries({ queryKey: identityKey(brandId) }), client.invalidateQueries({ queryKey: reportKey(brandId) })]);
}

/** The server's words for a failed request. */
export const messageOf = (err: unknown, fallback: string) => (err instanceof Error && err.message ? err.message : fallback);

/** A button that copies one value and says so for a moment. */
export function CopyButton({ value, label }: { value: string; label: string }) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  const timer = useRef<ReturnType<typeof setTimeout>>(undefined);
  useEffect(() => () => clearTimeout(timer.current), []);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(value);
      setState('copied');
    } catch {
      setState('failed');
    }
    clearTimeout(timer.current);
    timer.current = setTimeout(() => setState('idle'), 1800);
  };
  return (
    <button
      type="button"
      onClick={copy}
      aria-label={`Copy ${label}`}
      className={`shrink-0 rounded px-2 py-0.5 text-xs font-semibold transition-colors ${state === 'copied' ? 'bg-plumb-wash text-plumb-deep' : state === 'failed' ? 'bg-danger-wash text-danger' : 'text-ink-soft hover:bg-paper hover:text-ink'}`}
    >
      <span aria-live="polite">{state === 'copied' ? 'Copied' : state === 'failed' ? 'Select and copy' : 'Copy'}</span>
    </button>
  );
}

/** A plain-words caution, shown once where it matters. */
export function Caution({ title, children }: { title: string; children: ReactNode }) {
  return (
    <aside className="rounded-lg border border-warn/25 bg-warn-wash px-4 py-3 text-sm text-ink" aria-label={title}>
      <p className="font-semibold text-warn">{title}</p>
      <p className="mt-0.5 leading-relaxed text-ink-soft">{children}</p>
    </aside>
  );
}

/** A notice above a section: what just happened, or why it could not. */
export type NoticeState = { kind: 'ok' | 'error'; text: string } | null;

export function Notice({ notice }: { notice: NoticeState }) {
  if (!notice) return null;
  return (
    <p role={notice.kind === 'error' ? 'alert' : 'status'} className={`rounded-md px-3 py-2 text-sm ${notice.kind === 'error' ? 'bg-danger-wash text-danger' : 'bg-plumb-wash text-plumb-deep'}`}>
      {notice.text}
    </p>
  );
}

/** Loading and failure states shared by the sections. */
export function LoadState({ query, what }: { query: { isPending: boolean; isError: boolean; error: Error | null; refetch: () => unknown }; what: string }) {
  if (query.isPending) return <p className="py-8 text-ink-soft" role="status">Loading {what}…</p>;
  if (query.isError)
    return (
      <div role="alert" className="rounded-lg border border-danger/30 bg-danger-wash px-5 py-4">
        <p className="font-semibold text-danger">The {what} could not be loaded.</p>
        <p className="mt-1 text-sm text-ink-soft">{query.error?.message}</p>
        <button type="button" className="btn-quiet mt-3" onClick={() => query.refetch()}>Try again</button>
      </div>
    );
  return null;
}

/** Text colour (near-black or white) that reads best on a given background, for labels laid over swatches; pure
 *  black where neither reaches 4.5:1 (WCAG 2.2 SC 1.4.3): black or white always does, the warm near-black not quite. */
export function inkOn(hex: string): string {
  const white = contrastRatio('#ffffff', hex);
  const best = white >= contrastRatio('#1a1714', hex) ? '#ffffff' : '#1a1714';
  if (contrastRatio(best, hex) >= 4.5) return best;
  return white >= contrastRatio('#000000', hex) ? '#ffffff' : '#000000';
}
