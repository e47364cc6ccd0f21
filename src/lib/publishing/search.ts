// The search index of a published version: what a reader can look up on the guideline page (sections, text, colours
// in every notation the page prints, typefaces, logos, files), built once with the version, one index per audience
// that sees a different page. Built with MiniSearch; the page's script loads the same file and queries it with the
// options the file carries, so the build and the browser never disagree. Pure: no database, no storage.
import MiniSearch, { type Options, type SearchOptions } from 'minisearch';
import * as z from 'zod';
import { blockDefinition } from '@/blocks/index';
import { colorPaletteBlock } from '@/blocks/colorPalette/definition';
import { contrastPairsBlock } from '@/blocks/contrastPairs/definition';
import { downloadsBlock } from '@/blocks/downloads/definition';
import { imageryBlock } from '@/blocks/imagery/definition';
import { logoShowcaseBlock } from '@/blocks/logoShowcase/definition';
import { sectionHeadingBlock } from '@/blocks/sectionHeading/definition';
import { typographyBlock } from '@/blocks/typography/definition';
import { formatCmyk, formatRgb } from '@/lib/color/notation';
import { parseBlockAttrs, type GuidelineDoc } from '@/lib/guideline/document';
import { findColor, findLogo, typefaceForRole } from '@/lib/guideline/identity';
import { outline } from '@/lib/guideline/outline';
import { plainText, RICH_TEXT_TYPES } from '@/lib/guideline/richText';
import type { Identity, IdentityColor, IdentityLogo, IdentityTypeface, TypefaceRole } from '@/lib/identity/types';
import { isOneLine, storedHex } from '@/lib/safe/values';
import type { PageAudience } from './build/contract';

/** What a result is, in the order the results list groups them. */
export const SEARCH_KINDS = ['section', 'colour', 'logo', 'typeface', 'file', 'block', 'text', 'note'] as const;
export type SearchKind = (typeof SEARCH_KINDS)[number];

/** Who sees a different page, and so gets an index of their own (latest or older pages show the same blocks). */
export interface SearchAudience {
  who: PageAudience['who'];
  downloads: boolean;
}

export const SEARCH_AUDIENCES: readonly SearchAudience[] = (['editor', 'member', 'link'] as const).flatMap((who) => [true, false].map((downloads) => ({ who, downloads })));

export const searchAudienceOf = (audience: Pick<PageAudience, 'who' | 'downloads'>): SearchAudience => ({ who: audience.who, downloads: audience.downloads });

const oneLine = (max: number) => z.string().max(max).refine(isOneLine, { error: 'One line of text, without control characters.' });

/**
 * One thing a reader can find. Every value comes from the version's own checked snapshot; this schema is checked
 * again before the index is written, and the page's script only ever sets text (and a swatch from `swatch`).
 */
