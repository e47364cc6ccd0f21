// What changed between two published versions (or a version and the draft): blocks, colours and type.
import { blockDefinition } from '@/blocks';
import { TYPEFACE_ROLES, type Identity } from '@/lib/identity/types';

interface AnyBlock {
  type: string;
  attrs?: Record<string, unknown>;
  content?: unknown[];
}
export interface Snapshot {
  doc: { content?: AnyBlock[] };
  identity: Identity;
}

export interface BlockChange {
  id: string;
  type: string;
  label: string;
}
export interface ValueChange {
  what: string;
  from: string | null;
  to: string | null;
}
export interface VersionChanges {
  blocks: { added: BlockChange[]; removed: BlockChange[]; changed: BlockChange[] };
  colors: ValueChange[];
  type: ValueChange[];
  logos: ValueChange[];
}

const label = (b: AnyBlock): string => {
  const title = typeof b.attrs?.title === 'string' && b.attrs.title ? `: ${b.attrs.title}` : '';
  return `${blockDefinition(b.type)?.label ?? (b.type === 'paragraph' ? 'Text' : b.type)}${title}`;
};
const byId = (doc: Snapshot['doc']) => new Map((doc.content ?? []).map((b, i) => [String(b.attrs?.id ?? `#${i}`), b]));

/** Blocks added, removed and changed (by block id), and colour, type and logo values old → new. */
export function compareSnapshots(before: Snapshot, after: Snapshot): VersionChanges {
  const a = byId(before.doc);
  const b = byId(after.doc);
  const view = (id: string, block: AnyBlock): BlockChange => ({ id, type: block.type, label: label(block) });
  const blocks = {
    added: [...b].filter(([id]) => !a.has(id)).map(([id, blk]) => view(id, blk)),
    removed: [...a].filter(([id]) => !b.has(id)).map(([id, blk]) => view(id, blk)),
    changed: [...b].filter(([id, blk]) => a.has(id) && JSON.stringify(a.get(id)) !== JSON.stringify(blk)).map(([id, blk]) => view(id, blk)),
  };

  const colors: ValueChange[] = [];
  const oldColors = new Map(before.identity.colors.map((c) => [c.id, c]));
  const newColors = new Map(after.identity.colors.map((c) => [c.id, c]));
  for (const [id, c] of newColors) {
    const old = oldColors.get(id);
    if (!old) colors.push({ what: `Colour ${c.name}`, from: null, to: c.hex });
    else {
      if (old.hex !== c.hex) colors.push({ what: `Colour ${c.name}`, from: old.hex, to: c.hex });
      if (old.name !== c.name) colors.push({ what: `Colour name`, from: old.name, to: c.name });
      const oldPrint = JSON.stringify([old.cmykOverride, old.spot]);
      if (oldPrint !== JSON.stringify([c.cmykOverride, c.spot])) {
        colors.push({ what: `Print values of ${c.name}`, from: printText(old), to: printText(c) });
      }
    }
  }
  for (const [id, c] of oldColors) if (!newColors.has(id)) colors.push({ what: `Colour ${c.name}`, from: c.hex, to: null });

  const type: ValueChange[] = [];
  for (const role of TYPEFACE_ROLES) {
    const from = before.identity.typefaces.find((f) => f.role === role)?.family ?? null;
    const to = after.identity.typefaces.find((f) => f.role === role)?.family ?? null;
    if (from !== to) type.push({ what: `${role[0].toUpperCase()}${role.slice(1)} typeface`, from, to });
  }
  const s0 = before.identity.typeScale;
  const s1 = after.identity.typeScale;
  if (s0.basePx !== s1.basePx) type.push({ what: 'Base size', from: `${s0.basePx} px`, to: `${s1.basePx} px` });
  if (s0.ratioName !== s1.ratioName) type.push({ what: 'Scale ratio', from: s0.ratioName, to: s1.ratioName });
  if (s0.bodyLineHeight !== s1.bodyLineHeight) type.push({ what: 'Body line height', from: String(s0.bodyLineHeight), to: String(s1.bodyLineHeight) });

  const logos: ValueChange[] = [];
  const oldLogos = new Map(before.identity.logos.map((l) => [l.id, l]));
  const newLogos = new Map(after.identity.logos.map((l) => [l.id, l]));
  for (const [id, l] of newLogos) {
    const old = oldLogos.get(id);
    if (!old) logos.push({ what: `Logo ${l.name}`, from: null, to: 'added' });
    else {
      if (old.minimumSize.screenPx !== l.minimumSize.screenPx) logos.push({ what: `Minimum size of ${l.name}`, from: `${old.minimumSize.screenPx} px`, to: `${l.minimumSize.screenPx} px` });
      if (old.clearSpace.multiple !== l.clearSpace.multiple || old.clearSpace.unitSize !== l.clearSpace.unitSize) {
        logos.push({ what: `Clear space of ${l.name}`, from: `${old.clearSpace.multiple} × ${old.clearSpace.unitLabel}`, to: `${l.clearSpace.multiple} × ${l.clearSpace.unitLabel}` });
      }
    }
  }
  for (const [id, l] of oldLogos) if (!newLogos.has(id)) logos.push({ what: `Logo ${l.name}`, from: 'present', to: null });
  return { blocks, colors, type, logos };
}

const printText = (c: Identity['colors'][number]) =>
  [c.cmykOverride ? `CMYK ${c.cmykOverride.join('/')}` : null, c.spot].filter(Boolean).join(', ') || 'computed';

/** The changes as plain sentences, for e-mail notices and the history page. */
export function changeSummary(changes: VersionChanges): string[] {
  const lines: string[] = [];
  for (const b of changes.blocks.added) lines.push(`Added ${b.label}`);
  for (const b of changes.blocks.removed) lines.push(`Removed ${b.label}`);
  for (const b of changes.blocks.changed) lines.push(`Changed ${b.label}`);
  for (const v of [...changes.colors, ...changes.type, ...changes.logos]) {
    lines.push(v.from === null ? `${v.what}: added (${v.to})` : v.to === null ? `${v.what}: removed (was ${v.from})` : `${v.what}: ${v.from} → ${v.to}`);
  }
  return lines;
}
