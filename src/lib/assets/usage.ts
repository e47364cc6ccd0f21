// The short usage note packed into every bundle, written from the identity so the numbers match the guidelines.
import { PRINT_CAUTION, TRADEMARK_CAUTION, VECTOR_PRINT_NOTE } from '@/lib/cautions';
import type { Identity } from '@/lib/identity/types';
import { RIGHTS_CAUTION } from './expiry';

/** What the studio recorded about a file's licence (each part may be missing). */
export interface FileRights { rights: string | null; credit: string | null; expiresOn: string | null }

const round = (n: number, places = 2) => Number(n.toFixed(places));

/** Plain text, wrapped by hand at sensible places; lines end in CRLF so every desktop editor shows them. */
export function usageNote(identity: Identity, files: { path: string; name: string; notes: string | null; rights?: FileRights | null }[], madeAt: Date): string {
  const lines: string[] = [];
  lines.push(`${identity.brand.name} — files and how to use them`);
  lines.push(`Packed by Plumbline on ${madeAt.toISOString().slice(0, 10)}. The published guidelines are the reference; this note is a summary.`);
  lines.push('');
  lines.push('IN THIS BUNDLE');
  for (const f of files) lines.push(`  ${f.path}${f.notes ? ` — ${f.notes.replace(/\s+/g, ' ').slice(0, 200)}` : ''}`);
  lines.push('');
  const licensed = files.filter((f) => f.rights && (f.rights.rights || f.rights.credit || f.rights.expiresOn));
  if (licensed.length) {
    lines.push('RIGHTS AND CREDITS');
    for (const f of licensed) {
      lines.push(`  ${f.name}`);
      if (f.rights!.rights) lines.push(`    Usage rights: ${f.rights!.rights.replace(/\s+/g, ' ')}`);
      if (f.rights!.credit) lines.push(`    Credit: ${f.rights!.credit}`);
      if (f.rights!.expiresOn) lines.push(`    Expires on ${f.rights!.expiresOn} (ISO 8601 date); do not use it from that day.`);
    }
    lines.push(`  ${RIGHTS_CAUTION}`);
    lines.push('');
  }
  if (identity.logos.length) {
    lines.push('LOGO: SPACE AND SIZE');
    for (const logo of identity.logos) {
      const cs = logo.clearSpace;
      const margin = round(cs.unitSize * cs.multiple);
      lines.push(`  ${logo.name} (${logo.variant})`);
      lines.push(`    Keep clear: ${cs.multiple} × ${cs.unitLabel} on every side (${margin} units of the logo's own drawing, where it is ${round(logo.bounds.width)} wide).`);
      lines.push(`    Never smaller than ${logo.minimumSize.screenPx} px wide on screen or ${logo.minimumSize.printMm} mm wide in print.`);
    }
    lines.push('');
  }
  if (identity.colors.length) {
    lines.push('COLOURS');
    for (const c of identity.colors) {
      const cmyk = c.cmykOverride ?? c.cmykIcc;
      const source = c.cmykOverride ? 'proofed by the studio' : 'estimate';
      lines.push(`  ${c.name}${c.role ? ` (${c.role})` : ''}`);
      lines.push(`    HEX ${c.hex.toUpperCase()}   RGB ${c.rgb.join(' ')}   CMYK ${cmyk.map((v) => round(v, 1)).join(' ')} (${source})${c.spot ? `   Spot: ${c.spot}` : ''}`);
    }
    lines.push('');
    lines.push(`  ${PRINT_CAUTION}`);
    lines.push(`  ${VECTOR_PRINT_NOTE}`);
    lines.push('');
  }
  lines.push('PLEASE DO NOT');
  lines.push('  stretch, rotate, recolour, outline or add effects to the logo; set it on busy images or colours it cannot stand out from;');
  lines.push('  rebuild it from a screenshot. Ask for the file you need instead.');
  lines.push('');
  lines.push(TRADEMARK_CAUTION);
  return lines.join('\r\n') + '\r\n';
}
