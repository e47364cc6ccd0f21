// What a built version is: the contract between the build job that writes it and the requests that serve it.
// A version is rendered once, every file it will ever serve is written to storage under the version, and a
// manifest maps each served path to its stored object. Nothing here touches the database or storage.

/** Where a version stands: built by a job, then never changing. */
export type VersionState = 'building' | 'ready' | 'failed';

/** One step of a build as the publishing screen shows it. */
export interface BuildStep {
  /** Stable id, e.g. "copy-files", "pages", "print", "pdf-a4", "pdf-letter", "tokens", "manifest". */
  id: string;
  label: string;
  state: 'waiting' | 'running' | 'done' | 'failed';
  /** Files written so far by this step (optional, for the progress line). */
  count?: number;
  /** Something the step left out without failing the build, in words for the publishing screen. */
  note?: string;
  startedAt?: string;
  finishedAt?: string;
}

/** One stored file of a built version. */
export interface ManifestEntry {
  /** Storage object key (never a machine path). */
  key: string;
  /** SHA-256 of the bytes, hex. */
  hash: string;
  size: number;
  /** Content-Type to send. */
  type: string;
}

/**
 * Every file a version serves, by its path relative to the version (see the path helpers below). Written last,
 * in the same UPDATE that turns the version `ready`, so a ready version never names a missing file.
 */
export interface Manifest {
  format: 1;
  versionId: string;
  builtAt: string;
  entries: Record<string, ManifestEntry>;
}

/** The audiences a published page differs by today. A share-link visitor is never an editor. */
export interface PageAudience {
  latest: boolean;
  who: 'editor' | 'member' | 'link';
  downloads: boolean;
}

export const AUDIENCES: readonly PageAudience[] = [true, false].flatMap((latest) =>
  (['editor', 'member', 'link'] as const).flatMap((who) => [true, false].map((downloads) => ({ latest, who, downloads }))),
);

/** Manifest path of the guideline page for one audience, e.g. "page/latest-member-downloads.html". */
export const pagePath = (a: PageAudience) => `page/${a.latest ? 'latest' : 'older'}-${a.who}-${a.downloads ? 'downloads' : 'no-downloads'}.html`;

/**
 * Manifest path of a file URL under the version ("/b/:slug/v/:n/<rest>"): the rest of the path plus its query
 * with parameters sorted, so `files/x?w=960&aspect=3:2` and `files/x?aspect=3:2&w=960` are one entry.
 */
export function filePath(rest: string, search: URLSearchParams | string | Record<string, string> = ''): string {
  const params = new URLSearchParams(search);
  params.sort();
  const query = params.toString();
  return query ? `${rest}?${query}` : rest;
}

/**
 * Manifest path of the search index for one audience, e.g. "search/member-downloads.json". The index differs only by
 * who reads and whether they may download (latest and older pages show the same blocks).
 */
export const searchPath = (a: Pick<PageAudience, 'who' | 'downloads'>) => `search/${a.who}-${a.downloads ? 'downloads' : 'no-downloads'}.json`;

/** Manifest path of the print edition on one paper size: the address the PDF step prints (…/print?size=a4). */
export const printPath = (size: 'a4' | 'letter') => filePath('print', { size });

/**
 * Manifest path of the reveal presentation: as reached through the version (…/v/:n/presentation), as the current
 * version (/b/:slug/presentation, whose links point at the current site), or as printed (…/presentation?print).
 */
export const presentationPath = (form: 'version' | 'current' | 'print') =>
  form === 'print' ? filePath('presentation', { print: '' }) : form === 'current' ? 'presentation/current.html' : 'presentation';

/** Manifest paths of the version's own copies of the app's stylesheets and scripts (…/v/:n/static/<name>). */
export const staticPath = (name: string) => `static/${name}`;

/** Manifest path of a version's PDF: the guidelines on a paper size, or the presentation's slides. */
export const pdfPath = (edition: 'a4' | 'letter' | 'slides') => (edition === 'slides' ? 'presentation.pdf' : filePath('guideline.pdf', `size=${edition}`));

/** Manifest path of a design-token file in one format (see TOKEN_FORMATS). */
export const tokenPath = (format: string) => filePath('tokens', `format=${format}`);

/** A strong ETag from a stored file's hash. */
export const entryEtag = (entry: Pick<ManifestEntry, 'hash'>) => `"${entry.hash.slice(0, 32)}"`;

/** Storage key of a built file: content-addressed inside the version, so a retried build rewrites the same keys. */
export function builtKey(brandId: string, versionId: string, hash: string, extension: string): string {
  const ext = extension.replace(/[^a-z0-9]/gi, '').toLowerCase().slice(0, 8);
  return `${brandId}/build/${versionId}/${hash}${ext ? `.${ext}` : ''}`;
}

/** What every build step writes through: content-addressed objects under the version, collected into the manifest. */
export interface BuildWriter {
  /** Store bytes under a manifest path (see pagePath/filePath); writing the same path twice keeps the last. */
  write(path: string, bytes: Uint8Array, type: string): Promise<ManifestEntry>;
  /** Bytes this build already wrote under a path (a later step may read an earlier one's output), or null. */
  read(path: string): Promise<Buffer | null>;
  /** Manifest paths written so far. */
  paths(): string[];
  /** The entry written under a path so far (its key, hash, size and type), or null. */
  entry(path: string): ManifestEntry | null;
}

/** What a step knows of the version it builds; it loads anything else it needs through src/lib. */
export interface BuildContext {
  versionId: string;
  brandId: string;
  /** The brand's slug when the build started: built pages link under /b/<slug>/v/<number>/ (a renamed slug redirects). */
  slug: string;
  number: number;
  writer: BuildWriter;
  /** Report the number of files this step has written so far (shown on the publishing screen). */
  progress(count: number): Promise<void>;
  /** Say what the step left out without failing (shown beside the step on the publishing screen). */
  note(text: string): void;
}

/**
 * A step that cannot succeed however often the job retries it (e.g. no Chromium to print with): the build fails at
 * once with this reason; the publishing screen offers a retry for when whoever runs the server has fixed it.
 */
export class BuildBlocked extends Error {
  override name = 'BuildBlocked';
}

/** One step of the build, run in order by the build job; a throw fails the build with the step named. */
export interface BuildStepDefinition {
  id: string;
  label: string;
  run(ctx: BuildContext): Promise<void>;
}
