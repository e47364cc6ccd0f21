// Small shared pieces of the published blocks: placeholders for removed identity items, copy buttons, cautions.
import type { ReactNode } from 'react';
import type { Identity, IdentityLogo } from '@/lib/identity/types';
import { safeAssetUrl } from '@/lib/guideline/links';

export type RenderMode = 'site' | 'print';

export interface BlockRenderProps<A> {
  attrs: A;
  identity: Identity;
  mode: RenderMode;
  /** In the editor: show hints for empty blocks instead of leaving them out. */
  editing?: boolean;
}

const MISSING_TEXT = {
  colour: 'This colour was removed from the identity.',
  logo: 'This logo was removed from the identity.',
  typeface: 'No typeface has this role in the identity yet.',
  pattern: 'The linked shelf pattern cannot be drawn.',
} as const;

/** A gentle stand-in where a block points at an identity item that no longer exists. */
export function Missing({ what, detail }: { what: keyof typeof MISSING_TEXT; detail?: string }) {
  return (
    <div data-missing={what} className="rounded-lg border border-dashed border-rule-strong bg-paper/60 px-4 py-3 text-sm text-ink-soft">
      {MISSING_TEXT[what]}
      {detail ? <span className="block text-xs text-ink-faint">{detail}</span> : null}
    </div>
  );
}

/** What to do next in an empty block (editor only; the published site leaves empty blocks out). */
export function EmptyHint({ children }: { children: ReactNode }) {
  return <p className="rounded-lg border border-dashed border-rule-strong px-4 py-6 text-center text-sm text-ink-soft">{children}</p>;
}

/** A plain button the published page's small script wires to the clipboard; hidden in print. */
export function CopyButton({ value, label, mode }: { value: string; label: string; mode: RenderMode }) {
  if (mode === 'print') return null;
  return (
    <button
      type="button"
      data-copy={value}
      aria-label={`Copy ${label} ${value}`}
      className="rounded px-1.5 py-0.5 text-xs font-semibold text-ink-soft underline-offset-2 hover:underline focus-visible:outline-2"
    >
      Copy
    </button>
  );
}

/** A caution in plain words, shown once where it matters. */
export function Caution({ children }: { children: ReactNode }) {
  return (
    <p role="note" className="mt-4 rounded-md bg-warn-wash px-3 py-2 text-xs leading-relaxed text-warn">
      {children}
    </p>
  );
}

/** A block's optional note under its content. */
export function Note({ text }: { text: string }) {
  return text ? <p className="mt-3 text-sm leading-relaxed opacity-80">{text}</p> : null;
}

/** A logo file as an <img>, or nothing when the address is not one we may load; one-colour files have transparent grounds. */
export function LogoImage({ logo, file = 'original', on, className, style, mode = 'site' }: { logo: IdentityLogo; file?: keyof IdentityLogo['files']; on?: string; className?: string; style?: React.CSSProperties; mode?: RenderMode }) {
  const base = safeAssetUrl(logo.files[file] ?? logo.files.original);
  // On paper the ground is known: a one-colour file painted on it stays vector (a cut-out needs a mask, which PDFs rasterise).
  const painted = mode === 'print' && on && /^#[0-9a-f]{6}$/i.test(on) && (file === 'white' || file === 'black' || file === 'reversed') && base && logo.format === 'svg';
  const src = painted ? `${base}${base.includes('?') ? '&' : '?'}on=${encodeURIComponent(on)}` : base;
  if (!src) return <Missing what="logo" detail="Its file address could not be used." />;
  // The print edition loads every image before Chromium prints; the site loads them as the reader scrolls.
  return <img src={src} alt={logo.name} className={className} style={style} loading={mode === 'print' ? 'eager' : 'lazy'} decoding="async" />;
}

/** Only a six-digit hex reaches a style attribute. */
export const safeHex = (hex: string | undefined, fallback: string) => (hex && /^#[0-9a-f]{6}$/i.test(hex) ? hex : fallback);
