// Photographs with a do or don't verdict; until assets exist an asset id shows as a labelled frame.
import type { ImageryAttrs } from '../../../lib/guideline/blocks';
import { safeAssetUrl } from '../../../lib/guideline/links';
import { EmptyHint, type BlockRenderProps } from '../parts';

const COLUMNS = ['', 'sm:grid-cols-1', 'sm:grid-cols-2', 'sm:grid-cols-3', 'sm:grid-cols-4'];

export function ImageryBlock({ attrs, mode, editing }: BlockRenderProps<ImageryAttrs>) {
  if (attrs.items.length === 0) return editing ? <EmptyHint>Add photographs and say whether each is a do or a don’t.</EmptyHint> : null;
  return (
    <ul className={`grid gap-4 ${COLUMNS[attrs.columns]}`}>
      {attrs.items.map((item, i) => {
        const safe = safeAssetUrl(item.src);
        // The PDF renderer fetches only this version's own files; a photograph at an outside address stays online.
        const outside = mode === 'print' && safe !== null && !safe.startsWith('/');
        const url = outside ? null : safe;
        const dont = item.verdict === 'dont';
        return (
          <li key={i}>
            <figure className="overflow-hidden rounded-xl border border-black/10 bg-white text-[#1f1f1f]" data-verdict={item.verdict}>
              {url ? (
                <img src={url} alt={item.alt} className="aspect-[4/3] w-full object-cover" loading={mode === 'print' ? 'eager' : 'lazy'} decoding="async" />
              ) : (
                <div role="img" aria-label={item.alt || 'Image to come'} className="flex aspect-[4/3] items-center justify-center bg-[#f1efeb] p-4 text-center text-xs text-[#5a5650]">
                  {outside ? 'This photograph is kept at an outside address; see it in the online edition.' : `Image “${item.src}” appears here once the file is uploaded.`}
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
