// The reveal presentation's slides, in showing order. Each slide looks for its material in the published version
// and is left out when it finds none, so a slide for new work (mock-ups, proofs) is one more entry here.
import type { CSSProperties, ReactNode } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { blockDefinition, storedAttrs } from '@/blocks/index';
import { BlockRenderer } from '@/blocks/renderers';
import { LogoImage, type RenderMode } from '@/components/guideline/parts';
import { formatLongDate, formatNumber, SITE_LOCALE } from '@/lib/format';
import type { GuidelineDoc } from '@/lib/guideline/document';
import { fontStack, logosInOrder, markLogo, primaryLogo, typefaceForRole } from '@/lib/guideline/identity';
import type { Identity, IdentityColor, IdentityLogo } from '@/lib/identity/types';
import type { ToneCollapse, TonePart, ToneReport } from '@/lib/logo/tones';
import { colourDependence, firstBlock, inkOn, paletteSwatches, revealPhotographs, SLIDE_PHOTO_ASPECT, slideGrounds, type LogoFinding, type RevealPhotograph } from '@/lib/presentation/material';
import { safeAssetUrl } from '@/lib/guideline/links';
import { composeMockup, type MockupLayout, type MockupSources } from '@/lib/mockups/compose';
import { photoAddresses } from '@/lib/mockups/photos';
import { pageSvg } from '@/lib/mockups/svg';
import { mockupTemplate } from '@/lib/mockups/templates';
import { versionPath } from '@/lib/publishing/snapshot-urls';
import type { ApplicationsAttrs } from '@/blocks/applications/definition';

export interface DeckContext {
  identity: Identity;
  doc: GuidelineDoc;
  slug: string;
  version: { number: number; publishedAt: Date; note: string };
  /** Where the guidelines are read online, e.g. "plumbline.example/b/larchmere". */
  siteAddress: string;
  mode: RenderMode;
  /** The tone check of the logos shown (primary and mark), by logo id, from the version's own files; absent, no finding is shown. */
  tones?: Record<string, ToneReport>;
}

export interface SlideDefinition<M> {
  /** Stable name, written on the slide as data-slide. */
  key: string;
  /** What the slide is called in the counter and to screen readers. */
  title: string;
  /** What the slide shows, or null to leave it out. */
  material: (ctx: DeckContext) => M | null;
  View: (props: { material: M; ctx: DeckContext }) => ReactNode;
}

const defineSlide = <M,>(def: SlideDefinition<M>): SlideDefinition<unknown> => def as unknown as SlideDefinition<unknown>;

/** A slide's ground and ink as custom properties (the inks are chosen by contrast, never typed). */
const worn = (ground: string): CSSProperties => ({ '--ground': ground, '--ink': inkOn(ground) }) as CSSProperties;

function Kicker({ children }: { children: ReactNode }) {
  return <h2 className="s-kicker">{children}</h2>;
}

/**
 * One identity block as it renders on the published site, for slides that show a block's output as it stands;
 * null when the block is absent, unreadable or draws nothing.
 */
function blockOutput(ctx: DeckContext, type: string): string | null {
  const node = firstBlock(ctx.doc, type);
  const def = blockDefinition(type);
  if (!node || !def || !def.schema.safeParse(storedAttrs(type, node.attrs)).success) return null;
  const html = renderToStaticMarkup(<BlockRenderer type={type} attrs={node.attrs} identity={ctx.identity} mode={ctx.mode} />);
  return html.trim() ? html : null;
}

/** A slide that shows one block's published output full width, e.g. the pattern. */
const blockSlide = (key: string, title: string, type: string, kicker: string) =>
  defineSlide<string>({
    key,
    title,
    material: (ctx) => blockOutput(ctx, type),
    View: ({ material, ctx }) => (
      <div className="s-frame s-block-slide" style={worn(slideGrounds(ctx.identity).light)}>
        <Kicker>{kicker}</Kicker>
        {/* Our own renderer's markup, drawn from the version's schema-checked attributes. */}
        <div className={`s-block s-block-${type}`} dangerouslySetInnerHTML={{ __html: material }} />
      </div>
    ),
  });

