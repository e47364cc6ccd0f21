// The asset shelf: uploads that leave nothing behind when refused, states, renditions on request, bundles and the download log.
import { createHash } from 'node:crypto';
import { RENDITION_CUSTOM_LIMIT, RENDITION_RATE_LIMIT } from 'astro:env/server';
import { Readable } from 'node:stream';
import { ZipArchive } from 'archiver';
import sharp from 'sharp';
import { Op, QueryTypes, UniqueConstraintError, type WhereOptions } from 'sequelize';
import { Asset, AssetDownload, AssetRendition } from '@db/models/assets';
import type { Brand } from '@db/models';
import { audit } from '@/lib/audit.server';
import type { Caller } from '@/lib/auth/access.server';
import { sequelize } from '@/lib/db.server';
import { AppError } from '@/lib/errors';
import { ApiError, notFound } from '@/lib/http/api';
import { log } from '@/lib/log.server';
import { loadIdentity } from '@/lib/identity/identity.server';
import { cleanName } from '@/lib/safe/values';
import { drawnBounds } from '@/lib/logo/bounds.server';
import { LogoError } from '@/lib/logo/errors';
import type { Box } from '@/lib/logo/geometry';
import { consumeAttempt } from '@/lib/publishing/rate-limit.server';
import { newKey } from '@/lib/storage/storage';
import { storage } from '@/lib/storage/index.server';
import { inspectUpload, UploadRejection } from '@/lib/uploads/inspect.server';
import type { AssetReader } from './access.server';
import { formatList } from '@/lib/uploads/rules';
import { canMoveState, FORMAT_INFO, MAX_IMAGE_PIXELS, PHOTO_FORMATS, PREVIEW_MAX_WIDTH, renditionFilename, renditionType, STANDARD_RENDITIONS, VECTOR_PRINT_RENDITIONS, type AssetFormat, type AssetKind, type AssetState, type RenditionParams, type RenditionQuery } from './kinds';
import { cachedRendition, renditionKey, type Rendition } from './render.server';
import { checkRenditionSize, resolveRendition } from './renditions';
import { usageNote } from './usage';
import { ALT_TEXT_REQUIRED, type FocalPoint } from './photo';
import { addDays, dayOf, EXPIRING_DEFAULT_DAYS, expiryStatus, type ExpiryStatus } from './expiry';
import { searchWords, type AssetListQuery } from './schemas';

export interface AssetView {
  id: string;
  brandId: string;
  name: string;
  kind: AssetKind;
  format: string;
  mime: string;
  state: AssetState;
  byteSize: number;
  width: number | null;
  height: number | null;
  originalFilename: string;
  tags: string[];
  description: string | null;
  usageNotes: string | null;
  /** Photographs: alt text, caption and focal point (null elsewhere, and the focal point null until chosen). */
  altText: string | null;
  caption: string | null;
  focus: FocalPoint | null;
  createdAt: string;
  updatedAt: string;
  stateChangedAt: string | null;
  /** Usage rights or licence text (the studio's record), a credit line, the expiry day (ISO 8601 date) and where it stands today. */
  rights: string | null;
  credit: string | null;
  expiresOn: string | null;
  expiry: ExpiryStatus | null;
  /** Whether renditions (width, format, variants) can be asked for. */
  renderable: boolean;
  files: { original: string; preview: string | null };
  /** For a pattern tile Plumbline drew: the settings it was drawn from (null for uploads). */
  patternSettings: Record<string, unknown> | null;
}

const RENDERABLE = new Set(['svg', 'png', 'jpeg', 'webp', 'avif']);

export function assetView(row: Asset): AssetView {
  const renderable = RENDERABLE.has(row.format);
  const file = `/api/assets/${row.id}/file`;
  return {
    id: row.id,
    brandId: row.brandId,
    name: row.name,
    kind: row.kind,
    format: row.format,
    mime: row.mime,
    state: row.state,
    byteSize: row.byteSize,
    width: row.width,
    height: row.height,
    originalFilename: row.originalFilename,
    tags: row.tags,
    description: row.description,
    usageNotes: row.usageNotes,
    altText: row.altText ?? null,
    caption: row.caption ?? null,
    focus: row.focusX != null && row.focusY != null ? { x: row.focusX, y: row.focusY } : null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    stateChangedAt: row.stateChangedAt?.toISOString() ?? null,
    rights: row.rights ?? null,
    credit: row.credit ?? null,
    expiresOn: row.expiresOn ?? null,
    expiry: expiryStatus(row.expiresOn ?? null, dayOf(new Date())),
    renderable,
    files: { original: file, preview: renderable ? `${file}?format=png&width=${PREVIEW_MAX_WIDTH}&preview=1` : null },
    patternSettings: row.patternSettings ?? null,
  };
}

