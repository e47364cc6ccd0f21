// The frame of a published guideline site as one React tree: it wears the brand (fonts, colours, logo) and
// Plumbline recedes to the footer. The chrome (header, contents, footer) sets its text in our own inks, so it
// stays readable whatever text colour the brand chose for its pages. Rendered to a string on the server, by
// the Astro layout and by the cached page path alike.
import { formatLongDate, SITE_LOCALE } from '@/lib/format';
import type { OutlineEntry } from '@/lib/guideline/outline';
import { brandStyle, fontFaceCss, markLogo, primaryLogo } from '@/lib/guideline/identity';
import type { Identity } from '@/lib/identity/types';
import { versionPath } from '@/lib/publishing/snapshot-urls';
import { SiteSearch } from './SiteSearch';

export interface SiteFrameProps {
  identity: Identity;
  slug: string;
  version: { number: number; publishedAt: Date; note: string };
  latest: boolean;
  outline: OutlineEntry[];
  isEditor: boolean;
  viaShareLink: boolean;
  canDownload: boolean;
  title?: string;
  /** The app's stylesheet. */
  cssHref: string;
  /** The version's copy of the section-view script (static/insights.js); none on pages that are not a version's. */
  insightsHref?: string;
  /** The page's own content, already rendered by us (escaped React output or an Astro slot). */
  bodyHtml: string;
  /** Offer search of this version (the guideline page itself; its results are blocks on this page). */
  search?: boolean;
}

const FRAME_CSS = `.site-root { font-family: var(--brand-body-font); color: var(--brand-text); }
.site-root h1, .site-root h2, .site-root h3 { font-family: var(--brand-heading-font); }
.site-contents summary::-webkit-details-marker { display: none; }
.site-main [data-block-id] { scroll-margin-top: 1.5rem; }
@media (max-width: 63.99rem) { .site-main [id], .site-main [data-block-id] { scroll-margin-top: 3.5rem; } }
[data-search-target] { outline: 3px solid #211e1a; outline-offset: 6px; border-radius: 4px; box-shadow: 0 0 0 10px rgb(250 204 21 / 0.45); transition: box-shadow 0.6s ease-out; }
@media (prefers-reduced-motion: reduce) { [data-search-target] { transition: none; } }
@media print {
  .site-chrome, .site-search { display: none !important; }
  .site-main { margin: 0 !important; max-width: none !important; }
  section { break-inside: avoid-page; }
  * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}`;

// Copy buttons, and the phone's contents menu closing once a section is chosen (it works without this too).
const PAGE_SCRIPT = `document.addEventListener('click', async (e) => {
  const menu = e.target.closest && e.target.closest('details.site-contents');
  if (menu && e.target.closest('a')) menu.open = false;
  const b = e.target.closest && e.target.closest('[data-copy]');
  if (!b) return;
  try { await navigator.clipboard.writeText(b.dataset.copy); const t = b.textContent; b.textContent = 'Copied'; setTimeout(() => (b.textContent = t), 1200); } catch { b.textContent = 'Select and copy'; }
});
document.addEventListener('keydown', (e) => {
  const menu = e.key === 'Escape' && document.querySelector('details.site-contents[open]');
  if (menu) { menu.open = false; menu.querySelector('summary').focus(); }
});`;

