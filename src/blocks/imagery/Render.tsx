// Photographs with a do or don't verdict, each a file of the brand's asset shelf; anything else is a neutral frame.
// In a published version a photograph is served as renditions of the version's own copy, cut around its focal point.
import type { ImageryAttrs } from './definition';
import { safeAssetUrl } from '@/lib/guideline/links';
import type { Identity, IdentityAsset } from '@/lib/identity/types';
import { aspectParam, CENTRE, focalCrop, imagerySizes, objectPosition, renditionHeight, srcsetWidths, type PhotoAspect } from '@/lib/assets/photo';
import { isAssetRef } from '@/lib/safe/values';
import { EmptyHint, type BlockRenderProps } from '@/components/guideline/parts';

const COLUMNS = ['', 'sm:grid-cols-1', 'sm:grid-cols-2', 'sm:grid-cols-3', 'sm:grid-cols-4'];
const ASPECT_CLASS: Record<PhotoAspect, string> = { '4:3': 'aspect-[4/3]', '3:2': 'aspect-[3/2]', '1:1': 'aspect-square', '16:9': 'aspect-video', '4:5': 'aspect-[4/5]' };

/** An approved photograph or image on the brand's own shelf, or null: outside addresses are never used. */
function shelfImage(identity: Identity, src: string): IdentityAsset | null {
  if (!isAssetRef(src)) return null;
  return identity.assets?.find((a) => a.id === src && (a.kind === 'photo' || a.kind === 'image')) ?? null;
}

interface Picture {
  src: string;
  srcSet?: string;
  sizes?: string;
  width?: number;
  height?: number;
  position?: string;
}

/**
 * What the <img> gets: in a version, a srcset of the photograph's renditions by width (never wider than its crop, HTML
 * srcset width descriptors) with sizes from the grid; in the editor, the shelf's preview placed on the focal point.
 */
function picture(asset: IdentityAsset, aspect: PhotoAspect, columns: number): Picture | null {
  if (asset.kind === 'photo' && asset.renditions && asset.width && asset.height) {
    const base = safeAssetUrl(asset.renditions);
    if (!base) return null;
    const crop = focalCrop({ width: asset.width, height: asset.height }, aspect, asset.focus ?? CENTRE);
    const widths = srcsetWidths(crop.width);
    const at = (w: number) => `${base}?w=${w}&aspect=${aspectParam(aspect)}`;
    const largest = widths.at(-1)!;
    return {
      src: at(widths.find((w) => w >= 960) ?? largest),
      srcSet: widths.map((w) => `${at(w)} ${w}w`).join(', '),
      sizes: imagerySizes(columns),
      width: largest,
      height: renditionHeight(largest, aspect),
    };
  }
  if (asset.kind === 'photo') return { src: `/api/assets/${asset.id}/file?format=png&width=480&preview=1`, position: objectPosition(asset.focus) };
  const url = safeAssetUrl(asset.url);
  return url ? { src: url } : null;
}

export function Render({ attrs, identity, mode, editing }: BlockRenderProps<ImageryAttrs>) {
  if (attrs.items.length === 0) return editing ? <EmptyHint>Add photographs from the asset shelf and say whether each is a do or a don’t.</EmptyHint> : null;
  const aspect = attrs.aspect ?? '4:3';
  return (
    <ul className={`grid gap-4 ${COLUMNS[attrs.columns]}`}>
      {attrs.items.map((item, i) => {
        const asset = shelfImage(identity, item.src);
        const shown = asset ? picture(asset, aspect, attrs.columns) : null;
        const dont = item.verdict === 'dont';
        // The block's own words win; otherwise the photograph's alt text and caption from the shelf.
        const alt = item.alt.trim() || asset?.alt || '';
        const caption = item.caption.trim() || asset?.caption || '';
        return (
          <li key={i}>
            <figure className="overflow-hidden rounded-xl border border-black/10 bg-white text-[#1f1f1f]" data-verdict={item.verdict}>
              {shown ? (
                <img
                  src={shown.src}
                  srcSet={shown.srcSet}
                  sizes={shown.sizes}
                  width={shown.width}
                  height={shown.height}
                  alt={alt}
                  className={`${ASPECT_CLASS[aspect]} h-auto w-full object-cover`}
                  style={shown.position ? { objectPosition: shown.position } : undefined}
                  loading={mode === 'print' ? 'eager' : 'lazy'}
                  decoding="async"
                />
              ) : (
                <div role="img" aria-label={alt || 'Image to come'} className={`flex ${ASPECT_CLASS[aspect]} items-center justify-center bg-[#f1efeb] p-4 text-center text-xs text-[#5a5650]`} data-image-placeholder="">
                  {editing ? 'Choose an approved photograph from the asset shelf; it appears here.' : 'Image to come'}
                </div>
              )}
              <figcaption className="flex items-start gap-2 px-3 py-2 text-sm">
                <span className={`rounded px-1.5 py-0.5 text-[11px] font-bold uppercase tracking-wider text-white ${dont ? 'bg-[#b3261e]' : 'bg-[#2f6b3a]'}`}>{dont ? 'Don’t' : 'Do'}</span>
                <span>{caption}</span>
              </figcaption>
            </figure>
          </li>
        );
      })}
    </ul>
  );
}