const brandAudit = (caller: Caller, brand: Brand, action: string, targetId: string, details: Record<string, unknown>) => ({
  actorId: caller.id,
  action,
  targetType: 'asset',
  targetId,
  brandId: brand.id,
  studioId: brand.studioId,
  details,
});

const nameFrom = (filename: string) => cleanName(filename.replace(/\.[a-z0-9]{1,8}$/i, ''), 'Untitled asset', 160);

// ---------------------------------------------------------------- uploads

export interface UploadOutcome {
  assets: (AssetView & { duplicate: boolean; sanitised: string[] })[];
  rejected: { filename: string; code: string; message: string }[];
}

/** The kind a shelf file is filed under: photographs when asked (checked as such), drawings and images as the uploader says, the rest by format. */
function shelfKind(format: AssetFormat, wanted: AssetKind | undefined): AssetKind {
  if (wanted === 'photo') return 'photo';
  const rasterish = format === 'svg' || format === 'png' || format === 'jpeg' || format === 'webp';
  return rasterish && (wanted === 'logo' || wanted === 'image') ? wanted : FORMAT_INFO[format].kind;
}

/** What a shelf logo draws, as fractions of its canvas: an SVG's from the inspector, a PNG logo's measured here (null when nothing usable). */
async function shelfBounds(format: AssetFormat, kind: AssetKind, inspected: { stored: Buffer; drawn: { fraction: Box } | null }): Promise<Box | null> {
  if (format === 'svg') return inspected.drawn?.fraction ?? null;
  if (format !== 'png' || kind !== 'logo') return null;
  return drawnBounds(inspected.stored).then((b) => b.fraction, () => null);
}

/** A photograph's size as it is seen, its EXIF orientation applied (a portrait shot stored on its side is portrait). */
async function uprightSize(bytes: Buffer): Promise<{ width: number; height: number } | Record<string, never>> {
  const meta = await sharp(bytes, { limitInputPixels: MAX_IMAGE_PIXELS }).metadata();
  return meta.autoOrient ?? {};
}

/** Store one inspected file and its row, or nothing at all: the file is removed again when the row cannot be written. */
async function storeOne(caller: Caller, brand: Brand, file: File, wanted: AssetKind | undefined): Promise<AssetView & { duplicate: boolean; sanitised: string[] }> {
  // A photograph is checked against the photo row (raster pictures only); everything else against the shelf's.
  const checked = await inspectUpload(Buffer.from(await file.arrayBuffer()), { as: wanted === 'photo' ? 'photo' : 'shelf', filename: file.name });
  const format = checked.format as AssetFormat;
  const kind = shelfKind(format, wanted);
  const inspected = { ...checked, format, kind, drawnBounds: await shelfBounds(format, kind, checked), ...(kind === 'photo' ? await uprightSize(checked.stored) : {}) };
  const contentHash = createHash('sha256').update(inspected.stored).digest('hex');
  const existing = await Asset.findOne({ where: { brandId: brand.id, contentHash } });
  if (existing) return { ...assetView(existing), duplicate: true, sanitised: [] };
  const key = newKey(brand.id, 'asset', FORMAT_INFO[inspected.format].ext);
  await storage.put(key, inspected.stored, inspected.mime);
  try {
    const row = await sequelize.transaction(async (t) => {
      const asset = await Asset.create(
        {
          brandId: brand.id,
          name: nameFrom(file.name),
          kind: inspected.kind,
          format: inspected.format,
          mime: inspected.mime,
          storageKey: key,
          contentHash,
          byteSize: inspected.stored.length,
          width: inspected.width,
          height: inspected.height,
          drawnBounds: inspected.drawnBounds,
          originalFilename: file.name.slice(0, 255),
          description: null,
          usageNotes: null,
          uploadedById: caller.id,
          stateChangedAt: null,
          stateChangedById: null,
        },
        { transaction: t },
      );
      await audit(brandAudit(caller, brand, 'asset.upload', asset.id, { name: asset.name, format: asset.format, bytes: asset.byteSize, sanitised: inspected.removed }), t);
      return asset;
    });
    return { ...assetView(row), duplicate: false, sanitised: inspected.removed };
  } catch (err) {
    await storage.delete(key); // no orphan file when the row could not be written
    if (err instanceof UniqueConstraintError) {
      // The same bytes arrived twice at once: the other upload won.
      const winner = await Asset.findOne({ where: { brandId: brand.id, contentHash } });
      if (winner) return { ...assetView(winner), duplicate: true, sanitised: [] };
    }
    throw err;
  }
}