export function SiteFrame({ identity, slug, version, latest, outline, isEditor, viaShareLink, canDownload, title, cssHref, insightsHref, bodyHtml, search = false }: SiteFrameProps) {
  const style = Object.fromEntries(Object.entries(brandStyle(identity)));
  const fontFaces = fontFaceCss(identity.typefaces);
  const unlicensed = identity.typefaces.filter((f) => !f.licence.confirmed);
  const logo = primaryLogo(identity);
  const icon = markLogo(identity) ?? logo;
  const date = formatLongDate(version.publishedAt, SITE_LOCALE);
  const base = `/b/${slug}`;
  const pdf = `${versionPath(slug, version.number)}/guideline.pdf`;
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <meta name="robots" content="noindex" />
        <link rel="icon" href={icon ? icon.files.original : '/favicon.svg'} />
        <title>{`${title ? `${title} · ` : ''}${identity.brand.name} brand guidelines`}</title>
        <link rel="stylesheet" href={cssHref} />
        {insightsHref ? <script defer src={insightsHref} /> : null}
        <style dangerouslySetInnerHTML={{ __html: `${fontFaces}\n${FRAME_CSS}` }} />
      </head>
      <body className="site-root bg-white" style={style}>
        <a href="#content" className="sr-only focus:not-sr-only focus:absolute focus:left-4 focus:top-4 focus:z-10 focus:bg-white focus:px-3 focus:py-2">Skip to content</a>
        <header className="site-chrome border-b border-black/10 text-ink">
          <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-4 px-6 py-4">
            <a href={base} className="flex items-center gap-3 text-inherit no-underline">
              {logo ? <img src={logo.files.original} alt={`${identity.brand.name} logo`} className="h-10 w-auto" /> : <span className="text-xl font-bold">{identity.brand.name}</span>}
              <span className="sr-only">{identity.brand.name} guidelines home</span>
            </a>
            {search && <SiteSearch slug={slug} number={version.number} place="header" />}
            <div className={`ml-auto flex flex-wrap items-center gap-3 text-sm ${search ? 'lg:ml-0' : ''}`}>
              <a href={`${base}/versions`} className="rounded-full border border-black/15 px-3 py-1 font-semibold hover:bg-black/5" title={version.note}>
                Version {version.number} · {date}{latest ? ' · current' : ''}
              </a>
              {canDownload && <a href={`${base}/downloads`} className="font-semibold underline-offset-2 hover:underline">Downloads</a>}
              <a href={`${pdf}?size=a4`} className="font-semibold underline-offset-2 hover:underline">PDF (A4)</a>
              <a href={`${pdf}?size=letter`} className="font-semibold underline-offset-2 hover:underline">PDF (Letter)</a>
            </div>
          </div>
          {!latest && (
            <p className="bg-amber-50 px-6 py-2 text-center text-sm text-amber-900">
              You are reading an earlier version. <a className="font-semibold underline" href={base}>Go to the current guidelines</a>.
            </p>
          )}
          {isEditor && unlicensed.length > 0 && (
            <p className="bg-amber-50 px-6 py-2 text-center text-sm text-amber-900">
              For editors: {unlicensed.map((f) => f.family).join(', ')} {unlicensed.length > 1 ? 'are' : 'is'} shown in the fallback stack because no web licence was confirmed. Confirm it on the Identity page, then publish again.
            </p>
          )}
        </header>
        {outline.length > 0 && (
          // Below the wide layout the contents fold into a bar that stays at the top: a disclosure, no script needed.
          <nav aria-label="Contents" className="site-chrome sticky top-0 z-20 border-b border-black/10 bg-white text-ink lg:hidden">
            <details className="site-contents group">
              <summary className="flex cursor-pointer list-none items-center justify-between gap-3 px-6 py-3 text-sm font-semibold">
                <span>Contents</span>
                <span className="text-xs font-normal">
                  <span className="group-open:hidden">{outline.length} sections</span>
                  <span className="hidden group-open:inline">Close</span>
                  <span aria-hidden="true" className="ml-2 inline-block transition-transform group-open:rotate-180">▾</span>
                </span>
              </summary>
              <ol className="max-h-[70vh] overflow-y-auto border-t border-black/10 px-4 py-2 text-base">
                {outline.map((e) => (
                  <li key={e.anchor}><a href={`#${e.anchor}`} className="block rounded px-2 py-2.5 hover:bg-black/5">{e.title}</a></li>
                ))}
              </ol>
            </details>
          </nav>
        )}
        <div className="mx-auto flex max-w-7xl gap-10 px-6">
          {outline.length > 0 && (
            <nav aria-label="Contents" className="site-chrome sticky top-0 hidden max-h-screen w-60 shrink-0 overflow-y-auto py-10 text-sm text-ink lg:block">
              <p className="mb-3 text-xs font-semibold uppercase tracking-widest text-ink-soft">Contents</p>
              <ol className="space-y-1.5">
                {outline.map((e) => (
                  <li key={e.anchor}><a href={`#${e.anchor}`} className="block rounded px-2 py-1 hover:bg-black/5">{e.title}</a></li>
                ))}
              </ol>
            </nav>
          )}
          <main id="content" className="site-main min-w-0 max-w-guideline flex-1 py-10" dangerouslySetInnerHTML={{ __html: bodyHtml }} />
        </div>
        <footer className="site-chrome mt-16 border-t border-black/10 px-6 py-6 text-center text-xs text-ink-soft">
          {identity.brand.name} brand guidelines · version {version.number}{viaShareLink ? ' · shared with you by link' : ''} · published with Plumbline
        </footer>
        <script dangerouslySetInnerHTML={{ __html: PAGE_SCRIPT }} />
      </body>
    </html>
  );
}

/** The whole page as HTML, doctype included. */
export async function siteFrameHtml(props: SiteFrameProps): Promise<string> {
  const { renderToStaticMarkup } = await import('react-dom/server');
  return `<!doctype html>${renderToStaticMarkup(<SiteFrame {...props} />)}`;
}
