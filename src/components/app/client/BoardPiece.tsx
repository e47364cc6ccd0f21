// One piece of a mood board as everyone sees it: an image, a swatch, a type sample or a note.
import type { BoardItemView } from '@/lib/moodboards/views';
import { cssFontFamilyList } from '@/lib/safe/escape';
import { cleanTypefaceFamily } from '@/lib/safe/values';

export function BoardPiece({ item, imageUrl }: { item: BoardItemView; imageUrl: string }) {
  if (item.kind === 'image') {
    return <img src={imageUrl} alt={item.caption || 'Mood board image'} width={item.image!.width} height={item.image!.height} loading="lazy" className="aspect-[4/3] w-full rounded-md bg-paper object-cover" />;
  }
  if (item.kind === 'swatch') {
    return (
      <div>
        <div className="aspect-[4/3] w-full rounded-md border border-rule" style={{ background: item.swatch!.hex }} role="img" aria-label={`Colour swatch ${item.swatch!.name}, ${item.swatch!.hex}`} />
        <p className="mt-2 text-sm font-semibold">{item.swatch!.name}</p>
        <p className="font-mono text-xs text-ink-soft">{item.swatch!.hex}</p>
      </div>
    );
  }
  if (item.kind === 'type') {
    return (
      <div className="flex aspect-[4/3] flex-col justify-center rounded-md bg-paper px-4">
        <p className="text-2xl leading-tight" style={{ fontFamily: cssFontFamilyList([cleanTypefaceFamily(item.type!.family), 'serif']) }}>{item.type!.sample}</p>
        <p className="mt-2 text-xs text-ink-soft">{item.type!.family} (shown in this typeface only if your device has it)</p>
      </div>
    );
  }
  return <blockquote className="flex aspect-[4/3] items-center rounded-md bg-plumb-wash px-4 text-base text-plumb-deep">{item.caption}</blockquote>;
}