function LogoStage({ logo, on, file = 'original', size = 'large' }: { logo: IdentityLogo; on: string; file?: keyof IdentityLogo['files']; size?: 'large' | 'medium' }) {
  return (
    <div className={`s-logo s-logo-${size}`}>
      <LogoImage logo={logo} file={file} on={on} mode="print" />
    </div>
  );
}

const opening = defineSlide<true>({
  key: 'opening',
  title: 'Opening',
  material: () => true,
  View: ({ ctx }) => {
    const { brand } = slideGrounds(ctx.identity);
    return (
      <div className="s-frame s-opening" style={worn(brand)}>
        <Kicker>The identity, revealed</Kicker>
        <h1 className="s-display">{ctx.identity.brand.name}</h1>
        <p className="s-sub">
          Version {ctx.version.number} · {formatLongDate(ctx.version.publishedAt, SITE_LOCALE)}
        </p>
        {ctx.version.note ? <p className="s-note">{ctx.version.note}</p> : null}
      </div>
    );
  },
});

const logo = defineSlide<IdentityLogo>({
  key: 'logo',
  title: 'The logo',
  material: (ctx) => primaryLogo(ctx.identity) ?? null,
  View: ({ material, ctx }) => {
    const { light } = slideGrounds(ctx.identity);
    return (
      <div className="s-frame s-centred" style={worn(light)}>
        <Kicker>The logo</Kicker>
        <LogoStage logo={material} on={light} />
        <p className="s-caption">{material.name}</p>
      </div>
    );
  },
});

const mark = defineSlide<IdentityLogo>({
  key: 'mark',
  title: 'The mark',
  // Only a mark of its own: repeating the primary logo would say nothing new.
  material: (ctx) => {
    const found = markLogo(ctx.identity);
    return found && found.id !== primaryLogo(ctx.identity)?.id ? found : null;
  },
  View: ({ material, ctx }) => {
    const { light, brand } = slideGrounds(ctx.identity);
    return (
      <div className="s-split">
        <div className="s-frame s-centred" style={worn(light)}>
          <Kicker>The mark</Kicker>
          <LogoStage logo={material} on={light} size="medium" />
          <p className="s-caption">{material.name}: where space is short, the mark stands on its own.</p>
        </div>
        <div className="s-frame s-centred" style={worn(brand)}>
          <LogoStage logo={material} on={brand} file={inkOn(brand) === '#ffffff' ? 'reversed' : 'black'} size="medium" />
          <p className="s-caption">On the brand colour.</p>
        </div>
      </div>
    );
  },
});

const oneColour = defineSlide<IdentityLogo[]>({
  key: 'one-colour',
  title: 'In one colour',
  material: (ctx) => {
    const primary = primaryLogo(ctx.identity);
    const shown = [primary, markLogo(ctx.identity)].filter((l, i, all): l is IdentityLogo => !!l && all.findIndex((o) => o?.id === l.id) === i);
    return shown.length ? shown : null;
  },
  View: ({ material }) => (
    <div className="s-split">
      <div className="s-frame s-centred" style={worn('#ffffff')}>
        <Kicker>In one colour</Kicker>
        <div className="s-row">{material.map((l) => <LogoStage key={l.id} logo={l} on="#ffffff" file="black" size="medium" />)}</div>
        <p className="s-caption">Black on white</p>
      </div>
      <div className="s-frame s-centred" style={worn('#000000')}>
        <div className="s-row">{material.map((l) => <LogoStage key={l.id} logo={l} on="#000000" file="white" size="medium" />)}</div>
        <p className="s-caption">White on black</p>
      </div>
    </div>
  ),
});

/** The WCAG 2.2 luminance weights as an SVG colour matrix row: applied in linear light it gives relative luminance. */
const LUMA = '0.2126 0.7152 0.0722 0 0';

