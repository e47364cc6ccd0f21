// Every step of the type scale in the brand's own fonts, and the measure: characters per line at the column width.
import type { Identity } from '@/lib/identity/types';
import { stackOf, useFontFace } from './font-face';

const RUNNING_TEXT =
  'Set in the brand’s body face at the base size, this paragraph runs at the column width the measure is computed for. ' +
  'Read a few lines: the eye should find the start of each new line without hunting for it, and the rhythm of words should ' +
  'feel even. If the lines feel long, narrow the column or raise the size; if they feel choppy, widen it.';

const VERDICT: Record<'too-short' | 'comfortable' | 'too-long', string> = {
  'too-short': 'short — lines break often; widen the column or lower the size',
  comfortable: 'comfortable',
  'too-long': 'long — readers may lose their place; narrow the column or raise the size',
};

export function ScalePreview({ identity }: { identity: Identity }) {
  const heading = identity.typefaces.find((f) => f.role === 'heading') ?? identity.typefaces[0];
  const body = identity.typefaces.find((f) => f.role === 'body') ?? identity.typefaces[0];
  const h = useFontFace(heading);
  const b = useFontFace(body);
  const scale = identity.typeScale;
  const m = scale.measure;
  return (
    <div className="min-w-0 space-y-6">
      <ol className="panel divide-y divide-rule" aria-label="Type scale preview">
        {scale.steps.map((s) => {
          const face = s.role === 'heading' ? heading : body;
          const fam = s.role === 'heading' ? h.family : b.family;
          return (
            <li key={s.step} className="grid gap-x-5 gap-y-1 px-5 py-4 md:grid-cols-[8.5rem_1fr]">
              <div className="text-xs leading-5 text-ink-soft">
                <p className="font-semibold text-ink">{s.name} <span className="font-normal text-ink-faint">· step {s.step > 0 ? `+${s.step}` : s.step}</span></p>
                <p className="font-mono">{s.px} px · {s.rem} rem · {s.pt} pt</p>
                <p>line height {s.lineHeight} · {face?.family ?? 'no typeface yet'}</p>
              </div>
              <p className="min-w-0 overflow-hidden text-ellipsis break-words text-ink" style={{ fontFamily: stackOf(fam, face), fontSize: `${s.px}px`, lineHeight: s.lineHeight, fontWeight: s.role === 'heading' ? 600 : 400 }}>
                {s.step > 0 ? 'Roasted by the river' : 'Every bag carries the date it was roasted and the farm it came from.'}
              </p>
            </li>
          );
        })}
      </ol>
      <section className="panel p-5" aria-labelledby="measure-title">
        <h3 id="measure-title" className="font-semibold">Measure</h3>
        {m ? (
          <p className="mt-1 text-sm" data-measure={m.charsPerLine}>
            At a {scale.columnPx} px column and {scale.basePx} px body text, about <strong className="font-mono">{m.charsPerLine}</strong> characters per line:{' '}
            <strong className={m.verdict === 'comfortable' ? 'text-ok' : 'text-warn'}>{VERDICT[m.verdict]}</strong>. A comfortable single column holds {m.range.min}–{m.range.max} characters,
            about {m.range.ideal} being ideal (Bringhurst, <cite>The Elements of Typographic Style</cite>). Counted from the body font’s own character widths.
          </p>
        ) : (
          <p className="mt-1 text-sm text-ink-soft">Add a body typeface to see how many characters fit on a line at this column width.</p>
        )}
        <div className="mt-4 overflow-x-auto" tabIndex={0} role="region" aria-label="Running text at the column width, scrollable">
          <p
            className="border-x border-dashed border-rule-strong text-ink"
            style={{ width: `${scale.columnPx}px`, maxWidth: 'none', fontFamily: stackOf(b.family, body), fontSize: `${scale.basePx}px`, lineHeight: scale.bodyLineHeight }}
          >
            {RUNNING_TEXT}
          </p>
        </div>
      </section>
    </div>
  );
}
