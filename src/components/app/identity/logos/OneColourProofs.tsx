// One-colour proofs of one logo, the design-phase check: black on white, white on black (through the knockout, so
// inner shapes stay visible) and greyscale by relative luminance, with the touching colours that turn to the same grey.
import { useId } from 'react';
import { formatNumber, SITE_LOCALE } from '@/lib/format';
import { LIGHT_PARTS, LIGHT_PARTS_LABELS, type IdentityColor, type IdentityLogo, type LightParts } from '@/lib/identity/types';
import type { LogoProofs, ToneCollapse, TonePart } from '@/lib/logo/tones';
import { LoadState, messageOf, type NoticeState } from '../shared';
import { useLogoProofs, useUpdateLogo } from './logos.queries';

const ratio = (n: number) => `${formatNumber(Math.floor(n * 100) / 100, SITE_LOCALE, 2)}:1`;

/** The palette's name for a colour the logo is drawn in, when the brand has exactly that colour. */
const paletteName = (part: TonePart, colors: IdentityColor[]) => colors.find((c) => c.hex.toLowerCase() === part.hex.toLowerCase())?.name;

/** A colour in words: its palette name when the brand has it, and its hex. */
function colourName(part: TonePart, colors: IdentityColor[]): string {
  const named = paletteName(part, colors);
  return named ? `${named} (${part.hex})` : part.hex;
}

function ProofTile({ src, ground, label, alt }: { src: string; ground: string; label: string; alt: string }) {
  return (
    <figure className="overflow-hidden rounded-lg border border-rule">
      <div className="flex h-40 items-center justify-center" style={{ background: ground }}>
        <img src={src} alt={alt} className="max-h-full max-w-full object-contain" />
      </div>
      <figcaption className="border-t border-rule px-3 py-1.5 text-xs text-ink-soft">{label}</figcaption>
    </figure>
  );
}

function Swatch({ hex }: { hex: string }) {
  return <span aria-hidden="true" className="inline-block h-3.5 w-3.5 shrink-0 rounded-sm border border-rule-strong align-[-2px]" style={{ background: hex }} />;
}

function Collapse({ pair, colors }: { pair: ToneCollapse; colors: IdentityColor[] }) {
  return (
    <li>
      <Swatch hex={pair.a.hex} /> <span className="font-semibold">{colourName(pair.a, colors)}</span> and <Swatch hex={pair.b.hex} />{' '}
      <span className="font-semibold">{colourName(pair.b, colors)}</span> touch, and in grey they are only {ratio(pair.contrast)} apart (<Swatch hex={pair.a.grey} /> {pair.a.grey} and <Swatch hex={pair.b.grey} /> {pair.b.grey}).
    </li>
  );
}

/**
 * The designer's choice for the logo's light parts in one colour, with the other choice drawn small beside it, so it
 * is made by looking. Readers see the choice, not the buttons.
 */
