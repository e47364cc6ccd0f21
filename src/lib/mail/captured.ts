// Messages kept by the local fake SMTP server: one JSON file each in a capture folder, newest last by name.
import { mkdirSync, readdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

export interface CapturedMail {
  id: string;
  receivedAt: string;
  /** SMTP envelope: what the server was actually told (RFC 5321 MAIL FROM / RCPT TO). */
  envelope: { from: string; to: string[] };
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  messageId: string | null;
  /** The brand a message is about (our X-Plumbline-Brand header), so owners see their brands' mail. */
  brandId: string | null;
}

/** A file-name-safe form of an address, so a folder listing can be filtered by recipient without reading files. */
export const addressSlug = (address: string) => address.toLowerCase().replace(/[^a-z0-9@.-]+/g, '_').slice(0, 120);

/** Store one message; written to a temporary name and renamed so readers never see half a file. */
export function storeCaptured(dir: string, mail: CapturedMail): string {
  mkdirSync(dir, { recursive: true });
  const name = `${mail.receivedAt.replace(/[:.]/g, '-')}_${mail.id}_${addressSlug(mail.envelope.to[0] ?? 'nobody')}.json`;
  const tmp = join(dir, `.${name}.tmp`);
  writeFileSync(tmp, JSON.stringify(mail, null, 2));
  renameSync(tmp, join(dir, name));
  return name;
}

/** Captured messages, newest first; `to` filters by envelope recipient (case-insensitive). */
export function listCaptured(dir: string, opts: { to?: string; limit?: number } = {}): CapturedMail[] {
  let names: string[];
  try {
    names = readdirSync(dir).filter((n) => n.endsWith('.json') && !n.startsWith('.'));
  } catch {
    return [];
  }
  if (opts.to) {
    const slug = `_${addressSlug(opts.to)}.json`;
    names = names.filter((n) => n.endsWith(slug));
  }
  names.sort().reverse();
  const out: CapturedMail[] = [];
  for (const name of names) {
    try {
      const mail = JSON.parse(readFileSync(join(dir, name), 'utf8')) as CapturedMail;
      if (opts.to && !mail.envelope.to.some((t) => t.toLowerCase() === opts.to!.toLowerCase())) continue;
      out.push(mail);
    } catch {
      continue;
    }
    if (opts.limit && out.length >= opts.limit) break;
  }
  return out;
}