/** A logo in grey by relative luminance (the same filter as the one-colour block). */
function GreyLogo({ logo }: { logo: IdentityLogo }) {
  const src = safeAssetUrl(logo.files.original);
  if (!src) return null;
  const { width: w, height: h } = logo.canvas;
  const id = `deck-grey-${logo.id}`;
  return (
    <svg viewBox={`0 0 ${w} ${h}`} role="img" aria-label={`${logo.name} in grey`} className="s-finding-logo">
      <defs>
        <filter id={id} colorInterpolationFilters="linearRGB">
          <feColorMatrix type="matrix" values={`${LUMA} ${LUMA} ${LUMA} 0 0 0 1 0`} />
        </filter>
      </defs>
      <image href={src} width={w} height={h} filter={`url(#${id})`} />
    </svg>
  );
}

const ratioText = (n: number) => `${formatNumber(Math.floor(n * 100) / 100, SITE_LOCALE, 2)}:1`;
/** A colour of the logo by its palette name when the brand has exactly that colour, else its hex. */
const partName = (part: TonePart, colors: IdentityColor[]) => colors.find((c) => c.hex.toLowerCase() === part.hex.toLowerCase())?.name ?? part.hex.toUpperCase();

function Pair({ pair, colors, logoName }: { pair: ToneCollapse; colors: IdentityColor[]; logoName: string | null }) {
  return (
    <li>
      <span className="s-chips" aria-hidden="true">
        <span style={{ background: pair.a.hex }} />
        <span style={{ background: pair.b.hex }} />
      </span>
      <span>
        {logoName ? <span className="s-finding-of">{logoName}: </span> : null}
        <strong>{partName(pair.a, colors)}</strong> and <strong>{partName(pair.b, colors)}</strong> touch at <strong>{ratioText(pair.contrast)}</strong>: under the 3:1
        asked of adjacent parts of a graphic.
      </span>
    </li>
  );
}

const withoutColour = defineSlide<LogoFinding[]>({
  key: 'without-colour',
  title: 'Without colour',
  // Only when a logo shown leans on colour: a logo that reads in grey needs no slide to say so.
  material: (ctx) => {
    const found = colourDependence(ctx.identity, ctx.tones ?? {});
    return found.length ? found : null;
  },
  View: ({ material, ctx }) => (
    <div className="s-frame s-finding" style={worn('#ffffff')}>
      <Kicker>Without colour</Kicker>
      <div className="s-finding-logos">
        {material.map(({ logo }) => (
          <figure key={logo.id}>
            <div className="s-finding-pair">
              <LogoStage logo={logo} on="#ffffff" size="medium" />
              <GreyLogo logo={logo} />
            </div>
            <figcaption className="s-caption">{logo.name}: in colour, and in grey</figcaption>
          </figure>
        ))}
      </div>
      <div className="s-finding-words">
        <p className="s-finding-lead">In grey, some parts of the logo run together.</p>
        <ul className="s-finding-pairs">
          {material.flatMap(({ logo, report }) =>
            report.collapses.map((pair) => <Pair key={`${logo.id}-${pair.a.hex}-${pair.b.hex}`} pair={pair} colors={ctx.identity.colors} logoName={material.length > 1 ? logo.name : null} />),
          )}
        </ul>
        <p className="s-finding-note">
          Only the hue tells these parts apart, and a one-colour print, a photocopy or a reader who does not see that hue loses it. The 3:1 is WCAG 2.2’s
          figure for graphics (SC 1.4.11), used here as guidance: logos are exempt from its contrast rules.
        </p>
      </div>
    </div>
  ),
});

const palette = defineSlide<ReturnType<typeof paletteSwatches>>({
  key: 'palette',
  title: 'Colour',
  material: (ctx) => {
    const swatches = paletteSwatches(ctx.identity);
    return swatches.length ? swatches.slice(0, 8) : null;
  },
  View: ({ material, ctx }) => (
    <div className="s-frame s-palette" style={worn(slideGrounds(ctx.identity).light)}>
      <Kicker>Colour</Kicker>
      <ul className="s-swatches" aria-label="Palette">
        {material.map((c) => (
          <li key={c.id} style={{ background: c.hex, color: c.ink }}>
            <span className="s-swatch-name">{c.name}</span>
            <span className="s-swatch-value">{c.hex.toUpperCase()}</span>
            <span className="s-swatch-value">
              RGB {c.rgb.join(' ')}
            </span>
            {c.proofedCmyk ? <span className="s-swatch-value">CMYK {c.proofedCmyk.join(' ')}</span> : null}
          </li>
        ))}
      </ul>
    </div>
  ),
});

