// Colour pairs with their WCAG 2.2 contrast ratio and a verdict per level.
import { CONTRAST_CAUTION } from '@/lib/cautions';
import { contrastRatio, wcagLevels, type WcagLevels } from '@/lib/color/contrast';
import type { ContrastPairsAttrs } from './definition';
import { findColor } from '@/lib/guideline/identity';
import { Caution, EmptyHint, Missing, Note, safeHex, type BlockRenderProps } from '@/components/guideline/parts';

/** The levels we show, in our own words, with the WCAG 2.2 criterion each comes from. */
export const CONTRAST_LEVELS: { key: keyof WcagLevels; label: string; criterion: string }[] = [
  { key: 'aa', label: 'AA text', criterion: 'SC 1.4.3, 4.5:1' },
  { key: 'aaLarge', label: 'AA large text', criterion: 'SC 1.4.3, 3:1' },
  { key: 'aaa', label: 'AAA text', criterion: 'SC 1.4.6, 7:1' },
  { key: 'aaaLarge', label: 'AAA large text', criterion: 'SC 1.4.6, 4.5:1' },
  { key: 'nonText', label: 'Icons and controls', criterion: 'SC 1.4.11, 3:1' },
];

/** The ratio cut (not rounded) to two decimals, so a near miss never reads as a pass. */
export const formatRatio = (ratio: number) => `${(Math.floor(ratio * 100) / 100).toFixed(2)}:1`;

export function Render({ attrs, identity, editing }: BlockRenderProps<ContrastPairsAttrs>) {
  if (attrs.pairs.length === 0) return editing ? <EmptyHint>Add colour pairs to check their contrast.</EmptyHint> : null;
  return (
    <div>
      <ul className="grid gap-3">
        {attrs.pairs.map((pair) => {
          const fg = findColor(identity, pair.foreground);
          const bg = findColor(identity, pair.background);
          const key = `${pair.foreground}/${pair.background}`;
          if (!fg || !bg) return <li key={key}><Missing what="colour" detail="One colour of this pair is gone, so its contrast cannot be checked." /></li>;
          const ratio = contrastRatio(fg.hex, bg.hex);
          const levels = wcagLevels(ratio);
          return (
            <li key={key} className="grid items-center gap-4 rounded-xl border border-black/10 bg-white p-3 text-[#1f1f1f] sm:grid-cols-[8rem_1fr]" data-pair={key}>
              <div
                className="flex h-20 items-center justify-center rounded-lg text-2xl font-semibold"
                style={{ color: safeHex(fg.hex, '#000000'), backgroundColor: safeHex(bg.hex, '#ffffff'), fontFamily: 'var(--brand-heading-font)' }}
                aria-hidden="true"
                data-sample="contrast"
              >
                Aa
              </div>
              <div>
                <p className="text-sm">
                  <strong>{fg.name}</strong> on <strong>{bg.name}</strong>
                  <span className="ml-2 font-mono text-base font-semibold" data-ratio>
                    {formatRatio(ratio)}
                  </span>
                </p>
                <ul className="mt-2 flex flex-wrap gap-1.5" aria-label="WCAG 2.2 results">
                  {CONTRAST_LEVELS.map((level) => (
                    <li
                      key={level.key}
                      data-level={level.key}
                      data-pass={levels[level.key] ? 'yes' : 'no'}
                      title={level.criterion}
                      className={`rounded-full px-2.5 py-0.5 text-xs font-semibold ${levels[level.key] ? 'bg-[#e3f1e5] text-[#1f5a2a]' : 'bg-[#f8e5e3] text-[#8f241c]'}`}
                    >
                      {level.label}: {levels[level.key] ? 'pass' : 'fail'}
                    </li>
                  ))}
                </ul>
              </div>
            </li>
          );
        })}
      </ul>
      <Note text={attrs.note} />
      <Caution>{CONTRAST_CAUTION}</Caution>
    </div>
  );
}
