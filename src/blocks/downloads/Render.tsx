// The approved files a reader may download: the chosen ones, or every approved file when none is chosen.
import type { DownloadsAttrs } from './definition';
import { safeAssetUrl } from '@/lib/guideline/links';
import { EmptyHint, Note, type BlockRenderProps } from '@/components/guideline/parts';

export function Render({ attrs, identity, editing }: BlockRenderProps<DownloadsAttrs>) {
  const approved = identity.assets ?? [];
  const chosen = attrs.assetIds.length ? attrs.assetIds.map((id) => ({ id, asset: approved.find((a) => a.id === id) })) : approved.map((asset) => ({ id: asset.id, asset }));
  return (
    <div className="rounded-xl border border-black/10 bg-white p-5 text-[#1f1f1f]">
      <p className="text-lg font-semibold" style={{ fontFamily: 'var(--brand-heading-font)' }}>{attrs.title}</p>
      {chosen.length === 0 ? (
        editing ? <EmptyHint>Approve files on the Assets page and they are listed here.</EmptyHint> : <p className="mt-2 text-sm opacity-80">Files will be listed here once they are approved.</p>
      ) : (
        <ul className="mt-3 divide-y divide-black/10">
          {chosen.map(({ id, asset }) => {
            const href = asset ? safeAssetUrl(asset.url) : null;
            return (
              <li key={id} className="flex items-center justify-between gap-4 py-2 text-sm" data-asset-id={id}>
                {asset ? <span className="font-semibold">{asset.name}</span> : <span className="opacity-70">A file that is no longer approved</span>}
                {asset && <span className="opacity-70">{asset.format.toUpperCase()}</span>}
                {href && !editing && (
                  // download=1 asks for an attachment, so a phone saves the file instead of opening it in a tab.
                  <a className="font-semibold underline" href={`${href}${href.includes('?') ? '&' : '?'}download=1`} download>
                    Download<span className="sr-only"> {asset!.name}</span>
                  </a>
                )}
              </li>
            );
          })}
        </ul>
      )}
      <p className="mt-3 text-xs opacity-70">Downloads need a partner role or a share link that allows them.</p>
      <Note text={attrs.note} />
    </div>
  );
}