export const searchDocumentSchema = z.strictObject({
  id: z.string().regex(/^[a-z]+:[A-Za-z0-9_.:-]{1,220}$/),
  kind: z.enum(SEARCH_KINDS),
  /** What the result is called (a section title, a colour name, a file name…). */
  title: oneLine(300),
  /** One line under the title: the values a reader came for (a colour's HEX and CMYK, a logo's variant and format). */
  detail: oneLine(400),
  /** The section it stands in, for context. */
  section: oneLine(200),
  /** The block to jump to (`data-block-id` on the page). */
  blockId: z.string().regex(/^[A-Za-z0-9_-]{1,100}$/),
  /** A colour's sRGB hex, drawn as the result's swatch. */
  swatch: z.string().regex(/^#[0-9a-f]{6}$/).nullable(),
  /** Searched but not shown: every notation and spelling a reader might type. */
  terms: z.string().max(4000),
  /** Searched body text. */
  text: z.string().max(20_000),
});
export type SearchDocument = z.output<typeof searchDocumentSchema>;

/** Fields searched, and how much a match in each counts. */
export const SEARCH_FIELDS = ['title', 'terms', 'text'] as const;
/** Fields a result carries to the page. */
export const SEARCH_STORED = ['kind', 'title', 'detail', 'section', 'blockId', 'swatch'] as const;

/**
 * How the page queries the index: every word must match (AND), the last one as a prefix while typing, small typos
 * forgiven in longer words. Plain JSON, so it travels inside the index file to the page's script.
 */
export const SEARCH_QUERY_OPTIONS = { prefix: true, fuzzy: 0.15, combineWith: 'AND', boost: { title: 3, terms: 2, text: 1 } } satisfies SearchOptions;

const INDEX_OPTIONS: Options<SearchDocument> = { fields: [...SEARCH_FIELDS], storeFields: [...SEARCH_STORED], idField: 'id' };

/** The file the page loads: the options it must query with, then MiniSearch's own serialised index. */
export interface SearchIndexFile {
  format: 1;
  fields: string[];
  storeFields: string[];
  searchOptions: typeof SEARCH_QUERY_OPTIONS;
  index: unknown;
}

const clip = (text: string, max: number) => {
  const line = text.replace(/[\p{Cc}\p{Cf}\u2028\u2029]+/gu, ' ').replace(/\s+/g, ' ').trim();
  return line.length > max ? `${line.slice(0, max - 1).trimEnd()}…` : line;
};

const ROLE_LABELS: Record<TypefaceRole, string> = { heading: 'Headings', body: 'Running text', accent: 'Accents' };

/** Every notation of a colour the palette block prints, plus the spellings a reader types (hex without "#", CMYK run together). */
export function colourNotations(color: IdentityColor, showPrint: boolean): { shown: string[]; terms: string[] } {
  const hex = storedHex(color.hex, '#000000');
  const shown = [hex, formatRgb(color.rgb), color.hsl.css, color.oklch.css, color.lab.css];
  const terms = [hex.slice(1), `${color.rgb.join(' ')}`, `${color.rgb.join(',')}`];
  if (showPrint) {
    const cmyks = color.cmykOverride ? [color.cmykOverride] : [color.cmykIcc, color.cmyk];
    for (const cmyk of cmyks) {
      shown.push(formatCmyk(cmyk));
      const [c, m, y, k] = cmyk;
      terms.push(`C${c} M${m} Y${y} K${k}`, `${c} ${m} ${y} ${k}`, `${c}/${m}/${y}/${k}`);
    }
    if (color.spot) {
      shown.push(color.spot);
      // "PANTONE 2767 C" is also typed "2767C" or "2767-C".
      terms.push(color.spot.replace(/[\s-]+/g, ''));
    }
  }
  return { shown, terms };
}

type Section = { title: string; blockId: string };

/** The search documents of one version for one audience: only what that audience's page shows. */
export function searchDocuments(doc: GuidelineDoc, identity: Identity, audience: SearchAudience): SearchDocument[] {
  const docs = new Map<string, SearchDocument>();
  const entries = outline(doc);
  let section: Section = { title: '', blockId: '' };
  let sectionIndex = 0;
  const add = (d: Omit<SearchDocument, 'section' | 'swatch' | 'terms' | 'text'> & Partial<Pick<SearchDocument, 'swatch' | 'terms' | 'text'>>) => {
    if (docs.has(d.id) || !d.blockId) return;
    docs.set(d.id, { swatch: null, terms: '', text: '', ...d, title: clip(d.title, 300), detail: clip(d.detail, 400), section: clip(section.title, 200) });
  };

  for (const node of doc.content) {
    const attrs = (node.attrs ?? {}) as Record<string, unknown>;
    const id = typeof attrs.id === 'string' ? attrs.id : '';
    if (node.type === 'sectionHeading') {
      const entry = entries[sectionIndex++];
      const heading = parseBlockAttrs(sectionHeadingBlock, attrs);
      section = { title: entry?.title || 'Untitled section', blockId: id };
      add({ id: `section:${id}`, kind: 'section', title: section.title, detail: heading?.eyebrow ?? '', blockId: id, text: [heading?.eyebrow, heading?.intro].filter(Boolean).join(' ') });
      continue;
    }
    const blockId = id || section.blockId;
    if ((RICH_TEXT_TYPES as readonly string[]).includes(node.type)) {
      const body = clip(plainText(node as never), 20_000);
      if (!body) continue;
      add({ id: `text:${blockId}:${docs.size}`, kind: 'text', title: node.type === 'heading' ? clip(body, 120) : section.title || 'Text', detail: clip(body, 160), blockId, text: body });
      continue;
    }
    const definition = blockDefinition(node.type);
    if (!definition || !id) continue;
    const parsed = parseBlockAttrs(definition, attrs) as Record<string, unknown> | null;
    if (!parsed) continue;
    // Words every block may carry (its title, note or caption), found under the block's own name.
    const words = ['title', 'text', 'note', 'caption'].map((k) => (typeof parsed[k] === 'string' ? (parsed[k] as string) : '')).filter(Boolean);

    if (node.type === colorPaletteBlock.type) {
      const palette = parseBlockAttrs(colorPaletteBlock, attrs)!;
      for (const colorId of palette.colorIds) {
        const color = findColor(identity, colorId);
        if (color) addColour(add, color, palette.showPrint, id);
      }
    } else if (node.type === contrastPairsBlock.type) {
      // Colours shown only in contrast pairs are found by name and hex there.
      for (const pair of parseBlockAttrs(contrastPairsBlock, attrs)!.pairs) {
        for (const colorId of [pair.foreground, pair.background]) {
          const color = findColor(identity, colorId);
          if (color) addColour(add, color, false, id);
        }
      }
    } else if (node.type === logoShowcaseBlock.type) {
      for (const logoId of parseBlockAttrs(logoShowcaseBlock, attrs)!.logoIds) {
        const logo = findLogo(identity, logoId);
        if (logo) addLogo(add, logo, id, audience);
      }
    } else if (node.type === typographyBlock.type) {
      const typography = parseBlockAttrs(typographyBlock, attrs)!;
      for (const role of typography.roles) {
        const face = typefaceForRole(identity, role);
        if (face) addTypeface(add, face, role, id, audience);
      }
    } else if (node.type === downloadsBlock.type && audience.downloads) {
      const chosen = parseBlockAttrs(downloadsBlock, attrs)!.assetIds;
      const approved = identity.assets ?? [];
      const files = chosen.length ? chosen.map((assetId) => approved.find((a) => a.id === assetId)).filter((a) => !!a) : approved;
      for (const file of files) {
        const format = file.format.toUpperCase();
        add({ id: `file:${file.id}`, kind: 'file', title: file.name, detail: [format, file.kind].filter(Boolean).join(' · '), blockId: id, terms: [format, file.kind].join(' ') });
      }
    } else if (node.type === imageryBlock.type) {
      for (const item of parseBlockAttrs(imageryBlock, attrs)!.items) words.push(item.caption, item.alt);
    }
    // A block that names a logo (clear space, minimum size, misuse…) is found by the logo's name too.
    const logo = typeof parsed.logoId === 'string' ? findLogo(identity, parsed.logoId) : undefined;
    const blockWords = words.filter(Boolean).join(' ');
    if (node.type !== sectionHeadingBlock.type && (blockWords || logo)) {
      add({ id: `block:${id}`, kind: 'block', title: (typeof parsed.title === 'string' && parsed.title.trim()) || definition.label, detail: clip(blockWords || (logo ? logo.name : ''), 160), blockId: id, terms: logo ? logo.name : '', text: blockWords });
    }
  }
  return [...docs.values()].map((d) => searchDocumentSchema.parse(d));
}

type Add = (d: Omit<SearchDocument, 'section' | 'swatch' | 'terms' | 'text'> & Partial<Pick<SearchDocument, 'swatch' | 'terms' | 'text'>>) => void;

function addColour(add: Add, color: IdentityColor, showPrint: boolean, blockId: string) {
  const { shown, terms } = colourNotations(color, showPrint);
  const hex = storedHex(color.hex, '#000000');
  const detail = [hex.toUpperCase(), showPrint ? shown.find((s) => s.startsWith('C ')) : formatRgb(color.rgb), showPrint ? color.spot : null].filter(Boolean).join(' · ');
  add({ id: `colour:${color.id}`, kind: 'colour', title: color.name, detail, blockId, swatch: hex, terms: [...shown, ...terms, color.role ?? ''].join(' ') });
}

function addLogo(add: Add, logo: IdentityLogo, blockId: string, audience: SearchAudience) {
  const format = logo.format.toUpperCase();
  const versions = audience.downloads ? ['one colour', 'black', 'white', 'reversed'] : [];
  add({ id: `logo:${logo.id}`, kind: 'logo', title: logo.name, detail: `${logo.variant} · ${format}`, blockId, terms: [logo.variant, format, 'logo', 'on light', 'on dark', ...versions].join(' ') });
}

function addTypeface(add: Add, face: IdentityTypeface, role: TypefaceRole, blockId: string, audience: SearchAudience) {
  const weights = face.weights.join(', ');
  add({ id: `typeface:${face.id}`, kind: 'typeface', title: face.family, detail: `${ROLE_LABELS[role]} · weights ${weights}`, blockId, terms: [role, ROLE_LABELS[role], 'typeface font', weights, face.fallback.join(' ')].join(' ') });
  // Editors read, above the page, which faces show in their fallback for want of a confirmed licence.
  if (audience.who === 'editor' && !face.licence.confirmed) {
    add({ id: `note:licence-${face.id}`, kind: 'note', title: `${face.family}: no web licence confirmed`, detail: 'Shown in the fallback stack until a licence is confirmed on the Identity page.', blockId, terms: 'licence license font fallback' });
  }
}

/** The index file for one audience's documents (JSON text, as the page's script loads it). */
export function searchIndexJson(documents: readonly SearchDocument[]): string {
  const engine = new MiniSearch<SearchDocument>(INDEX_OPTIONS);
  engine.addAll(documents);
  const file: SearchIndexFile = { format: 1, fields: [...SEARCH_FIELDS], storeFields: [...SEARCH_STORED], searchOptions: SEARCH_QUERY_OPTIONS, index: engine.toJSON() };
  return JSON.stringify(file);
}

/** Load an index file as the page's script does (tests use it to ask what a reader would find). */
export function loadSearchIndex(json: string): { search(query: string): (Pick<SearchDocument, (typeof SEARCH_STORED)[number]> & { id: string; score: number })[] } {
  const file = JSON.parse(json) as SearchIndexFile;
  const engine = MiniSearch.loadJS(file.index as never, { fields: file.fields, storeFields: file.storeFields, idField: 'id' });
  return { search: (query) => engine.search(query, file.searchOptions) as never };
}
