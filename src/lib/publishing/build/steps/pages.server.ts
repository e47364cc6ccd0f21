// Build step "pages": every page a version serves, drawn once — the guideline page for each of the twelve
// audiences, the print edition on A4 and Letter, the reveal presentation (as the version, as the current version,
// and as printed) — then every address under the version those pages and their stylesheets refer to, made by the
// same functions the routes used to call live. An address the build cannot make fails the build, naming it, so a
// ready version never shows a broken image.
import { existsSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { basename, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { SITE_URL } from 'astro:env/server';
import { Brand, GuidelineVersion } from '@db/models';
import { AppError } from '@/lib/errors';
import { versionMockup, type MockupFormat } from '@/lib/mockups/mockup.server';
import { versionPath } from '@/lib/publishing/snapshot-urls';
import { versionFile } from '@/lib/publishing/version-files.server';
import { versionTones } from '@/site/presentation.server';
import { renderGuideline, versionMaterial } from '@/site/render.server';
import { STATIC_FILES, type StaticName } from '@/site/static-files';
import { presentationHtml, printEditionHtml, sitePageHtml } from '@/site/version-pages.server';
import { AUDIENCES, filePath, pagePath, presentationPath, printPath, staticPath, type BuildContext, type BuildStepDefinition } from '../contract';
import { cssUrls, htmlUrls, insideVersion } from '../references';

const HTML = 'text/html; charset=utf-8';
const CSS = 'text/css; charset=utf-8';

/** Files under the version that a later step writes (the PDFs): pages may link to them before they exist. */
const LATER_STEPS = new Set(['guideline.pdf', 'presentation.pdf']);

/** Thrown for an address a page refers to that the build cannot make. */
class Unmakeable extends Error {}

/** The folder the running app's built browser files are served from (dist/client), or null in development. */
function appClientDir(): string | null {
  const here = fileURLToPath(import.meta.url);
  const server = here.lastIndexOf(`${'/'}server${'/'}`);
  const candidates = [server > 0 ? join(here.slice(0, server), 'client') : null, resolve(process.env.PLUMBLINE_OUT_DIR ?? 'dist', 'client')];
  return candidates.find((dir): dir is string => !!dir && existsSync(dir)) ?? null;
}

/** The bytes of a file the app's stylesheet refers to (a font of Plumbline's own chrome), from the app build. */
async function appFile(path: string): Promise<Buffer> {
  const clean = decodeURIComponent(path.split(/[?#]/)[0]);
  const client = appClientDir();
  // The built app (/_astro/…), or the development server's own addresses (/@fs/<absolute path>, /node_modules/…).
  const candidates = [client ? join(client, clean) : null, clean.startsWith('/@fs/') ? clean.slice(4) : null, join(process.cwd(), clean)].filter((p): p is string => !!p);
  for (const file of candidates) {
    const inside = [client, process.cwd()].some((root) => root && resolve(file).startsWith(`${resolve(root)}/`));
    if (inside && existsSync(file)) return readFile(file);
  }
  throw new Unmakeable(`the stylesheet refers to ${clean}, which is not among the app's built files`);
}

const FONT_TYPES: Record<string, string> = { woff2: 'font/woff2', woff: 'font/woff', ttf: 'font/ttf', otf: 'font/otf', svg: 'image/svg+xml', png: 'image/png' };

/**
 * One of the app's stylesheets as the version keeps it: every url() outside the version (the app's own fonts) copied
 * into the version under static/ and the stylesheet pointed at the copy.
 */
async function ownStylesheet(ctx: BuildContext, css: string): Promise<string> {
  let out = css;
  const base = versionPath(ctx.slug, ctx.number);
  for (const url of new Set(cssUrls(css))) {
    if (url.startsWith('data:') || insideVersion(url, `${base}/static/`, base)) continue;
    if (/^[a-z][a-z0-9+.-]*:/i.test(url) || url.startsWith('//')) throw new Unmakeable(`the app's stylesheet refers to an outside address, ${url}`);
    const bytes = await appFile(url);
    const name = basename(url.split(/[?#]/)[0]).replace(/[^A-Za-z0-9._-]/g, '_');
    const ext = name.split('.').pop()?.toLowerCase() ?? '';
    await ctx.writer.write(staticPath(name), bytes, FONT_TYPES[ext] ?? 'application/octet-stream');
    out = out.split(url).join(`${base}/${staticPath(name)}`);
  }
  return out;
}

/** Make one address under the version that a page refers to, through the function its route used to call. */
async function makeReferenced(version: GuidelineVersion, brand: Brand, rest: string, search: string): Promise<{ body: Buffer; type: string } | null> {
  const query = new URLSearchParams(search);
  const [head, ...tail] = rest.split('/');
  if (head === 'files' && tail.length === 1) {
    const made = await versionFile(version, tail[0], query);
    return made && { body: made.body, type: made.contentType };
  }
  if (head === 'mockups' && tail.length === 1) {
    const format: MockupFormat = query.get('format') === 'pdf' ? 'pdf' : 'png';
    try {
      const made = await versionMockup(brand, version, tail[0], format);
      return { body: made.body, type: made.contentType };
    } catch (err) {
      if (err instanceof AppError && err.status < 500) return null;
      throw err;
    }
  }
  return null;
}

export const pagesStep: BuildStepDefinition = {
  id: 'pages',
  label: 'Draw the pages',
  async run(ctx) {
    // The whole row, snapshot and the files the "files" step recorded included.
    const version = await GuidelineVersion.findByPk(ctx.versionId);
    const brand = await Brand.findByPk(ctx.brandId);
    if (!version || !brand) throw new Error('The version or its brand is gone.');
    const material = await versionMaterial(version, ctx.slug);
    const host = new URL(SITE_URL).host;
    const base = versionPath(ctx.slug, ctx.number);
    /** What each written page or stylesheet says, to look for the addresses it refers to. */
    const documents = new Map<string, { text: string; kind: 'html' | 'css'; at: string }>();
    let written = 0;
    const write = async (path: string, text: string, type: string, at: string) => {
      await ctx.writer.write(path, Buffer.from(text), type);
      if (type === HTML || type === CSS) documents.set(path, { text, kind: type === HTML ? 'html' : 'css', at });
      await ctx.progress(++written);
    };

    try {
      for (const [name, file] of Object.entries(STATIC_FILES) as [StaticName, (typeof STATIC_FILES)[StaticName]][]) {
        const body = file.type.startsWith('text/css') ? await ownStylesheet(ctx, file.body) : file.body;
        await write(staticPath(name), body, file.type, `${base}/static/${name}`);
      }
      const site = renderGuideline(material, 'site');
      for (const audience of AUDIENCES) await write(pagePath(audience), await sitePageHtml(material, audience, site), HTML, base);
      const print = renderGuideline(material, 'print');
      for (const size of ['a4', 'letter'] as const) await write(printPath(size), printEditionHtml(material, size, host, print), HTML, `${base}/print`);
      // The tone check of the logos the slides show, from the version's own copies (the "Without colour" slide).
      const tones = await versionTones(version, material.identity);
      for (const form of ['version', 'current', 'print'] as const) {
        await write(presentationPath(form), presentationHtml(material, form, host, tones), HTML, form === 'current' ? `/b/${ctx.slug}/presentation` : `${base}/presentation`);
      }

      // Every address under the version that a page or stylesheet refers to, made once.
      const failures: string[] = [];
      const made = new Set(ctx.writer.paths());
      // The identity's own file addresses count as referred to (every logo version, every font), so the live pages
      // that show a version's identity (downloads, history) and readers following its addresses find them too.
      const { identity } = material;
      const declared = [...identity.logos.flatMap((l) => Object.values(l.files)), ...identity.typefaces.map((f) => f.fileUrl), ...(identity.assets ?? []).map((a) => a.url)];
      const sources: [string, { at: string; urls: string[] }][] = [
        ['the identity', { at: base, urls: declared.filter((u): u is string => typeof u === 'string' && u !== '') }],
        ...[...documents].map(([path, d]) => [path, { at: d.at, urls: d.kind === 'html' ? htmlUrls(d.text) : cssUrls(d.text) }] as [string, { at: string; urls: string[] }]),
      ];
      for (const [documentPath, document] of sources) {
        for (const url of document.urls) {
          if (URL.parse(url, `http://site.invalid${document.at}`)?.pathname.startsWith('/_astro/')) {
            failures.push(`${documentPath} refers to the app's own build (${url}), which a later release replaces`);
            continue;
          }
          const inside = insideVersion(url, document.at, base);
          if (!inside) continue;
          const path = filePath(inside.rest, inside.search);
          if (made.has(path) || LATER_STEPS.has(inside.rest)) continue;
          made.add(path);
          const file = await makeReferenced(version, brand, inside.rest, inside.search);
          if (!file) {
            failures.push(`${documentPath} refers to ${base}/${path}, which this version cannot make`);
            continue;
          }
          await ctx.writer.write(path, file.body, file.type);
          await ctx.progress(++written);
        }
      }
      if (failures.length) throw new Unmakeable(failures.slice(0, 5).join('; ') + (failures.length > 5 ? ` (and ${failures.length - 5} more)` : ''));
    } catch (err) {
      if (err instanceof Unmakeable) throw new Error(`Not every file its pages need can be made: ${err.message}.`, { cause: err });
      throw err;
    }
  },
};