/** Upload several files; each is accepted or refused on its own. */
export async function uploadAssets(caller: Caller, brand: Brand, files: File[], kind?: AssetKind): Promise<UploadOutcome> {
  const outcome: UploadOutcome = { assets: [], rejected: [] };
  for (const file of files) {
    try {
      outcome.assets.push(await storeOne(caller, brand, file, kind));
    } catch (err) {
      if (err instanceof UploadRejection) outcome.rejected.push({ filename: file.name, code: err.code, message: err.message });
      else throw err;
    }
  }
  return outcome;
}

// ---------------------------------------------------------------- reading and editing

export type AssetFilters = Partial<Omit<AssetListQuery, 'state' | 'kind'>> & { state?: AssetState; kind?: AssetKind };

/**
 * The words a shelf search looks in, as one PostgreSQL text-search document ('simple' configuration: no stemming, so
 * brand names and tags are matched as written, in any language): name, rights, credit and every tag.
 */
const SEARCH_DOCUMENT = `(to_tsvector('simple', coalesce("Asset"."name", '') || ' ' || coalesce("Asset"."rights", '') || ' ' || coalesce("Asset"."credit", '')) || jsonb_to_tsvector('simple', "Asset"."tags", '["string"]'))`;

/** The shelf a reader may see, narrowed by the filters (all of them must hold); `today` is the calendar day expiry is judged on. */
export async function listAssets(reader: AssetReader, filters: AssetFilters, today: string = dayOf(new Date())): Promise<AssetView[]> {
  const where: WhereOptions<Asset> & Record<string, unknown> = { brandId: reader.brand.id };
  const and: unknown[] = [];
  const replacements: Record<string, string> = {};
  if (reader.approvedOnly) where.state = 'approved';
  if (filters.state) where.state = reader.approvedOnly && filters.state !== 'approved' ? '__none__' : filters.state;
  if (filters.kind) where.kind = filters.kind;
  if (filters.format) where.format = filters.format;
  if (filters.tag) where.tags = { [Op.contains]: [filters.tag.trim().toLowerCase()] };
  if (filters.rights) where.rights = filters.rights === 'with' ? { [Op.ne]: null } : { [Op.is]: null };
  if (filters.expiry === 'none') where.expiresOn = { [Op.is]: null };
  if (filters.expiry === 'expired') where.expiresOn = { [Op.lte]: today };
  if (filters.expiry === 'expiring') where.expiresOn = { [Op.gt]: today, [Op.lte]: addDays(today, filters.days ?? EXPIRING_DEFAULT_DAYS) };
  // Each word is letters and digits only and travels as a bound value; ':*' matches it as the start of a word.
  searchWords(filters.q ?? '').forEach((word, i) => {
    replacements[`w${i}`] = word;
    and.push(sequelize.literal(`${SEARCH_DOCUMENT} @@ to_tsquery('simple', :w${i} || ':*')`));
  });
  if (and.length) Object.assign(where, { [Op.and]: and });
  const rows = await Asset.findAll({ where, replacements, order: [['createdAt', 'DESC'], ['name', 'ASC']] });
  return rows.map(assetView);
}

/** An asset of the brand the reader may see; drafts and retired assets are 404 for approved-only readers. */
export async function assetFor(brandId: string, assetId: string, approvedOnly: boolean): Promise<Asset> {
  const asset = await Asset.findOne({ where: { id: assetId, brandId } });
  if (!asset || (approvedOnly && asset.state !== 'approved')) throw notFound('That asset');
  return asset;
}

