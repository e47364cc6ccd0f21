// How the palette reads on itself: the WCAG 2.2 contrast matrix, APCA as a second opinion, the nearest passing
// shade for failing pairs, colours too close to tell apart, and colour-vision previews.
import { useMutation, useQuery } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { api } from '@/lib/client/api';
import { APCA_CAUTION, COLOR_VISION_CAUTION, CONTRAST_CAUTION } from '@/lib/cautions';
import { WCAG_THRESHOLDS } from '@/lib/color/contrast';
import { nearestPassing } from '@/lib/color/nearest';
import { NEAR_DUPLICATE_DELTA_E, type PalettePair, type PaletteReport } from '@/lib/color/palette';
import { COLOR_VISION_KINDS, type ColorVisionKind } from '@/lib/color/vision';
import { formatNumber, SITE_LOCALE } from '@/lib/format';
import type { IdentityColor } from '@/lib/identity/types';
import { Caution, IdentityRoot, inkOn, LoadState, messageOf, Notice, reportKey, useIdentity, useRefreshIdentity } from './shared';

/** Ratios and ΔE with fixed decimals, in the site's locale so the server's render and the browser's agree. */
const decimals = (value: number, digits: number) => formatNumber(value, SITE_LOCALE, digits);

const LEVELS: { key: 'aa' | 'aaLarge' | 'aaa' | 'nonText'; label: string; need: number }[] = [
  { key: 'aa', label: 'AA', need: WCAG_THRESHOLDS.aa },
  { key: 'aaLarge', label: 'AA large', need: WCAG_THRESHOLDS.aaLarge },
  { key: 'aaa', label: 'AAA', need: WCAG_THRESHOLDS.aaa },
  { key: 'nonText', label: 'Non-text', need: WCAG_THRESHOLDS.nonText },
];

const VISION_LABEL: Record<ColorVisionKind, string> = {
  protanopia: 'Protanopia (no red cones)',
  deuteranopia: 'Deuteranopia (no green cones)',
  tritanopia: 'Tritanopia (no blue cones)',
};

/** A swatch with its name, used as a row or column heading. */
function ColorLabel({ color }: { color: IdentityColor }) {
  return (
    <span className="flex items-center gap-2">
      <span aria-hidden="true" className="h-5 w-5 shrink-0 rounded border border-rule-strong" style={{ background: color.hex }} />
      <span className="min-w-0">
        <span className="block truncate font-semibold text-ink">{color.name}</span>
        <span className="block font-mono text-[0.7rem] font-normal text-ink-faint">{color.hex}</span>
      </span>
    </span>
  );
}

function PairCell({ pair, fg, bg, selected, onPick }: { pair: PalettePair; fg: IdentityColor; bg: IdentityColor; selected: boolean; onPick: () => void }) {
  return (
    <td className={`min-w-[7.5rem] border border-rule p-0 align-top ${selected ? 'ring-2 ring-inset ring-plumb' : ''}`} data-fg={fg.hex} data-bg={bg.hex}>
      {/* The pair as it looks, failing or not: a sample beside its verdict (incidental text, WCAG 2.2 SC 1.4.3). */}
      <div className="flex h-12 items-center justify-center text-2xl font-semibold" style={{ background: bg.hex, color: fg.hex }} aria-hidden="true" data-sample="contrast">
        Aa
      </div>
      <div className="px-2 py-2">
        <p className="font-mono text-base font-semibold text-ink" data-ratio>
          {decimals(pair.ratio, 2)}<span className="text-xs font-normal text-ink-soft">:1</span>
        </p>
        <ul className="mt-1 space-y-0.5 text-xs">
          {LEVELS.map((l) => (
            <li key={l.key} className={pair[l.key] ? 'text-ok' : 'text-danger'} data-level={l.key}>
              <span aria-hidden="true" className="inline-block w-3.5 font-bold">{pair[l.key] ? '✓' : '✕'}</span>
              {l.label} {pair[l.key] ? 'pass' : 'fail'}
            </li>
          ))}
        </ul>
        <p className="mt-1 text-xs text-ink-faint" title="APCA lightness contrast, a second opinion">APCA Lc {Math.round(pair.apca)}</p>
        {!pair.aa && (
          <button type="button" className="mt-1.5 text-left text-xs font-semibold text-plumb underline-offset-2 hover:underline" onClick={onPick} aria-pressed={selected}>
            Nearest passing shade
          </button>
        )}
      </div>
    </td>
  );
}

