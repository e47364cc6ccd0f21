// The typefaces by role with a specimen, and the type scale set in the brand's own fonts.
import type { TypographyAttrs } from './definition';
import { fontStack, typefaceForRole } from '@/lib/guideline/identity';
import type { IdentityTypeface, TypefaceRole } from '@/lib/identity/types';
import { EmptyHint, Missing, type BlockRenderProps } from '@/components/guideline/parts';

const ROLE_LABELS: Record<TypefaceRole, string> = { heading: 'Headings', body: 'Running text', accent: 'Accents' };
const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ abcdefghijklmnopqrstuvwxyz 0123456789 & ! ? “ ” ‘ ’ —';
const num = (n: number, places = 2) => String(Math.round(n * 10 ** places) / 10 ** places);

function Face({ face, role, attrs }: { face: IdentityTypeface; role: TypefaceRole; attrs: TypographyAttrs }) {
  const family = fontStack(face, role === 'body' ? 'serif' : 'sans-serif');
  return (
    <li className="rounded-xl border border-black/10 bg-white p-5 text-[#1f1f1f]" data-typeface={face.id}>
      <p className="text-xs font-semibold uppercase tracking-wider opacity-70">{ROLE_LABELS[role]}</p>
      <p className="mt-1 text-4xl leading-tight" style={{ fontFamily: family }}>
        {face.family}
      </p>
      <p className="mt-1 text-sm opacity-80">Weights {face.weights.join(', ')}</p>
      {attrs.showSpecimen ? (
        <>
          <p className="mt-4 text-2xl leading-snug" style={{ fontFamily: family }}>
            {attrs.specimenText}
          </p>
          <p className="mt-3 break-words text-base leading-relaxed opacity-90" style={{ fontFamily: family }}>
            {ALPHABET}
          </p>
        </>
      ) : null}
    </li>
  );
}

export function Render({ attrs, identity, mode, editing }: BlockRenderProps<TypographyAttrs>) {
  const scale = identity.typeScale;
  if (attrs.roles.length === 0 && !attrs.showScale) return editing ? <EmptyHint>Choose the typefaces or the scale to show.</EmptyHint> : null;
  return (
    <div className="grid gap-6">
      {attrs.roles.length > 0 ? (
        <ul className={`grid gap-4 ${mode === 'print' ? 'grid-cols-2' : 'md:grid-cols-2'}`}>
          {attrs.roles.map((role) => {
            const face = typefaceForRole(identity, role);
            if (face) return <Face key={role} face={face} role={role} attrs={attrs} />;
            return role === 'accent' && !editing ? null : (
              <li key={role}>
                <Missing what="typeface" detail={ROLE_LABELS[role]} />
              </li>
            );
          })}
        </ul>
      ) : null}
      {attrs.showScale && scale.steps.length > 0 ? (
        // A table where it has room; in a column narrower than ~600 px each step folds into a card of two lines.
        <div className="@container overflow-hidden rounded-xl border border-black/10 bg-white text-[#1f1f1f]">
          <table className="w-full text-left text-sm @max-[37.5rem]:block">
            <caption className="px-4 pt-4 text-left text-sm @max-[37.5rem]:block">
              Type scale: {num(scale.basePx)} px base, ratio {num(scale.ratio, 3)} ({scale.ratioName.replace(/-/g, ' ')})
              {scale.measure ? `; running text sets about ${Math.round(scale.measure.charsPerLine)} characters per line at ${scale.columnPx} px` : ''}.
            </caption>
            <thead className={`border-b border-black/10 text-xs uppercase tracking-wider text-[#595959] ${mode === 'print' ? '' : '@max-[37.5rem]:sr-only'}`}>
              {mode === 'print' ? (
                <tr>
                  <th scope="col" className="w-[32%] px-4 py-2">Style, size, line height</th>
                  <th scope="col" className="px-4 py-2">Sample</th>
                </tr>
              ) : (
                <tr>
                  <th scope="col" className="px-4 py-2">Style</th>
                  <th scope="col" className="px-4 py-2">Size</th>
                  <th scope="col" className="px-4 py-2">Line height</th>
                  <th scope="col" className="px-4 py-2">Sample</th>
                </tr>
              )}
            </thead>
            <tbody className="@max-[37.5rem]:mt-3 @max-[37.5rem]:block @max-[37.5rem]:border-t @max-[37.5rem]:border-black/10">
              {[...scale.steps].sort((a, b) => b.step - a.step).map((step) => {
                const face = typefaceForRole(identity, step.role);
                const size = `${num(step.px)} px · ${num(step.rem, 3)} rem · ${num(step.pt)} pt`;
                const sample = (
                  <td className="px-4 py-3" style={{ fontFamily: fontStack(face), fontSize: `${step.px}px`, lineHeight: step.lineHeight, overflowWrap: 'anywhere' }} data-sample="scale">
                    {attrs.specimenText.split(' ').slice(0, 4).join(' ')}
                  </td>
                );
                // On paper the sample gets the measure's width at its true size and wraps; it is never clipped.
                if (mode === 'print') return (
                  <tr key={step.step} className="border-b border-black/5 align-baseline last:border-0" data-step={step.step}>
                    <th scope="row" className="px-4 py-3 font-semibold">
                      {step.name}
                      <span className="mt-0.5 block font-mono text-[0.7rem] font-normal">{size}</span>
                      <span className="block font-mono text-[0.7rem] font-normal">line height {num(step.lineHeight)}</span>
                    </th>
                    {sample}
                  </tr>
                );
                return (
                  <tr key={step.step} className="border-b border-black/5 align-baseline last:border-0 @max-[37.5rem]:flex @max-[37.5rem]:flex-wrap @max-[37.5rem]:items-baseline @max-[37.5rem]:gap-x-3 @max-[37.5rem]:px-4 @max-[37.5rem]:py-3" data-step={step.step}>
                    <th scope="row" className="whitespace-nowrap px-4 py-3 font-semibold @max-[37.5rem]:p-0">{step.name}</th>
                    <td className="whitespace-nowrap px-4 py-3 font-mono text-xs @max-[37.5rem]:p-0">
                      {num(step.px)} px · {num(step.rem, 3)} rem · {num(step.pt)} pt
                    </td>
                    <td className="whitespace-nowrap px-4 py-3 font-mono text-xs @max-[37.5rem]:p-0">
                      <span aria-hidden="true" className="hidden font-sans @max-[37.5rem]:inline">line height </span>
                      {num(step.lineHeight)}
                    </td>
                    {/* One line per step, cut at the column's edge, as a specimen sheet sets it. */}
                    <td className="w-full max-w-0 overflow-hidden whitespace-nowrap px-4 py-3 @max-[37.5rem]:max-w-full @max-[37.5rem]:px-0 @max-[37.5rem]:pb-0 @max-[37.5rem]:pt-1" data-scale-sample style={{ fontFamily: fontStack(face), fontSize: `${step.px}px`, lineHeight: step.lineHeight }}>
                      {attrs.specimenText.split(' ').slice(0, 4).join(' ')}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
