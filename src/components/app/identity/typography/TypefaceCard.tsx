// One typeface: a specimen in the real font, its metrics, its fallback stack and (for uploads) the licence confirmation.
import { When } from '@/components/ui/When';
import type { IdentityTypeface } from '@/lib/identity/types';
import { messageOf, type NoticeState } from '../shared';
import { FallbackFonts } from './FallbackFonts';
import { stackOf, useFontFace } from './font-face';
import { ROLE_LABEL } from './labels';
import { useRemoveTypeface, useUpdateTypeface } from './typography.queries';

const SPECIMEN = 'Quiet harbours, bright kites & 24 jars of quince jam.';

export function TypefaceCard({ brandId, face, canEdit, onNotice }: { brandId: string; face: IdentityTypeface; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const { family, state } = useFontFace(face);
  const patch = useUpdateTypeface(brandId, face.id);
  const remove = useRemoveTypeface(brandId, face.id, {
    onSuccess: () => onNotice({ kind: 'ok', text: `${face.family} removed.` }),
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The typeface could not be removed.') }),
  });
  const m = face.metrics;
  const weights = m.isVariable ? `${m.weight.min}–${m.weight.max} (variable)` : String(m.weight.default);
  return (
    <li className="panel overflow-hidden">
      <div className="border-b border-rule px-5 py-5" style={{ fontFamily: stackOf(family, face) }}>
        <p className="eyebrow" style={{ fontFamily: 'var(--font-sans)' }}>{ROLE_LABEL[face.role]} · {face.source === 'shipped' ? 'shipped open font' : 'uploaded'}</p>
        <p className="mt-2 text-5xl leading-tight text-ink">{face.family}</p>
        <p className="mt-2 text-xl text-ink-soft">{SPECIMEN}</p>
        {state === 'loading' && <p className="mt-2 text-xs text-ink-faint" role="status" style={{ fontFamily: 'var(--font-sans)' }}>Loading the font for preview…</p>}
        {state === 'failed' && <p className="mt-2 text-xs text-danger" role="alert" style={{ fontFamily: 'var(--font-sans)' }}>The font file could not be loaded for preview; the fallback stack is shown.</p>}
      </div>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 px-5 py-3 text-sm sm:grid-cols-4">
        <div><dt className="text-xs text-ink-faint">Weights</dt><dd>{weights}</dd></div>
        <div><dt className="text-xs text-ink-faint">Units per em</dt><dd className="font-mono">{m.unitsPerEm}</dd></div>
        <div><dt className="text-xs text-ink-faint">x-height</dt><dd className="font-mono">{m.xHeight}</dd></div>
        <div><dt className="text-xs text-ink-faint">Cap height</dt><dd className="font-mono">{m.capHeight}</dd></div>
      </dl>
      <div className="space-y-4 border-t border-rule px-5 py-4">
        {canEdit ? (
          <FallbackFonts face={face} patch={patch} />
        ) : (
          <p className="text-sm text-ink-soft">Fallback: <span className="font-mono">{face.fallback.join(', ') || 'none'}</span></p>
        )}
        {face.source === 'shipped' ? (
          <p className="text-sm text-ink-soft">Licence: SIL Open Font License 1.1 — it allows embedding on web pages; Plumbline ships the file.</p>
        ) : (
          <div className={`rounded-md px-3 py-2.5 text-sm ${face.licence.confirmed ? 'bg-paper' : 'bg-warn-wash'}`}>
            <label className="flex items-start gap-2.5">
              <input
                type="checkbox"
                className="mt-1 h-4 w-4 accent-plumb"
                checked={face.licence.confirmed}
                disabled={!canEdit || patch.isPending}
                onChange={(e) => patch.mutate({ licenceConfirmed: e.target.checked }, { onError: (err) => onNotice({ kind: 'error', text: messageOf(err, 'The licence could not be saved.') }) })}
              />
              <span>
                <span className="font-semibold">The licence allows this font on the web.</span>{' '}
                {face.licence.confirmed
                  ? <>Confirmed{face.licence.confirmedAt ? <> on <When value={face.licence.confirmedAt} /></> : ''}: published pages serve this font.</>
                  : 'Until this is ticked, published pages show the fallback fonts instead.'}
              </span>
            </label>
          </div>
        )}
        {canEdit && (
          <button
            type="button"
            className="btn-danger px-3 py-1.5"
            disabled={remove.isPending}
            onClick={() => { if (confirm(`Remove ${face.family} from the ${ROLE_LABEL[face.role].toLowerCase()} role?`)) remove.mutate(); }}
          >
            {remove.isPending ? 'Removing…' : 'Remove typeface'}
          </button>
        )}
      </div>
    </li>
  );
}
