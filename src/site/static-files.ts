// The app's own stylesheets and the pages' scripts (the presentation's, search and its engine), as text: a build copies
// them into the version, so a published page never depends on the app build that happens to be running (a redeploy
// cannot break an old page).
import deckScript from '@/components/presentation/deck.js?raw';
import searchScript from '@/components/site/search.js?raw';
import searchEngine from 'minisearch?raw';
import insightsScript from '@/components/site/insights.js?raw';
import siteCss from '@/styles/global.css?inline';
import presentationCss from '@/styles/presentation.css?inline';
import printEditionCss from '@/styles/print-edition.css?inline';
import { staticPath } from '@/lib/publishing/build/contract';
import { versionPath } from '@/lib/publishing/snapshot-urls';

/** The files every built version carries, by name under …/v/:n/static/. */
export const STATIC_FILES = {
  'site.css': { body: siteCss, type: 'text/css; charset=utf-8' },
  'print-edition.css': { body: printEditionCss, type: 'text/css; charset=utf-8' },
  'presentation.css': { body: presentationCss, type: 'text/css; charset=utf-8' },
  'deck.js': { body: deckScript, type: 'text/javascript; charset=utf-8' },
  'search.js': { body: searchScript, type: 'text/javascript; charset=utf-8' },
  // MiniSearch's own ES module, loaded by search.js on first focus (its source map is not shipped, so not named).
  'minisearch.js': { body: searchEngine.replace(/\n\/\/# sourceMappingURL=\S+\s*$/, '\n'), type: 'text/javascript; charset=utf-8' },
  'insights.js': { body: insightsScript, type: 'text/javascript; charset=utf-8' },
} as const;

export type StaticName = keyof typeof STATIC_FILES;

/** The address of a version's own copy of a static file. */
export const staticHref = (slug: string, number: number, name: StaticName) => `${versionPath(slug, number)}/${staticPath(name)}`;