/** The nearest tint or shade of the text colour that reaches AA on the chosen background, with a one-click add. */
function PassingShade({ brandId, fg, bg, canEdit, onClose }: { brandId: string; fg: IdentityColor; bg: IdentityColor; canEdit: boolean; onClose: () => void }) {
  const refresh = useRefreshIdentity(brandId);
  const [notice, setNotice] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const shade = useMemo(() => nearestPassing(fg.hex, bg.hex, WCAG_THRESHOLDS.aa), [fg.hex, bg.hex]);
  const name = `${fg.name} on ${bg.name}`.slice(0, 80);
  const add = useMutation({
    mutationFn: (hex: string) => api<{ color: IdentityColor }>(`/api/brands/${brandId}/colors`, { method: 'POST', body: { name, value: hex, role: fg.role ?? null } }),
    onSuccess: async (r) => {
      setNotice({ kind: 'ok', text: `${r.color.name} (${r.color.hex}) added to the palette.` });
      await refresh();
    },
    onError: (e) => setNotice({ kind: 'error', text: messageOf(e, 'The colour could not be added.') }),
  });
  return (
    <section className="rounded-xl border border-rule bg-paper/60 p-5" aria-label="Nearest passing shade" aria-live="polite">
      <div className="flex items-start justify-between gap-4">
        <h4 className="font-semibold">
          {fg.name} text on {bg.name}: the nearest shade that passes AA ({WCAG_THRESHOLDS.aa}:1)
        </h4>
        <button type="button" className="btn-quiet px-3 py-1" onClick={onClose}>Close</button>
      </div>
      {shade === null ? (
        <p className="mt-3 text-ink-soft">
          No tint or shade of {fg.name} reaches {WCAG_THRESHOLDS.aa}:1 on {bg.name}. Pair {bg.name} with a much darker or lighter text colour instead.
        </p>
      ) : (
        <div className="mt-4 flex flex-wrap items-center gap-5">
          <div className="flex overflow-hidden rounded-lg border border-rule-strong" aria-hidden="true" data-sample="contrast">
            <span className="flex h-16 w-28 items-center justify-center text-xl font-semibold" style={{ background: bg.hex, color: fg.hex }}>Aa</span>
            <span className="flex h-16 w-28 items-center justify-center text-xl font-semibold" style={{ background: bg.hex, color: shade.hex }}>Aa</span>
          </div>
          <div className="text-sm">
            <p>
              Now <span className="font-mono">{fg.hex}</span> · {' '}
              <strong>suggested <span className="font-mono">{shade.hex}</span></strong> at <span className="font-mono">{decimals(shade.ratio, 2)}:1</span>
            </p>
            <p className="text-ink-soft">Same hue, lightness moved in OKLCH until the ratio is reached.</p>
          </div>
          {canEdit && (
            <button type="button" className="btn-primary" disabled={add.isPending || add.isSuccess} onClick={() => add.mutate(shade.hex)}>
              {add.isPending ? 'Adding…' : add.isSuccess ? 'Added' : `Add ${shade.hex} as a new colour`}
            </button>
          )}
        </div>
      )}
      <div className="mt-3"><Notice notice={notice} /></div>
    </section>
  );
}

