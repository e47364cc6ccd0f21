// The pages a published version serves, drawn once when the version is built: the guideline page for each audience,
// the print edition on each paper size and the reveal presentation. Each one links to the version's own copies of
// the stylesheets (static-files.ts) and files, never to the running app's build.
import { renderToStaticMarkup } from 'react-dom/server';
import { Presentation } from '@/components/presentation/Presentation';
import { deckSlides } from '@/components/presentation/slides';
import { printPageName } from '@/components/guideline/GuidelineDocument';
import { siteFrameHtml } from '@/components/site/SiteFrame';
import { SiteSearch } from '@/components/site/SiteSearch';
import { formatLongDate, SITE_LOCALE } from '@/lib/format';
import { brandStyle, fontFaceCss, primaryLogo } from '@/lib/guideline/identity';
import { safeAssetUrl } from '@/lib/guideline/links';
import type { ToneReport } from '@/lib/logo/tones';
import type { PageAudience } from '@/lib/publishing/build/contract';
import { printPageRules, type PaperSize } from '@/lib/publishing/print-css';
import { versionPath } from '@/lib/publishing/snapshot-urls';
import { renderGuideline, type VersionMaterial } from './render.server';
import { staticHref } from './static-files';

/** The guideline page of a version for one audience. */
export function sitePageHtml(material: VersionMaterial, audience: PageAudience, rendered = renderGuideline(material, 'site')): Promise<string> {
  const { identity, slug, version } = material;
  return siteFrameHtml({
    identity,
    slug,
    version,
    latest: audience.latest,
    outline: rendered.outline,
    isEditor: audience.who === 'editor',
    viaShareLink: audience.who === 'link',
    canDownload: audience.downloads,
    cssHref: staticHref(slug, version.number, 'site.css'),
    insightsHref: staticHref(slug, version.number, 'insights.js'),
    bodyHtml: rendered.html,
    search: true,
  });
}

const cssVariables = (style: Record<string, string>) => Object.fromEntries(Object.entries(style)) as React.CSSProperties;

/**
 * The print edition of a version, set as a book: a cover, a contents page, then every section on pages of its own
 * with running heads and folios. The PDF step prints the body and the front matter in two passes (pdf.server.ts).
 * `host` names where the guidelines live online, on the cover.
 */
export function printEditionHtml(material: VersionMaterial, size: PaperSize, host: string, rendered = renderGuideline(material, 'print')): string {
  const { identity, slug, version } = material;
  const brandName = identity.brand.name;
  const style = cssVariables({ ...brandStyle(identity), '--sheet-height': size === 'a4' ? '257mm' : '239mm' });
  const fontFaces = fontFaceCss(identity.typefaces, { print: true });
  const logo = primaryLogo(identity);
  const logoSrc = logo ? safeAssetUrl(logo.files.original) : null;
  const edition = `Version ${version.number} · ${formatLongDate(version.publishedAt, SITE_LOCALE)}`;
  const sections = rendered.outline.map((entry, i) => ({ ...entry, title: entry.title || 'Untitled section', pageName: printPageName(i) }));
  const pageRules = printPageRules({ size, brandName, edition, sections });
  const markup = renderToStaticMarkup(
    <html lang="en" className="print-edition" style={style}>
      <head>
        <meta charSet="utf-8" />
        {/* no favicon request from the renderer */}
        <link rel="icon" href="data:," />
        <title>{`${brandName} brand guidelines · version ${version.number}`}</title>
        <link rel="stylesheet" href={staticHref(slug, version.number, 'site.css')} />
        <link rel="stylesheet" href={staticHref(slug, version.number, 'print-edition.css')} />
        <style dangerouslySetInnerHTML={{ __html: fontFaces }} />
        <style dangerouslySetInnerHTML={{ __html: pageRules }} />
      </head>
      <body>
        <div className="front">
          <section className="cover" aria-label="Cover">
            <div className="cover-logo">{logoSrc && <img src={logoSrc} alt={logo!.name} />}</div>
            <div className="cover-title">
              <p className="cover-kicker">Brand guidelines</p>
              <p className="cover-name">{brandName}</p>
              <p className="cover-edition">{edition}</p>
              {version.note ? <p className="cover-note">{version.note}</p> : null}
            </div>
            <p className="cover-foot">
              The current version is always the one online at <span className="cover-url">{`${host}/b/${slug}`}</span>. A printed copy is correct on the day it
              was printed; colour on paper depends on the press and the stock, so proof it with your printer.
            </p>
          </section>
          <nav className="contents" aria-labelledby="contents-title">
            <h2 id="contents-title">Contents</h2>
            <ol>
              {sections.map((entry, i) => (
                <li key={entry.anchor}>
                  <a href={`#${entry.anchor}`} data-contents-link={i}>
                    <span className="contents-number">{String(i + 1).padStart(2, '0')}</span>
                    <span className="contents-title">
                      {entry.title}
                      {entry.eyebrow ? <span className="contents-eyebrow">{entry.eyebrow}</span> : null}
                    </span>
                    <span className="contents-leader" aria-hidden="true" />
                    <span className="contents-page" data-contents-page />
                  </a>
                </li>
              ))}
            </ol>
          </nav>
        </div>
        <main className="print-body" dangerouslySetInnerHTML={{ __html: rendered.html }} />
        {/* On screen only: the print stylesheet hides it, and the PDF step prints with scripts off. */}
        <SiteSearch slug={slug} number={version.number} place="sheet" />
      </body>
    </html>,
  );
  return `<!doctype html>${markup}`;
}

/**
 * The reveal presentation of a version, full screen: one slide at a time on screen (deck.js), one slide per 16:9
 * page in print. 'current' is the form reached as /b/:slug/presentation, whose links lead to the current site;
 * 'print' is what the PDF step prints (variable faces as static weights, which PDF writers embed properly).
 */
export function presentationHtml(material: VersionMaterial, form: 'version' | 'current' | 'print', host: string, tones: Record<string, ToneReport> = {}): string {
  const { identity, slug, version, doc } = material;
  const printing = form === 'print';
  const slides = deckSlides({
    identity,
    doc,
    slug,
    version: { number: version.number, publishedAt: version.publishedAt, note: version.note },
    siteAddress: `${host}/b/${slug}`,
    mode: printing ? 'print' : 'site',
    tones,
  });
  const base = form === 'current' ? `/b/${slug}` : versionPath(slug, version.number);
  const fontFaces = fontFaceCss(identity.typefaces, { print: printing });
  const startDeck = `import { startDeck } from ${JSON.stringify(staticHref(slug, version.number, 'deck.js'))};\nconst root = document.querySelector('[data-deck]');\nif (root) startDeck(root);`;
  const markup = renderToStaticMarkup(
    <html lang="en" className="deck-page" style={cssVariables(brandStyle(identity))}>
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <meta name="robots" content="noindex" />
        <link rel="icon" href="data:," />
        <title>{`${identity.brand.name} · the identity · version ${version.number}`}</title>
        <link rel="stylesheet" href={staticHref(slug, version.number, 'site.css')} />
        <link rel="stylesheet" href={staticHref(slug, version.number, 'presentation.css')} />
        <style dangerouslySetInnerHTML={{ __html: fontFaces }} />
      </head>
      <body>
        <Presentation brandName={identity.brand.name} slides={slides} guidelinesHref={base} pdfHref={`${base}/presentation.pdf`} />
        <script type="module" dangerouslySetInnerHTML={{ __html: startDeck }} />
      </body>
    </html>,
  );
  return `<!doctype html>${markup}`;
}