export interface AssetChanges {
  state?: AssetState;
  tags?: string[];
  description?: string | null;
  usageNotes?: string | null;
  name?: string;
  kind?: 'logo' | 'image' | 'photo';
  altText?: string | null;
  caption?: string | null;
  focus?: FocalPoint | null;
  rights?: string | null;
  credit?: string | null;
  expiresOn?: string | null;
}

export async function updateAsset(caller: Caller, brand: Brand, assetId: string, body: AssetChanges): Promise<AssetView> {
  const asset = await assetFor(brand.id, assetId, false);
  const changes: Partial<Asset> = {};
  if (body.state !== undefined && body.state !== asset.state) {
    if (!canMoveState(asset.state, body.state)) {
      throw new ApiError(409, 'invalid_transition', `A ${asset.state} asset cannot become ${body.state}; approve it first, or move it back to draft.`);
    }
    Object.assign(changes, { state: body.state, stateChangedAt: new Date(), stateChangedById: caller.id });
  }
  if (body.tags !== undefined) changes.tags = [...new Set(body.tags.map((t) => t.trim().toLowerCase()).filter(Boolean))];
  if (body.description !== undefined) changes.description = body.description || null;
  if (body.usageNotes !== undefined) changes.usageNotes = body.usageNotes || null;
  if (body.name !== undefined) changes.name = body.name;
  if (body.kind !== undefined && body.kind !== asset.kind) {
    if (!RENDERABLE.has(asset.format)) throw new ApiError(400, 'invalid_input', `A ${asset.format.toUpperCase()} file cannot be marked as a logo or image.`, { path: 'kind' });
    if (body.kind === 'photo' && !(PHOTO_FORMATS as readonly string[]).includes(asset.format)) {
      throw new ApiError(400, 'invalid_input', `A photograph is ${formatList(PHOTO_FORMATS)}; this file is ${FORMAT_INFO[asset.format].label}.`, { path: 'kind' });
    }
    if (asset.format === 'avif' && body.kind !== 'photo') throw new ApiError(400, 'invalid_input', 'An AVIF file is kept as a photograph.', { path: 'kind' });
    changes.kind = body.kind;
  }
  if (body.altText !== undefined) changes.altText = body.altText || null;
  if (body.caption !== undefined) changes.caption = body.caption || null;
  if (body.rights !== undefined) changes.rights = body.rights || null;
  if (body.credit !== undefined) changes.credit = body.credit || null;
  if (body.expiresOn !== undefined) changes.expiresOn = body.expiresOn || null;
  if (body.focus !== undefined) Object.assign(changes, { focusX: body.focus?.x ?? null, focusY: body.focus?.y ?? null });
  // WCAG 2.2 SC 1.1.1: an approved photograph always has a text alternative, so every page that shows it can say what it shows.
  const kindAfter = changes.kind ?? asset.kind;
  const stateAfter = changes.state ?? asset.state;
  const altAfter = changes.altText !== undefined ? changes.altText : asset.altText;
  if (kindAfter === 'photo' && stateAfter === 'approved' && !altAfter?.trim()) throw new ApiError(422, 'alt_text_required', ALT_TEXT_REQUIRED, { path: 'altText' });
  // An asset past its expiry day cannot be handed out again until the date moves on (the expiry job would retire it anyway).
  const expiresAfter = changes.expiresOn !== undefined ? changes.expiresOn : asset.expiresOn;
  const expiryTouched = changes.state === 'approved' || changes.expiresOn !== undefined;
  if (expiryTouched && stateAfter === 'approved' && expiryStatus(expiresAfter ?? null, dayOf(new Date())) === 'expired') {
    throw new ApiError(422, 'expired', `This asset expired on ${expiresAfter}; an approved asset needs a later expiry date (or none); retire it instead.`, { path: 'expiresOn' });
  }
  const before = { state: asset.state, name: asset.name, expiresOn: asset.expiresOn ?? null };
  await sequelize.transaction(async (t) => {
    await asset.update(changes, { transaction: t });
    await audit(brandAudit(caller, brand, changes.state ? 'asset.state' : 'asset.update', asset.id, { before, changes: body }), t);
  });
  return assetView(asset);
}

