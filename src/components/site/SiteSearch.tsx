// The search box of a published version's page and of its print edition on screen. Hidden until its script runs
// (search.js, the version's own copy), so a page without scripts shows no box that does nothing; never printed.
import { staticHref } from '@/site/static-files';
import { EVENTS_PATH } from '@/lib/insights/contract';
import { versionPath } from '@/lib/publishing/snapshot-urls';

export interface SiteSearchProps {
  slug: string;
  number: number;
  /** In the site's header, or floating over the print edition's sheets. */
  place: 'header' | 'sheet';
}

export function SiteSearch({ slug, number, place }: SiteSearchProps) {
  const base = versionPath(slug, number);
  const id = `site-search-${place}`;
  return (
    <div
      data-site-search
      hidden
      data-index={`${base}/search.json`}
      data-engine={staticHref(slug, number, 'minisearch.js')}
      data-events={`${base}/${EVENTS_PATH}`}
      role="search"
      className={place === 'header' ? 'site-search relative order-last w-full text-ink lg:order-none lg:ml-auto lg:w-72' : 'site-search print-search text-ink'}
    >
      <label htmlFor={`${id}-input`} className="sr-only">
        Search these guidelines
      </label>
      <div className="relative">
        <input
          id={`${id}-input`}
          data-search-input
          type="search"
          role="combobox"
          aria-autocomplete="list"
          aria-expanded="false"
          aria-controls={`${id}-list`}
          aria-describedby={`${id}-hint`}
          aria-keyshortcuts="/"
          autoComplete="off"
          spellCheck={false}
          placeholder="Colour, logo, typeface, word…"
          className="peer w-full rounded-lg border border-black/25 bg-white py-2 pl-3 pr-9 text-sm text-ink placeholder:text-ink-faint"
        />
        <kbd id={`${id}-hint`} title="Press / to search" className="pointer-events-none absolute right-2 top-1/2 -translate-y-1/2 rounded border max-lg:hidden peer-focus:invisible peer-[:not(:placeholder-shown)]:invisible border-black/20 px-1.5 font-mono text-xs text-ink-soft">
          <span aria-hidden="true">/</span>
          <span className="sr-only">Press slash to search from anywhere on the page.</span>
        </kbd>
      </div>
      <div data-search-panel hidden className="absolute left-0 right-0 top-full z-40 mt-2 max-h-[70vh] overflow-y-auto rounded-lg border border-black/15 bg-white p-1 text-sm text-ink shadow-lg lg:left-auto lg:w-[26rem] lg:max-w-[calc(100vw-3rem)]">
        <p data-search-message hidden className="px-3 py-2 text-ink-soft" />
        <div data-search-list id={`${id}-list`} role="listbox" aria-label="Search results" />
      </div>
      <p data-search-status role="status" className="sr-only" />
      <script type="module" src={staticHref(slug, number, 'search.js')} />
    </div>
  );
}
