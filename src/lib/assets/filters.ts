// The shelf's filters as the screen holds them, and the one query string they make for the API and the page's address.
import type { AssetFormat, AssetKind, AssetState } from './kinds';
import type { AssetListQuery } from './schemas';

export interface ShelfFilters {
  q: string;
  tag: string;
  kind: AssetKind | '';
  state: AssetState | '';
  format: AssetFormat | '';
  rights: 'with' | 'without' | '';
  expiry: 'expired' | 'expiring' | 'none' | '';
  /** Days ahead for "expiring" (0 when not used). */
  days: number;
}

export const EMPTY_FILTERS: ShelfFilters = { q: '', tag: '', kind: '', state: '', format: '', rights: '', expiry: '', days: 0 };

/** The screen's filters from a checked query (assetListQuerySchema's output). */
export function filtersFrom(query: AssetListQuery): ShelfFilters {
  return {
    q: query.q ?? '',
    tag: query.tag ?? '',
    kind: query.kind ?? '',
    state: query.state ?? '',
    format: query.format ?? '',
    rights: query.rights ?? '',
    expiry: query.expiry ?? '',
    days: query.days ?? 0,
  };
}

/** The query string of the filters, in a fixed order, leaving out what is unset (the same for the API and the address). */
export function filterParams(f: ShelfFilters): URLSearchParams {
  const params = new URLSearchParams();
  if (f.q.trim()) params.set('q', f.q.trim());
  if (f.tag.trim()) params.set('tag', f.tag.trim().toLowerCase());
  if (f.kind) params.set('kind', f.kind);
  if (f.state) params.set('state', f.state);
  if (f.format) params.set('format', f.format);
  if (f.rights) params.set('rights', f.rights);
  if (f.expiry) params.set('expiry', f.expiry);
  if (f.expiry === 'expiring' && f.days > 0) params.set('days', String(f.days));
  return params;
}