export async function deleteAsset(caller: Caller, brand: Brand, assetId: string): Promise<void> {
  const asset = await assetFor(brand.id, assetId, false);
  const renditions = await AssetRendition.findAll({ where: { assetId: asset.id }, attributes: ['storageKey'] });
  await sequelize.transaction(async (t) => {
    await asset.destroy({ transaction: t });
    await audit(brandAudit(caller, brand, 'asset.delete', asset.id, { name: asset.name, format: asset.format }), t);
  });
  for (const key of [asset.storageKey, ...renditions.map((r) => r.storageKey)]) await storage.delete(key);
}

// ---------------------------------------------------------------- files and renditions

/** Resolve a request for an asset; a refusal is a RenditionError (400, or 422 over a limit). */
export function renditionParams(asset: Asset, query: RenditionQuery): RenditionParams {
  return resolveRendition(query, asset);
}

// ---------------------------------------------------------------- limits on what a caller can make us draw

/** Window of the per-caller rate of new custom renditions. */
const RENDITION_RATE_WINDOW_SECONDS = 60;

/**
 * Who asks for a rendition, for the per-caller rate: the member's id, or for a share-link holder the link together with
 * the connection's address (one leaked link cannot be used from many places to spend one budget, nor one place to spend many).
 */
export function renditionRequester(reader: AssetReader, address: string): string {
  return reader.caller ? `user:${reader.caller.id}` : `link:${reader.shareLinkId}:${address}`;
}

/** Renditions Plumbline itself links to (shelf, previews, downloads page, bundles): a fixed number per asset, so never capped. */
function offeredQueries(): RenditionQuery[] {
  return [
    ...STANDARD_RENDITIONS.map((r) => r.query),
    ...BUNDLE_LOGO_FILES.map((f) => f.query),
    { format: 'png', width: PREVIEW_MAX_WIDTH },
    { format: 'png', width: PREVIEW_MAX_WIDTH, variant: 'white' },
    { format: 'png', width: 1024 },
    { format: 'svg', variant: 'white' },
    { preset: 'print' },
  ];
}

/** The cache keys of the offered renditions that make sense for this asset. */
function offeredKeys(asset: Asset): string[] {
  const keys = new Set<string>();
  for (const query of offeredQueries()) {
    try {
      keys.add(renditionKey(asset, resolveRendition(query, asset)).paramsKey);
    } catch {
      // Not offered for this kind of asset (e.g. a variant of a photo).
    }
  }
  return [...keys];
}

/**
 * Admits drawing a new (uncached) rendition: offered ones always; a custom one only while the asset has fewer than
 * RENDITION_CUSTOM_LIMIT custom renditions (422) and the requester has drawn fewer than RENDITION_RATE_LIMIT in the
 * last minute (429). Concurrent requests can pass the count together: the cap holds within the requests in flight.
 */
async function admitNewRendition(asset: Asset, paramsKey: string, requester: string | null): Promise<void> {
  const offered = offeredKeys(asset);
  if (offered.includes(paramsKey)) return;
  // At most the offered set plus the cap: a small read.
  const kept = await AssetRendition.findAll({ where: { assetId: asset.id }, attributes: ['paramsKey'] });
  const count = kept.filter((r) => !offered.includes(r.paramsKey)).length;
  if (count >= RENDITION_CUSTOM_LIMIT) {
    throw new ApiError(
      422,
      'rendition_limit',
      `“${asset.name}” already has ${count} custom renditions, the most Plumbline keeps for one asset (besides the standard set). Choose one of the standard files, a size made before, or download the original.`,
      { limit: RENDITION_CUSTOM_LIMIT },
    );
  }
  if (requester && !(await consumeAttempt(`rendition:${requester}`, RENDITION_RATE_LIMIT, RENDITION_RATE_WINDOW_SECONDS))) {
    throw new ApiError(
      429,
      'rate_limited',
      `You asked for more than ${RENDITION_RATE_LIMIT} new renditions in a minute. Files made before are still served at once; try a new size again in a minute.`,
      { limit: RENDITION_RATE_LIMIT, windowSeconds: RENDITION_RATE_WINDOW_SECONDS },
    );
  }
}

/** The original as stored, streamed: the same bytes as the 'original' rendition, never held whole. */
async function originalStream(asset: Asset): Promise<DownloadBody> {
  const stored = await storage.getStream(asset.storageKey);
  if (!stored) throw new ApiError(404, 'not_found', 'The asset’s file is missing from storage.');
  return { body: stored.stream, size: stored.size, mime: renditionType('original', asset.format).mime };
}

