// One palette route as the designer and the client both see it: its colours, why, and how text reads on its grounds.
import type { ReactNode } from 'react';
import { VERDICT_WORDS, type ContrastVerdict, type RouteView } from '@/lib/palette-routes/views';

const VERDICT_STYLE: Record<ContrastVerdict, string> = {
  AAA: 'bg-ok/10 text-ok',
  AA: 'bg-ok/10 text-ok',
  'AA large': 'bg-warn-wash text-warn',
  fails: 'bg-danger-wash text-danger',
};

export function PaletteRouteCard({ route, label, chosen = false, children }: { route: RouteView; label: string; chosen?: boolean; children?: ReactNode }) {
  const byId = new Map(route.colors.map((c) => [c.id, c]));
  return (
    <article className={`panel flex flex-col px-5 py-5 ${chosen ? 'ring-2 ring-plumb' : ''}`} aria-labelledby={`route-${route.id}`}>
      <p className="eyebrow">{label}{chosen ? ' · chosen' : ''}</p>
      <h3 id={`route-${route.id}`} className="mt-1 text-xl font-bold">{route.name}</h3>
      {route.rationale && <p className="mt-2 whitespace-pre-line text-sm text-ink-soft">{route.rationale}</p>}
      <div className="mt-4 flex h-16 overflow-hidden rounded-md border border-rule" role="img" aria-label={`The colours of ${route.name}: ${route.colors.map((c) => c.name).join(', ')}`}>
        {route.colors.map((c) => <span key={c.id} className="h-full flex-1" style={{ background: c.hex }} />)}
      </div>
      <ul className="mt-3 grid grid-cols-2 gap-x-4 gap-y-2 sm:grid-cols-3" aria-label={`Colours of ${route.name}`}>
        {route.colors.map((c) => (
          <li key={c.id} className="flex items-start gap-2">
            <span className="mt-0.5 size-4 shrink-0 rounded-sm border border-rule" style={{ background: c.hex }} aria-hidden="true" />
            <span className="min-w-0">
              <span className="block truncate text-sm font-semibold">{c.name}</span>
              <span className="block font-mono text-xs text-ink-soft">{c.hex}{c.role ? ` · ${c.role}` : ''}</span>
            </span>
          </li>
        ))}
      </ul>
      <table className="mt-4 w-full text-left text-sm">
        <caption className="text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">Text on its grounds (WCAG 2.2)</caption>
        <thead className="sr-only"><tr><th>Sample</th><th>Text colour on ground</th><th>Contrast ratio</th><th>Level</th></tr></thead>
        <tbody className="divide-y divide-rule">
          {route.contrast.map((p) => {
            const text = byId.get(p.text)!;
            const ground = byId.get(p.ground)!;
            return (
              <tr key={`${p.text}/${p.ground}`}>
                <td className="py-1.5 pr-2"><span className="inline-block rounded px-2 py-0.5 font-bold" style={{ color: text.hex, background: ground.hex }} aria-hidden="true" data-sample="contrast">Aa</span></td>
                <td className="py-1.5 pr-2">{text.name} <span className="text-ink-soft">on</span> {ground.name}</td>
                <td className="py-1.5 pr-2 font-mono tabular-nums">{p.shown}:1</td>
                <td className="py-1.5"><span className={`rounded-full px-2 py-0.5 text-xs font-semibold ${VERDICT_STYLE[p.verdict]}`}>{VERDICT_WORDS[p.verdict]}</span></td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {route.clientComment && <p className="mt-3 rounded-md bg-plumb-wash px-3 py-2 text-sm text-plumb-deep">Client’s note: “{route.clientComment}”</p>}
      {children}
    </article>
  );
}
