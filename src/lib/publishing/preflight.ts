// The check before publishing: what a reader should never receive (template instructions, stand-in images, missing
// alt text, contrast below the level the brand claims, unlicensed fonts, files that are not approved). Pure: the
// caller loads the draft, identity and shelf; the designer sees the list and may publish anyway with a note.
import { contrastRatio } from '@/lib/color/contrast';
import { blockLabels } from '@/lib/guideline/block-label';
import type { GuidelineDoc } from '@/lib/guideline/document';
import type { Identity } from '@/lib/identity/types';

export type FindingCode =
  | 'template_text'
  | 'image_placeholder'
  | 'missing_alt'
  | 'contrast_below_claim'
  | 'font_unlicensed'
  | 'file_not_approved'
  | 'file_retired';

export interface Finding {
  code: FindingCode;
  /** The block the finding is in (null for the identity, e.g. a typeface). */
  blockId: string | null;
  /** A reader's name for where it is: "Imagery in “Imagery”", "Typeface Fraunces". */
  where: string;
  message: string;
}

export interface ShelfEntry {
  state: 'draft' | 'approved' | 'retired';
  name: string;
  /** A photograph's own alt text on the shelf, which the imagery block uses when its item has none. */
  alt?: string | null;
}

export interface PreflightInput {
  doc: GuidelineDoc;
  identity: Identity;
  /** The brand's shelf by asset id. */
  shelf: ReadonlyMap<string, ShelfEntry>;
  /** Instruction texts of the starter templates, as written there (see templateInstructions()). */
  instructions: readonly string[];
}

/** The WCAG 2.2 minimum for normal text at each level (SC 1.4.3 AA 4.5:1, SC 1.4.6 AAA 7:1). */
export const CLAIM_MINIMUM = { AA: 4.5, AAA: 7 } as const;
export type ContrastClaim = keyof typeof CLAIM_MINIMUM;

type AnyNode = { type: string; attrs?: Record<string, unknown> | null; content?: AnyNode[]; text?: string };

const normalise = (s: string) => s.replace(/\s+/g, ' ').trim().toLowerCase();

/** The text of every paragraph-like node under `node`, one string each. */
function paragraphs(node: AnyNode, out: string[] = []): string[] {
  if (node.type === 'paragraph' || node.type === 'heading') {
    out.push((node.content ?? []).map((n) => n.text ?? '').join(''));
    return out;
  }
  for (const child of node.content ?? []) paragraphs(child, out);
  for (const key of ['text', 'title', 'intro', 'caption', 'note'] as const) {
    const v = node.attrs?.[key];
    if (typeof v === 'string' && v) out.push(v);
  }
  return out;
}

/** Two decimals, never rounded up to the threshold it failed (4.499 shows as 4.49, not 4.50). */
const ratioText = (r: number, min: number) => `${(Number(r.toFixed(2)) >= min ? Math.floor(r * 100) / 100 : r).toFixed(2)}:1`;

export function preflight({ doc, identity, shelf, instructions }: PreflightInput): Finding[] {
  const findings: Finding[] = [];
  const labels = blockLabels(doc);
  const instructionSet = new Set(instructions.map(normalise).filter(Boolean));
  const colors = new Map(identity.colors.map((c) => [c.id, c]));
  const add = (code: FindingCode, blockId: string | null, where: string | undefined, message: string) =>
    findings.push({ code, blockId, where: where ?? 'The guidelines', message });

  for (const raw of doc.content as AnyNode[]) {
    const id = typeof raw.attrs?.id === 'string' ? (raw.attrs.id as string) : null;
    const where = id ? labels.get(id) : undefined;
    const texts = paragraphs(raw);
    const leftover = texts.find((t) => instructionSet.has(normalise(t)));
    if (leftover) add('template_text', id, where, `Still holds the template’s instruction: “${leftover.slice(0, 80)}${leftover.length > 80 ? '…' : ''}”`);

    if (raw.type === 'imagery') {
      const items = (raw.attrs?.items ?? []) as { src?: string; alt?: string }[];
      items.forEach((item, i) => {
        const n = `Image ${i + 1}`;
        const entry = item.src ? shelf.get(item.src) : undefined;
        if (!entry) add('image_placeholder', id, where, `${n} is a stand-in, not a file from the shelf: choose a photograph.`);
        else if (entry.state === 'retired') add('file_retired', id, where, `${n} (${entry.name}) has been retired.`);
        else if (entry.state !== 'approved') add('file_not_approved', id, where, `${n} (${entry.name}) is not approved yet.`);
        if (!item.alt?.trim() && !entry?.alt?.trim()) add('missing_alt', id, where, `${n} has no alternative text for people who cannot see it.`);
      });
    }
    if (raw.type === 'downloads') {
      for (const assetId of (raw.attrs?.assetIds ?? []) as string[]) {
        const entry = shelf.get(assetId);
        if (!entry) add('file_not_approved', id, where, 'Lists a file that is no longer on the shelf.');
        else if (entry.state === 'retired') add('file_retired', id, where, `Lists ${entry.name}, which has been retired.`);
        else if (entry.state !== 'approved') add('file_not_approved', id, where, `Lists ${entry.name}, which is not approved yet.`);
      }
    }
    if (raw.type === 'contrastPairs') {
      const claim = (raw.attrs?.claim === 'AAA' ? 'AAA' : 'AA') as ContrastClaim;
      for (const pair of (raw.attrs?.pairs ?? []) as { foreground: string; background: string }[]) {
        const fg = colors.get(pair.foreground);
        const bg = colors.get(pair.background);
        if (!fg || !bg) continue;
        const ratio = contrastRatio(fg.value, bg.value);
        if (ratio < CLAIM_MINIMUM[claim]) {
          add('contrast_below_claim', id, where, `${fg.name} on ${bg.name} is ${ratioText(ratio, CLAIM_MINIMUM[claim])}, below ${claim} for body text (${CLAIM_MINIMUM[claim]}:1).`);
        }
      }
    }
  }
  for (const face of identity.typefaces) {
    if (!face.licence.confirmed) {
      add('font_unlicensed', null, `Typeface ${face.family}`, `The web licence of ${face.family} is not confirmed: published pages will show the fallback fonts.`);
    }
  }
  return findings;
}