async function originalBytes(asset: Asset): Promise<Buffer> {
  const bytes = await storage.get(asset.storageKey);
  if (!bytes) throw new ApiError(404, 'not_found', 'The asset’s file is missing from storage.');
  return bytes;
}

/**
 * The rendition from the cache (free), or drawn now and remembered when it is within the pixel caps and admitted
 * (see admitNewRendition; `requester` null for Plumbline's own work such as bundles, which asks only offered files).
 */
export async function renditionOf(asset: Asset, params: RenditionParams, requester: string | null = null): Promise<Rendition> {
  try {
    if (asset.width && asset.height) checkRenditionSize(params, { format: asset.format, width: asset.width, height: asset.height });
    return await cachedRendition(
      storage,
      { id: asset.id, brandId: asset.brandId, format: asset.format, drawnBounds: asset.drawnBounds, bytes: () => originalBytes(asset) },
      params,
      {
        beforeDraw: ({ paramsKey }) => admitNewRendition(asset, paramsKey, requester),
        onStored: async (entry) => {
          await AssetRendition.bulkCreate(
            [{ assetId: asset.id, paramsKey: entry.paramsKey, storageKey: entry.key, contentType: entry.mime, byteSize: entry.size }],
            { ignoreDuplicates: true },
          );
        },
      },
    );
  } catch (err) {
    // A stored SVG that today's upload checks refuse (e.g. an embedded image over the pixel cap) is not drawn.
    if (err instanceof LogoError) throw new LogoError(err.code, err.message, 422);
    throw err;
  }
}

const logRow = (reader: AssetReader, kind: 'file' | 'bundle', assetId: string | null, details: Record<string, unknown>) => ({
  brandId: reader.brand.id,
  assetId,
  kind,
  userId: reader.caller?.id ?? null,
  shareLinkId: reader.shareLinkId,
  details,
});

/** One file download: the rendition asked for, its name, and a row in the download log. */
/** A file to send: whole bytes (a rendition, small) or the stored original as a stream (up to the shelf's cap). */
export type DownloadBody = Rendition | { body: Readable; size: number; mime: string };

export async function downloadFile(reader: AssetReader, asset: Asset, query: RenditionQuery, requester: string): Promise<{ rendition: DownloadBody; filename: string; params: RenditionParams }> {
  const { preview, ...wanted } = query;
  const params = renditionParams(asset, wanted);
  if (preview && (params.format !== 'png' || !params.width || params.width > PREVIEW_MAX_WIDTH || params.square)) {
    throw new ApiError(400, 'invalid_input', `A preview is a PNG at most ${PREVIEW_MAX_WIDTH} px wide; download anything else without preview=1.`);
  }
  const rendition = params.format === 'original' ? await originalStream(asset) : await renditionOf(asset, params, requester);
  const filename = renditionFilename(reader.brand.slug, asset.name, params, asset.format);
  if (preview) return { rendition, filename, params };
  await AssetDownload.create(
    logRow(reader, 'file', asset.id, {
      filename,
      format: params.format,
      width: params.width,
      variant: params.variant,
      preset: query.preset ?? null,
      colorSpace: params.colorSpace,
      bytes: 'size' in rendition ? rendition.size : rendition.body.length,
    }),
  );
  return { rendition, filename, params };
}

// ---------------------------------------------------------------- bundles

/** What each logo brings into a bundle beside its original. */
const BUNDLE_LOGO_FILES: { folder: string; query: RenditionQuery; svgOnly?: boolean }[] = [
  { folder: 'screen', query: { format: 'png', width: 512 } },
  { folder: 'screen', query: { format: 'png', width: 2048 } },
  { folder: 'one-colour', query: { format: 'png', width: 512, variant: 'black' } },
  { folder: 'one-colour', query: { format: 'png', width: 512, variant: 'white' } },
  { folder: 'one-colour', query: { format: 'svg', variant: 'black' }, svgOnly: true },
  { folder: 'one-colour', query: { format: 'svg', variant: 'white' }, svgOnly: true },
  { folder: 'web-icons', query: { preset: 'favicon' } },
  { folder: 'web-icons', query: { preset: 'apple-touch' } },
  { folder: 'print', query: { preset: 'print', width: 2048 } },
  ...VECTOR_PRINT_RENDITIONS.map((r) => ({ folder: 'print', query: r.query, svgOnly: true })),
];
export const MAX_BUNDLE_ASSETS = 100;