function LightPartsChoice({ brandId, logo, proofs, colors, canEdit, onNotice }: { brandId: string; logo: IdentityLogo; proofs: LogoProofs; colors: IdentityColor[]; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const update = useUpdateLogo(brandId, logo.id, {
    onSuccess: (_r, { lightParts }) => onNotice({ kind: 'ok', text: `${logo.name}: light parts are now ${lightParts === 'ink' ? 'printed in the ink' : 'cut out'} in every one-colour version.` }),
    onError: (e) => onNotice({ kind: 'error', text: messageOf(e, 'The choice could not be saved.') }),
  });
  // The choice being saved shows as made; the proofs follow once it is stored.
  const current = (update.isPending ? update.variables?.lightParts : undefined) ?? proofs.lightParts;
  const light = proofs.lightColours.map((hex) => {
    const named = colors.find((c) => c.hex.toLowerCase() === hex.toLowerCase())?.name;
    return named ? `${named} (${hex})` : hex;
  });
  return (
    <fieldset className="rounded-lg bg-paper px-4 py-3" aria-describedby={`${id}-about`}>
      <legend className="float-left w-full text-sm font-semibold">Light parts in one colour</legend>
      <p id={`${id}-about`} className="clear-left pt-1 text-xs leading-relaxed text-ink-soft">
        {light.length ? (
          <>
            {light.length === 1 ? 'One colour of this logo is' : `${light.length} colours of this logo are`} too light to stand out from white (under 3:1, WCAG 2.2 SC
            1.4.11): {light.join(', ')}. In one colour they can be cut out or printed in the ink: your decision, used on the site, in the PDF, in patterns,
            mock-ups and downloads.
          </>
        ) : (
          'This logo has no light colours besides white, so both choices print the same; white parts always stay cut out.'
        )}
      </p>
      <div className="mt-2 grid gap-2 sm:grid-cols-2">
        {LIGHT_PARTS.map((choice: LightParts) => {
          const preview = choice === proofs.lightParts ? proofs.files.blackOnWhite : proofs.compare.blackOnWhite;
          return (
            <label key={choice} className={`flex items-center gap-3 rounded-md border px-3 py-2 text-sm ${choice === current ? 'border-plumb bg-white' : 'border-rule'}`}>
              <input
                type="radio"
                name={`${id}-light`}
                value={choice}
                checked={choice === current}
                disabled={!canEdit || update.isPending}
                onChange={() => update.mutate({ lightParts: choice })}
              />
              <img src={preview} alt={`${logo.name} in black with light parts ${choice === 'ink' ? 'printed in the ink' : 'cut out'}`} className="h-12 w-16 shrink-0 rounded border border-rule bg-white object-contain" />
              <span>
                <span className="block font-semibold">{LIGHT_PARTS_LABELS[choice].label}</span>
                <span className="block text-xs text-ink-soft">{LIGHT_PARTS_LABELS[choice].hint}</span>
              </span>
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}

export function OneColourProofs({ brandId, logo, colors, canEdit, onNotice }: { brandId: string; logo: IdentityLogo; colors: IdentityColor[]; canEdit: boolean; onNotice: (n: NoticeState) => void }) {
  const id = useId();
  const proofs = useLogoProofs(brandId, logo);
  return (
    <section aria-labelledby={`${id}-proofs`} className="space-y-3 border-t border-rule px-5 py-4">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h4 id={`${id}-proofs`} className="font-semibold">One-colour proofs</h4>
        {proofs.data && (
          <a className="text-sm font-semibold text-plumb hover:underline" href={`${proofs.data.files.sheet}?download=1`}>Download proof sheet (PNG)</a>
        )}
      </div>
      <p className="text-sm text-ink-soft">
        A logo should hold together before colour is added: in one ink on either ground, and in grey, where only lightness is left.
      </p>
      {!proofs.data ? (
        <LoadState query={proofs} what="proofs" />
      ) : (
        <>
          <div className="grid gap-3 sm:grid-cols-3">
            <ProofTile src={proofs.data.files.blackOnWhite} ground="#ffffff" label="Black on white" alt={`${logo.name} in black on white`} />
            <ProofTile src={proofs.data.files.whiteOnBlack} ground="#000000" label="White on black" alt={`${logo.name} in white on black`} />
            <ProofTile src={proofs.data.files.greyscale} ground="#ffffff" label="Greyscale" alt={`${logo.name} in greyscale`} />
          </div>
          <LightPartsChoice brandId={brandId} logo={logo} proofs={proofs.data} colors={colors} canEdit={canEdit} onNotice={onNotice} />
          {proofs.data.tones.dependsOnColour ? (
            <div role="status" className="rounded-lg border border-warn/25 bg-warn-wash px-4 py-3 text-sm">
              <p className="font-semibold text-warn">This logo leans on colour</p>
              <ul className="mt-1 space-y-1 leading-relaxed text-ink">
                {proofs.data.tones.collapses.map((pair) => <Collapse key={`${pair.a.hex}-${pair.b.hex}`} pair={pair} colors={colors} />)}
              </ul>
              <p className="mt-2 leading-relaxed text-ink-soft">
                Touching parts of a graphic need {proofs.data.tones.threshold.contrast}:1 to be told apart (WCAG 2.2 SC 1.4.11); below it only the hue
                separates them, which a grey print, a fax, a one-colour stamp or a reader with a colour-vision deficiency loses. Make one of them lighter or
                darker, or part them with a gap or a line.
              </p>
            </div>
          ) : (
            <p role="status" className="rounded-lg bg-plumb-wash px-4 py-3 text-sm text-plumb-deep">
              {proofs.data.tones.parts.length <= 1
                ? 'Drawn in one colour: there are no colours to run together in grey.'
                : `Holds up in grey: every pair of touching colours stays at least ${proofs.data.tones.threshold.contrast}:1 apart (WCAG 2.2 SC 1.4.11).`}
            </p>
          )}
          {proofs.data.tones.parts.length > 0 && (
            <details className="text-sm">
              <summary className="cursor-pointer text-ink-soft">Colours found and their greys</summary>
              <ul className="mt-2 grid gap-1 sm:grid-cols-2">
                {proofs.data.tones.parts.map((p) => {
                  const named = paletteName(p, colors);
                  return (
                    <li key={p.hex} className="flex items-center gap-2">
                      <Swatch hex={p.hex} /> <span className="font-mono text-xs">{p.hex}</span> → <Swatch hex={p.grey} />{' '}
                      <span className="font-mono text-xs">{p.grey}</span>
                      <span className="text-xs text-ink-soft">
                        {named ? `${named}, ` : ''}
                        {formatNumber(Math.max(1, Math.round(p.share * 100)), SITE_LOCALE)} % of the drawing
                      </span>
                    </li>
                  );
                })}
              </ul>
            </details>
          )}
          <p className="text-xs text-ink-soft">
            Greys keep each colour’s relative luminance (WCAG 2.2, sRGB). The 3:1 is borrowed from the rule for graphics as guidance: logotypes are exempt
            from WCAG’s contrast rules, and this check is no certification. Look at the proofs small as well.
          </p>
        </>
      )}
    </section>
  );
}