function Report({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  const identity = useIdentity(brandId);
  const report = useQuery({ queryKey: reportKey(brandId), queryFn: () => api<PaletteReport>(`/api/brands/${brandId}/palette-report`) });
  const [picked, setPicked] = useState<{ fg: string; bg: string } | null>(null);

  if (!identity.data) return <LoadState query={identity} what="palette" />;
  const colors = identity.data.colors;
  if (colors.length < 2)
    return (
      <div className="rounded-xl border border-rule bg-paper/60 px-6 py-10 text-center">
        <p className="text-lg font-semibold">Nothing to compare yet</p>
        <p className="mt-1 text-ink-soft">Add at least two colours to the palette above to see how each reads on the others.</p>
      </div>
    );
  if (!report.data) return <LoadState query={report} what="contrast report" />;

  const byId = new Map(colors.map((c) => [c.id, c]));
  const pairOf = new Map(report.data.pairs.map((p) => [`${p.foreground.id}:${p.background.id}`, p]));
  // The report may lag a moment behind the palette; show only colours it already covers.
  const shown = colors.filter((c) => report.data.colorVision[c.id]);
  const pickedFg = picked && byId.get(picked.fg);
  const pickedBg = picked && byId.get(picked.bg);

  return (
    <div className="space-y-8">
      <Caution title="Contrast is guidance, not certification">{CONTRAST_CAUTION}</Caution>

      <div>
        <p className="mb-3 text-sm text-ink-soft">
          Rows are text colours, columns are backgrounds. Thresholds (WCAG 2.2): AA {WCAG_THRESHOLDS.aa}:1 for body text, AA large {WCAG_THRESHOLDS.aaLarge}:1 for
          text from 24 px (or 18.66 px bold), AAA {WCAG_THRESHOLDS.aaa}:1, non-text {WCAG_THRESHOLDS.nonText}:1 for icons, borders and controls.
        </p>
        <div className="overflow-x-auto rounded-xl border border-rule" aria-busy={report.isFetching}>
          <table className="border-collapse text-left text-sm" aria-label="Contrast of text colours on background colours">
            <thead>
              <tr>
                <th scope="col" className="sticky left-0 z-10 min-w-[8.5rem] border border-rule bg-card px-3 py-2 text-xs font-semibold text-ink-faint">
                  Text ↓ · Background →
                </th>
                {shown.map((bg) => (
                  <th key={bg.id} scope="col" className="border border-rule bg-card px-2 py-2 font-normal"><ColorLabel color={bg} /></th>
                ))}
              </tr>
            </thead>
            <tbody>
              {shown.map((fg) => (
                <tr key={fg.id}>
                  <th scope="row" className="sticky left-0 z-10 border border-rule bg-card px-3 py-2 font-normal"><ColorLabel color={fg} /></th>
                  {shown.map((bg) => {
                    const pair = pairOf.get(`${fg.id}:${bg.id}`);
                    if (fg.id === bg.id || !pair)
                      return (
                        <td key={bg.id} className="border border-rule bg-paper/70 text-center text-xs text-ink-faint">
                          {fg.id === bg.id ? 'same colour' : '…'}
                        </td>
                      );
                    return (
                      <PairCell
                        key={bg.id}
                        pair={pair}
                        fg={fg}
                        bg={bg}
                        selected={picked?.fg === fg.id && picked?.bg === bg.id}
                        onPick={() => setPicked({ fg: fg.id, bg: bg.id })}
                      />
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="mt-2 text-xs text-ink-soft">{APCA_CAUTION}</p>
      </div>

      {pickedFg && pickedBg && <PassingShade key={`${pickedFg.id}:${pickedBg.id}`} brandId={brandId} fg={pickedFg} bg={pickedBg} canEdit={canEdit} onClose={() => setPicked(null)} />}

      <section aria-labelledby="near-dup-title">
        <h3 id="near-dup-title" className="text-lg font-semibold">Colours too close to tell apart</h3>
        {report.data.nearDuplicates.length === 0 ? (
          <p className="mt-1 text-sm text-ink-soft">
            None: every pair differs by at least ΔE2000 {NEAR_DUPLICATE_DELTA_E}, enough to tell them apart side by side (a rule of thumb).
          </p>
        ) : (
          <ul className="mt-2 space-y-2">
            {report.data.nearDuplicates.map((d) => {
              const a = byId.get(d.a);
              const b = byId.get(d.b);
              if (!a || !b) return null;
              return (
                <li key={`${d.a}:${d.b}`} className="flex flex-wrap items-center gap-3 rounded-lg bg-warn-wash px-4 py-2.5 text-sm">
                  <span className="flex overflow-hidden rounded border border-rule-strong" aria-hidden="true">
                    <span className="h-7 w-10" style={{ background: a.hex }} />
                    <span className="h-7 w-10" style={{ background: b.hex }} />
                  </span>
                  <span>
                    <strong>{a.name}</strong> and <strong>{b.name}</strong> differ by only ΔE2000 {decimals(d.deltaE2000, 1)} (below {NEAR_DUPLICATE_DELTA_E}): readers may take
                    them for the same colour. Merge them, or move one further apart.
                  </span>
                </li>
              );
            })}
          </ul>
        )}
      </section>

      <section aria-labelledby="vision-title">
        <h3 id="vision-title" className="text-lg font-semibold">Colour-vision previews</h3>
        <p className="mt-1 text-sm text-ink-soft">{COLOR_VISION_CAUTION}</p>
        {/* A wide table scrolls on its own; focusable so a keyboard can scroll it too. */}
        <div className="mt-3 overflow-x-auto" tabIndex={0} role="region" aria-label="Colour-vision previews, scrollable">
          <table className="w-full border-separate border-spacing-1 text-left text-sm" aria-label="The palette as seen with each colour-vision deficiency">
            <thead>
              <tr className="text-xs text-ink-faint">
                <th scope="col" className="px-1 py-1 font-semibold">Colour</th>
                <th scope="col" className="px-1 py-1 font-semibold">As designed</th>
                {COLOR_VISION_KINDS.map((k) => <th key={k} scope="col" className="px-1 py-1 font-semibold">{VISION_LABEL[k]}</th>)}
              </tr>
            </thead>
            <tbody>
              {shown.map((c) => (
                <tr key={c.id}>
                  <th scope="row" className="pr-3 font-semibold">{c.name}</th>
                  {[c.hex, ...COLOR_VISION_KINDS.map((k) => report.data.colorVision[c.id][k])].map((hex, i) => (
                    <td key={i} className="min-w-[7rem]">
                      <span className="flex h-12 items-end rounded-md border border-black/10 px-2 py-1 font-mono text-[0.7rem]" style={{ background: hex, color: inkOn(hex) }}>{hex}</span>
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}

export default function ContrastReport({ brandId, canEdit }: { brandId: string; canEdit: boolean }) {
  return (
    <IdentityRoot>
      <Report brandId={brandId} canEdit={canEdit} />
    </IdentityRoot>
  );
}