export interface BundlePlan {
  filename: string;
  entries: number;
  estimateBytes: number;
  stream: ReadableStream<Uint8Array>;
}

const folderName = (s: string) => s.toLowerCase().normalize('NFKD').replace(/[^\w]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'asset';

/** A zip of approved assets (or every approved logo), with their renditions and a usage note; streamed as it is written. */
export async function bundle(reader: AssetReader, request: { assetIds?: string[]; allLogos?: boolean }): Promise<BundlePlan> {
  const brand = reader.brand;
  let assets: Asset[];
  if (request.allLogos) {
    assets = await Asset.findAll({ where: { brandId: brand.id, state: 'approved', kind: 'logo' }, order: [['name', 'ASC']] });
    if (!assets.length) throw new ApiError(400, 'nothing_to_bundle', 'This brand has no approved logos yet. Approve a logo on the shelf first.');
  } else {
    const ids = [...new Set(request.assetIds ?? [])];
    if (!ids.length) throw new ApiError(400, 'invalid_input', 'Choose at least one asset, or ask for all logos.', { path: 'assetIds' });
    assets = await Asset.findAll({ where: { brandId: brand.id, id: ids }, order: [['name', 'ASC']] });
    const found = new Map(assets.map((a) => [a.id, a]));
    for (const id of ids) {
      const a = found.get(id);
      if (!a || (reader.approvedOnly && a.state !== 'approved')) throw new ApiError(404, 'not_found', 'One of the chosen assets was not found on this brand’s shelf.', { assetId: id });
      if (a.state !== 'approved') throw new ApiError(400, 'not_approved', `“${a.name}” is ${a.state}; only approved assets go into bundles.`, { assetId: id });
    }
  }
  if (assets.length > MAX_BUNDLE_ASSETS) throw new ApiError(400, 'too_many_assets', `A bundle can hold at most ${MAX_BUNDLE_ASSETS} assets.`);

  // Renditions first (most come from the cache), so the size estimate is honest before the first byte is sent.
  const used = new Set<string>();
  const plan: { path: string; source: () => Promise<Buffer>; size: number; asset: Asset }[] = [];
  for (const asset of assets) {
    let folder = folderName(asset.name);
    for (let n = 2; used.has(folder); n++) folder = `${folderName(asset.name)}-${n}`;
    used.add(folder);
    const ext = FORMAT_INFO[asset.format].ext;
    plan.push({ path: `${folder}/original/${folderName(asset.name)}.${ext}`, source: () => originalBytes(asset), size: asset.byteSize, asset });
    if (asset.kind !== 'logo' || !RENDERABLE.has(asset.format)) continue;
    for (const item of BUNDLE_LOGO_FILES) {
      if (item.svgOnly && asset.format !== 'svg') continue;
      const params = renditionParams(asset, item.query);
      let made: Rendition;
      try {
        made = await renditionOf(asset, params);
      } catch (err) {
        // Over a pixel cap (a very tall or wide logo): the bundle goes without that file; the original is in it.
        if (err instanceof AppError && err.status === 422) continue;
        throw err;
      }
      plan.push({ path: `${folder}/${item.folder}/${renditionFilename(brand.slug, asset.name, params, asset.format)}`, source: async () => made.body, size: made.body.length, asset });
    }
  }
  const identity = await loadIdentity(brand);
  const note = Buffer.from(
    usageNote(
      identity,
      plan.map((p) => {
        const original = p.path.includes('/original/');
        const rights = original ? { rights: p.asset.rights ?? null, credit: p.asset.credit ?? null, expiresOn: p.asset.expiresOn ?? null } : null;
        return { path: p.path, name: p.asset.name, notes: original ? p.asset.usageNotes : null, rights };
      }),
      new Date(),
    ),
  );

  await AssetDownload.create(logRow(reader, 'bundle', null, { assetIds: assets.map((a) => a.id), allLogos: !!request.allLogos, entries: plan.length + 1 }));

  const archive = new ZipArchive({ zlib: { level: 6 } });
  (async () => {
    try {
      archive.append(note, { name: 'USAGE.txt' });
      for (const entry of plan) archive.append(await entry.source(), { name: entry.path });
      await archive.finalize();
    } catch (err) {
      log.error({ err }, 'assets: bundle failed');
      archive.destroy(err as Error);
    }
  })();
  return {
    filename: `${brand.slug}-assets.zip`,
    entries: plan.length + 1,
    estimateBytes: note.length + plan.reduce((s, p) => s + p.size, 0),
    stream: Readable.toWeb(archive) as ReadableStream<Uint8Array>,
  };
}

// ---------------------------------------------------------------- download log

export interface DownloadFilters {
  kind?: 'file' | 'bundle';
  assetId?: string;
  via?: 'member' | 'share-link';
  userId?: string;
  from?: Date;
  to?: Date;
  limit: number;
}

export interface DownloadEntry {
  id: string;
  at: string;
  kind: 'file' | 'bundle';
  asset: { id: string; name: string } | null;
  who: { type: 'member'; id: string; name: string; email: string } | { type: 'share-link'; linkId: string } | { type: 'unknown' };
  details: Record<string, unknown>;
}

export async function downloadLog(brand: Brand, filters: DownloadFilters): Promise<DownloadEntry[]> {
  const where: Record<string | symbol, unknown> = { brandId: brand.id };
  if (filters.kind) where.kind = filters.kind;
  if (filters.assetId) where.assetId = filters.assetId;
  if (filters.userId) where.userId = filters.userId;
  if (filters.via === 'member') where.userId = { [Op.ne]: null };
  if (filters.via === 'share-link') where.shareLinkId = { [Op.ne]: null };
  if (filters.from || filters.to) {
    where.createdAt = { ...(filters.from ? { [Op.gte]: filters.from } : {}), ...(filters.to ? { [Op.lt]: filters.to } : {}) };
  }
  const rows = await AssetDownload.findAll({ where, order: [['createdAt', 'DESC']], limit: filters.limit });
  const assetIds = [...new Set(rows.map((r) => r.assetId).filter((v): v is string => !!v))];
  const userIds = [...new Set(rows.map((r) => r.userId).filter((v): v is string => !!v))];
  const assets = assetIds.length ? await Asset.findAll({ where: { id: assetIds }, attributes: ['id', 'name'] }) : [];
  // better-auth owns "user": read names with a plain query, never through a model.
  const users = userIds.length
    ? await sequelize.query<{ id: string; name: string; email: string }>('SELECT id, name, email FROM "user" WHERE id IN (:ids)', { replacements: { ids: userIds }, type: QueryTypes.SELECT })
    : [];
  const assetName = new Map(assets.map((a) => [a.id, a.name]));
  const person = new Map(users.map((u) => [u.id, u]));
  return rows.map((r) => {
    const u = r.userId ? person.get(r.userId) : undefined;
    return {
      id: r.id,
      at: r.createdAt.toISOString(),
      kind: r.kind,
      asset: r.assetId ? { id: r.assetId, name: assetName.get(r.assetId) ?? '(deleted)' } : null,
      who: u ? { type: 'member', id: u.id, name: u.name, email: u.email } : r.shareLinkId ? { type: 'share-link', linkId: r.shareLinkId } : { type: 'unknown' },
      details: r.details,
    };
  });
}

/** The log as CSV rows, header first. */
export function downloadLogRows(entries: DownloadEntry[]): unknown[][] {
  return [
    ['when', 'kind', 'asset', 'who', 'email', 'share_link', 'file', 'format', 'width', 'variant', 'entries'],
    ...entries.map((e) => [
      e.at,
      e.kind,
      e.asset?.name ?? (e.kind === 'bundle' ? `${((e.details.assetIds as string[]) ?? []).length} assets` : ''),
      e.who.type === 'member' ? e.who.name : e.who.type === 'share-link' ? 'share link' : '',
      e.who.type === 'member' ? e.who.email : '',
      e.who.type === 'share-link' ? e.who.linkId : '',
      e.details.filename ?? '',
      e.details.format ?? '',
      e.details.width ?? '',
      e.details.variant ?? '',
      e.details.entries ?? '',
    ]),
  ];
}