const type = defineSlide<true>({
  key: 'type',
  title: 'Type',
  material: (ctx) => (ctx.identity.typefaces.length > 0 ? true : null),
  View: ({ ctx }) => {
    const heading = typefaceForRole(ctx.identity, 'heading') ?? typefaceForRole(ctx.identity, 'body');
    const body = typefaceForRole(ctx.identity, 'body') ?? heading;
    // The brand's first word: the whole name at a headline size would run off the column.
    const sample = ctx.identity.brand.name.split(/\s+/)[0];
    const steps = [...ctx.identity.typeScale.steps].filter((s) => s.step >= 0).sort((a, b) => b.step - a.step).slice(0, 5);
    return (
      <div className="s-frame s-type" style={worn(slideGrounds(ctx.identity).light)}>
        <Kicker>Type</Kicker>
        <div className="s-type-faces">
          {heading ? (
            <div className="s-face" style={{ fontFamily: fontStack(heading) }}>
              <p className="s-face-sample" aria-hidden="true">Aa</p>
              <p className="s-face-name">{heading.family}</p>
              <p className="s-face-meta">Headings · weights {heading.weights.join(', ')}</p>
            </div>
          ) : null}
          {body && body.id !== heading?.id ? (
            <div className="s-face" style={{ fontFamily: fontStack(body, 'serif') }}>
              <p className="s-face-sample" aria-hidden="true">Aa</p>
              <p className="s-face-name">{body.family}</p>
              <p className="s-face-meta">Running text · weights {body.weights.join(', ')}</p>
            </div>
          ) : null}
        </div>
        {steps.length ? (
          <ol className="s-scale" aria-label="Type scale">
            {steps.map((s) => (
              <li key={s.name} style={{ fontFamily: fontStack(s.role === 'body' ? body : heading) }}>
                <span className="s-scale-name">{s.name} · {Math.round(s.px * 10) / 10} px</span>
                <span className="s-scale-sample" style={{ fontSize: `${Math.min(s.px, 96) / 12.8}cqw` }}>
                  {sample}
                </span>
              </li>
            ))}
          </ol>
        ) : null}
      </div>
    );
  },
});

const photographs = defineSlide<RevealPhotograph[]>({
  key: 'photographs',
  title: 'Photography',
  material: (ctx) => {
    const found = revealPhotographs(ctx.identity, ctx.doc, versionPath(ctx.slug, ctx.version.number));
    return found.length ? found : null;
  },
  View: ({ material, ctx }) => (
    <div className="s-frame s-photos-slide" style={worn(slideGrounds(ctx.identity).dark)}>
      <Kicker>Photography</Kicker>
      <ul className={`s-photos s-photos-${material.length}`} style={{ '--photo-aspect': SLIDE_PHOTO_ASPECT[material.length].replace(':', ' / ') } as CSSProperties}>
        {material.map((p) => (
          <li key={p.src}>
            <figure>
              <img
                src={p.src}
                srcSet={p.srcSet}
                sizes={p.sizes}
                width={p.width}
                height={p.height}
                alt={p.alt}
                style={{ objectPosition: p.position }}
                loading="eager"
                decoding="async"
              />
              {p.caption ? <figcaption>{p.caption}</figcaption> : null}
            </figure>
          </li>
        ))}
      </ul>
    </div>
  ),
});

interface PieceInUse {
  key: string;
  name: string;
  layout: MockupLayout;
}

