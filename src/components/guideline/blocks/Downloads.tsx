// The list of approved files; until assets exist each entry is a labelled placeholder.
import type { DownloadsAttrs } from '../../../lib/guideline/blocks';
import { EmptyHint, Note, type BlockRenderProps } from '../parts';

export function DownloadsBlock({ attrs, editing }: BlockRenderProps<DownloadsAttrs>) {
  return (
    <div className="rounded-xl border border-black/10 bg-white p-5 text-[#1f1f1f]">
      <p className="text-lg font-semibold" style={{ fontFamily: 'var(--brand-heading-font)' }}>{attrs.title}</p>
      {attrs.assetIds.length === 0 ? (
        editing ? <EmptyHint>Approved files will be listed here once uploads are available.</EmptyHint> : <p className="mt-2 text-sm opacity-80">Files will be listed here once they are approved.</p>
      ) : (
        <ul className="mt-3 divide-y divide-black/10">
          {attrs.assetIds.map((id) => (
            <li key={id} className="flex items-center justify-between py-2 text-sm" data-asset-id={id}>
              <span className="font-mono">{id}</span>
              <span className="opacity-70">Available once approved</span>
            </li>
          ))}
        </ul>
      )}
      <Note text={attrs.note} />
    </div>
  );
}
