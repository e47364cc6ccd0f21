// Photographs with a do or don't verdict, each a file of the brand's asset shelf; anything else is a neutral frame.
import type { ImageryAttrs } from './definition';
import { safeAssetUrl } from '@/lib/guideline/links';
import type { Identity } from '@/lib/identity/types';
import { isAssetRef } from '@/lib/safe/values';
import { EmptyHint, type BlockRenderProps } from '@/components/guideline/parts';

const COLUMNS = ['', 'sm:grid-cols-1', 'sm:grid-cols-2', 'sm:grid-cols-3', 'sm:grid-cols-4'];

/** The address of an approved image on the brand's own shelf, or null: outside addresses are never used. */
function shelfImageUrl(identity: Identity, src: string): string | null {
  if (!isAssetRef(src)) return null;
  const asset = identity.assets?.find((a) => a.id === src && a.kind === 'image');
  return asset ? safeAssetUrl(asset.url) : null;
}

export function Render({ attrs, identity, mode, editing }: BlockRenderProps<ImageryAttrs>) {
  if (attrs.items.length === 0) return editing ? <EmptyHint>Add photographs from the asset shelf and say whether each is a do or a don’t.</EmptyHint> : null;
  return (
    <ul className={`grid gap-4 ${COLUMNS[attrs.columns]}`}>
      {attrs.items.map((item, i) => {
        const url = shelfImageUrl(identity, item.src);
        const dont = item.verdict === 'dont';
        return (
          <li key={i}>
            <figure className="overflow-hidden rounded-xl border border-black/10 bg-white text-[#1f1f1f]" data-verdict={item.verdict}>
              {url ? (
                <img src={url} alt={item.alt} className="aspect-[4/3] w-full object-cover" loading={mode === 'print' ? 'eager' : 'lazy'} decoding="async" />
              ) : (
                <div role="img" aria-label={item.alt || 'Image to come'} className="flex aspect-[4/3] items-center justify-center bg-[#f1efeb] p-4 text-center text-xs text-[#5a5650]" data-image-placeholder="">
                  {editing ? 'Choose an approved image from the asset shelf; it appears here.' : 'Image to come'}
                </div>
              )}
              <figcaption className="flex items-start gap-2 px-3 py-2 text-sm">
                <span className={`rounded px-1.5 py-0.5 text-[11px] font-bold uppercase tracking-wider text-white ${dont ? 'bg-[#b3261e]' : 'bg-[#2f6b3a]'}`}>{dont ? 'Don’t' : 'Do'}</span>
                <span>{item.caption}</span>
              </figcaption>
            </figure>
          </li>
        );
      })}
    </ul>
  );
}
