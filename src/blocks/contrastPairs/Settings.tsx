// Settings of the contrast pairs: add, change and remove text-on-ground pairs.
import type { ReactNodeViewProps } from '@tiptap/react';
import type { ContrastPair, ContrastPairsAttrs } from './definition';
import { suggestedPairs } from '@/lib/guideline/templates';
import { colorsInOrder } from '@/lib/guideline/identity';
import { BlockFrame } from '@/components/editor/blocks/BlockFrame';
import { ColorSelect, Select, TextInput } from '@/components/editor/blocks/controls';
import { useIdentity } from '@/components/editor/IdentityContext';

export function Settings(props: ReactNodeViewProps) {
  const identity = useIdentity();
  const a = props.node.attrs as ContrastPairsAttrs;
  const set = (patch: Partial<ContrastPairsAttrs>) => props.updateAttributes(patch);
  const change = (i: number, patch: Partial<ContrastPair>) => set({ pairs: a.pairs.map((p, j) => (j === i ? { ...p, ...patch } : p)) });
  const colors = colorsInOrder(identity);
  const add = () => {
    const taken = new Set(a.pairs.map((p) => `${p.foreground}/${p.background}`));
    const next = suggestedPairs(identity).find((p) => !taken.has(`${p.foreground}/${p.background}`));
    if (next) set({ pairs: [...a.pairs, next] });
    else if (colors.length >= 2) set({ pairs: [...a.pairs, { foreground: colors[0].id, background: colors[1].id }] });
  };
  return (
    <BlockFrame
      props={props}
      startOpen={a.pairs.length === 0}
      settings={
        <>
          {a.pairs.map((pair, i) => (
            <div key={i} className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_auto]">
              <ColorSelect label={`Pair ${i + 1}: text`} identity={identity} value={pair.foreground} onChange={(v) => v && change(i, { foreground: v })} noneLabel="Choose a colour" />
              <ColorSelect label={`Pair ${i + 1}: ground`} identity={identity} value={pair.background} onChange={(v) => v && change(i, { background: v })} noneLabel="Choose a colour" />
              <button type="button" className="btn-danger px-3 py-2" onClick={() => set({ pairs: a.pairs.filter((_, j) => j !== i) })} aria-label={`Remove pair ${i + 1}`}>
                Remove
              </button>
            </div>
          ))}
          <div>
            <button type="button" className="btn-quiet" onClick={add} disabled={colors.length < 2}>
              Add a pair
            </button>
            {colors.length < 2 ? <p className="hint">Add at least two colours to the identity to compare them.</p> : null}
          </div>
          <Select
            label="Level the brand claims for text"
            value={a.claim ?? 'AA'}
            options={[{ value: 'AA', label: 'WCAG 2.2 AA (4.5:1 for body text)' }, { value: 'AAA', label: 'WCAG 2.2 AAA (7:1 for body text)' }]}
            onChange={(claim) => set({ claim })}
            hint="Pairs below this level are listed in the check before publishing."
          />
          <TextInput label="Note (optional)" value={a.note} max={500} onChange={(note) => set({ note })} />
        </>
      }
    />
  );
}