/** The mock-ups the guidelines' applications block shows, composed from the version's identity (at most six). */
function piecesInUse(ctx: DeckContext): PieceInUse[] | null {
  const node = firstBlock(ctx.doc, 'applications');
  const def = blockDefinition('applications');
  if (!node || !def) return null;
  const parsed = def.schema.safeParse(storedAttrs('applications', node.attrs));
  if (!parsed.success) return null;
  const attrs = parsed.data as ApplicationsAttrs;
  const sources: MockupSources = { logo: (logo, file) => safeAssetUrl(logo.files[file] ?? logo.files.original), photos: photoAddresses(ctx.identity, attrs.photoIds) };
  const pieces = attrs.templates.flatMap((key) => {
    const template = mockupTemplate(key);
    if (!template) return [];
    try {
      const composed = composeMockup(template, ctx.identity, sources, { logoId: attrs.logoId });
      return composed.ok ? [{ key, name: template.name, layout: composed.layout }] : [];
    } catch {
      // A piece that cannot be drawn is left out here; the guidelines say why.
      return [];
    }
  });
  return pieces.length ? pieces.slice(0, 6) : null;
}

/** One piece, its pages side by side, as large as its cell allows (container units keep the proportions). */
function Piece({ piece }: { piece: PieceInUse }) {
  const { trim, pages } = piece.layout;
  // Pages side by side with a gap of 4 % of one page's width between them.
  const total = pages.length * trim.width + (pages.length - 1) * 0.04 * trim.width;
  const ratio = total / trim.height;
  const gap = `${((0.04 * trim.width) / total) * 100}%`;
  return (
    <li className="s-piece">
      <div className="s-piece-stage">
        <div className="s-piece-pages" style={{ '--piece-ratio': ratio.toFixed(4), gridTemplateColumns: `repeat(${pages.length}, minmax(0, 1fr))`, columnGap: gap } as CSSProperties}>
          {pages.map((page) => (
            <div
              key={page.name}
              className="s-piece-page"
              // pageSvg escapes every value it writes; colours are parsed #rrggbb and addresses checked.
              dangerouslySetInnerHTML={{ __html: pageSvg(piece.layout, page, { width: '100%', label: `${piece.name}, ${page.name}` }) }}
            />
          ))}
        </div>
      </div>
      <p className="s-piece-name">{piece.name}</p>
    </li>
  );
}

const inUse = defineSlide<PieceInUse[]>({
  key: 'in-use',
  title: 'In use',
  material: piecesInUse,
  View: ({ material, ctx }) => (
    <div className="s-frame s-in-use" style={worn(slideGrounds(ctx.identity).light)}>
      <Kicker>In use</Kicker>
      <ul className={`s-pieces s-pieces-${material.length}`}>
        {material.map((piece) => (
          <Piece key={piece.key} piece={piece} />
        ))}
      </ul>
    </div>
  ),
});

const closing = defineSlide<true>({
  key: 'closing',
  title: 'Closing',
  material: () => true,
  View: ({ ctx }) => {
    const { dark } = slideGrounds(ctx.identity);
    const shown = primaryLogo(ctx.identity) ?? logosInOrder(ctx.identity)[0];
    return (
      <div className="s-frame s-centred s-closing" style={worn(dark)}>
        {shown ? <LogoStage logo={shown} on={dark} file={inkOn(dark) === '#ffffff' ? 'white' : 'black'} size="medium" /> : null}
        <p className="s-closing-line">Everything shown here, with the rules for using it, lives in the guidelines.</p>
        <p className="s-sub">{ctx.siteAddress}</p>
      </div>
    );
  },
});

/** The slides in showing order; a slide without material is left out. */
export const SLIDES: readonly SlideDefinition<unknown>[] = [
  opening,
  logo,
  mark,
  oneColour,
  withoutColour,
  palette,
  type,
  blockSlide('pattern', 'Pattern', 'pattern', 'Pattern'),
  photographs,
  inUse,
  closing,
];

export interface DeckSlide {
  key: string;
  title: string;
  content: ReactNode;
}

/** The slides this version has material for, each drawn. */
export function deckSlides(ctx: DeckContext, registry: readonly SlideDefinition<unknown>[] = SLIDES): DeckSlide[] {
  return registry.flatMap((def) => {
    const material = def.material(ctx);
    return material === null || material === undefined ? [] : [{ key: def.key, title: def.title, content: <def.View material={material} ctx={ctx} /> }];
  });
}
